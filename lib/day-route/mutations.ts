// Writes of the day's route: "Put in driving order" (the stops not yet started in the order
// lib/day-route/plan.ts proposes) and the order set by hand (move up / move down). Both take the
// day's visit rows' locks (in id order, so two writes at once queue instead of deadlocking), check
// the day still has the stops the request was made for, renumber visits.stop_order 1…n and audit
// each stop whose number changed, as schedule moves are. The stop order changes no Index, book row
// or alert (the book's next visit is a date), so no after-write step is needed.
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { AppError } from "@/lib/http/app-error";
import { services } from "@/lib/services";
import { travelMatrix } from "@/lib/services/routing/client";

import { dayRoute, routePoints } from "./plan";
import { dayStopsQuery, dayTechnician, findDepot, toDayStop } from "./queries";
import type { DrivingOrderInput, StopOrderInput } from "./schemas";

type Trx = Transaction<Database>;

const CHANGED =
  "The day's stops changed meanwhile (a stop was added, moved or started); reload Today and try again.";

/** Locks the day's visits (id order) and returns them in stored order. */
async function lockDay(trx: Trx, actor: Actor, technicianId: string, date: string) {
  await trx
    .selectFrom("visits")
    .select("id")
    .where("company_id", "=", actor.companyId)
    .where("technician_id", "=", technicianId)
    .where("scheduled_for", "=", date)
    .orderBy("id")
    .forUpdate()
    .execute();
  return dayStopsQuery(trx, actor, technicianId, date).execute();
}

/** Numbers the day's stops 1…n in `order` and audits each change. */
async function renumber(
  trx: Trx,
  actor: Actor,
  rows: { id: string; stop_order: number }[],
  order: readonly string[],
  action: "reorder" | "driving_order",
): Promise<number> {
  const before = new Map(rows.map((r) => [r.id, r.stop_order]));
  let changed = 0;
  for (const [index, id] of order.entries()) {
    const to = index + 1;
    const from = before.get(id)!;
    if (from === to) continue;
    changed++;
    await trx
      .updateTable("visits")
      .set({ stop_order: to, updated_at: sql<Date>`now()` })
      .where("company_id", "=", actor.companyId)
      .where("id", "=", id)
      .execute();
    await recordAudit(trx, actor, {
      entity: "visit",
      entityId: id,
      action,
      changes: { stopOrder: { from, to } },
    });
  }
  return changed;
}

/** Stores the proposed driving order of the day (called-off stops go last, in their order). */
export async function putInDrivingOrder(
  actor: Actor,
  input: DrivingOrderInput,
): Promise<{ changed: number }> {
  const technicianId = await dayTechnician(db(), actor, input.technicianId);
  // The matrix comes from the routing service: fetched before the transaction, checked inside it.
  const seen = await dayStopsQuery(db(), actor, technicianId, input.date).execute();
  const driven = seen.filter((r) => r.status !== "cancelled").map(toDayStop);
  const depot = await findDepot(db(), actor, technicianId);
  const { matrix } = await travelMatrix(services().routing, routePoints(driven, depot));
  const { proposed } = dayRoute(driven, depot, matrix);
  const fingerprint = (rows: typeof seen) =>
    rows
      .map((r) => `${r.id}:${r.status}:${r.latitude}:${r.longitude}`)
      .sort()
      .join(",");

  return db()
    .transaction()
    .execute(async (trx) => {
      const rows = await lockDay(trx, actor, technicianId, input.date);
      if (fingerprint(rows) !== fingerprint(seen)) throw new AppError("conflict", CHANGED);
      const calledOff = rows.filter((r) => r.status === "cancelled").map((r) => r.id);
      const changed = await renumber(
        trx,
        actor,
        rows,
        [...proposed.visitIds, ...calledOff],
        "driving_order",
      );
      return { changed };
    });
}

/** Stores the order set by hand: `visitIds` must be exactly the day's stops. */
export async function setStopOrder(
  actor: Actor,
  input: StopOrderInput,
): Promise<{ changed: number }> {
  const technicianId = await dayTechnician(db(), actor, input.technicianId);
  if (new Set(input.visitIds).size !== input.visitIds.length)
    throw new AppError("invalid_input", "Some values need attention.", {
      visitIds: ["Stops: list each stop of the day once."],
    });
  return db()
    .transaction()
    .execute(async (trx) => {
      const rows = await lockDay(trx, actor, technicianId, input.date);
      const day = new Set(rows.map((r) => r.id));
      if (rows.length !== input.visitIds.length || !input.visitIds.every((id) => day.has(id)))
        throw new AppError("conflict", CHANGED);
      return { changed: await renumber(trx, actor, rows, input.visitIds, "reorder") };
    });
}
