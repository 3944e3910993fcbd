// The managers' e-mail digest of newly raised high-severity alerts: one message per company
// manager, listing each alert with its evidence in words and a link to the alerts page. The
// messages are outbox rows written in the same transaction that marks the alerts notified, so a
// crash or an SMTP outage delays the digest and never loses or repeats it (the worker delivers).
import { createHash } from "node:crypto";
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { enqueueMail } from "@/lib/mail/outbox";
import { RISK_ALERTS_PATH } from "@/lib/paths";
import { alertKindLabel } from "@/lib/risk/labels";
import { escapeHtml } from "@/lib/text";

export interface DigestResult {
  messages: number;
  alerts: number;
}

export async function queueHighAlertDigests(
  executor: Kysely<Database>,
  options: { appUrl: string; companyIds?: string[] },
): Promise<DigestResult> {
  return executor.transaction().execute(async (trx) => {
    let query = trx
      .selectFrom("risk_alerts")
      .innerJoin("properties", "properties.id", "risk_alerts.property_id")
      .innerJoin("companies", "companies.id", "risk_alerts.company_id")
      .leftJoin("zones", "zones.id", "risk_alerts.zone_id")
      .select([
        "risk_alerts.id",
        "risk_alerts.company_id",
        "risk_alerts.kind",
        "risk_alerts.summary",
        "risk_alerts.raised_on",
        "properties.name as property_name",
        "properties.city",
        "zones.name as zone_name",
        "companies.name as company_name",
      ])
      .where("risk_alerts.severity", "=", "high")
      .where("risk_alerts.status", "!=", "resolved")
      .where("risk_alerts.notified_at", "is", null);
    if (options.companyIds)
      query = options.companyIds.length
        ? query.where("risk_alerts.company_id", "in", options.companyIds)
        : query.where((eb) => eb.val(false));
    // Two digests running at once (two time zones' mornings) never take the same alert.
    const pending = await query
      .orderBy("risk_alerts.company_id")
      .orderBy("properties.name")
      .forUpdate("risk_alerts")
      .skipLocked()
      .execute();
    const result: DigestResult = { messages: 0, alerts: 0 };
    const companies = [...new Set(pending.map((a) => a.company_id))];
    for (const companyId of companies) {
      const alerts = pending.filter((a) => a.company_id === companyId);
      const managers = await trx
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["users.id", "users.email"])
        .where("memberships.company_id", "=", companyId)
        .where("memberships.role", "=", "manager")
        .where("users.disabled_at", "is", null)
        .execute();
      if (!managers.length) continue; // they wait for a manager
      const mail = digestEmail(alerts, options.appUrl);
      const batch = createHash("sha256")
        .update(alerts.map((a) => a.id).join(","))
        .digest("hex")
        .slice(0, 24);
      for (const m of managers) {
        await enqueueMail(trx, {
          companyId,
          kind: "alert_digest",
          dedupeKey: `alert_digest:${batch}:${m.id}`,
          to: m.email,
          ...mail,
        });
        result.messages++;
      }
      await trx
        .updateTable("risk_alerts")
        .set({ notified_at: new Date() })
        .where(
          "id",
          "in",
          alerts.map((a) => a.id),
        )
        .execute();
      result.alerts += alerts.length;
    }
    return result;
  });
}

function digestEmail(
  alerts: {
    kind: string;
    summary: string;
    raised_on: string;
    property_name: string;
    city: string;
    zone_name: string | null;
    company_name: string;
  }[],
  appUrl: string,
) {
  const link = `${appUrl.replace(/\/$/, "")}${RISK_ALERTS_PATH}?severity=high`;
  const lines = alerts.map(
    (a) =>
      `• ${alertKindLabel(a.kind)} — ${a.property_name}, ${a.city}${a.zone_name ? ` (${a.zone_name})` : ""}, raised ${a.raised_on}: ${a.summary}`,
  );
  const subject = `${alerts.length} new high-severity ${alerts.length === 1 ? "alert" : "alerts"} in ${alerts[0]!.company_name}'s book`;
  const text = `${subject}.\n\n${lines.join("\n")}\n\nSee the evidence and act on them: ${link}\n\nSward checks every morning and when a visit is finished.`;
  const html = `<p>${escapeHtml(subject)}.</p><ul>${alerts
    .map(
      (a) =>
        `<li><strong>${escapeHtml(alertKindLabel(a.kind))}</strong> — ${escapeHtml(a.property_name)}, ${escapeHtml(a.city)}${a.zone_name ? ` (${escapeHtml(a.zone_name)})` : ""}, raised ${escapeHtml(a.raised_on)}: ${escapeHtml(a.summary)}</li>`,
    )
    .join(
      "",
    )}</ul><p><a href="${escapeHtml(link)}">See the evidence and act on them</a></p><p>Sward checks every morning and when a visit is finished.</p>`;
  return { subject, text, html };
}
