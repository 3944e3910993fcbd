// POST /api/v1/visits/:visitId/start — stamp the start time (and device location when given).
import { route } from "@/lib/auth/guards";
import { startVisit } from "@/lib/visits/mutations";
import { startVisitSchema, visitIdParams } from "@/lib/visits/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: visitIdParams,
    body: startVisitSchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) => startVisit(actor, params.visitId, body),
);
