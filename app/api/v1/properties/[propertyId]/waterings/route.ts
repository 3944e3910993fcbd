// GET  /api/v1/properties/:propertyId/waterings — { items: WateringDto[] }, newest first.
// POST /api/v1/properties/:propertyId/waterings — log a watering (depth, or run time × rate); staff, and homeowners for their own lawn.
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { propertyIdParams } from "@/lib/properties/schemas";
import { logWatering } from "@/lib/watering/mutations";
import { listWaterings } from "@/lib/watering/queries";
import { wateringSchema } from "@/lib/watering/schemas";

export const GET = route(
  { access: ROLES, params: propertyIdParams, resource: "That property" },
  async ({ actor, params }) => ({ items: await listWaterings(actor, params.propertyId) }),
);

export const POST = route(
  {
    access: ["manager", "technician", "homeowner"],
    params: propertyIdParams,
    body: wateringSchema,
    resource: "That property",
  },
  async ({ actor, params, body }) =>
    Response.json(await logWatering(actor, params.propertyId, body), { status: 201 }),
);
