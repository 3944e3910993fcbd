// Index history reads: a zone's, a property's and the book's. Rows come from here; every figure
// is computed by the pure functions of lib/scoring/history.ts. Stored Indexes only (never
// recomputed at read time); weather read from the shared cache
// (pages refresh it first with lib/weather/mutations.ts).
import "server-only";

import { db } from "@/db";
import { lawnKc, turfKcOf, zoneWateringByDate } from "@/lib/agronomy/water";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { deriveDays } from "@/lib/weather/derived";
import { getCachedWeather, getPropertyLocation } from "@/lib/weather/queries";

import type { BookScoring, PropertyScoreHistory, ZoneScoreHistory } from "./dto";
import {
  indexDistribution,
  propertyIndexByVisit,
  propertyNitrogenEvents,
  recentTrend,
  seasonChange,
  zoneCorrelations,
  type CheckPoint,
  type NitrogenEvent,
} from "./history";

/** How far back histories reach: one year of checks (charts start at the first of them). */
const HISTORY_DAYS = 365;

/** Everything the Index charts of a property need: per visit, per zone, with weather. */
export async function getPropertyScoreHistory(
  actor: Actor,
  propertyId: string,
  options: { weather?: boolean } = {},
): Promise<PropertyScoreHistory> {
  const property = await getPropertyLocation(actor, propertyId);
  const today = todayIn(property.time_zone);
  const since = addDays(today, -HISTORY_DAYS);
  const companyId = actor.companyId;

  const [zones, checks, applications, waterings] = await Promise.all([
    db()
      .selectFrom("zones")
      .select(["id", "name", "area_ft2", "grass_species"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("archived_at", "is", null)
      .orderBy("sort_order")
      .orderBy("name")
      .execute(),
    db()
      .selectFrom("zone_checks")
      .innerJoin("visits", "visits.id", "zone_checks.visit_id")
      .select([
        "zone_checks.id",
        "zone_checks.zone_id",
        "zone_checks.visit_id",
        "zone_checks.sward_index",
        "visits.scheduled_for",
      ])
      .select((eb) =>
        eb
          .exists(
            eb
              .selectFrom("photos")
              .select("photos.id")
              .whereRef("photos.zone_check_id", "=", "zone_checks.id"),
          )
          .as("has_photo"),
      )
      .where("zone_checks.company_id", "=", companyId)
      .where("visits.property_id", "=", propertyId)
      .where("visits.company_id", "=", companyId) // lets the planner use visits_property_idx
      .where("visits.status", "!=", "cancelled")
      .where("visits.scheduled_for", ">=", since)
      .where("zone_checks.sward_index", "is not", null)
      .orderBy("visits.scheduled_for")
      .execute(),
    db()
      .selectFrom("applications")
      .innerJoin("visits", "visits.id", "applications.visit_id")
      .innerJoin("products", "products.id", "applications.product_id")
      .select([
        "applications.zone_id",
        "applications.applied_on",
        "applications.n_lb_per_1000",
        "applications.wsn_lb_per_1000",
        "applications.area_ft2",
        "products.name as product_name",
      ])
      .where("applications.company_id", "=", companyId)
      .where("visits.property_id", "=", propertyId)
      .where("visits.company_id", "=", companyId) // lets the planner use visits_property_idx
      .where("applications.applied_on", ">=", addDays(since, -60))
      .orderBy("applications.applied_on")
      .execute(),
    db()
      .selectFrom("waterings")
      .select(["zone_id", "watered_on", "depth_in"])
      .where("company_id", "=", companyId)
      .where("property_id", "=", propertyId)
      .where("watered_on", ">=", addDays(since, -15))
      .execute(),
  ]);

  const first = checks[0]?.scheduled_for ?? today;
  const from = addDays(first, -7) < since ? since : addDays(first, -7);
  // Weather from 15 days before the first check, for the 14-day balance the day before it.
  const weather =
    options.weather === false
      ? { days: [], status: "unavailable" as const, message: null }
      : await getCachedWeather(
          property.latitude,
          property.longitude,
          addDays(first, -15),
          today,
          today,
        );

  const lawnArea = zones.reduce((s, z) => s + Number(z.area_ft2), 0);
  const zoneHistories: ZoneScoreHistory[] = zones.map((z) => {
    const own = checks.filter((c) => c.zone_id === z.id);
    const points: CheckPoint[] = own.map((c) => ({
      date: c.scheduled_for,
      index: c.sward_index!,
      visitId: c.visit_id,
      hasPhoto: Boolean(c.has_photo),
    }));
    const apps: NitrogenEvent[] = applications
      .filter((a) => a.zone_id === z.id)
      .map((a) => ({
        date: a.applied_on,
        nLb: Number(a.n_lb_per_1000),
        wsnLb: Number(a.wsn_lb_per_1000),
        productName: a.product_name,
      }));
    const wateringByDate = zoneWateringByDate(waterings, z.id);
    const days = deriveDays(weather.days, {
      latitudeDeg: property.latitude,
      kc: turfKcOf(z.grass_species),
      wateringInByDate: wateringByDate,
    });
    return {
      zoneId: z.id,
      name: z.name,
      areaFt2: Number(z.area_ft2),
      points,
      applications: apps,
      waterings: Object.entries(wateringByDate)
        .filter(([date]) => date >= from)
        .map(([date, wateringIn]) => ({ date, wateringIn }))
        .sort((a, b) => a.date.localeCompare(b.date)),
      trend: recentTrend(points),
      season: seasonChange(points),
      correlations: zoneCorrelations(points, apps, days),
    };
  });

  const areaOf = new Map(zones.map((z) => [z.id, Number(z.area_ft2)]));
  const visits = propertyIndexByVisit(
    checks
      .filter((c) => areaOf.has(c.zone_id))
      .map((c) => ({
        visitId: c.visit_id,
        date: c.scheduled_for,
        index: c.sward_index!,
        areaFt2: areaOf.get(c.zone_id)!,
      })),
  ).map((v) => ({
    ...v,
    hasPhoto: checks.some((c) => c.visit_id === v.visitId && c.has_photo),
  }));
  const propertyApps = propertyNitrogenEvents(
    applications.map((a) => ({
      date: a.applied_on,
      nLb: Number(a.n_lb_per_1000),
      wsnLb: Number(a.wsn_lb_per_1000),
      productName: a.product_name,
      areaFt2: Number(a.area_ft2),
    })),
    lawnArea,
  ).filter((a) => a.date >= from);

  // Weather for the charts: the property's mean Kc (area-weighted) for turf use.
  const days = deriveDays(weather.days, {
    latitudeDeg: property.latitude,
    kc: lawnKc(zones),
    wateringInByDate: {},
  }).filter((d) => d.date >= from && d.date <= today);
  const indexPoints = visits.map((v) => ({ date: v.date, index: v.index }));

  return {
    propertyId,
    today,
    from,
    weather: { status: weather.status, message: weather.message, days },
    visits,
    applications: propertyApps,
    trend: recentTrend(indexPoints),
    season: seasonChange(indexPoints),
    zones: zoneHistories.map((z) => ({
      ...z,
      applications: z.applications.filter((a) => a.date >= from),
    })),
  };
}

/**
 * Across the book (managers): how the latest property indexes are spread, which properties are
 * declining, and the share of zones whose Index follows the nitrogen available to them — all read
 * from the property summaries that the write paths and the sweep keep (lib/after-write/summary.ts), so
 * the cost does not grow with the zone checks. Water balance is left out here: it needs the
 * weather of every place, and N is the question the book view answers.
 */
export async function getBookScoring(actor: Actor): Promise<BookScoring> {
  const rows = await db()
    .selectFrom("properties")
    .leftJoin("property_summaries as ps", "ps.property_id", "properties.id")
    .select([
      "properties.id",
      "properties.name",
      "ps.latest_index",
      "ps.trend_word",
      "ps.trend_slope",
      "ps.zones_total",
      "ps.zones_enough_checks",
      "ps.zones_responding_n",
    ])
    .where(propertyInScope(actor))
    .where("properties.archived_at", "is", null)
    .execute();
  const indexes = rows
    .flatMap((r) => (r.latest_index === null ? [] : [Number(r.latest_index)]))
    .sort((a, b) => a - b);
  const sum = (k: "zones_total" | "zones_enough_checks" | "zones_responding_n") =>
    rows.reduce((s, r) => s + Number(r[k] ?? 0), 0);
  return {
    total: rows.length,
    scored: indexes.length,
    median: indexes.length ? indexes[Math.floor((indexes.length - 1) / 2)]! : null,
    distribution: indexDistribution(indexes),
    declining: rows
      .filter((r) => r.trend_word === "declining")
      .map((r) => ({ propertyId: r.id, name: r.name, slopePer30Days: Number(r.trend_slope ?? 0) }))
      .sort((a, b) => a.slopePer30Days - b.slopePer30Days || a.name.localeCompare(b.name)),
    zonesWithEnoughChecks: sum("zones_enough_checks"),
    zonesRespondingToN: sum("zones_responding_n"),
    zonesTotal: sum("zones_total"),
  };
}
