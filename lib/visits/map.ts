// Row ↔ DTO mapping for zone checks, and the plain-words summary of what a check found.
import type { Property, Visit, ZoneCheck } from "@/db/schema";
import { findSymptom } from "@/lib/reference/symptoms";
import { RATING_FIELDS, RATING_SCALE } from "@/lib/reference/visit-options";

import type { VisitSummaryDto, ZoneCheckDto, ZoneCheckValues } from "./dto";
import type { ZoneCheckInput } from "./schemas";

export function toZoneCheckDto(row: ZoneCheck, updatedBy: string | null = null): ZoneCheckDto {
  return {
    id: row.id,
    visitId: row.visit_id,
    swardIndex: row.sward_index,
    version: row.version,
    updatedAt: new Date(row.updated_at).toISOString(),
    updatedBy,
    ...valuesOf(row),
  };
}

export function valuesOf(
  row: Omit<ZoneCheck, "sward_index" | "index_parts"> &
    Partial<Pick<ZoneCheck, "sward_index" | "index_parts">>,
): ZoneCheckValues {
  return {
    zoneId: row.zone_id,
    status: row.status,
    quality: row.quality,
    color: row.color,
    density: row.density,
    uniformity: row.uniformity,
    barePct: row.bare_pct,
    weedsPct: row.weeds_pct,
    thatchIn: row.thatch_in === null ? null : Number(row.thatch_in),
    soilMoisture: row.soil_moisture,
    soilMoisturePct: row.soil_moisture_pct === null ? null : Number(row.soil_moisture_pct),
    heightOfCutIn: row.height_of_cut_in === null ? null : Number(row.height_of_cut_in),
    mowedToday: row.mowed_today,
    heightBeforeMowingIn:
      row.height_before_mowing_in === null ? null : Number(row.height_before_mowing_in),
    mowingDirection: row.mowing_direction,
    isMatted: row.is_matted,
    isScalped: row.is_scalped,
    hasTornTips: row.has_torn_tips,
    hasClumpedClippings: row.has_clumped_clippings,
    symptoms: row.symptoms,
    notes: row.notes,
    skipReason: row.skip_reason,
    skipNote: row.skip_note,
  };
}

/** Column values for an insert/update from validated input. */
export function toColumns(input: ZoneCheckInput) {
  return {
    zone_id: input.zoneId,
    status: input.status,
    quality: input.quality,
    color: input.color,
    density: input.density,
    uniformity: input.uniformity,
    bare_pct: input.barePct,
    weeds_pct: input.weedsPct,
    thatch_in: input.thatchIn,
    soil_moisture: input.soilMoisture,
    soil_moisture_pct: input.soilMoisturePct,
    height_of_cut_in: input.heightOfCutIn,
    mowed_today: input.mowedToday,
    height_before_mowing_in: input.mowedToday === true ? input.heightBeforeMowingIn : null,
    mowing_direction: input.mowingDirection,
    is_matted: input.isMatted,
    is_scalped: input.isScalped,
    has_torn_tips: input.hasTornTips,
    has_clumped_clippings: input.hasClumpedClippings,
    symptoms: JSON.stringify(input.symptoms),
    notes: input.notes,
    skip_reason: input.status === "skipped" ? input.skipReason : null,
    skip_note: input.status === "skipped" ? input.skipNote : "",
  };
}

/** Field-by-field differences, for conflict checks and the audit trail. */
export function diffValues(
  before: ZoneCheckValues,
  after: ZoneCheckValues,
): Record<string, { from: unknown; to: unknown }> {
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  for (const key of Object.keys(after) as (keyof ZoneCheckValues)[]) {
    if (JSON.stringify(before[key]) !== JSON.stringify(after[key]))
      changes[key] = { from: before[key], to: after[key] };
  }
  return changes;
}

const SEVERITY_WORD = { 1: "light", 2: "moderate", 3: "severe" } as const;

/** What stands out in a check, in words: ratings below acceptable, symptoms, mowing signs. */
export function concernsOf(zoneName: string, v: ZoneCheckValues): string[] {
  const out: string[] = [];
  if (v.status === "skipped") return [`${zoneName}: skipped last time`];
  for (const [field, label] of Object.entries(RATING_FIELDS) as [
    keyof typeof RATING_FIELDS,
    string,
  ][]) {
    const value = v[field];
    if (value !== null && value < RATING_SCALE.acceptable)
      out.push(`${zoneName}: ${label.toLowerCase()} ${value} of 9 (below acceptable)`);
  }
  for (const s of v.symptoms) {
    out.push(
      `${zoneName}: ${findSymptom(s.key)?.name ?? s.key} (${SEVERITY_WORD[s.severity]}, ${s.extentPct} % of zone)`,
    );
  }
  if (v.isMatted) out.push(`${zoneName}: matted canopy`);
  if (v.isScalped) out.push(`${zoneName}: scalping`);
  if (v.hasTornTips) out.push(`${zoneName}: torn leaf tips`);
  return out;
}

/** A visit with its property's name and address and its progress (lib/visits/queries.ts). */
export type VisitSummaryRow = Pick<
  Visit,
  | "id"
  | "property_id"
  | "scheduled_for"
  | "stop_order"
  | "planned_service"
  | "status"
  | "technician_id"
  | "started_at"
  | "completed_at"
  | "cancel_kind"
  | "cancel_reason"
  | "cancelled_at"
> &
  Pick<Property, "street" | "city"> & {
    property_name: string;
    technician_name: string | null;
    checked_zones: number | string | null;
    zone_count: number | string | null;
    saved_checks: number | string | null;
    cancelled_by_name: string | null;
    rescheduled_visit_id: string | null;
    rescheduled_for: string | null;
  };

export function toVisitSummaryDto(r: VisitSummaryRow): VisitSummaryDto {
  return {
    id: r.id,
    propertyId: r.property_id,
    propertyName: r.property_name,
    address: `${r.street}, ${r.city}`,
    scheduledFor: r.scheduled_for,
    stopOrder: r.stop_order,
    plannedService: r.planned_service,
    status: r.status,
    technician: r.technician_id ? { id: r.technician_id, name: r.technician_name ?? "" } : null,
    startedAt: r.started_at ? new Date(r.started_at).toISOString() : null,
    completedAt: r.completed_at ? new Date(r.completed_at).toISOString() : null,
    checkedZones: Number(r.checked_zones ?? 0),
    zoneCount: Number(r.zone_count ?? 0),
    savedChecks: Number(r.saved_checks ?? 0),
    outcome:
      r.status === "cancelled"
        ? {
            kind: r.cancel_kind,
            reason: r.cancel_reason,
            at: r.cancelled_at ? new Date(r.cancelled_at).toISOString() : null,
            by: r.cancelled_by_name,
            keptChecks: Number(r.saved_checks ?? 0),
            rescheduled:
              r.rescheduled_visit_id && r.rescheduled_for
                ? { visitId: r.rescheduled_visit_id, scheduledFor: r.rescheduled_for }
                : null,
            nextFreeDay: null, // filled by the queries that offer one (withNextFreeDays)
          }
        : null,
  };
}
