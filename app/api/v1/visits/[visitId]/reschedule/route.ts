// POST /api/v1/visits/:visitId/reschedule — a new visit in place of a stop that was rained out or
// canceled, on the day chosen (the assigned technician or a manager). Answers the new visit.
import { route } from "@/lib/auth/guards";
import { rescheduleVisit } from "@/lib/visits/mutations";
import { visitIdParams } from "@/lib/visits/schemas";
import { rescheduleVisitSchema } from "@/lib/visits/stop-outcomes";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: visitIdParams,
    body: rescheduleVisitSchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) => rescheduleVisit(actor, params.visitId, body),
);
