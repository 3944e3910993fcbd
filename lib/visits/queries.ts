// Visit reads, scoped to the actor (lib/auth/scope.ts). Out of scope = not found.
import "server-only";

import type { z } from "zod";

import { db } from "@/db";
import { putsDownNOrP } from "@/lib/agronomy/season";
import { listVisitApplications } from "@/lib/applications/queries";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { notFound } from "@/lib/http/app-error";
import { listCheckPhotos, listVisitPhotos } from "@/lib/photos/queries";
import { toZoneDto, ZONE_COLUMNS } from "@/lib/properties/map";
import { findZoneInScope } from "@/lib/properties/queries";
import { listVisitWaterings } from "@/lib/watering/queries";

import { auditWords } from "./audit-words";
import type {
  AuditEventDto,
  LastZoneCheckDto,
  TodayStopDto,
  VisitDetailDto,
  VisitSummaryDto,
  ZoneHistoryEntryDto,
} from "./dto";
import { concernsOf, toVisitSummaryDto, toZoneCheckDto, valuesOf } from "./map";
import { nextFreeDay } from "./next-free-day";
import { SCHEDULE_AHEAD_DAYS, type listVisitsQuery } from "./schemas";

function visitSummaries() {
  return db()
    .selectFrom("visits")
    .innerJoin("properties", (j) =>
      j
        .onRef("properties.id", "=", "visits.property_id")
        .onRef("properties.company_id", "=", "visits.company_id"),
    )
    .leftJoin("users as tech", "tech.id", "visits.technician_id")
    .leftJoin("users as canceller", "canceller.id", "visits.cancelled_by")
    .leftJoin("visits as replacement", (j) =>
      j
        .onRef("replacement.id", "=", "visits.rescheduled_visit_id")
        .onRef("replacement.company_id", "=", "visits.company_id"),
    )
    .select((eb) => [
      "visits.id",
      "visits.property_id",
      "properties.name as property_name",
      "properties.street",
      "properties.city",
      "properties.time_zone",
      "properties.rule_set_id",
      "properties.latitude",
      "properties.longitude",
      "properties.customer_phone",
      "properties.access_notes",
      "visits.scheduled_for",
      "visits.stop_order",
      "visits.planned_service",
      "visits.status",
      "visits.technician_id",
      "tech.name as technician_name",
      "visits.started_at",
      "visits.completed_at",
      "visits.notes",
      "visits.weather",
      "visits.version",
      "visits.company_id",
      "visits.cancel_kind",
      "visits.cancel_reason",
      "visits.cancelled_at",
      "canceller.name as cancelled_by_name",
      "visits.rescheduled_visit_id",
      "replacement.scheduled_for as rescheduled_for",
      eb
        .selectFrom("zone_checks")
        .select((e) => e.fn.countAll<number>().as("n"))
        .whereRef("zone_checks.visit_id", "=", "visits.id")
        .as("saved_checks"),
      eb
        .selectFrom("zone_checks")
        .select((e) => e.fn.countAll<number>().as("n"))
        .whereRef("zone_checks.visit_id", "=", "visits.id")
        .where("zone_checks.status", "in", ["done", "skipped"])
        .as("checked_zones"),
      eb
        .selectFrom("zones")
        .select((e) => e.fn.countAll<number>().as("n"))
        .whereRef("zones.property_id", "=", "visits.property_id")
        .where("zones.archived_at", "is", null)
        .as("zone_count"),
    ]);
}

export async function listVisits(
  actor: Actor,
  query: z.infer<typeof listVisitsQuery>,
): Promise<VisitSummaryDto[]> {
  let q = visitSummaries().where(visitInScope(actor));
  if (query.date) q = q.where("visits.scheduled_for", "=", query.date);
  if (query.from) q = q.where("visits.scheduled_for", ">=", query.from);
  if (query.to) q = q.where("visits.scheduled_for", "<=", query.to);
  if (query.technicianId) q = q.where("visits.technician_id", "=", query.technicianId);
  if (query.propertyId) q = q.where("visits.property_id", "=", query.propertyId);
  if (query.status) q = q.where("visits.status", "=", query.status);
  const rows = await q
    .orderBy("visits.scheduled_for", "desc")
    .orderBy("visits.stop_order")
    .orderBy("visits.id")
    .limit(500)
    .execute();
  return withNextFreeDays(actor, rows.map(toVisitSummaryDto));
}

/**
 * Offers the next free day (lib/visits/next-free-day.ts) on each canceled stop not yet rescheduled:
 * from today in the property's time zone, past the property's other visits, outside the rule
 * set's no-fertilizer window for a round with nitrogen or phosphorus.
 */
async function withNextFreeDays<T extends VisitSummaryDto>(
  actor: Actor,
  visits: T[],
): Promise<T[]> {
  const open = visits.filter((v) => v.outcome && !v.outcome.rescheduled);
  if (open.length === 0) return visits;
  const propertyIds = [...new Set(open.map((v) => v.propertyId))];
  const properties = await db()
    .selectFrom("properties")
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .select([
      "properties.id",
      "properties.time_zone",
      "rule_sets.pro_no_fertilizer_after",
      "rule_sets.pro_no_fertilizer_before",
    ])
    .where("properties.company_id", "=", actor.companyId)
    .where("properties.id", "in", propertyIds)
    .execute();
  const earliest = addDays(todayIn("UTC"), -1); // no time zone is a day behind that
  const taken = await db()
    .selectFrom("visits")
    .select(["property_id", "scheduled_for"])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "in", propertyIds)
    .where("status", "!=", "cancelled")
    .where("scheduled_for", ">=", earliest)
    .execute();
  return visits.map((v) => {
    const property = properties.find((p) => p.id === v.propertyId);
    if (!v.outcome || v.outcome.rescheduled || !property) return v;
    const window =
      property.pro_no_fertilizer_after && property.pro_no_fertilizer_before
        ? ([property.pro_no_fertilizer_after, property.pro_no_fertilizer_before] as const)
        : null;
    const day = nextFreeDay({
      today: todayIn(property.time_zone),
      taken: taken.filter((t) => t.property_id === v.propertyId).map((t) => t.scheduled_for),
      window,
      putsDownNOrP: putsDownNOrP(v.plannedService),
      aheadDays: SCHEDULE_AHEAD_DAYS,
    });
    return { ...v, outcome: { ...v.outcome, nextFreeDay: day } };
  });
}

/**
 * Each zone's last check at an earlier finished visit of the same property (the newest by visit
 * date, then by finish), with who checked it and its first photo: what today's check is compared
 * with. The visit was already found in the actor's scope.
 */
async function listLastZoneChecks(
  actor: Actor,
  visit: { id: string; propertyId: string; scheduledFor: string },
): Promise<LastZoneCheckDto[]> {
  const rows = await db()
    .selectFrom("zone_checks")
    .innerJoin("visits", (j) =>
      j
        .onRef("visits.id", "=", "zone_checks.visit_id")
        .onRef("visits.company_id", "=", "zone_checks.company_id"),
    )
    .leftJoin("users as checker", "checker.id", "zone_checks.updated_by")
    .leftJoin("users as tech", "tech.id", "visits.technician_id")
    .distinctOn("zone_checks.zone_id")
    .select([
      "zone_checks.id",
      "zone_checks.zone_id",
      "zone_checks.visit_id",
      "zone_checks.status",
      "zone_checks.quality",
      "zone_checks.color",
      "zone_checks.density",
      "zone_checks.uniformity",
      "zone_checks.height_of_cut_in",
      "zone_checks.notes",
      "zone_checks.skip_reason",
      "visits.scheduled_for",
      "checker.name as checker_name",
      "tech.name as technician_name",
    ])
    .where("zone_checks.company_id", "=", actor.companyId)
    .where("visits.property_id", "=", visit.propertyId)
    .where("visits.status", "=", "completed")
    .where("visits.id", "!=", visit.id)
    .where("visits.scheduled_for", "<=", visit.scheduledFor)
    .where("zone_checks.status", "in", ["done", "skipped"])
    .orderBy("zone_checks.zone_id")
    .orderBy("visits.scheduled_for", "desc")
    .orderBy("visits.completed_at", "desc")
    .execute();
  const photos = await listCheckPhotos(
    actor,
    rows.map((r) => r.id),
  );
  return rows.map((r) => {
    const photo = photos.find((p) => p.zoneCheckId === r.id);
    return {
      zoneId: r.zone_id,
      visitId: r.visit_id,
      visitedOn: r.scheduled_for,
      checkedBy: r.checker_name ?? r.technician_name,
      status: r.status,
      quality: r.quality,
      color: r.color,
      density: r.density,
      uniformity: r.uniformity,
      heightOfCutIn: r.height_of_cut_in === null ? null : Number(r.height_of_cut_in),
      notes: r.notes,
      skipReason: r.skip_reason,
      photo: photo
        ? {
            thumbUrl: photo.thumbUrl,
            displayUrl: photo.displayUrl,
            width: photo.width,
            height: photo.height,
          }
        : null,
    };
  });
}

export async function getVisit(actor: Actor, visitId: string): Promise<VisitDetailDto> {
  const row = await visitSummaries()
    .leftJoin("users as closer", "closer.id", "visits.completed_by")
    .select("closer.name as completed_by_name")
    .where(visitInScope(actor))
    .where("visits.id", "=", visitId)
    .executeTakeFirst();
  if (!row) throw notFound("That visit");

  const checks = await db()
    .selectFrom("zone_checks")
    .leftJoin("users", "users.id", "zone_checks.updated_by")
    .selectAll("zone_checks")
    .select("users.name as updated_by_name")
    .where("zone_checks.company_id", "=", actor.companyId)
    .where("zone_checks.visit_id", "=", visitId)
    .execute();
  const checkedZoneIds = checks.map((c) => c.zone_id);

  // Active zones, plus archived ones that this visit already checked (history stays whole).
  const zones = await db()
    .selectFrom("zones")
    .select([...ZONE_COLUMNS])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", row.property_id)
    .where((eb) =>
      checkedZoneIds.length
        ? eb.or([eb("archived_at", "is", null), eb("id", "in", checkedZoneIds)])
        : eb("archived_at", "is", null),
    )
    .orderBy("sort_order")
    .orderBy("name")
    .execute();

  const [summary] = await withNextFreeDays(actor, [toVisitSummaryDto(row)]);
  return {
    ...summary!,
    notes: row.notes,
    timeZone: row.time_zone,
    ruleSetId: row.rule_set_id,
    weather: (row.weather as VisitDetailDto["weather"]) ?? null,
    version: row.version,
    completedBy: row.completed_by_name ?? null,
    zones: zones.map(toZoneDto),
    checks: checks.map((c) => toZoneCheckDto(c, c.updated_by_name)),
    photos: await listVisitPhotos(actor, visitId),
    applications: await listVisitApplications(actor, visitId),
    waterings: await listVisitWaterings(actor, visitId),
    viewerId: actor.userId,
    lastChecks: await listLastZoneChecks(actor, {
      id: row.id,
      propertyId: row.property_id,
      scheduledFor: row.scheduled_for,
    }),
    canEdit:
      actor.role === "manager" ||
      (actor.role === "technician" && row.status !== "completed" && row.status !== "cancelled"),
  };
}

/** A technician's stops on a date, in order, with the last visit and what it found. */
export async function listTodayStops(
  actor: Actor,
  date: string,
  technicianId?: string,
): Promise<TodayStopDto[]> {
  const techId = actor.role === "technician" ? actor.userId : technicianId;
  // Canceled stops stay on the day, with their outcome (rained out, canceled) and the day offered.
  let q = visitSummaries().where(visitInScope(actor)).where("visits.scheduled_for", "=", date);
  if (techId) q = q.where("visits.technician_id", "=", techId);
  const rows = await q.orderBy("visits.stop_order").orderBy("properties.name").execute();
  if (rows.length === 0) return [];

  // The latest completed visit before this date at each property, with its checks.
  const previous = await db()
    .selectFrom("visits")
    .select(["visits.id", "visits.property_id", "visits.scheduled_for"])
    .distinctOn("visits.property_id")
    .where("visits.company_id", "=", actor.companyId)
    .where(
      "visits.property_id",
      "in",
      rows.map((r) => r.property_id),
    )
    .where("visits.status", "=", "completed")
    .where("visits.scheduled_for", "<", date)
    .orderBy("visits.property_id")
    .orderBy("visits.scheduled_for", "desc")
    .execute();
  const checks = previous.length
    ? await db()
        .selectFrom("zone_checks")
        .innerJoin("zones", "zones.id", "zone_checks.zone_id")
        .selectAll("zone_checks")
        .select(["zones.name as zone_name", "zones.sort_order"])
        .where("zone_checks.company_id", "=", actor.companyId)
        .where(
          "zone_checks.visit_id",
          "in",
          previous.map((p) => p.id),
        )
        .orderBy("zones.sort_order")
        .execute()
    : [];

  const stops = rows.map((r) => {
    const last = previous.find((p) => p.property_id === r.property_id);
    const concerns = last
      ? checks
          .filter((c) => c.visit_id === last.id)
          .flatMap((c) => concernsOf(c.zone_name, valuesOf(c)))
      : [];
    return {
      ...toVisitSummaryDto(r),
      lastVisitOn: last?.scheduled_for ?? null,
      concerns,
      location: { latitude: r.latitude, longitude: r.longitude },
      customerPhone: r.customer_phone,
      accessNotes: r.access_notes,
    };
  });
  return withNextFreeDays(actor, stops);
}

/** Every check of a zone, newest first. The zone must be within the actor's property scope. */
export async function getZoneHistory(
  actor: Actor,
  zoneId: string,
): Promise<{ zoneName: string; propertyId: string; entries: ZoneHistoryEntryDto[] }> {
  const zone = await findZoneInScope(actor, zoneId);

  const rows = await db()
    .selectFrom("zone_checks")
    .innerJoin("visits", "visits.id", "zone_checks.visit_id")
    .leftJoin("users", "users.id", "visits.technician_id")
    .selectAll("zone_checks")
    .select(["visits.scheduled_for", "users.name as technician_name"])
    .where("zone_checks.company_id", "=", actor.companyId)
    .where("zone_checks.zone_id", "=", zoneId)
    .where("visits.status", "!=", "cancelled")
    .orderBy("visits.scheduled_for", "desc")
    .orderBy("zone_checks.created_at", "desc")
    .limit(200)
    .execute();

  return {
    zoneName: zone.name,
    propertyId: zone.property_id,
    entries: rows.map((r) => ({
      zoneCheckId: r.id,
      visitId: r.visit_id,
      visitedOn: r.scheduled_for,
      swardIndex: r.sward_index,
      status: r.status,
      quality: r.quality,
      color: r.color,
      density: r.density,
      uniformity: r.uniformity,
      barePct: r.bare_pct,
      weedsPct: r.weeds_pct,
      heightOfCutIn: r.height_of_cut_in === null ? null : Number(r.height_of_cut_in),
      mowedToday: r.mowed_today,
      heightBeforeMowingIn:
        r.height_before_mowing_in === null ? null : Number(r.height_before_mowing_in),
      symptoms: r.symptoms,
      skipReason: r.skip_reason,
      technician: r.technician_name,
    })),
  };
}

export async function listVisitAudit(actor: Actor, visitId: string): Promise<AuditEventDto[]> {
  if (actor.role !== "manager") return [];
  const visit = await db()
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select("properties.time_zone")
    .where(visitInScope(actor))
    .where("visits.id", "=", visitId)
    .executeTakeFirst();
  if (!visit) return [];
  const rows = await db()
    .selectFrom("audit_events")
    .leftJoin("users", "users.id", "audit_events.actor_id")
    .leftJoin("zones", "zones.id", "audit_events.zone_id")
    .select([
      "audit_events.id",
      "audit_events.created_at",
      "users.name",
      "audit_events.entity",
      "audit_events.entity_id",
      "audit_events.action",
      "audit_events.changes",
      "audit_events.reason",
      "zones.name as zone_name",
    ])
    .where("audit_events.company_id", "=", actor.companyId)
    .where("audit_events.visit_id", "=", visitId)
    .orderBy("audit_events.created_at", "desc")
    .orderBy("audit_events.id", "desc")
    .execute();
  return rows.map((r) => {
    const facts = {
      at: new Date(r.created_at).toISOString(),
      actor: r.name,
      entity: r.entity,
      action: r.action,
      changes: r.changes,
      reason: r.reason,
      zoneName: r.zone_name,
    };
    const words = auditWords(facts, { timeZone: visit.time_zone, locale: actor.companyLocale });
    return {
      id: String(r.id),
      at: facts.at,
      actor: r.name,
      entity: r.entity,
      entityId: r.entity_id,
      action: r.action,
      changes: r.changes,
      reason: r.reason,
      zoneName: r.zone_name,
      when: words.when,
      sentence: words.sentence,
    };
  });
}
