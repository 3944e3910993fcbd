// Writes of the week's schedule (managers): move stops to another day or technician, move a rained-out
// day's remaining stops to the next working day, set a technician's stops a day. A move keeps the
// stops' order, lands after what the day already has, and warns (a second visit that day, a round
// with N or P inside the no-fertilizer window, a day past capacity, a Sunday) before it is made
// unless the manager confirms. Only stops not yet started move. Each moved stop is audited, and
// the book (next visit) follows in the same transaction.
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { putsDownNOrP } from "@/lib/agronomy/season";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { addDays, formatDate, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";
import { translator } from "@/lib/i18n/translate";
import { findCompanyTechnician } from "@/lib/people/queries";
import { SCHEDULE_AHEAD_DAYS } from "@/lib/visits/schemas";

import type { MovePreviewDto } from "./dto";
import { nextWorkingDay, planMove, type MoveWarning, type PlanStop } from "./plan";
import type { MoveStopsInput, RainDelayInput } from "./schemas";

function requireManager(actor: Actor) {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the schedule.");
}

type Trx = Transaction<Database>;

/** The stops, locked, with what the plan needs (404 for any not of this company). */
async function lockStops(trx: Trx, actor: Actor, visitIds: readonly string[]) {
  const rows = await trx
    .selectFrom("visits")
    .innerJoin("properties", (j) =>
      j
        .onRef("properties.id", "=", "visits.property_id")
        .onRef("properties.company_id", "=", "visits.company_id"),
    )
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .leftJoin("users as tech", "tech.id", "visits.technician_id")
    .select([
      "visits.id",
      "visits.property_id",
      "properties.name as property_name",
      "visits.scheduled_for",
      "visits.technician_id",
      "tech.name as technician_name",
      "visits.stop_order",
      "visits.status",
      "visits.planned_service",
      "rule_sets.pro_no_fertilizer_after",
      "rule_sets.pro_no_fertilizer_before",
    ])
    .where("visits.company_id", "=", actor.companyId)
    .where("visits.id", "in", [...visitIds])
    .orderBy("visits.id")
    .forUpdate("visits")
    .execute();
  if (rows.length !== new Set(visitIds).size) throw notFound("That stop");
  const started = rows.filter((r) => r.status !== "scheduled");
  if (started.length)
    throw new AppError(
      "conflict",
      `Only stops not yet started can be moved: ${started
        .map(
          (r) =>
            `${r.property_name} (${{ in_progress: "in progress", completed: "finished", cancelled: "called off", scheduled: "" }[r.status]})`,
        )
        .join(", ")}.`,
    );
  return rows;
}

type LockedStop = Awaited<ReturnType<typeof lockStops>>[number];

const toPlanStop = (r: LockedStop): PlanStop => ({
  id: r.id,
  propertyId: r.property_id,
  propertyName: r.property_name,
  scheduledFor: r.scheduled_for,
  technicianId: r.technician_id,
  stopOrder: r.stop_order,
  putsDownNOrP: putsDownNOrP(r.planned_service),
  window:
    r.pro_no_fertilizer_after && r.pro_no_fertilizer_before
      ? [r.pro_no_fertilizer_after, r.pro_no_fertilizer_before]
      : null,
});

async function activeTechnician(trx: Trx, actor: Actor, technicianId: string) {
  const tech = await findCompanyTechnician(actor, technicianId, { active: true, trx });
  if (!tech)
    throw new AppError("invalid_input", "Some values need attention.", {
      technicianId: ["Technician: choose one of your technicians."],
    });
  return tech;
}

function warningWords(
  w: MoveWarning,
  toDate: string,
  technicianName: string | null,
  locale: string,
): string {
  const day = formatDate(toDate, locale);
  const t = translator(locale, "schedule");
  switch (w.kind) {
    case "same_day":
      return t("warnings.sameDay", { property: w.propertyName, day });
    case "blackout":
      return t("warnings.blackout", { property: w.propertyName, day });
    case "over_capacity":
      return t("warnings.overCapacity", {
        technician: technicianName ?? t("warnings.someTechnician"),
        count: w.count,
        capacity: w.capacity,
        day,
      });
    case "not_working_day":
      return t("warnings.notWorkingDay", { day });
  }
}

/**
 * Plans (and unless previewing, makes) the move of `stops` to `toDate`: each group of stops going
 * to one technician lands after that technician's stops of the day.
 */
async function moveLocked(
  trx: Trx,
  actor: Actor,
  stops: LockedStop[],
  toDate: string,
  technicianId: string | undefined,
  options: { confirm: boolean; preview: boolean; action: "move" | "rain_delay" },
): Promise<MovePreviewDto[]> {
  const today = todayIn(actor.companyTimeZone);
  const refuse = (message: string) =>
    new AppError("invalid_input", "Some values need attention.", { toDate: [message] });
  if (toDate < today)
    throw refuse(
      `Move to: today (${formatDate(today, actor.companyLocale)}) or a later day, not in the past.`,
    );
  if (toDate > addDays(today, SCHEDULE_AHEAD_DAYS))
    throw refuse(
      `Move to: at most 18 months ahead (${formatDate(addDays(today, SCHEDULE_AHEAD_DAYS), actor.companyLocale)} or earlier).`,
    );
  const target = technicianId ? await activeTechnician(trx, actor, technicianId) : null;

  // Group by the technician each stop goes to.
  const groups = new Map<string | null, LockedStop[]>();
  for (const s of stops) {
    const key = target ? target.id : s.technician_id;
    groups.set(key, [...(groups.get(key) ?? []), s]);
  }
  const moving = stops.map((s) => s.id);
  const dayVisits = await trx
    .selectFrom("visits")
    .select(["property_id", "technician_id", "stop_order"])
    .where("company_id", "=", actor.companyId)
    .where("scheduled_for", "=", toDate)
    .where("status", "!=", "cancelled")
    .where("id", "not in", moving)
    .execute();
  const capacities = new Map(
    (
      await trx
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["users.id", "users.name", "memberships.daily_stop_capacity"])
        .where("memberships.company_id", "=", actor.companyId)
        .where("memberships.role", "=", "technician")
        .execute()
    ).map((r) => [r.id, r]),
  );

  const previews: MovePreviewDto[] = [];
  const plans = [...groups.entries()].map(([techId, group]) => {
    const theirs = dayVisits.filter((v) => v.technician_id === techId);
    const plan = planMove(group.map(toPlanStop), toDate, techId, {
      propertyIds: dayVisits.map((v) => v.property_id),
      count: theirs.length,
      lastStopOrder: Math.max(0, ...theirs.map((v) => v.stop_order)),
      capacity: techId ? (capacities.get(techId)?.daily_stop_capacity ?? 10) : Infinity,
    });
    const techName = techId ? (capacities.get(techId)?.name ?? null) : null;
    const warnings = plan.warnings.map((w) =>
      warningWords(w, toDate, techName, actor.companyLocale),
    );
    previews.push({
      toDate,
      technicianId: techId,
      technicianName: techName,
      moves: plan.moves.map((m) => ({
        ...m,
        propertyName: group.find((s) => s.id === m.stopId)!.property_name,
      })),
      warnings,
    });
    return plan;
  });
  if (options.preview) return previews;
  const warnings = previews.flatMap((p) => p.warnings);
  if (warnings.length && !options.confirm)
    throw new AppError(
      "invalid_input",
      "Check the warnings below, then confirm or change the move.",
      { confirm: warnings },
      { warnings: ["confirm"] },
    );

  for (const plan of plans)
    for (const move of plan.moves) {
      const before = stops.find((s) => s.id === move.stopId)!;
      await trx
        .updateTable("visits")
        .set({
          scheduled_for: toDate,
          stop_order: move.stopOrder,
          technician_id: plan.technicianId,
          version: sql<number>`version + 1`,
          updated_at: sql<Date>`now()`,
        })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", move.stopId)
        .execute();
      const newTech = plan.technicianId ? (capacities.get(plan.technicianId)?.name ?? null) : null;
      await recordAudit(trx, actor, {
        entity: "visit",
        entityId: move.stopId,
        action: options.action,
        changes: {
          scheduledFor: { from: before.scheduled_for, to: toDate },
          ...(before.technician_id !== plan.technicianId
            ? { technician: { from: before.technician_name, to: newTech } }
            : {}),
        },
      });
    }
  // The book shows each property's next visit.
  for (const propertyId of new Set(stops.map((s) => s.property_id)))
    await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "keep" });
  return previews;
}

export async function moveStops(actor: Actor, input: MoveStopsInput): Promise<MovePreviewDto[]> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      const stops = await lockStops(trx, actor, input.visitIds);
      return moveLocked(trx, actor, stops, input.toDate, input.technicianId, {
        confirm: input.confirm,
        preview: input.preview,
        action: "move",
      });
    });
}

/**
 * A rained-out day: every stop of `date` not yet started (one technician's, or everyone's) goes to
 * the next working day, each with its own technician, in the same order after what that day has.
 */
export async function rainDelay(actor: Actor, input: RainDelayInput): Promise<MovePreviewDto[]> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      if (input.technicianId) await activeTechnician(trx, actor, input.technicianId);
      const ids = (
        await trx
          .selectFrom("visits")
          .select("id")
          .where("company_id", "=", actor.companyId)
          .where("scheduled_for", "=", input.date)
          .where("status", "=", "scheduled")
          .$if(Boolean(input.technicianId), (q) =>
            q.where("technician_id", "=", input.technicianId!),
          )
          .execute()
      ).map((r) => r.id);
      if (ids.length === 0)
        throw new AppError(
          "invalid_input",
          `No stops left to move on ${formatDate(input.date, actor.companyLocale)}: every stop there is started, finished or called off.`,
          {
            date: [`Day: no stops left to move on ${formatDate(input.date, actor.companyLocale)}.`],
          },
        );
      const stops = await lockStops(trx, actor, ids);
      return moveLocked(trx, actor, stops, nextWorkingDay(input.date), undefined, {
        confirm: input.confirm,
        preview: input.preview,
        action: "rain_delay",
      });
    });
}

export async function setDailyCapacity(
  actor: Actor,
  technicianId: string,
  capacity: number,
): Promise<{ technicianId: string; capacity: number }> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      const before = await trx
        .selectFrom("memberships")
        .select("daily_stop_capacity")
        .where("company_id", "=", actor.companyId)
        .where("role", "=", "technician")
        .where("user_id", "=", technicianId)
        .forUpdate()
        .executeTakeFirst();
      if (!before) throw notFound("That technician");
      await trx
        .updateTable("memberships")
        .set({ daily_stop_capacity: capacity })
        .where("company_id", "=", actor.companyId)
        .where("user_id", "=", technicianId)
        .execute();
      if (before.daily_stop_capacity !== capacity)
        await recordAudit(trx, actor, {
          entity: "person",
          entityId: technicianId,
          action: "set_capacity",
          changes: { dailyStopCapacity: { from: before.daily_stop_capacity, to: capacity } },
        });
      return { technicianId, capacity };
    });
}
