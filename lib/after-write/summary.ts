// The book's per-property summary row, recomputed from the property's own rows by afterWrite
// (lib/after-write/index.ts) in the transaction of every write that changes what it shows, and by
// the daily sweep. Takes the transaction from its caller.
//
// Readings we chose:
// - Overdue: a scheduled visit whose day has passed without being done, or no visit for more than
//   OVERDUE_AFTER_DAYS with none scheduled (lawns are visited every few weeks in season).
// - Needs attention: declining Index +100, each high alert +30, overdue +20, Index below 60 +10,
//   each moderate alert +5. The reasons are kept with the score so the book can say why.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { addDays, daysBetween, todayIn } from "@/lib/dates";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { LOW_INDEX } from "@/lib/scoring/bands";
import {
  MIN_CHECKS_FOR_CORRELATION,
  NITROGEN_WINDOW_DAYS,
  propertyIndexByVisit,
  recentTrend,
  zoneCorrelations,
} from "@/lib/scoring/history";

const OVERDUE_AFTER_DAYS = 35;
const ATTENTION = {
  declining: 100,
  high: 30,
  overdue: 20,
  lowIndex: 10,
  moderate: 5,
} as const;

const plural = (n: number, word: string) => `${n} ${word}${n === 1 ? "" : "s"}`;

/** Writes the summary row of a property (its time zone given by the caller, who has the row locked). */
export async function refreshPropertySummary(
  executor: Kysely<Database>,
  companyId: string,
  propertyId: string,
  timeZone: string,
): Promise<void> {
  const today = todayIn(timeZone);
  const year = today.slice(0, 4);
  const [zones, checks, visits, alerts, applications] = await Promise.all([
    executor
      .selectFrom("zones")
      .select(["id", "area_ft2", "grass_species"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("archived_at", "is", null)
      .execute(),
    executor
      .selectFrom("zone_checks")
      .innerJoin("visits", "visits.id", "zone_checks.visit_id")
      .select([
        "zone_checks.zone_id",
        "zone_checks.visit_id",
        "zone_checks.sward_index",
        "visits.scheduled_for",
      ])
      .where("zone_checks.company_id", "=", companyId)
      .where("visits.property_id", "=", propertyId)
      .where("visits.company_id", "=", companyId) // lets the planner use visits_property_idx
      .where("visits.status", "!=", "cancelled")
      .where("zone_checks.sward_index", "is not", null)
      .where("visits.scheduled_for", ">=", addDays(today, -365))
      .execute(),
    executor
      .selectFrom("visits")
      .select(["scheduled_for", "status"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("status", "!=", "cancelled")
      .execute(),
    executor
      .selectFrom("risk_alerts")
      .select(["kind", "severity"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("status", "!=", "resolved")
      .execute(),
    // The year's N, and the feedings before each check of the last year (for the N response).
    executor
      .selectFrom("applications")
      .select(["zone_id", "applied_on", "n_lb_per_1000", "wsn_lb_per_1000", "area_ft2"])
      .where("company_id", "=", companyId)
      .where(
        "zone_id",
        "in",
        executor.selectFrom("zones").select("id").where("property_id", "=", propertyId),
      )
      .where("applied_on", ">=", addDays(today, -365 - NITROGEN_WINDOW_DAYS))
      .where("applied_on", "<=", today)
      .execute(),
  ]);
  const yearApplications = applications.filter((a) => a.applied_on >= `${year}-01-01`);

  const area = new Map(zones.map((z) => [z.id, Number(z.area_ft2)]));
  const lawn = zones.reduce((s, z) => s + Number(z.area_ft2), 0);
  const perVisit = propertyIndexByVisit(
    checks
      .filter((c) => area.has(c.zone_id))
      .map((c) => ({
        visitId: c.visit_id,
        date: c.scheduled_for,
        index: c.sward_index!,
        areaFt2: area.get(c.zone_id)!,
      })),
  );
  const latest = perVisit.at(-1) ?? null;
  const trend = recentTrend(perVisit);
  const done = visits
    .filter((v) => v.status === "completed")
    .map((v) => v.scheduled_for)
    .sort();
  const open = visits
    .filter((v) => v.status === "scheduled" || v.status === "in_progress")
    .map((v) => v.scheduled_for)
    .sort();
  const lastVisit = done.at(-1) ?? null;
  const nextVisit = open.find((d) => d >= today) ?? null;
  const missed = open.find((d) => d < today) ?? null;
  const isOverdue =
    missed !== null ||
    (lastVisit !== null &&
      daysBetween(lastVisit, today) > OVERDUE_AFTER_DAYS &&
      nextVisit === null);
  const count = (s: string) => alerts.filter((a) => a.severity === s).length;
  const high = count("high");
  const moderate = count("moderate");
  const nYtd = lawn
    ? yearApplications.reduce((s, a) => s + Number(a.n_lb_per_1000) * Number(a.area_ft2), 0) / lawn
    : 0;
  const nMax = lawn
    ? zones.reduce(
        (s, z) =>
          s + (findGrassSpecies(z.grass_species)?.annualNitrogenLb.max ?? 0) * Number(z.area_ft2),
        0,
      ) / lawn
    : null;

  const reasons: string[] = [];
  let score = 0;
  if (trend?.word === "declining") {
    score += ATTENTION.declining;
    reasons.push(`Declining ${Math.abs(trend.slopePer30Days).toFixed(1)} points / 30 days`);
  }
  if (high) {
    score += ATTENTION.high * high;
    reasons.push(`${plural(high, "high alert")}`);
  }
  if (isOverdue) {
    score += ATTENTION.overdue;
    reasons.push(
      missed
        ? `Visit of ${missed} not done`
        : `No visit for ${daysBetween(lastVisit!, today)} days`,
    );
  }
  if (latest && latest.index < LOW_INDEX) {
    score += ATTENTION.lowIndex;
    reasons.push(`Index ${Math.round(latest.index)}, below ${LOW_INDEX}`);
  }
  if (moderate) {
    score += ATTENTION.moderate * moderate;
    reasons.push(`${plural(moderate, "moderate alert")}`);
  }

  // Which zones' Index follows the N available before each check (lib/scoring/history.ts).
  let enoughChecks = 0;
  let respondingToN = 0;
  for (const z of zones) {
    const points = checks
      .filter((c) => c.zone_id === z.id)
      .map((c) => ({ date: c.scheduled_for, index: c.sward_index! }));
    const feedings = applications
      .filter((a) => a.zone_id === z.id)
      .map((a) => ({
        date: a.applied_on,
        nLb: Number(a.n_lb_per_1000),
        wsnLb: Number(a.wsn_lb_per_1000),
        productName: "",
      }));
    const r = zoneCorrelations(points, feedings, []);
    if (r.n >= MIN_CHECKS_FOR_CORRELATION) enoughChecks++;
    if (r.respondsToNitrogen) respondingToN++;
  }

  const row = {
    property_id: propertyId,
    company_id: companyId,
    latest_index: latest?.index ?? null,
    latest_index_on: latest?.date ?? null,
    trend_slope: trend?.slopePer30Days ?? null,
    trend_r2: trend?.r2 ?? null,
    trend_n: trend?.n ?? 0,
    trend_word: trend?.word ?? null,
    last_visit_on: lastVisit,
    next_visit_on: nextVisit,
    missed_visit_on: missed,
    is_overdue: isOverdue,
    alerts_high: high,
    alerts_moderate: moderate,
    alerts_low: count("low"),
    alert_kinds: [...new Set(alerts.map((a) => a.kind))].sort(),
    n_ytd_lb: nYtd,
    n_max_lb: nMax,
    attention_score: score,
    attention_reasons: reasons,
    zones_total: zones.length,
    zones_enough_checks: enoughChecks,
    zones_responding_n: respondingToN,
    updated_at: new Date(),
  };
  await executor
    .insertInto("property_summaries")
    .values(row)
    .onConflict((oc) => oc.column("property_id").doUpdateSet(row))
    .execute();
}
