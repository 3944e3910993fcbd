// GET  /api/v1/visits — { items: VisitSummaryDto[] } in scope, filtered by date/from/to/technicianId/propertyId/status (staff).
// POST /api/v1/visits — schedule a visit (manager); a client-chosen id makes retries safe.
import { route } from "@/lib/auth/guards";
import { scheduleVisit } from "@/lib/visits/mutations";
import { listVisits } from "@/lib/visits/queries";
import { listVisitsQuery, scheduleVisitSchema } from "@/lib/visits/schemas";

export const GET = route(
  { access: ["manager", "technician"], query: listVisitsQuery },
  async ({ actor, query }) => ({ items: await listVisits(actor, query) }),
);

export const POST = route(
  { access: ["manager"], body: scheduleVisitSchema },
  async ({ actor, body }) => scheduleVisit(actor, body),
);
