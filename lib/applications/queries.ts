// Application reads, scoped like visits (staff); homeowners read them through visit reports later.
import "server-only";

import { db } from "@/db";
import type { RuleFinding } from "@/lib/agronomy/rules";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";

import type { ApplicationDto } from "./dto";

export async function listVisitApplications(
  actor: Actor,
  visitId: string,
): Promise<ApplicationDto[]> {
  if (actor.role === "homeowner") return [];
  const rows = await db()
    .selectFrom("applications")
    .innerJoin("visits", "visits.id", "applications.visit_id")
    .innerJoin("products", "products.id", "applications.product_id")
    .leftJoin("users as overrider", "overrider.id", "applications.override_by")
    .selectAll("applications")
    .select([
      "products.name as product_name",
      "products.is_pesticide",
      "products.registration_number",
      "products.label_cautions",
      "products.reentry_guidance",
      "overrider.name as override_by_name",
    ])
    .where(visitInScope(actor))
    .where("applications.company_id", "=", actor.companyId)
    .where("applications.visit_id", "=", visitId)
    .orderBy("applications.applied_at")
    .execute();
  return rows.map((r) => ({
    id: r.id,
    visitId: r.visit_id,
    zoneId: r.zone_id,
    product: {
      id: r.product_id,
      name: r.product_name,
      isPesticide: r.is_pesticide,
      registrationNumber: r.registration_number,
      labelCautions: r.label_cautions,
      reentryGuidance: r.reentry_guidance,
    },
    rate: { amount: Number(r.rate_amount), unit: r.rate_unit },
    areaFt2: Number(r.area_ft2),
    productTotalLb: Number(r.product_total_lb),
    productTotalGal: r.product_total_gal === null ? null : Number(r.product_total_gal),
    per1000: {
      nLb: Number(r.n_lb_per_1000),
      p2o5Lb: Number(r.p2o5_lb_per_1000),
      k2oLb: Number(r.k2o_lb_per_1000),
      wsnLb: Number(r.wsn_lb_per_1000),
    },
    appliedAt: new Date(r.applied_at).toISOString(),
    appliedOn: r.applied_on,
    windMph: r.wind_mph === null ? null : Number(r.wind_mph),
    temperatureF: r.temperature_f === null ? null : Number(r.temperature_f),
    isEstablishing: r.is_establishing,
    isRepairing: r.is_repairing,
    applicatorName: r.applicator_name,
    applicatorLicence: r.applicator_licence,
    findings: r.findings as RuleFinding[],
    overrideReason: r.override_reason,
    overrideCategory: r.override_category,
    overrideBy: r.override_by_name,
    createdById: r.created_by,
  }));
}

/** lb N per 1,000 ft² put down on a zone in a calendar year before a date (year to date). */
export async function getZoneNitrogenYearToDate(
  companyId: string,
  zoneId: string,
  beforeDate: string,
  /** An application being corrected: its own N does not count against it. */
  exceptId?: string,
): Promise<number> {
  let query = db()
    .selectFrom("applications")
    .select((eb) => eb.fn.coalesce(eb.fn.sum<number>("n_lb_per_1000"), eb.lit(0)).as("n"))
    .where("company_id", "=", companyId)
    .where("zone_id", "=", zoneId)
    .where("applied_on", ">=", `${beforeDate.slice(0, 4)}-01-01`)
    .where("applied_on", "<=", beforeDate);
  if (exceptId) query = query.where("id", "!=", exceptId);
  const row = await query.executeTakeFirstOrThrow();
  return Number(row.n);
}

/** lb N per 1,000 ft² applied to each zone of a property in a calendar year (zone id → lb). */
export async function getNitrogenByZone(
  actor: Actor,
  propertyId: string,
  year: string,
): Promise<Record<string, number>> {
  if (actor.role === "homeowner") return {};
  const rows = await db()
    .selectFrom("applications")
    .select((eb) => ["zone_id", eb.fn.sum<number>("n_lb_per_1000").as("n")])
    .innerJoin("visits", "visits.id", "applications.visit_id")
    .where("applications.company_id", "=", actor.companyId)
    .where("visits.property_id", "=", propertyId)
    .where("visits.company_id", "=", actor.companyId) // lets the planner use visits_property_idx
    .where("applied_on", ">=", `${year}-01-01`)
    .where("applied_on", "<=", `${year}-12-31`)
    .groupBy("zone_id")
    .execute();
  return Object.fromEntries(rows.map((r) => [r.zone_id, Number(r.n)]));
}

/** A property's applications of a year, newest first (staff). */
export async function listPropertyApplications(actor: Actor, propertyId: string, year: string) {
  if (actor.role === "homeowner") return [];
  const rows = await db()
    .selectFrom("applications")
    .innerJoin("visits", "visits.id", "applications.visit_id")
    .innerJoin("products", "products.id", "applications.product_id")
    .innerJoin("zones", "zones.id", "applications.zone_id")
    .select([
      "applications.id",
      "applications.visit_id",
      "applications.applied_on",
      "applications.rate_amount",
      "applications.rate_unit",
      "applications.n_lb_per_1000",
      "applications.p2o5_lb_per_1000",
      "applications.k2o_lb_per_1000",
      "applications.override_reason",
      "products.name as product_name",
      "products.is_pesticide",
      "zones.name as zone_name",
    ])
    .where(visitInScope(actor))
    .where("applications.company_id", "=", actor.companyId)
    .where("visits.property_id", "=", propertyId)
    .where("visits.company_id", "=", actor.companyId) // lets the planner use visits_property_idx
    .where("applications.applied_on", ">=", `${year}-01-01`)
    .where("applications.applied_on", "<=", `${year}-12-31`)
    .orderBy("applications.applied_on", "desc")
    .orderBy("zones.name")
    .limit(500)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    visitId: r.visit_id,
    appliedOn: r.applied_on,
    zoneName: r.zone_name,
    productName: r.product_name,
    isPesticide: r.is_pesticide,
    rate: `${Number(r.rate_amount)} ${r.rate_unit.replace("1000ft2", "1,000 ft²")}`,
    nLb: Number(r.n_lb_per_1000),
    p2o5Lb: Number(r.p2o5_lb_per_1000),
    k2oLb: Number(r.k2o_lb_per_1000),
    overridden: r.override_reason !== null,
  }));
}
