// POST /api/v1/people/invitations — invite a technician or a manager by e-mail (manager): a
// single-use link through the outbox; an address already in use by an account is refused (409).
import { route } from "@/lib/auth/guards";
import { inviteStaff, STAFF_INVITATION_MAIL_KIND } from "@/lib/invitations/mutations";
import { staffInvitationSchema } from "@/lib/invitations/schemas";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";

export const POST = route(
  { access: ["manager"], body: staffInvitationSchema },
  async ({ actor, body }) => {
    const invitation = await inviteStaff(actor, body);
    deliverMailAfterResponse(STAFF_INVITATION_MAIL_KIND);
    return Response.json(
      { invitation },
      { status: 201, headers: { "Cache-Control": "private, no-store" } },
    );
  },
);
