// Reads of the week's schedule (managers): the company's technicians with their daily capacity and
// every stop of the seven days.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";

import type { ScheduleStopDto, ScheduleTechnicianDto, WeekScheduleDto } from "./dto";
import { weekDays, weekStart } from "./plan";

async function listScheduleTechnicians(actor: Actor): Promise<ScheduleTechnicianDto[]> {
  const rows = await db()
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select(["users.id", "users.name", "memberships.daily_stop_capacity"])
    .where("memberships.company_id", "=", actor.companyId)
    .where("memberships.role", "=", "technician")
    .where("users.disabled_at", "is", null)
    .orderBy("users.name")
    .execute();
  return rows.map((r) => ({ id: r.id, name: r.name, capacity: r.daily_stop_capacity }));
}

export async function getWeekSchedule(actor: Actor, anyDay?: string): Promise<WeekScheduleDto> {
  const today = todayIn(actor.companyTimeZone);
  const monday = weekStart(anyDay ?? today);
  const [technicians, rows] = await Promise.all([
    listScheduleTechnicians(actor),
    db()
      .selectFrom("visits")
      .innerJoin("properties", (j) =>
        j
          .onRef("properties.id", "=", "visits.property_id")
          .onRef("properties.company_id", "=", "visits.company_id"),
      )
      .select([
        "visits.id",
        "visits.property_id",
        "properties.name as property_name",
        "properties.city",
        "visits.scheduled_for",
        "visits.stop_order",
        "visits.planned_service",
        "visits.status",
        "visits.cancel_kind",
        "visits.technician_id",
      ])
      .where("visits.company_id", "=", actor.companyId)
      .where("visits.scheduled_for", ">=", monday)
      .where("visits.scheduled_for", "<=", addDays(monday, 6))
      .orderBy("visits.scheduled_for")
      .orderBy("visits.stop_order")
      .orderBy("properties.name")
      .execute(),
  ]);
  const stops: ScheduleStopDto[] = rows.map((r) => ({
    id: r.id,
    propertyId: r.property_id,
    propertyName: r.property_name,
    city: r.city,
    scheduledFor: r.scheduled_for,
    stopOrder: r.stop_order,
    plannedService: r.planned_service,
    status: r.status,
    cancelKind: r.cancel_kind,
    technicianId: r.technician_id,
  }));
  return { weekStart: monday, days: weekDays(monday), today, technicians, stops };
}
