// Evaluates every risk rule for one property on a day and applies the lifecycle to its alerts,
// inside the caller's transaction (afterWrite). Weather comes from the cache only: no network in a
// transaction; refreshAlertWeather fills the cache beforehand where fresh weather matters (visit
// finish, the daily sweep). Idempotent: the same condition updates its one live alert.
import type { Kysely, Transaction } from "kysely";

import type { Database } from "@/db/schema";
import { TURF_KC, turfKcOf, zoneWateringByDate } from "@/lib/agronomy/water";
import { addDays, todayIn } from "@/lib/dates";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { decide } from "@/lib/risk/lifecycle";
import {
  blackoutApplication,
  brownPatchWeather,
  decliningIndex,
  dollarSpotWeather,
  droughtStress,
  heatFeeding,
  lateSeasonFeeding,
  mattedCanopy,
  mowingTooShort,
  overApplication,
  pythiumWeather,
  seedingConflict,
  tornTips,
  type ApplicationFacts,
  type CheckFacts,
  type RiskDay,
  type RuleResult,
} from "@/lib/risk/rules";
import { recentTrend } from "@/lib/scoring/history";
import type { WeatherProvider } from "@/lib/services/weather/provider";
import { weatherFromCache } from "@/lib/weather/cache";
import { deriveDays } from "@/lib/weather/derived";

/** The first month-day a rule set forbids: the day after its "no fertilizer after" day. */
function firstForbiddenDay(after: string | null): string | null {
  if (after === null) return null;
  const d = new Date(Date.UTC(2000, Number(after.slice(0, 2)) - 1, Number(after.slice(3)) + 1));
  return d.toISOString().slice(5, 10);
}

export interface EvaluationSummary {
  propertyId: string;
  at: string;
  raised: number;
  reopened: number;
  updated: number;
  cleared: number;
  autoResolved: number;
  weather: "ok" | "cached" | "unavailable";
}

type Executor = Kysely<Database>;
const CHECK_WINDOW_DAYS = 150;
/** The weather the rules read: 20 days back (14-day balances and spells), 3 days of forecast. */
const weatherWindow = (at: string) => ({ from: addDays(at, -20), to: addDays(at, 3) });

/**
 * Fills the weather cache for a property's evaluation from the provider. Network: call it before
 * the writing transaction, never inside. A failing service leaves the cache as it was.
 */
export async function refreshAlertWeather(
  executor: Executor,
  provider: WeatherProvider | null,
  companyId: string,
  propertyId: string,
  at?: string,
): Promise<void> {
  if (!provider) return;
  const p = await executor
    .selectFrom("properties")
    .select(["latitude", "longitude", "time_zone"])
    .where("company_id", "=", companyId)
    .where("id", "=", propertyId)
    .executeTakeFirst();
  if (!p) return;
  const today = todayIn(p.time_zone);
  const w = weatherWindow(at ?? today);
  await weatherFromCache(executor, provider, p.latitude, p.longitude, w.from, w.to, today);
}

/** The rule results for one property on `at` (zone rules per zone, weather rules for the property). */
async function propertyRuleResults(
  executor: Executor,
  companyId: string,
  propertyId: string,
  at: string,
) {
  const property = await executor
    .selectFrom("properties")
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .select([
      "properties.id",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
      "rule_sets.name as rule_set_name",
      "rule_sets.citation as rule_set_citation",
      "rule_sets.pro_no_fertilizer_after",
    ])
    .where("properties.company_id", "=", companyId)
    .where("properties.id", "=", propertyId)
    .executeTakeFirstOrThrow();
  const today = todayIn(property.time_zone);
  const year = at.slice(0, 4);
  const [zones, checks, applications, seedingApplications, waterings] = await Promise.all([
    executor
      .selectFrom("zones")
      .select(["id", "name", "grass_species"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("archived_at", "is", null)
      // The property page's order: evidence that names zones lists them the same way every time.
      .orderBy("sort_order")
      .orderBy("name")
      .execute(),
    executor
      .selectFrom("zone_checks")
      .innerJoin("visits", "visits.id", "zone_checks.visit_id")
      .select([
        "zone_checks.zone_id",
        "zone_checks.mowing_direction",
        "zone_checks.is_matted",
        "zone_checks.is_scalped",
        "zone_checks.has_torn_tips",
        "zone_checks.height_of_cut_in",
        "zone_checks.mowed_today",
        "zone_checks.height_before_mowing_in",
        "zone_checks.symptoms",
        "zone_checks.sward_index",
        "visits.scheduled_for",
      ])
      .where("zone_checks.company_id", "=", companyId)
      .where("visits.property_id", "=", propertyId)
      .where("visits.company_id", "=", companyId) // lets the planner use visits_property_idx
      .where("visits.status", "!=", "cancelled")
      .where("zone_checks.status", "=", "done")
      .where("visits.scheduled_for", "<=", at)
      .where("visits.scheduled_for", ">=", addDays(at, -CHECK_WINDOW_DAYS))
      .orderBy("visits.scheduled_for")
      .orderBy("zone_checks.created_at")
      .execute(),
    executor
      .selectFrom("applications")
      .innerJoin("products", "products.id", "applications.product_id")
      .select([
        "applications.zone_id",
        "applications.applied_on",
        "applications.n_lb_per_1000",
        "applications.findings",
        "products.name as product_name",
      ])
      .where("applications.company_id", "=", companyId)
      .where(
        "applications.zone_id",
        "in",
        executor.selectFrom("zones").select("id").where("property_id", "=", propertyId),
      )
      .where("applications.applied_on", ">=", `${year}-01-01`)
      .where("applications.applied_on", "<=", at)
      .execute(),
    // Seed and pre-emergence products on the zones in the 12 months to the day (the conflict
    // rule; the longest interval is under a year).
    executor
      .selectFrom("applications")
      .innerJoin("products", "products.id", "applications.product_id")
      .select([
        "applications.zone_id",
        "applications.applied_on",
        "products.name as product_name",
        "products.pre_emergence_active",
        "products.seeding_interval_days",
        "products.seed_species",
      ])
      .where("applications.company_id", "=", companyId)
      .where(
        "applications.zone_id",
        "in",
        executor.selectFrom("zones").select("id").where("property_id", "=", propertyId),
      )
      .where((eb) =>
        eb.or([
          eb("products.pre_emergence_active", "is not", null),
          eb("products.seed_species", "is not", null),
        ]),
      )
      .where("applications.applied_on", ">", addDays(at, -366))
      .where("applications.applied_on", "<=", at)
      .execute(),
    executor
      .selectFrom("waterings")
      .select(["zone_id", "watered_on", "depth_in"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("watered_on", ">=", addDays(at, -20))
      .execute(),
  ]);
  const window = weatherWindow(at);
  const weather = await weatherFromCache(
    executor,
    null, // the cache only: this runs inside the writing transaction
    property.latitude,
    property.longitude,
    window.from,
    window.to,
    today,
  );
  const raw = new Map(weather.days.map((d) => [d.date, d]));
  const toRiskDays = (kc: number, wateringInByDate: Record<string, number>) =>
    deriveDays(weather.days, { latitudeDeg: property.latitude, kc, wateringInByDate }).map(
      (d): RiskDay & { balance14In: number } => ({
        ...d,
        rhMinPct: raw.get(d.date)?.rhMinPct ?? null,
        rhMaxPct: raw.get(d.date)?.rhMaxPct ?? null,
        hourly: raw.get(d.date)?.hourly ?? null,
      }),
    );
  const propertyDays = toRiskDays(TURF_KC.cool, {});
  const ruleSource = property.rule_set_name
    ? `${property.rule_set_name}: ${property.rule_set_citation}`
    : null;

  // Unknown species count as cool-season, as the late-season rule reads them.
  const seasonOf = (key: string) => findGrassSpecies(key)?.season ?? "cool";
  const coolSeasonZones = zones
    .filter((z) => seasonOf(z.grass_species) === "cool")
    .map((z) => z.name);
  const results: { zoneId: string | null; result: RuleResult }[] = [
    dollarSpotWeather(propertyDays, at),
    brownPatchWeather(propertyDays, at, coolSeasonZones),
    pythiumWeather(propertyDays, at),
  ].map((result) => ({ zoneId: null, result }));
  for (const z of zones) {
    const species = findGrassSpecies(z.grass_species);
    const own = checks.filter((c) => c.zone_id === z.id);
    const facts: CheckFacts[] = own.map((c) => ({
      date: c.scheduled_for,
      mowingDirection: c.mowing_direction,
      isMatted: c.is_matted,
      isScalped: c.is_scalped,
      hasTornTips: c.has_torn_tips,
      heightOfCutIn: c.height_of_cut_in === null ? null : Number(c.height_of_cut_in),
      mowedToday: c.mowed_today,
      heightBeforeMowingIn:
        c.height_before_mowing_in === null ? null : Number(c.height_before_mowing_in),
      symptomKeys: c.symptoms.map((s) => s.key),
    }));
    const apps: ApplicationFacts[] = applications
      .filter((a) => a.zone_id === z.id)
      .map((a) => ({
        date: a.applied_on,
        nLb: Number(a.n_lb_per_1000),
        productName: a.product_name,
        findings: (a.findings as ApplicationFacts["findings"]) ?? [],
      }));
    const days = toRiskDays(turfKcOf(z.grass_species), zoneWateringByDate(waterings, z.id));
    const trend = recentTrend(
      own
        .filter((c) => c.sward_index !== null)
        .map((c) => ({ date: c.scheduled_for, index: c.sward_index! })),
    );
    const zoneResults = [
      mattedCanopy(facts, days, at, seasonOf(z.grass_species)),
      droughtStress(days.find((d) => d.date === at)?.balance14In ?? null, days, at, facts.at(-1)),
      heatFeeding(apps, days, at, seasonOf(z.grass_species)),
      overApplication(apps, species?.annualNitrogenLb.max ?? null, year, ruleSource),
      blackoutApplication(apps, year, ruleSource),
      mowingTooShort(facts, species?.heightOfCutIn ?? null),
      tornTips(facts),
      decliningIndex(trend),
      lateSeasonFeeding(
        seasonOf(z.grass_species),
        apps,
        at,
        firstForbiddenDay(property.pro_no_fertilizer_after),
      ),
      seedingConflict(
        seedingApplications
          .filter((a) => a.zone_id === z.id)
          .map((a) => ({
            date: a.applied_on,
            productName: a.product_name,
            preEmergence: a.pre_emergence_active
              ? { active: a.pre_emergence_active, labelIntervalDays: a.seeding_interval_days }
              : null,
            seedSpecies: a.seed_species,
          })),
        at,
      ),
    ];
    for (const result of zoneResults) results.push({ zoneId: z.id, result });
  }
  return { results, weatherStatus: weather.status };
}

/**
 * Evaluates a property on `at` (default: its local today) and applies the lifecycle, in the
 * caller's transaction, which must already hold the property row's lock (afterWrite takes it).
 */
export async function evaluateAlerts(
  trx: Transaction<Database>,
  companyId: string,
  propertyId: string,
  options: { at: string; visitId?: string | null },
): Promise<EvaluationSummary> {
  const at = options.at;
  const { results, weatherStatus } = await propertyRuleResults(trx, companyId, propertyId, at);
  const summary: EvaluationSummary = {
    propertyId,
    at,
    raised: 0,
    reopened: 0,
    updated: 0,
    cleared: 0,
    autoResolved: 0,
    weather: weatherStatus,
  };
  const existing = await trx
    .selectFrom("risk_alerts")
    .selectAll()
    .where("company_id", "=", companyId)
    .where("property_id", "=", propertyId)
    .orderBy("created_at", "desc")
    .execute();
  for (const { zoneId, result } of results) {
    const same = existing.filter((a) => a.kind === result.kind && a.zone_id === zoneId);
    const live = same.find((a) => a.status !== "resolved");
    const lastResolved = same.find((a) => a.status === "resolved");
    const decision = decide(
      live
        ? {
            id: live.id,
            status: live.status as "open" | "acknowledged",
            severity: live.severity,
            summary: live.summary,
            clearSince: live.clear_since,
          }
        : null,
      lastResolved?.id ?? null,
      result,
      at,
    );
    await applyDecision(
      trx,
      companyId,
      propertyId,
      zoneId,
      result,
      decision,
      live?.id ?? null,
      live?.status ?? null,
      at,
      options.visitId ?? null,
      summary,
    );
  }
  return summary;
}

async function applyDecision(
  trx: Transaction<Database>,
  companyId: string,
  propertyId: string,
  zoneId: string | null,
  result: RuleResult,
  decision: ReturnType<typeof decide>,
  liveId: string | null,
  liveStatus: string | null,
  at: string,
  visitId: string | null,
  summary: EvaluationSummary,
) {
  const evidence = JSON.stringify(result.evidence);
  const event = (
    alertId: string,
    action: Database["risk_alert_events"]["action"],
    from: string | null,
    to: string | null,
    details: Record<string, unknown> = {},
  ) =>
    trx
      .insertInto("risk_alert_events")
      .values({
        alert_id: alertId,
        company_id: companyId,
        action,
        from_status: from as never,
        to_status: to as never,
        details: JSON.stringify(details),
      })
      .execute();
  switch (decision.action) {
    case "none":
      return;
    case "raise": {
      const { id } = await trx
        .insertInto("risk_alerts")
        .values({
          company_id: companyId,
          property_id: propertyId,
          zone_id: zoneId,
          kind: result.kind,
          severity: result.severity,
          summary: result.summary,
          evidence,
          source: result.source,
          raised_on: at,
          last_seen_on: at,
          raised_by_visit_id: visitId,
          previous_alert_id: decision.previousAlertId,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await event(id, decision.previousAlertId ? "reopened" : "raised", null, "open", {
        severity: result.severity,
        evidence: result.evidence,
        previousAlertId: decision.previousAlertId,
      });
      if (decision.previousAlertId) summary.reopened++;
      else summary.raised++;
      return;
    }
    case "update":
      await trx
        .updateTable("risk_alerts")
        .set({
          severity: result.severity,
          summary: result.summary,
          evidence,
          last_seen_on: at,
          clear_since: null,
          updated_at: new Date(),
        })
        .where("id", "=", liveId!)
        .execute();
      if (decision.severityChanged || decision.returned) {
        await event(liveId!, decision.returned ? "returned" : "updated", liveStatus, liveStatus, {
          severity: result.severity,
          evidence: result.evidence,
        });
        summary.updated++;
      }
      return;
    case "clearing":
      await trx
        .updateTable("risk_alerts")
        .set({ clear_since: decision.since, updated_at: new Date() })
        .where("id", "=", liveId!)
        .execute();
      await event(liveId!, "cleared", liveStatus, liveStatus, { evidence: result.evidence });
      summary.cleared++;
      return;
    case "auto_resolve":
      await trx
        .updateTable("risk_alerts")
        .set({
          status: "resolved",
          resolution: "auto",
          resolved_at: new Date(),
          updated_at: new Date(),
        })
        .where("id", "=", liveId!)
        .execute();
      await event(liveId!, "auto_resolved", liveStatus, "resolved", {
        clearSince: decision.clearSince,
        evidence: result.evidence,
      });
      summary.autoResolved++;
      return;
  }
}
