// GET /api/v1/visits/:visitId — the visit with its property's zones and its zone checks (staff in scope).
import { route } from "@/lib/auth/guards";
import { getVisit } from "@/lib/visits/queries";
import { visitIdParams } from "@/lib/visits/schemas";

export const GET = route(
  { access: ["manager", "technician"], params: visitIdParams, resource: "That visit" },
  async ({ actor, params }) => getVisit(actor, params.visitId),
);
