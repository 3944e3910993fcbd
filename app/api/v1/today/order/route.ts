// PUT /api/v1/today/order { date, technicianId?, visitIds } — the day's stops in the order set by
// hand (Today's move up / move down): every stop of the day, first to last; 409 when the day's
// stops changed meanwhile. Technicians: their own day; managers name the technician.
import { route } from "@/lib/auth/guards";
import { setStopOrder } from "@/lib/day-route/mutations";
import { stopOrderSchema } from "@/lib/day-route/schemas";

export const PUT = route(
  { access: ["manager", "technician"], body: stopOrderSchema },
  async ({ actor, body }) => setStopOrder(actor, body),
);
