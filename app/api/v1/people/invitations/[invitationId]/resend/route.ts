// POST /api/v1/people/invitations/:invitationId/resend — send a pending staff invitation again
// with a new link (manager); the earlier link stops working.
import { route } from "@/lib/auth/guards";
import { resendStaffInvitation, STAFF_INVITATION_MAIL_KIND } from "@/lib/invitations/mutations";
import { staffInvitationParams } from "@/lib/invitations/schemas";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";

export const POST = route(
  { access: ["manager"], params: staffInvitationParams, resource: "That invitation" },
  async ({ actor, params }) => {
    const invitation = await resendStaffInvitation(actor, params.invitationId);
    deliverMailAfterResponse(STAFF_INVITATION_MAIL_KIND);
    return { invitation };
  },
);
