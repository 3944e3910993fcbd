// GET /api/v1/properties/:propertyId — the property with its zones; 404 when out of scope.
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { getProperty } from "@/lib/properties/queries";
import { propertyIdParams } from "@/lib/properties/schemas";

export const GET = route({ access: ROLES, params: propertyIdParams, resource: "That property" }, async ({ actor, params }) =>
  getProperty(actor, params.propertyId),
);
