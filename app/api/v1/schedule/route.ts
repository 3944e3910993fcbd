// GET /api/v1/schedule?week=YYYY-MM-DD — the week (Monday to Sunday) holding that day, or this
// week: the company's technicians with their stops a day, and every stop of the seven days
// (managers).
import { route } from "@/lib/auth/guards";
import { getWeekSchedule } from "@/lib/schedule/queries";
import { weekQuery } from "@/lib/schedule/schemas";

export const GET = route({ access: ["manager"], query: weekQuery }, async ({ actor, query }) =>
  getWeekSchedule(actor, query.week),
);
