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
  await db()
    .transaction()
    .execute(async (trx) => {
      // The row, locked: of resolves sent at once one wins; the others see it resolved here.
      const row = await trx
        .selectFrom("risk_alerts")
        .select(["status", "resolved_by"])
        .where("company_id", "=", actor.companyId)
        .where("id", "=", alertId)
        .forUpdate()
        .executeTakeFirstOrThrow();
      if (row.status === "resolved") {
        const last = await trx
          .selectFrom("risk_alert_events")
          .leftJoin("users", "users.id", "risk_alert_events.actor_id")
          .select(["risk_alert_events.note", "users.name"])
          .where("risk_alert_events.alert_id", "=", alertId)
          .where("risk_alert_events.action", "=", "resolved")
          .orderBy("risk_alert_events.at", "desc")
          .executeTakeFirst();
        // The same manager sending the same note again (a retry): harmless, nothing added.
        if (row.resolved_by === actor.userId && (last?.note ?? "") === note) return;
        throw new AppError(
          "conflict",
          `This alert was already resolved${last?.name ? ` by ${last.name}` : ""}, so your note was not saved. Read the resolution and add what is missing to the property's notes.`,
        );
      }
      await trx
        .updateTable("risk_alerts")
        .set({
          status: "resolved",
          resolution: "manual",
          resolved_at: new Date(),
          resolved_by: actor.userId,
          updated_at: new Date(),
        })
        .where("id", "=", alertId)
        .execute();
      await trx
        .insertInto("risk_alert_events")
        .values({
          alert_id: alertId,
          company_id: actor.companyId,
          actor_id: actor.userId,
          action: "resolved",
          from_status: row.status,
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
