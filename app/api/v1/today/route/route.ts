// GET  /api/v1/today/route?date=YYYY-MM-DD[&technicianId=] — the day's route: stops in stored
//      order with each drive, totals in meters and seconds, where it starts, whether the figures are
//      estimates, and the driving order Sward proposes.
// POST /api/v1/today/route { date, technicianId? } — "Put in driving order": stores the proposal.
// Technicians: their own day; managers name the technician.
import { route } from "@/lib/auth/guards";
import { putInDrivingOrder } from "@/lib/day-route/mutations";
import { getDayRoute } from "@/lib/day-route/queries";
import { dayRouteQuery, drivingOrderSchema } from "@/lib/day-route/schemas";

export const GET = route(
  { access: ["manager", "technician"], query: dayRouteQuery },
  async ({ actor, query }) => getDayRoute(actor, query),
);

export const POST = route(
  { access: ["manager", "technician"], body: drivingOrderSchema },
  async ({ actor, body }) => putInDrivingOrder(actor, body),
);
