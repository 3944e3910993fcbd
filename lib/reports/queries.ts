// Visit reports: what a finished visit found and did, for the homeowner of the lawn (and staff).
// Only completed visits of properties in the actor's scope; anything else is not found.
import "server-only";

import type { Kysely } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/http/app-error";
import { words } from "@/lib/i18n/translate";
import { listVisitPhotos } from "@/lib/photos/queries";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { findSymptom } from "@/lib/reference/symptoms";
import { SKIP_REASONS } from "@/lib/reference/visit-options";
import { propertyIndex } from "@/lib/scoring/sward-index";
import { valuesOf } from "@/lib/visits/map";

import { matchCareNotes } from "./care-notes";
import type { NextVisit, VisitReport } from "./dto";
import { zoneSentences } from "./words";

const symptomName = (k: string) => findSymptom(k)?.name ?? k;

export async function listReports(
  actor: Actor,
  propertyId: string,
): Promise<{ visitId: string; date: string }[]> {
  const rows = await db()
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select(["visits.id", "visits.scheduled_for"])
    .where(propertyInScope(actor))
    .where("visits.company_id", "=", actor.companyId)
    .where("visits.property_id", "=", propertyId)
    .where("visits.status", "=", "completed")
    .orderBy("visits.scheduled_for", "desc")
    .limit(50)
    .execute();
  return rows.map((r) => ({ visitId: r.id, date: r.scheduled_for }));
}

/** The report as `actor` may see it; `executor` lets the finish transaction read its own writes. */
export async function getVisitReport(
  actor: Actor,
  visitId: string,
  executor: Kysely<Database> = db(),
): Promise<VisitReport> {
  const visit = await executor
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .innerJoin("companies", "companies.id", "visits.company_id")
    .leftJoin("users", "users.id", "visits.technician_id")
    .select([
      "visits.id",
      "visits.scheduled_for",
      "visits.weather",
      "visits.property_id",
      "properties.name",
      "properties.street",
      "properties.city",
      "properties.region",
      "properties.postal_code",
      "companies.name as company_name",
      "users.name as technician_name",
    ])
    .where(propertyInScope(actor))
    .where("visits.id", "=", visitId)
    .where("visits.status", "=", "completed")
    .executeTakeFirst();
  if (!visit) throw notFound("That report");
  const [zones, checks, applications, photos, alerts, nextVisit] = await Promise.all([
    executor
      .selectFrom("zones")
      .selectAll()
      .where("company_id", "=", actor.companyId)
      .where("property_id", "=", visit.property_id)
      .orderBy("sort_order")
      .orderBy("name")
      .execute(),
    executor
      .selectFrom("zone_checks")
      .selectAll()
      .where("company_id", "=", actor.companyId)
      .where("visit_id", "=", visitId)
      .execute(),
    executor
      .selectFrom("applications")
      .innerJoin("products", "products.id", "applications.product_id")
      .innerJoin("zones", "zones.id", "applications.zone_id")
      .select([
        "zones.name as zone_name",
        "zones.grass_species",
        "products.name as product_name",
        "products.is_pesticide",
        "products.registration_number",
        "products.label_cautions",
        "products.reentry_guidance",
        "applications.n_lb_per_1000",
        "applications.p2o5_lb_per_1000",
        "applications.k2o_lb_per_1000",
        "applications.applied_on",
      ])
      .where("applications.company_id", "=", actor.companyId)
      .where("applications.visit_id", "=", visitId)
      .orderBy("applications.applied_at")
      .execute(),
    listVisitPhotos(actor, visitId, executor),
    executor
      .selectFrom("risk_alerts")
      .select("kind")
      .where("company_id", "=", actor.companyId)
      .where("property_id", "=", visit.property_id)
      .where("status", "!=", "resolved")
      .execute(),
    findNextVisit(actor, visit.property_id, visit.scheduled_for, executor),
  ]);
  const checked = zones.filter((z) => checks.some((c) => c.zone_id === z.id));
  const zoneWords = words(actor.companyLocale, "report.zone");
  const reportZones = checked.map((z) => {
    const c = checks.find((x) => x.zone_id === z.id)!;
    const values = valuesOf(c);
    return {
      zoneId: z.id,
      name: z.name,
      skipped:
        c.status === "skipped"
          ? c.skip_reason
            ? SKIP_REASONS[c.skip_reason]
            : "Not checked this time"
          : null,
      sentences: c.status === "skipped" ? [] : zoneSentences(values, symptomName, zoneWords),
      index: c.sward_index,
      photos: photos.filter((p) => p.zoneId === z.id),
    };
  });
  const observed = checked
    .map((z) => ({ z, c: checks.find((x) => x.zone_id === z.id)! }))
    .filter(({ c }) => c.status === "done")
    .map(({ z, c }) => {
      const v = valuesOf(c);
      const species = findGrassSpecies(z.grass_species);
      return {
        zoneName: z.name,
        season: species?.season ?? "cool",
        speciesMinCutIn: species?.heightOfCutIn.min ?? null,
        mowingDirection: v.mowingDirection,
        isMatted: v.isMatted,
        hasTornTips: v.hasTornTips,
        isScalped: v.isScalped,
        hasClumpedClippings: v.hasClumpedClippings,
        heightOfCutIn: v.heightOfCutIn,
        thatchIn: v.thatchIn,
        soilMoisture: v.soilMoisture,
        barePct: v.barePct,
        weedsPct: v.weedsPct,
        symptomKeys: v.symptoms.map((s) => s.key),
      };
    });
  const applied = applications.map((a) => ({
    zoneName: a.zone_name,
    nLb: Number(a.n_lb_per_1000),
    p2o5Lb: Number(a.p2o5_lb_per_1000),
    isPesticide: a.is_pesticide,
    appliedOn: a.applied_on,
    season: findGrassSpecies(a.grass_species)?.season ?? ("cool" as const),
  }));
  const weather = visit.weather as {
    status?: string;
    tmaxF?: number;
    tminF?: number;
    precipIn?: number;
  } | null;
  const area = new Map(zones.map((z) => [z.id, Number(z.area_ft2)]));
  return {
    visitId,
    date: visit.scheduled_for,
    propertyId: visit.property_id,
    propertyName: visit.name,
    address: `${visit.street}, ${visit.city}, ${visit.region} ${visit.postal_code}`,
    companyName: visit.company_name,
    technicianName: visit.technician_name,
    weather:
      weather?.status === "ok"
        ? { tmaxF: weather.tmaxF!, tminF: weather.tminF!, precipIn: weather.precipIn! }
        : null,
    propertyIndex: propertyIndex(
      checks
        .filter((c) => c.sward_index !== null && area.has(c.zone_id))
        .map((c) => ({ index: c.sward_index!, areaFt2: area.get(c.zone_id)! })),
    ),
    zones: reportZones,
    applications: applications.map((a) => ({
      zoneName: a.zone_name,
      productName: a.product_name,
      isPesticide: a.is_pesticide,
      registrationNumber: a.registration_number,
      nLb: Number(a.n_lb_per_1000),
      p2o5Lb: Number(a.p2o5_lb_per_1000),
      k2oLb: Number(a.k2o_lb_per_1000),
      labelCautions: a.label_cautions,
      reentryGuidance: a.reentry_guidance,
    })),
    careNotes: matchCareNotes(
      observed,
      alerts.map((a) => a.kind),
      applied,
      symptomName,
      {
        date: visit.scheduled_for,
        weather:
          weather?.status === "ok" && weather.tmaxF !== undefined ? { tmaxF: weather.tmaxF } : null,
      },
    ),
    nextVisit,
  };
}

/**
 * The property's next scheduled visit (not started, not called off) strictly after `after`, or on
 * or after `from`: its day and planned service; null when none is scheduled. Scoped like every read.
 */
export async function findNextVisit(
  actor: Actor,
  propertyId: string,
  after: string,
  executor: Kysely<Database> = db(),
  { inclusive = false }: { inclusive?: boolean } = {},
): Promise<NextVisit | null> {
  const row = await executor
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select(["visits.scheduled_for", "visits.planned_service"])
    .where(propertyInScope(actor))
    .where("visits.company_id", "=", actor.companyId)
    .where("visits.property_id", "=", propertyId)
    .where("visits.status", "=", "scheduled")
    .where("visits.scheduled_for", inclusive ? ">=" : ">", after)
    .orderBy("visits.scheduled_for")
    .orderBy("visits.stop_order")
    .limit(1)
    .executeTakeFirst();
  return row ? { date: row.scheduled_for, service: row.planned_service } : null;
}
