// DELETE /api/v1/properties/:propertyId/invitations/:invitationId — withdraw a pending invitation
// (manager): its link stops working at once.
import { route } from "@/lib/auth/guards";
import { revokeInvitation } from "@/lib/invitations/mutations";
import { invitationParams } from "@/lib/invitations/schemas";

export const DELETE = route(
  { access: ["manager"], params: invitationParams, resource: "That invitation" },
  async ({ actor, params }) => {
    await revokeInvitation(actor, params.propertyId, params.invitationId);
    return { revoked: true };
  },
);
