// GET /api/v1/visits/:visitId/audit — { items: AuditEventDto[] }: who changed what on this visit, newest first (manager).
import { route } from "@/lib/auth/guards";
import { getVisit, listVisitAudit } from "@/lib/visits/queries";
import { visitIdParams } from "@/lib/visits/schemas";

export const GET = route(
  { access: ["manager"], params: visitIdParams, resource: "That visit" },
  async ({ actor, params }) => {
    await getVisit(actor, params.visitId); // 404 when out of scope
    return { items: await listVisitAudit(actor, params.visitId) };
  },
);
