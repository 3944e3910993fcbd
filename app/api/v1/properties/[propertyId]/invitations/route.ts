// GET  /api/v1/properties/:propertyId/invitations — the property's pending invitations (manager).
// POST /api/v1/properties/:propertyId/invitations — invite a homeowner by e-mail (manager). The
// answer is the same whatever the address: the invitation as sent, nothing about any account.
import { route } from "@/lib/auth/guards";
import { INVITATION_MAIL_KIND, inviteHomeowner } from "@/lib/invitations/mutations";
import { listPendingInvitations } from "@/lib/invitations/queries";
import { invitationSchema } from "@/lib/invitations/schemas";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";
import { propertyIdParams } from "@/lib/properties/schemas";

export const GET = route(
  { access: ["manager"], params: propertyIdParams, resource: "That property" },
  async ({ actor, params }) => ({
    invitations: await listPendingInvitations(actor, params.propertyId),
  }),
);

export const POST = route(
  {
    access: ["manager"],
    params: propertyIdParams,
    body: invitationSchema,
    resource: "That property",
  },
  async ({ actor, params, body }) => {
    const invitation = await inviteHomeowner(actor, params.propertyId, body);
    deliverMailAfterResponse(INVITATION_MAIL_KIND);
    return Response.json(
      { invitation },
      { status: 201, headers: { "Cache-Control": "private, no-store" } },
    );
  },
);
