// Logging a watering (staff, and homeowners for their own lawn). Idempotent by id; the alerts
// and the book follow in the same transaction (afterWrite). A watering may be recorded on a visit
// (staff); then it follows the visit's rules: its author or a manager may correct or delete it
// while the visit is open, only a manager with a reason once the visit is finished, audited.
import "server-only";

import type { Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { usDate } from "@/lib/agronomy/season";
import { wateringDepthIn } from "@/lib/agronomy/water";
import { correctionReasonFor } from "@/lib/audit/correction";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";
import { assertEditable, lockVisit } from "@/lib/visit-state/lock";

import type { WateringDto } from "./dto";
import { listWaterings } from "./queries";
import { WATERING_BACK_DAYS, type WateringInput } from "./schemas";

const invalid = (fieldErrors: Record<string, string[]>) =>
  new AppError("invalid_input", "Some values need attention.", fieldErrors);

async function scopedProperty(actor: Actor, propertyId: string) {
  const property = await db()
    .selectFrom("properties")
    .select(["properties.id", "properties.time_zone"])
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  return property;
}

/** The checks every watering goes through, new or corrected; the depth it stores. */
async function checkedDepth(
  actor: Actor,
  property: { id: string; time_zone: string },
  input: WateringInput,
): Promise<number> {
  // The property's own day: no watering in the future, none more than a year back.
  const today = todayIn(property.time_zone);
  if (input.wateredOn > today)
    throw invalid({ wateredOn: [`Date watered: not in the future (today is ${usDate(today)}).`] });
  if (input.wateredOn < addDays(today, -WATERING_BACK_DAYS))
    throw invalid({
      wateredOn: [
        `Date watered: within the last year (${usDate(addDays(today, -WATERING_BACK_DAYS))} or later).`,
      ],
    });
  if (input.zoneId) {
    const zone = await db()
      .selectFrom("zones")
      .select("id")
      .where("company_id", "=", actor.companyId)
      .where("property_id", "=", property.id)
      .where("id", "=", input.zoneId)
      .executeTakeFirst();
    if (!zone) throw invalid({ zoneId: ["That zone is not part of this property."] });
  }
  const depth =
    input.depthIn ?? wateringDepthIn(input.runMinutes!, input.precipitationRateInPerHour!);
  if (depth > 10)
    throw invalid({
      runMinutes: ["That run time and rate make more than 10 in of water. Check both."],
    });
  return Math.round(depth * 1000) / 1000;
}

/** The visit a watering is recorded on: staff only, the same property, locked, editable. */
async function lockedVisitOf(
  trx: Transaction<Database>,
  actor: Actor,
  visitId: string,
  propertyId: string,
) {
  if (actor.role === "homeowner")
    throw invalid({ visitId: ["Waterings are recorded on a visit by staff only."] });
  const visit = await lockVisit(trx, actor, visitId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found")
      throw invalid({ visitId: ["That visit is not one of this property's."] });
    throw err;
  });
  if (visit.property_id !== propertyId)
    throw invalid({ visitId: ["That visit is not one of this property's."] });
  assertEditable(actor, visit);
  return visit;
}

const factsOf = (w: {
  watered_on: string;
  depth_in: number;
  run_minutes: number | null;
  precipitation_rate_in_per_h: number | null;
  notes: string;
}) => ({
  wateredOn: w.watered_on,
  depthIn: Number(w.depth_in),
  runMinutes: w.run_minutes === null ? null : Number(w.run_minutes),
  precipitationRateInPerHour:
    w.precipitation_rate_in_per_h === null ? null : Number(w.precipitation_rate_in_per_h),
  notes: w.notes,
});

function changesOf(
  before: ReturnType<typeof factsOf> | null,
  after: ReturnType<typeof factsOf> | null,
): Record<string, { from: unknown; to: unknown }> {
  const keys = Object.keys(after ?? before ?? {}) as (keyof ReturnType<typeof factsOf>)[];
  const changes: Record<string, { from: unknown; to: unknown }> = {};
  for (const key of keys) {
    const from = before ? before[key] : null;
    const to = after ? after[key] : null;
    if (!before || !after || JSON.stringify(from) !== JSON.stringify(to))
      changes[key] = { from, to };
  }
  return changes;
}

async function savedWatering(actor: Actor, propertyId: string, id: string) {
  const saved = (await listWaterings(actor, propertyId, { limit: 500 })).find((w) => w.id === id);
  if (!saved) throw new AppError("conflict", "A different watering already uses that id.");
  return saved;
}

export async function logWatering(
  actor: Actor,
  propertyId: string,
  input: WateringInput,
): Promise<WateringDto> {
  const property = await scopedProperty(actor, propertyId);
  const depth = await checkedDepth(actor, property, input);
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = input.visitId
        ? await lockedVisitOf(trx, actor, input.visitId, propertyId)
        : null;
      const reason = visit ? correctionReasonFor(visit, input.correctionReason) : null;
      const values = {
        watered_on: input.wateredOn,
        depth_in: depth,
        run_minutes: input.runMinutes,
        precipitation_rate_in_per_h: input.precipitationRateInPerHour,
        notes: input.notes,
      };
      const row = await trx
        .insertInto("waterings")
        .values({
          id: input.id,
          company_id: actor.companyId,
          property_id: propertyId,
          zone_id: input.zoneId,
          visit_id: visit?.id ?? null,
          ...values,
          entered_by_role: actor.role,
          created_by: actor.userId,
        })
        .onConflict((oc) => oc.column("id").doNothing())
        .returning("id")
        .executeTakeFirst();
      if (row && visit?.status === "completed")
        await recordAudit(trx, actor, {
          entity: "watering",
          entityId: input.id,
          action: "add_after_finish",
          changes: changesOf(null, factsOf(values)),
          reason,
          visitId: visit.id,
          zoneId: input.zoneId,
        });
      // The water balance feeds the drought and disease rules: the alerts and the book follow.
      if (row)
        await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "evaluate" });
    });
  return savedWatering(actor, propertyId, input.id);
}

/** The watering, locked, with the rules of who may change it (404 out of scope, 403 not theirs). */
async function lockedWatering(
  trx: Transaction<Database>,
  actor: Actor,
  wateringId: string,
  verb: "correct" | "delete",
) {
  const row = await trx
    .selectFrom("waterings")
    .innerJoin("properties", "properties.id", "waterings.property_id")
    .selectAll("waterings")
    .select("properties.time_zone")
    .where(propertyInScope(actor))
    .where("waterings.company_id", "=", actor.companyId)
    .where("waterings.id", "=", wateringId)
    .forUpdate("waterings")
    .executeTakeFirst();
  if (!row) throw notFound("That watering");
  const visit = row.visit_id ? await lockVisit(trx, actor, row.visit_id) : null;
  if (visit) assertEditable(actor, visit);
  if (actor.role !== "manager" && row.created_by !== actor.userId)
    throw new AppError(
      "forbidden",
      `Only the person who logged this watering, or a manager, can ${verb} it.`,
    );
  return { row, visit };
}

/** Corrects a watering with the same checks as a new one; audited when it is on a visit. */
export async function correctWatering(
  actor: Actor,
  wateringId: string,
  input: WateringInput,
): Promise<WateringDto> {
  if (input.id !== wateringId)
    throw invalid({ id: ["The watering's id cannot change; send the id of the path."] });
  const propertyId = await db()
    .transaction()
    .execute(async (trx) => {
      const { row, visit } = await lockedWatering(trx, actor, wateringId, "correct");
      if ((input.visitId ?? row.visit_id) !== row.visit_id)
        throw invalid({ visitId: ["A watering cannot move to another visit."] });
      const reason = visit ? correctionReasonFor(visit, input.correctionReason) : null;
      const depth = await checkedDepth(
        actor,
        { id: row.property_id, time_zone: row.time_zone },
        input,
      );
      const values = {
        watered_on: input.wateredOn,
        depth_in: depth,
        run_minutes: input.runMinutes,
        precipitation_rate_in_per_h: input.precipitationRateInPerHour,
        notes: input.notes,
      };
      await trx
        .updateTable("waterings")
        .set({ ...values, zone_id: input.zoneId })
        .where("id", "=", wateringId)
        .execute();
      const changes = changesOf(factsOf(row), factsOf(values));
      if (visit && Object.keys(changes).length)
        await recordAudit(trx, actor, {
          entity: "watering",
          entityId: wateringId,
          action: visit.status === "completed" ? "edit_after_finish" : "edit",
          changes,
          reason,
          visitId: visit.id,
          zoneId: input.zoneId,
        });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: row.property_id,
        alerts: "evaluate",
      });
      return row.property_id;
    });
  return savedWatering(actor, propertyId, wateringId);
}

/** Deletes a watering; audited when it is on a visit (with the reason a finished one needs). */
export async function deleteWatering(
  actor: Actor,
  wateringId: string,
  correctionReason: string | null | undefined,
): Promise<void> {
  await db()
    .transaction()
    .execute(async (trx) => {
      const { row, visit } = await lockedWatering(trx, actor, wateringId, "delete");
      const reason = visit ? correctionReasonFor(visit, correctionReason) : null;
      await trx.deleteFrom("waterings").where("id", "=", wateringId).execute();
      if (visit)
        await recordAudit(trx, actor, {
          entity: "watering",
          entityId: wateringId,
          action: visit.status === "completed" ? "delete_after_finish" : "delete",
          changes: changesOf(factsOf(row), null),
          reason,
          visitId: visit.id,
          zoneId: row.zone_id,
        });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: row.property_id,
        alerts: "evaluate",
      });
    });
}
