// The managers' e-mail digest of newly raised high-severity alerts: one message per company to
// its managers, listing each alert with its evidence in words and a link to the alerts page.
// Alerts are marked notified only after the message was accepted, so an SMTP outage delays the
// digest (the job is retried) and never loses it.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { RISK_ALERTS_PATH } from "@/lib/paths";
import { alertKindLabel } from "@/lib/risk/labels";
import type { Mailer } from "@/lib/services/mail";
import { escapeHtml } from "@/lib/text";

export interface DigestResult {
  messages: number;
  alerts: number;
}

export async function sendHighAlertDigests(
  executor: Kysely<Database>,
  mailer: Mailer,
  options: { appUrl: string },
): Promise<DigestResult> {
  const pending = await executor
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
    .where("risk_alerts.notified_at", "is", null)
    .orderBy("risk_alerts.company_id")
    .orderBy("properties.name")
    .execute();
  const result: DigestResult = { messages: 0, alerts: 0 };
  const companies = [...new Set(pending.map((a) => a.company_id))];
  for (const companyId of companies) {
    const alerts = pending.filter((a) => a.company_id === companyId);
    const managers = await executor
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select(["users.email"])
      .where("memberships.company_id", "=", companyId)
      .where("memberships.role", "=", "manager")
      .where("users.disabled_at", "is", null)
      .execute();
    if (!managers.length) continue;
    const link = `${options.appUrl.replace(/\/$/, "")}${RISK_ALERTS_PATH}?severity=high`;
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
    await mailer.send({ to: managers.map((m) => m.email), subject, text, html });
    await executor
      .updateTable("risk_alerts")
      .set({ notified_at: new Date() })
      .where(
        "id",
        "in",
        alerts.map((a) => a.id),
      )
      .execute();
    result.messages++;
    result.alerts += alerts.length;
  }
  return result;
}
