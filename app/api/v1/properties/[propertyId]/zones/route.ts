// POST /api/v1/properties/:propertyId/zones — add a zone (manager); area in ft² or m² (stored as ft²).
import { route } from "@/lib/auth/guards";
import { createZone } from "@/lib/properties/mutations";
import { propertyIdParams, zoneSchema } from "@/lib/properties/schemas";

export const POST = route(
  { access: ["manager"], params: propertyIdParams, body: zoneSchema, resource: "That property" },
  async ({ actor, params, body }) => createZone(actor, params.propertyId, body),
);
