// GET /api/v1/properties/:propertyId — the property with its zones; 404 when out of scope.
// PUT /api/v1/properties/:propertyId — replace its editable fields (manager).
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";
import { updateProperty } from "@/lib/properties/mutations";
import { getProperty } from "@/lib/properties/queries";
import { propertyIdParams, propertySchema } from "@/lib/properties/schemas";

export const GET = route(
  { access: ROLES, params: propertyIdParams, resource: "That property" },
  async ({ actor, params }) => getProperty(actor, params.propertyId),
);

export const PUT = route(
  {
    access: ["manager"],
    params: propertyIdParams,
    body: propertySchema,
    resource: "That property",
  },
  async ({ actor, params, body }) => updateProperty(actor, params.propertyId, body),
);
