// POST /api/v1/properties/:propertyId/invitations/:invitationId/resend — send a pending invitation
// again (manager): a new link, a new expiry; the old link stops working.
import { route } from "@/lib/auth/guards";
import { INVITATION_MAIL_KIND, resendInvitation } from "@/lib/invitations/mutations";
import { invitationParams } from "@/lib/invitations/schemas";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";

export const POST = route(
  { access: ["manager"], params: invitationParams, resource: "That invitation" },
  async ({ actor, params }) => {
    const invitation = await resendInvitation(actor, params.propertyId, params.invitationId);
    deliverMailAfterResponse(INVITATION_MAIL_KIND);
    return { invitation };
  },
);
