// POST /api/v1/visits/:visitId/finish — lock the visit; every zone must be done or skipped (422 names the rest).
// The homeowners' report e-mails are queued in the outbox and delivered right after the response.
import { route } from "@/lib/auth/guards";
import { deliverMailAfterResponse } from "@/lib/mail/mutations";
import { finishVisit } from "@/lib/reports/mutations";
import { finishVisitSchema, visitIdParams } from "@/lib/visits/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: visitIdParams,
    body: finishVisitSchema,
    resource: "That visit",
  },
  async ({ actor, params }) => {
    const visit = await finishVisit(actor, params.visitId);
    deliverMailAfterResponse("visit_report");
    return visit;
  },
);
