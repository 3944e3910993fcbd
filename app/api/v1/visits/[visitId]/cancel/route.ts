// POST /api/v1/visits/:visitId/cancel — call off a stop that is not finished as a whole: rained out
// or canceled, with a reason (the assigned technician or a manager). Saved zone checks are kept.
import { route } from "@/lib/auth/guards";
import { cancelVisit } from "@/lib/visits/mutations";
import { visitIdParams } from "@/lib/visits/schemas";
import { cancelVisitSchema } from "@/lib/visits/stop-outcomes";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: visitIdParams,
    body: cancelVisitSchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) => cancelVisit(actor, params.visitId, body),
);
