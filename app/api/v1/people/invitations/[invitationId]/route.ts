// DELETE /api/v1/people/invitations/:invitationId — withdraw a pending staff invitation (manager):
// its link stops working at once.
import { route } from "@/lib/auth/guards";
import { revokeStaffInvitation } from "@/lib/invitations/mutations";
import { staffInvitationParams } from "@/lib/invitations/schemas";

export const DELETE = route(
  { access: ["manager"], params: staffInvitationParams, resource: "That invitation" },
  async ({ actor, params }) => {
    await revokeStaffInvitation(actor, params.invitationId);
    return { revoked: true };
  },
);
