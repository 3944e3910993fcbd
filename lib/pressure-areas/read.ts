// Pressure areas computed on read from the company's live alerts (the pure core is
// lib/risk/pressure-areas.ts). Computed on read rather than stored: an area is a function of the
// live alerts, the properties' locations and three settings, so any write that changes one of
// them (afterWrite raising or resolving an alert, a manager resolving one, a property moved, a
// setting changed) shows at once with nothing to keep in step. Reading them costs one indexed
// query on `risk_alerts (company_id, kind, raised_on)`; tests/bench prints the figures.
// Takes the executor so the digest can read inside its transaction (lib/risk-alerts/digest.ts).
import type { Kysely, Transaction } from "kysely";

import type { Database } from "@/db/schema";
import { addDays } from "@/lib/dates";
import { alertKindLabel } from "@/lib/risk/labels";
import {
  drawnRadiusMi,
  findPressureAreas,
  isInsideArea,
  PRESSURE_KINDS,
  pressureSince,
  type PressureArea,
  type PressureSettings,
} from "@/lib/risk/pressure-areas";
import type { Evidence } from "@/lib/risk/rules";

import type { PressureAreaDto, PressureSettingsDto } from "./dto";

type Executor = Kysely<Database> | Transaction<Database>;

export async function readPressureSettings(
  executor: Executor,
  companyId: string,
): Promise<PressureSettingsDto> {
  const row = await executor
    .selectFrom("companies")
    .select(["pressure_distance_mi", "pressure_days", "pressure_min_properties"])
    .where("id", "=", companyId)
    .executeTakeFirstOrThrow();
  return {
    distanceMi: Number(row.pressure_distance_mi),
    days: Number(row.pressure_days),
    minProperties: Number(row.pressure_min_properties),
  };
}

/** The areas of the company's live alerts raised since `pressureSince(today)`, as bare clusters. */
export async function readAreaClusters(
  executor: Executor,
  companyId: string,
  today: string,
  settings: PressureSettings,
): Promise<PressureArea[]> {
  const alerts = await executor
    .selectFrom("risk_alerts")
    .innerJoin("properties", "properties.id", "risk_alerts.property_id")
    .select([
      "risk_alerts.id",
      "risk_alerts.kind",
      "risk_alerts.property_id",
      "risk_alerts.raised_on",
      "properties.latitude",
      "properties.longitude",
    ])
    .where("risk_alerts.company_id", "=", companyId)
    .where("risk_alerts.kind", "in", [...PRESSURE_KINDS])
    .where("risk_alerts.raised_on", ">=", pressureSince(today))
    .where("risk_alerts.status", "!=", "resolved")
    .where("properties.archived_at", "is", null)
    .execute();
  return findPressureAreas(
    alerts.map((a) => ({
      alertId: a.id,
      kind: a.kind,
      propertyId: a.property_id,
      raisedOn: a.raised_on,
      lat: a.latitude,
      lng: a.longitude,
    })),
    settings,
  );
}

/** A property needs a look when it lies inside an area and has had no visit in the window. */
export const needsCheck = (lastVisitOn: string | null, today: string, settings: PressureSettings) =>
  lastVisitOn === null || lastVisitOn < addDays(today, -settings.days);

/**
 * The ids of the given places that are inside some area and without a visit in the window
 * ("Check soon" on the book, the map and the property page).
 */
export function checkSoonIds(
  areas: PressureArea[],
  settings: PressureSettings,
  today: string,
  places: { id: string; lat: number; lng: number; lastVisitOn: string | null }[],
): Set<string> {
  const out = new Set<string>();
  if (!areas.length) return out;
  for (const p of places)
    if (
      needsCheck(p.lastVisitOn, today, settings) &&
      areas.some((a) => isInsideArea(a, settings, p))
    )
      out.add(p.id);
  return out;
}

/** The areas with their properties (members and every property inside the drawn circle) and alerts. */
export async function readPressureAreas(
  executor: Executor,
  companyId: string,
  today: string,
  settings: PressureSettings,
): Promise<PressureAreaDto[]> {
  const areas = await readAreaClusters(executor, companyId, today, settings);
  if (!areas.length) return [];
  const alertIds = areas.flatMap((a) => a.alertIds);
  // Every property in the union of the areas' bounding boxes (1° of latitude ≈ 69 mi).
  const boxes = areas.map((a) => {
    const r = drawnRadiusMi(a, settings) / 68;
    const rl = r / Math.max(Math.cos((a.centre.lat * Math.PI) / 180), 0.01);
    return {
      minLat: a.centre.lat - r,
      maxLat: a.centre.lat + r,
      minLng: a.centre.lng - rl,
      maxLng: a.centre.lng + rl,
    };
  });
  const [alerts, nearby] = await Promise.all([
    executor
      .selectFrom("risk_alerts")
      .innerJoin("properties", "properties.id", "risk_alerts.property_id")
      .select([
        "risk_alerts.id",
        "risk_alerts.property_id",
        "risk_alerts.severity",
        "risk_alerts.raised_on",
        "risk_alerts.summary",
        "risk_alerts.evidence",
        "properties.name as property_name",
      ])
      .where("risk_alerts.company_id", "=", companyId)
      .where("risk_alerts.id", "in", alertIds)
      .orderBy("risk_alerts.raised_on")
      .orderBy("properties.name")
      .execute(),
    executor
      .selectFrom("properties")
      .leftJoin("property_summaries as ps", "ps.property_id", "properties.id")
      .select([
        "properties.id",
        "properties.name",
        "properties.street",
        "properties.city",
        "properties.latitude",
        "properties.longitude",
        "ps.last_visit_on",
      ])
      .where("properties.company_id", "=", companyId)
      .where("properties.archived_at", "is", null)
      .where((eb) =>
        eb.or(
          boxes.map((b) =>
            eb.and([
              eb("properties.latitude", ">=", b.minLat),
              eb("properties.latitude", "<=", b.maxLat),
              eb("properties.longitude", ">=", b.minLng),
              eb("properties.longitude", "<=", b.maxLng),
            ]),
          ),
        ),
      )
      .orderBy("properties.name")
      .execute(),
  ]);
  return areas.map((area) => {
    const members = new Set(area.propertyIds);
    const properties = nearby
      .filter(
        (p) =>
          members.has(p.id) || isInsideArea(area, settings, { lat: p.latitude, lng: p.longitude }),
      )
      .map((p) => ({
        id: p.id,
        name: p.name,
        street: p.street,
        city: p.city,
        lat: p.latitude,
        lng: p.longitude,
        lastVisitOn: p.last_visit_on ?? null,
        isMember: members.has(p.id),
        checkSoon: needsCheck(p.last_visit_on ?? null, today, settings),
      }))
      // Members first, then the other lawns inside the circle.
      .sort((a, b) => Number(b.isMember) - Number(a.isMember) || a.name.localeCompare(b.name));
    const own = new Set(area.alertIds);
    return {
      key: area.key,
      kind: area.kind,
      kindLabel: alertKindLabel(area.kind),
      firstOn: area.firstOn,
      latestOn: area.latestOn,
      centre: area.centre,
      radiusMi: drawnRadiusMi(area, settings),
      properties,
      alerts: alerts
        .filter((a) => own.has(a.id))
        .map((a) => ({
          id: a.id,
          propertyId: a.property_id,
          propertyName: a.property_name,
          severity: a.severity,
          raisedOn: a.raised_on,
          summary: a.summary,
          evidence: a.evidence as Evidence,
        })),
    };
  });
}
