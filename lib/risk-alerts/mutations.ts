// Alert lifecycle by hand: a technician or manager acknowledges with a note; a manager resolves
// with a note. Every change is an event; the book's summary follows in the same transaction
// (afterWrite without re-evaluating, which would reopen what a manager just resolved).
import "server-only";

import { db } from "@/db";
import { afterWrite } from "@/lib/after-write";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";

import type { AlertDto } from "./dto";
import { getAlert } from "./queries";

async function lockAlert(actor: Actor, alertId: string) {
  const alert = await getAlert(actor, alertId); // scope: not found outside the actor's properties
  if (!alert) throw notFound("That alert");
  return alert;
}

export async function acknowledgeAlert(
  actor: Actor,
  alertId: string,
  note: string,
): Promise<AlertDto> {
  const alert = await lockAlert(actor, alertId);
  if (alert.status === "resolved")
    throw new AppError("conflict", "This alert is already resolved.");
  if (alert.status === "acknowledged" && !note) return alert; // acknowledging twice is harmless
  await db()
    .transaction()
    .execute(async (trx) => {
      const updated = await trx
        .updateTable("risk_alerts")
        .set({
          status: "acknowledged",
          acknowledged_at: alert.acknowledgedAt ?? new Date(),
          acknowledged_by: alert.status === "acknowledged" ? undefined : actor.userId,
          updated_at: new Date(),
        })
        .where("id", "=", alertId)
        .where("status", "!=", "resolved")
        .executeTakeFirst();
      if (!updated.numUpdatedRows)
        throw new AppError("conflict", "This alert was resolved meanwhile.");
      await trx
        .insertInto("risk_alert_events")
        .values({
          alert_id: alertId,
          company_id: actor.companyId,
          actor_id: actor.userId,
          action: "acknowledged",
          from_status: alert.status,
          to_status: "acknowledged",
          note,
        })
        .execute();
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: alert.property.id,
        alerts: "keep",
      });
    });
  return (await getAlert(actor, alertId))!;
}

export async function resolveAlert(actor: Actor, alertId: string, note: string): Promise<AlertDto> {
  if (actor.role !== "manager")
    throw new AppError(
      "forbidden",
      "Only a manager can resolve an alert. Acknowledge it with a note instead.",
    );
  const alert = await lockAlert(actor, alertId);
  if (alert.status === "resolved") return alert; // resolving twice is harmless
  await db()
    .transaction()
    .execute(async (trx) => {
      const updated = await trx
        .updateTable("risk_alerts")
        .set({
          status: "resolved",
          resolution: "manual",
          resolved_at: new Date(),
          resolved_by: actor.userId,
          updated_at: new Date(),
        })
        .where("id", "=", alertId)
        .where("status", "!=", "resolved")
        .executeTakeFirst();
      if (!updated.numUpdatedRows) return; // resolved meanwhile: that write refreshed the book
      await trx
        .insertInto("risk_alert_events")
        .values({
          alert_id: alertId,
          company_id: actor.companyId,
          actor_id: actor.userId,
          action: "resolved",
          from_status: alert.status,
          to_status: "resolved",
          note,
        })
        .execute();
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: alert.property.id,
        alerts: "keep",
      });
    });
  return (await getAlert(actor, alertId))!;
}
