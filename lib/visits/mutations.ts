// Visit writes: schedule, start, save a zone check (idempotent, versioned), call a stop off
// (rained out or canceled, with a reason), reschedule it. Finishing a
// visit publishes its visit report (lib/reports/mutations.ts). Every write re-checks scope inside
// its transaction (out of scope = not found) and ends with afterWrite in that transaction.
import "server-only";

import { randomUUID } from "node:crypto";
import { sql } from "kysely";

import { db } from "@/db";
import type { ZoneCheck } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { indexColumns } from "@/lib/after-write/check-index";
import { inNoFertilizerWindow, monthDayWords } from "@/lib/agronomy/rules";
import { nextFertilizerDate, putsDownNOrP, usDate } from "@/lib/agronomy/season";
import { CLOCK_SKEW_MS } from "@/lib/applications/applied-at";
import { correctionReasonFor } from "@/lib/audit/correction";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";
import { findCompanyTechnician } from "@/lib/people/queries";
import { removeUnreferencedFiles } from "@/lib/photos/mutations";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import type { PhotoFigures } from "@/lib/scoring/from-check";
import type { PhotoStorage } from "@/lib/services/storage";
import { assertEditable, lockVisit } from "@/lib/visit-state/lock";
import { fillVisitWeather } from "@/lib/weather/mutations";

import type { VisitDetailDto, ZoneCheckDto } from "./dto";
import { diffValues, toColumns, toZoneCheckDto, valuesOf } from "./map";
import { nextFreeDay } from "./next-free-day";
import { getVisit } from "./queries";
import {
  SCHEDULE_AHEAD_DAYS,
  type ScheduleVisitInput,
  type ZoneCheckInput,
  type ZoneCheckRequest,
} from "./schemas";
import { CANCEL_KINDS, type CancelVisitInput, type RescheduleVisitInput } from "./stop-outcomes";
import { mowingConsistency } from "./zone-check-rules";

export async function scheduleVisit(
  actor: Actor,
  input: ScheduleVisitInput,
): Promise<VisitDetailDto> {
  const id = input.id ?? randomUUID();
  await db()
    .transaction()
    .execute(async (trx) => {
      const property = await trx
        .selectFrom("properties")
        .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
        .select([
          "properties.id",
          "properties.name",
          "properties.archived_at",
          "properties.time_zone",
          "rule_sets.name as rule_set_name",
          "rule_sets.pro_no_fertilizer_after",
          "rule_sets.pro_no_fertilizer_before",
        ])
        .where(propertyInScope(actor))
        .where("properties.id", "=", input.propertyId)
        .executeTakeFirst();
      if (!property)
        throw new AppError("invalid_input", "Some values need attention.", {
          propertyId: ["Choose a property of your book."],
        });
      if (property.archived_at)
        throw new AppError("invalid_input", "Some values need attention.", {
          propertyId: ["That property is archived."],
        });
      // The date's window, in the property's time zone: today up to 18 months ahead.
      const today = todayIn(property.time_zone);
      if (input.scheduledFor < today)
        throw new AppError("invalid_input", "Some values need attention.", {
          scheduledFor: [
            `Date: a visit is scheduled for today (${usDate(today)}) or a later day, not in the past.`,
          ],
        });
      if (input.scheduledFor > addDays(today, SCHEDULE_AHEAD_DAYS))
        throw new AppError("invalid_input", "Some values need attention.", {
          scheduledFor: [
            `Date: at most 18 months ahead (${usDate(addDays(today, SCHEDULE_AHEAD_DAYS))} or earlier).`,
          ],
        });
      // Warnings the manager confirms: a second visit that day, a round with N or P inside the
      // rule set's no-fertilizer window (with the next day it is allowed).
      const warnings: Record<string, string[]> = {};
      const sameDay = await trx
        .selectFrom("visits")
        .select(["id", "planned_service"])
        .where("company_id", "=", actor.companyId)
        .where("property_id", "=", input.propertyId)
        .where("scheduled_for", "=", input.scheduledFor)
        .where("status", "!=", "cancelled")
        .where("id", "!=", id)
        .execute();
      if (sameDay.length && !input.confirmSameDay)
        warnings.confirmSameDay = [
          `${property.name} already has ${sameDay.length === 1 ? "a visit" : `${sameDay.length} visits`} on ${usDate(input.scheduledFor)} (${sameDay.map((v) => PLANNED_SERVICES[v.planned_service]).join(", ")}). Confirm to schedule another one that day.`,
        ];
      const window =
        property.pro_no_fertilizer_after && property.pro_no_fertilizer_before
          ? ([property.pro_no_fertilizer_after, property.pro_no_fertilizer_before] as const)
          : null;
      if (
        window &&
        putsDownNOrP(input.plannedService) &&
        inNoFertilizerWindow(input.scheduledFor.slice(5), window) &&
        !input.confirmBlackout
      ) {
        const next = nextFertilizerDate(input.scheduledFor, window);
        warnings.confirmBlackout = [
          `${usDate(input.scheduledFor)} is inside the no-fertilizer window of ${property.rule_set_name}: no fertilizer with nitrogen or phosphorus after ${monthDayWords(window[0])} or before ${monthDayWords(window[1])}.${next ? ` The next allowed day is ${usDate(next)}.` : ""} Choose that date, a round without nitrogen or phosphorus (lime, soil sampling, inspection), or confirm to schedule it anyway.`,
        ];
      }
      if (Object.keys(warnings).length)
        throw new AppError(
          "invalid_input",
          "Check the warnings below, then confirm or change the visit.",
          warnings,
          { warnings: Object.keys(warnings) },
        );
      if (input.technicianId) {
        const tech = await findCompanyTechnician(actor, input.technicianId, {
          active: true,
          trx,
        });
        if (!tech)
          throw new AppError("invalid_input", "Some values need attention.", {
            technicianId: ["Choose one of your technicians."],
          });
      }
      const inserted = await trx
        .insertInto("visits")
        .values({
          id,
          company_id: actor.companyId,
          property_id: input.propertyId,
          technician_id: input.technicianId,
          scheduled_for: input.scheduledFor,
          stop_order: input.stopOrder,
          planned_service: input.plannedService,
          notes: input.notes,
          created_by: actor.userId,
        })
        // No conflict target: the id is unique twice over (primary key and (company_id, id)), and a
        // concurrent retry may trip either.
        .onConflict((oc) => oc.doNothing())
        .returning("id")
        .executeTakeFirst();
      if (!inserted) {
        // A retry of the same request: fine if it is the same visit, a conflict otherwise.
        const existing = await trx
          .selectFrom("visits")
          .select(["company_id", "property_id", "scheduled_for"])
          .where("id", "=", id)
          .executeTakeFirst();
        if (
          !existing ||
          existing.company_id !== actor.companyId ||
          existing.property_id !== input.propertyId ||
          existing.scheduled_for !== input.scheduledFor
        )
          throw new AppError("conflict", "A different visit already uses that id.");
      }
      // The book shows the next visit.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: input.propertyId,
        alerts: "keep",
      });
    });
  return getVisit(actor, id);
}

/**
 * The device's moment of Start (a start queued offline is sent later): accepted from a working
 * day before now up to the clock difference the applications allow (lib/applications/applied-at.ts),
 * 422 naming the field otherwise. Without one, the server's clock.
 */
const START_LOOKBACK_MS = 24 * 3_600_000;
function boundStartedAt(requested: string | undefined, now: Date): Date | null {
  if (!requested) return null;
  const at = new Date(requested);
  if (
    at.getTime() > now.getTime() + CLOCK_SKEW_MS ||
    at.getTime() < now.getTime() - START_LOOKBACK_MS
  )
    throw new AppError("invalid_input", "Some values need attention.", {
      startedAt: [
        "The start time must be within the last 24 hours and not in the future (check the phone's clock).",
      ],
    });
  return at;
}

export async function startVisit(
  actor: Actor,
  visitId: string,
  location: { latitude: number | null; longitude: number | null; startedAt?: string },
  now: Date = new Date(),
): Promise<VisitDetailDto> {
  const startedAt = boundStartedAt(location.startedAt, now);
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      assertEditable(actor, visit);
      if (visit.status !== "scheduled") return; // already started: starting again changes nothing
      await trx
        .updateTable("visits")
        .set({
          status: "in_progress",
          started_at: startedAt ?? sql<Date>`now()`,
          started_by: actor.userId,
          start_latitude: location.latitude,
          start_longitude: location.longitude,
          version: sql<number>`version + 1`,
          updated_at: sql<Date>`now()`,
        })
        .where("id", "=", visitId)
        .execute();
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: "keep",
      });
    });
  // The day's weather goes with the visit; a slow or absent service leaves "unavailable" and
  // never blocks the start (the next page load tries again).
  await fillVisitWeather(actor, visitId).catch(() => undefined);
  return getVisit(actor, visitId);
}

/**
 * A request with every field: the mowing fields a form older than them does not send keep the
 * stored values (null on a new check), so an old page cannot erase them. The merged check is
 * checked again, since a kept height before mowing must still agree with a new height of cut.
 */
function withStoredMowing(
  request: ZoneCheckRequest,
  existing: ZoneCheck | undefined,
): ZoneCheckInput {
  const input: ZoneCheckInput = {
    ...request,
    mowedToday:
      request.mowedToday === undefined ? (existing?.mowed_today ?? null) : request.mowedToday,
    heightBeforeMowingIn:
      request.heightBeforeMowingIn === undefined
        ? existing?.height_before_mowing_in == null
          ? null
          : Number(existing.height_before_mowing_in)
        : request.heightBeforeMowingIn,
  };
  const problems = mowingConsistency(input);
  if (Object.keys(problems).length)
    throw new AppError(
      "invalid_input",
      "Some values need attention.",
      Object.fromEntries(Object.entries(problems).map(([field, message]) => [field, [message]])),
    );
  return input;
}

function sameValues(row: ZoneCheck, input: ZoneCheckInput): boolean {
  const { baseVersion: _ignored, ...submitted } = input;
  const normalised = {
    ...submitted,
    skipReason: submitted.status === "skipped" ? submitted.skipReason : null,
    skipNote: submitted.status === "skipped" ? submitted.skipNote : "",
  };
  return Object.keys(diffValues(valuesOf(row), normalised)).length === 0;
}

function conflict(current: ZoneCheck, who: string | null): AppError {
  return new AppError(
    "conflict",
    `This zone check was changed on another device${who ? ` by ${who}` : ""}. Choose which version to keep.`,
    undefined,
    { current: toZoneCheckDto(current, who) },
  );
}

/**
 * Creates or updates one zone check. The client names the check (its own UUID) and the version
 * its edit is based on, so a double tap or a retry leaves one row, and an edit based on an old
 * version is refused with the server's copy instead of overwriting it.
 */
export async function saveZoneCheck(
  actor: Actor,
  visitId: string,
  zoneCheckId: string,
  request: ZoneCheckRequest,
  /** Required when the visit is finished (a manager's correction). */
  correctionReason?: string | null,
): Promise<ZoneCheckDto> {
  return db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      assertEditable(actor, visit);
      const zone = await trx
        .selectFrom("zones")
        .select(["id", "archived_at"])
        .where("company_id", "=", actor.companyId)
        .where("property_id", "=", visit.property_id)
        .where("id", "=", request.zoneId)
        .executeTakeFirst();
      if (!zone)
        throw new AppError("invalid_input", "Some values need attention.", {
          zoneId: ["That zone is not part of this property."],
        });

      const nameOf = async (userId: string | null) =>
        userId
          ? ((
              await trx
                .selectFrom("users")
                .select("name")
                .where("id", "=", userId)
                .executeTakeFirst()
            )?.name ?? null)
          : null;

      // The row with its photos' figures: the Index is computed here and written with the row.
      const existing = await trx
        .selectFrom("zone_checks")
        .selectAll()
        .select((eb) =>
          eb
            .selectFrom("photos")
            .select(
              sql<
                PhotoFigures[]
              >`coalesce(json_agg(json_build_object('greenCoverPct', photos.green_cover_pct, 'dgci', photos.dgci, 'darkPct', photos.dark_pct, 'clippedPct', photos.clipped_pct)), '[]'::json)`.as(
                "figures",
              ),
            )
            .whereRef("photos.zone_check_id", "=", "zone_checks.id")
            .as("photo_figures"),
        )
        .where("id", "=", zoneCheckId)
        .forUpdate()
        .executeTakeFirst();
      if (existing && (existing.company_id !== actor.companyId || existing.visit_id !== visitId))
        throw notFound("That zone check");
      const input = withStoredMowing(request, existing);
      if (existing && existing.zone_id !== input.zoneId)
        throw new AppError("invalid_input", "Some values need attention.", {
          zoneId: ["A zone check cannot move to another zone."],
        });

      let saved: ZoneCheck;
      const audited = { visitId, zoneId: input.zoneId };
      if (!existing) {
        if (zone.archived_at)
          throw new AppError("invalid_input", "Some values need attention.", {
            zoneId: ["That zone is archived."],
          });
        const reason = correctionReasonFor(visit, correctionReason);
        const inserted = await trx
          .insertInto("zone_checks")
          .values({
            id: zoneCheckId,
            company_id: actor.companyId,
            visit_id: visitId,
            updated_by: actor.userId,
            ...toColumns(input),
            ...indexColumns(input, []), // a new check has no photos yet
          })
          .onConflict((oc) => oc.doNothing())
          .returningAll()
          .executeTakeFirst();
        if (inserted) {
          saved = inserted;
          // A zone checked after the visit was finished: a correction, with its reason.
          if (visit.status === "completed")
            await recordAudit(trx, actor, {
              entity: "zone_check",
              entityId: zoneCheckId,
              action: "add_after_finish",
              changes: diffValues({ ...valuesOf(inserted), status: "draft" }, valuesOf(inserted)),
              reason,
              ...audited,
            });
        } else {
          // Either the same check arrived twice at once, or another device checked this zone.
          const other = await trx
            .selectFrom("zone_checks")
            .selectAll()
            .where((eb) =>
              eb.or([
                eb("id", "=", zoneCheckId),
                eb.and([eb("visit_id", "=", visitId), eb("zone_id", "=", input.zoneId)]),
              ]),
            )
            .executeTakeFirstOrThrow();
          if (other.id === zoneCheckId && sameValues(other, input))
            return toZoneCheckDto(other, await nameOf(other.updated_by));
          throw conflict(other, await nameOf(other.updated_by));
        }
      } else if (existing.version !== input.baseVersion) {
        if (sameValues(existing, input))
          return toZoneCheckDto(existing, await nameOf(existing.updated_by));
        throw conflict(existing, await nameOf(existing.updated_by));
      } else {
        if (sameValues(existing, input))
          return toZoneCheckDto(existing, await nameOf(existing.updated_by));
        const reason = correctionReasonFor(visit, correctionReason);
        saved = await trx
          .updateTable("zone_checks")
          .set({
            ...toColumns(input),
            ...indexColumns(input, existing.photo_figures ?? []),
            version: sql<number>`version + 1`,
            updated_at: sql<Date>`now()`,
            updated_by: actor.userId,
          })
          .where("id", "=", zoneCheckId)
          .returningAll()
          .executeTakeFirstOrThrow();
        if (visit.status === "completed") {
          await recordAudit(trx, actor, {
            entity: "zone_check",
            entityId: zoneCheckId,
            action: "edit_after_finish",
            changes: diffValues(valuesOf(existing), valuesOf(saved)),
            reason,
            ...audited,
          });
        }
      }
      if (visit.status === "scheduled") {
        // Saving a check starts the visit if the technician did not tap "Start".
        await trx
          .updateTable("visits")
          .set({ status: "in_progress", started_at: sql<Date>`now()`, started_by: actor.userId })
          .where("id", "=", visitId)
          .execute();
      }
      // A finished visit's correction re-evaluates at once; an open visit's checks are evaluated
      // when it is finished.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: visit.status === "completed" ? "evaluate" : "keep",
      });
      return toZoneCheckDto(saved, actor.name);
    });
}

/**
 * Calls a stop off as a whole — rained out or canceled — with the reason the person gave. Zone
 * checks already saved are kept with the visit (never deleted), but a canceled visit's checks
 * count nowhere: not in the Index, the book or alerts (every read leaves canceled visits out), so
 * afterWrite re-evaluates them in this transaction. A replay of the same call changes nothing.
 */
export async function cancelVisit(
  actor: Actor,
  visitId: string,
  input: CancelVisitInput,
): Promise<VisitDetailDto> {
  const words = CANCEL_KINDS[input.outcome].label.toLowerCase();
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      if (visit.status === "cancelled") {
        if (visit.cancel_kind === input.outcome && visit.cancel_reason === input.reason) return;
        throw new AppError(
          "conflict",
          `This stop was already ${visit.cancel_kind ? CANCEL_KINDS[visit.cancel_kind].label.toLowerCase() : "canceled"}${visit.cancel_reason ? ` (${visit.cancel_reason})` : ""}; it can no longer be changed.`,
        );
      }
      if (visit.status === "completed")
        throw new AppError("conflict", `A finished visit cannot be ${words}.`);
      await trx
        .updateTable("visits")
        .set({
          status: "cancelled",
          cancel_kind: input.outcome,
          cancel_reason: input.reason,
          cancelled_at: sql<Date>`now()`,
          cancelled_by: actor.userId,
          version: sql<number>`version + 1`,
          updated_at: sql<Date>`now()`,
        })
        .where("id", "=", visitId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "visit",
        entityId: visitId,
        action: input.outcome === "rained_out" ? "rain_out" : "cancel",
        changes: {
          status: { from: visit.status, to: "cancelled" },
          outcome: { from: null, to: input.outcome },
        },
        reason: input.reason,
        visitId,
      });
      // Its checks no longer count: the Index, the book (next visit, last checks) and the alerts
      // follow.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: "evaluate",
      });
    });
  return getVisit(actor, visitId);
}

/**
 * Removes a zone check (and its photos: the files go after the commit unless another photo row
 * shares them). While the visit is open: anyone who may work on the visit (its technician, a
 * manager); after it is finished: a manager with a reason. Audited either way — a check that is
 * removed leaves its values in the trail.
 */
export async function deleteZoneCheck(
  actor: Actor,
  visitId: string,
  zoneCheckId: string,
  correctionReason: string | null | undefined,
  storage: PhotoStorage,
): Promise<void> {
  const keys = await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      const check = await trx
        .selectFrom("zone_checks")
        .selectAll()
        .where("company_id", "=", actor.companyId)
        .where("visit_id", "=", visitId)
        .where("id", "=", zoneCheckId)
        .forUpdate()
        .executeTakeFirst();
      if (!check) throw notFound("That zone check");
      assertEditable(actor, visit);
      const reason = correctionReasonFor(visit, correctionReason);
      const photos = await trx
        .deleteFrom("photos")
        .where("zone_check_id", "=", zoneCheckId)
        .returning(["display_key", "thumb_key"])
        .execute();
      await trx.deleteFrom("zone_checks").where("id", "=", zoneCheckId).execute();
      const before = valuesOf(check);
      await recordAudit(trx, actor, {
        entity: "zone_check",
        entityId: zoneCheckId,
        action: visit.status === "completed" ? "delete_after_finish" : "delete",
        changes: Object.fromEntries(
          Object.entries(before)
            .filter(([key, value]) => key !== "zoneId" && value !== null && value !== "")
            .map(([key, value]) => [key, { from: value, to: null }]),
        ),
        reason,
        visitId,
        zoneId: check.zone_id,
      });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: visit.status === "completed" ? "evaluate" : "keep",
      });
      return photos.flatMap((p) => [p.display_key, p.thumb_key]);
    });
  await removeUnreferencedFiles(keys, storage);
}

/**
 * A new visit in place of a stop that was rained out or canceled: same property, technician,
 * service, stop number and office note, on the day chosen (the page offers the next free day).
 * Once per canceled stop; the canceled visit keeps a link to its replacement.
 */
export async function rescheduleVisit(
  actor: Actor,
  visitId: string,
  input: RescheduleVisitInput,
): Promise<VisitDetailDto> {
  const newId = randomUUID();
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      if (visit.status !== "cancelled")
        throw new AppError(
          "conflict",
          "Only a stop that was rained out or canceled can be rescheduled this way.",
        );
      if (visit.rescheduled_visit_id) {
        const replacement = await trx
          .selectFrom("visits")
          .select("scheduled_for")
          .where("id", "=", visit.rescheduled_visit_id)
          .executeTakeFirst();
        throw new AppError(
          "conflict",
          `This stop was already rescheduled${replacement ? ` for ${usDate(replacement.scheduled_for)}` : ""}.`,
        );
      }
      const property = await trx
        .selectFrom("properties")
        .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
        .select([
          "properties.name",
          "properties.archived_at",
          "properties.time_zone",
          "rule_sets.name as rule_set_name",
          "rule_sets.pro_no_fertilizer_after",
          "rule_sets.pro_no_fertilizer_before",
        ])
        .where("properties.company_id", "=", actor.companyId)
        .where("properties.id", "=", visit.property_id)
        .executeTakeFirstOrThrow();
      if (property.archived_at)
        throw new AppError("conflict", "That property is archived; it has no more visits.");
      const today = todayIn(property.time_zone);
      const taken = (
        await trx
          .selectFrom("visits")
          .select("scheduled_for")
          .where("company_id", "=", actor.companyId)
          .where("property_id", "=", visit.property_id)
          .where("status", "!=", "cancelled")
          .where("scheduled_for", ">=", today)
          .execute()
      ).map((v) => v.scheduled_for);
      const window =
        property.pro_no_fertilizer_after && property.pro_no_fertilizer_before
          ? ([property.pro_no_fertilizer_after, property.pro_no_fertilizer_before] as const)
          : null;
      const offer = nextFreeDay({
        today,
        taken,
        window,
        putsDownNOrP: putsDownNOrP(visit.planned_service),
        aheadDays: SCHEDULE_AHEAD_DAYS,
      });
      const orOffer = offer ? ` The next free day is ${usDate(offer)}.` : "";
      const refuse = (message: string) =>
        new AppError("invalid_input", "Some values need attention.", {
          scheduledFor: [`Date: ${message}${orOffer}`],
        });
      if (input.scheduledFor < today)
        throw refuse(`the new visit is today (${usDate(today)}) or a later day, not in the past.`);
      if (input.scheduledFor > addDays(today, SCHEDULE_AHEAD_DAYS))
        throw refuse(
          `at most 18 months ahead (${usDate(addDays(today, SCHEDULE_AHEAD_DAYS))} or earlier).`,
        );
      if (taken.includes(input.scheduledFor))
        throw refuse(`${property.name} already has a visit on ${usDate(input.scheduledFor)}.`);
      if (
        window &&
        putsDownNOrP(visit.planned_service) &&
        inNoFertilizerWindow(input.scheduledFor.slice(5), window)
      )
        throw refuse(
          `${usDate(input.scheduledFor)} is inside the no-fertilizer window of ${property.rule_set_name}: no fertilizer with nitrogen or phosphorus after ${monthDayWords(window[0])} or before ${monthDayWords(window[1])}.`,
        );
      await trx
        .insertInto("visits")
        .values({
          id: newId,
          company_id: actor.companyId,
          property_id: visit.property_id,
          // A stop a technician started without being assigned goes to them.
          technician_id: visit.technician_id ?? (actor.role === "technician" ? actor.userId : null),
          scheduled_for: input.scheduledFor,
          stop_order: visit.stop_order,
          planned_service: visit.planned_service,
          notes: visit.notes,
          created_by: actor.userId,
        })
        .execute();
      await trx
        .updateTable("visits")
        .set({ rescheduled_visit_id: newId, updated_at: sql<Date>`now()` })
        .where("id", "=", visitId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "visit",
        entityId: visitId,
        action: "reschedule",
        changes: { scheduledFor: { from: visit.scheduled_for, to: input.scheduledFor } },
      });
      // The book shows the next visit.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: "keep",
      });
    });
  return getVisit(actor, newId);
}
