// POST /api/v1/properties/:propertyId/homeowners — link a homeowner by e-mail (manager).
import { route } from "@/lib/auth/guards";
import { linkHomeowner } from "@/lib/properties/mutations";
import { homeownerLinkSchema, propertyIdParams } from "@/lib/properties/schemas";

export const POST = route(
  {
    access: ["manager"],
    params: propertyIdParams,
    body: homeownerLinkSchema,
    resource: "That property",
  },
  async ({ actor, params, body }) => linkHomeowner(actor, params.propertyId, body),
);
