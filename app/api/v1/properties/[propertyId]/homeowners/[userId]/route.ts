// DELETE /api/v1/properties/:propertyId/homeowners/:userId — unlink a homeowner (manager).
import { route } from "@/lib/auth/guards";
import { unlinkHomeowner } from "@/lib/properties/mutations";
import { homeownerParams } from "@/lib/properties/schemas";

export const DELETE = route(
  { access: ["manager"], params: homeownerParams, resource: "That homeowner link" },
  async ({ actor, params }) => unlinkHomeowner(actor, params.propertyId, params.userId),
);
