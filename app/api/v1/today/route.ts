// GET /api/v1/today?date=YYYY-MM-DD[&technicianId=] — a technician's stops in order, with last visit and open concerns.
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { isIsoDate, todayIn } from "@/lib/dates";
import { listTodayStops } from "@/lib/visits/queries";

const query = z
  .object({
    date: z.string().refine(isIsoDate, "Use a date like 2026-06-15.").optional(),
    technicianId: z.uuid().optional(),
  })
  .strict();

export const GET = route({ access: ["manager", "technician"], query }, async ({ actor, query }) => {
  const date = query.date ?? todayIn(actor.companyTimeZone);
  return { date, items: await listTodayStops(actor, date, query.technicianId) };
});
