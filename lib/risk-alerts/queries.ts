// Alert reads, within the actor's property scope (staff only: homeowners get care notes instead).
import "server-only";

import { sql } from "kysely";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { alertKindLabel } from "@/lib/risk/labels";
import type { Evidence } from "@/lib/risk/rules";
import { escapeLike } from "@/lib/text";

import type { AlertDto } from "./dto";
import type { AlertFilters } from "./schemas";

function baseQuery(actor: Actor) {
  return db()
    .selectFrom("risk_alerts")
    .innerJoin("properties", "properties.id", "risk_alerts.property_id")
    .leftJoin("zones", "zones.id", "risk_alerts.zone_id")
    .leftJoin("users as tech", "tech.id", "properties.technician_id")
    .leftJoin("users as acker", "acker.id", "risk_alerts.acknowledged_by")
    .leftJoin("users as resolver", "resolver.id", "risk_alerts.resolved_by")
    .selectAll("risk_alerts")
    .select([
      "properties.name as property_name",
      "properties.city",
      "zones.name as zone_name",
      "tech.name as technician_name",
      "acker.name as acknowledged_by_name",
      "resolver.name as resolved_by_name",
    ])
    .where("risk_alerts.company_id", "=", actor.companyId)
    .where(propertyInScope(actor));
}

type Row = Awaited<ReturnType<ReturnType<typeof baseQuery>["execute"]>>[number];

async function withEvents(rows: Row[]): Promise<AlertDto[]> {
  const events = rows.length
    ? await db()
        .selectFrom("risk_alert_events")
        .leftJoin("users", "users.id", "risk_alert_events.actor_id")
        .select([
          "risk_alert_events.alert_id",
          "risk_alert_events.at",
          "risk_alert_events.action",
          "risk_alert_events.note",
          "users.name",
        ])
        .where(
          "risk_alert_events.alert_id",
          "in",
          rows.map((r) => r.id),
        )
        .orderBy("risk_alert_events.at")
        .orderBy("risk_alert_events.id")
        .execute()
    : [];
  return rows.map((r) => ({
    id: r.id,
    kind: r.kind,
    kindLabel: alertKindLabel(r.kind),
    severity: r.severity,
    status: r.status,
    summary: r.summary,
    evidence: r.evidence as Evidence,
    source: r.source,
    raisedOn: r.raised_on,
    lastSeenOn: r.last_seen_on,
    clearSince: r.clear_since,
    property: { id: r.property_id, name: r.property_name, city: r.city },
    zone: r.zone_id && r.zone_name ? { id: r.zone_id, name: r.zone_name } : null,
    technicianName: r.technician_name,
    acknowledgedAt: r.acknowledged_at ? new Date(r.acknowledged_at).toISOString() : null,
    acknowledgedBy: r.acknowledged_by_name,
    resolvedAt: r.resolved_at ? new Date(r.resolved_at).toISOString() : null,
    resolvedBy: r.resolved_by_name,
    resolution: r.resolution,
    previousAlertId: r.previous_alert_id,
    events: events
      .filter((e) => e.alert_id === r.id)
      .map((e) => ({
        at: new Date(e.at).toISOString(),
        action: e.action,
        actor: e.name,
        note: e.note,
      })),
  }));
}

/** Live alerts before resolved ones, then high → moderate → low. */
const liveFirst = () => sql<number>`case when risk_alerts.status = 'resolved' then 1 else 0 end`;
const severityRank = () =>
  sql<number>`case risk_alerts.severity when 'high' then 0 when 'moderate' then 1 else 2 end`;

/** Alerts across the actor's book, filtered; live ones (open or acknowledged) by default. */
export async function listAlerts(
  actor: Actor,
  filters: AlertFilters,
  limit = 200,
): Promise<AlertDto[]> {
  if (actor.role === "homeowner") return [];
  const status = filters.status ?? "live";
  const rows = await baseQuery(actor)
    .$if(status === "live", (q) => q.where("risk_alerts.status", "!=", "resolved"))
    .$if(status !== "live" && status !== "all", (q) =>
      q.where("risk_alerts.status", "=", status as "open"),
    )
    .$if(filters.kind !== undefined, (q) => q.where("risk_alerts.kind", "=", filters.kind!))
    .$if(filters.severity !== undefined, (q) =>
      q.where("risk_alerts.severity", "=", filters.severity!),
    )
    .$if(filters.technician !== undefined, (q) =>
      q.where("properties.technician_id", "=", filters.technician!),
    )
    .$if(Boolean(filters.area), (q) =>
      q.where((eb) =>
        eb.or([
          eb("properties.city", "ilike", `%${escapeLike(filters.area!)}%`),
          eb("properties.postal_code", "ilike", `${escapeLike(filters.area!)}%`),
        ]),
      ),
    )
    .orderBy(liveFirst())
    .orderBy(severityRank())
    .orderBy("risk_alerts.raised_on", "desc")
    .orderBy("risk_alerts.id")
    .limit(limit)
    .execute();
  return withEvents(rows);
}

/** A property's alerts: live ones first, then the resolved ones of the last 90 days. */
export async function listPropertyAlerts(actor: Actor, propertyId: string): Promise<AlertDto[]> {
  if (actor.role === "homeowner") return [];
  const rows = await baseQuery(actor)
    .where("risk_alerts.property_id", "=", propertyId)
    .where((eb) =>
      eb.or([
        eb("risk_alerts.status", "!=", "resolved"),
        eb("risk_alerts.resolved_at", ">", sql<Date>`now() - interval '90 days'`),
      ]),
    )
    .orderBy(liveFirst())
    .orderBy(severityRank())
    .orderBy("risk_alerts.raised_on", "desc")
    .limit(100)
    .execute();
  return withEvents(rows);
}

export async function getAlert(actor: Actor, alertId: string): Promise<AlertDto | null> {
  if (actor.role === "homeowner") return null;
  const rows = await baseQuery(actor).where("risk_alerts.id", "=", alertId).execute();
  return (await withEvents(rows))[0] ?? null;
}
