// The managers' e-mail digest of newly raised high-severity alerts: one message per company
// manager, listing each alert with its evidence in words and a link to the alerts page. The
// messages are outbox rows written in the same transaction that marks the alerts notified, so a
// crash or an SMTP outage delays the digest and never loses or repeats it (the worker delivers).
import { createHash } from "node:crypto";
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { formatDate, todayIn } from "@/lib/dates";
import { translator } from "@/lib/i18n/translate";
import { enqueueMail } from "@/lib/mail/outbox";
import { RISK_ALERTS_PATH } from "@/lib/paths";
import { readPressureAreas, readPressureSettings } from "@/lib/pressure-areas/read";
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
        "companies.locale as company_locale",
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
    company_locale: string;
  }[],
  appUrl: string,
) {
  const locale = alerts[0]!.company_locale;
  const t = translator(locale, "digest");
  const link = `${appUrl.replace(/\/$/, "")}${RISK_ALERTS_PATH}?severity=high`;
  const line = (a: (typeof alerts)[number], esc: (s: string) => string) =>
    t("line", {
      kind: esc(alertKindLabel(a.kind)),
      property: esc(a.property_name),
      city: esc(a.city),
      zone: a.zone_name ? ` (${esc(a.zone_name)})` : "",
      date: esc(formatDate(a.raised_on, locale)),
      summary: esc(a.summary),
    });
  const subject = t("subject", { count: alerts.length, company: alerts[0]!.company_name });
  const text = `${subject}.\n\n${alerts.map((a) => `• ${line(a, (s) => s)}`).join("\n")}\n\n${t("act")}: ${link}\n\n${t("when")}`;
  const html = `<p>${escapeHtml(subject)}.</p><ul>${alerts
    .map((a) => `<li>${line(a, escapeHtml)}</li>`)
    .join(
      "",
    )}</ul><p><a href="${escapeHtml(link)}">${escapeHtml(t("act"))}</a></p><p>${escapeHtml(t("when"))}</p>`;
  return { subject, text, html };
}

/**
 * The managers' e-mail naming each new pressure area once (lib/pressure-areas/read.ts): the areas
 * of today are read in the transaction; each key not yet in pressure_area_notices is inserted
 * there (`on conflict do nothing`, so two digests at once name an area once) and named in one
 * message per manager, enqueued in the same transaction.
 */
export async function queuePressureAreaDigests(
  executor: Kysely<Database>,
  options: { appUrl: string; companyIds?: string[]; today?: string },
): Promise<{ messages: number; areas: number }> {
  let companies = executor.selectFrom("companies").select(["id", "name", "locale", "time_zone"]);
  if (options.companyIds)
    companies = options.companyIds.length
      ? companies.where("id", "in", options.companyIds)
      : companies.where((eb) => eb.val(false));
  const result = { messages: 0, areas: 0 };
  for (const company of await companies.execute()) {
    await executor.transaction().execute(async (trx) => {
      const today = options.today ?? todayIn(company.time_zone);
      const settings = await readPressureSettings(trx, company.id);
      const areas = await readPressureAreas(trx, company.id, today, settings);
      if (!areas.length) return;
      const managers = await trx
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["users.id", "users.email"])
        .where("memberships.company_id", "=", company.id)
        .where("memberships.role", "=", "manager")
        .where("users.disabled_at", "is", null)
        .execute();
      if (!managers.length) return; // named when the company has a manager again
      const inserted = await trx
        .insertInto("pressure_area_notices")
        .values(
          areas.map((a) => ({
            company_id: company.id,
            area_key: a.key,
            kind: a.kind,
            noticed_on: today,
          })),
        )
        .onConflict((oc) => oc.columns(["company_id", "area_key"]).doNothing())
        .returning("area_key")
        .execute();
      const fresh = new Set(inserted.map((r) => r.area_key));
      const named = areas.filter((a) => fresh.has(a.key));
      if (!named.length) return;
      const mail = pressureAreaEmail(named, company, settings.days, options.appUrl);
      const batch = createHash("sha256")
        .update(named.map((a) => a.key).join(","))
        .digest("hex")
        .slice(0, 24);
      for (const m of managers) {
        await enqueueMail(trx, {
          companyId: company.id,
          kind: "pressure_area_digest",
          dedupeKey: `pressure_area_digest:${batch}:${m.id}`,
          to: m.email,
          ...mail,
        });
        result.messages++;
      }
      result.areas += named.length;
    });
  }
  return result;
}

function pressureAreaEmail(
  areas: Awaited<ReturnType<typeof readPressureAreas>>,
  company: { name: string; locale: string },
  days: number,
  appUrl: string,
) {
  const t = translator(company.locale, "digest");
  const link = `${appUrl.replace(/\/$/, "")}${RISK_ALERTS_PATH}#pressure-areas`;
  const line = (a: (typeof areas)[number], esc: (s: string) => string) => {
    const members = a.properties.filter((p) => p.isMember);
    const soon = a.properties.filter((p) => p.checkSoon).length;
    return t("areaLine", {
      kind: esc(a.kindLabel),
      count: String(members.length),
      properties: esc(members.map((p) => p.name).join(", ")),
      first: esc(formatDate(a.firstOn, company.locale)),
      latest: esc(formatDate(a.latestOn, company.locale)),
      checkSoon: soon ? esc(t("areaCheckSoon", { count: soon, days: String(days) })) : "",
    });
  };
  const subject = t("areasSubject", { count: areas.length, company: company.name });
  const text = `${subject}.\n\n${areas.map((a) => `• ${line(a, (s) => s)}.`).join("\n")}\n\n${t("areasAct")}: ${link}\n\n${t("areasWhat")}`;
  const html = `<p>${escapeHtml(subject)}.</p><ul>${areas
    .map((a) => `<li>${line(a, escapeHtml)}.</li>`)
    .join(
      "",
    )}</ul><p><a href="${escapeHtml(link)}">${escapeHtml(t("areasAct"))}</a></p><p>${escapeHtml(t("areasWhat"))}</p>`;
  return { subject, text, html };
}
