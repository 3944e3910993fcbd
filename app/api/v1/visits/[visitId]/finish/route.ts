// POST /api/v1/visits/:visitId/finish — lock the visit; every zone must be done or skipped (422 names the rest).
import { route } from "@/lib/auth/guards";
import { finishVisit } from "@/lib/visits/mutations";
import { finishVisitSchema, visitIdParams } from "@/lib/visits/schemas";

export const POST = route({ access: ["manager", "technician"], params: visitIdParams, body: finishVisitSchema, resource: "That visit" }, async ({ actor, params }) =>
  finishVisit(actor, params.visitId),
);
