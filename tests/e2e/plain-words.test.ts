// Every page each role can open, every e-mail Sward sends and the CSV exports, scanned for British
// spellings and developer internals (the one list: tests/helpers/house-words.ts), and for statistics
// jargon on what a homeowner reads. The demo scenario is what is read: its lawns have every kind of
// visit, alert and report. Text is taken from the rendered page (hidden text and attributes a
// screen reader speaks included) and from the outbox rows the server wrote.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { addDays, todayIn } from "@/lib/dates";

import { DESKTOP, launchBrowser } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import { scanWords, type WordFinding } from "../helpers/house-words";
import { doneCheck } from "../helpers/zone-checks";

const BASE = inject("baseUrl");
type Who = "manager" | "tech" | "owner1" | "owner2" | "owner3" | "otherManager" | "anonymous";

let browser: Browser;
const cookies = {} as Record<Who, string>;
const pages: [Who, string][] = [];
const findings: WordFinding[] = [];

function report(list: WordFinding[]): string {
  const byWord = new Map<string, WordFinding[]>();
  for (const f of list)
    byWord.set(`${f.rule} «${f.found}»`, [...(byWord.get(`${f.rule} «${f.found}»`) ?? []), f]);
  return [...byWord.entries()]
    .map(([k, fs]) => `${k} ×${fs.length}: ${fs[0]!.where} … ${fs[0]!.context}`)
    .join("\n");
}

beforeAll(async () => {
  useE2eDatabase();
  const { testDb } = await import("../helpers/factories");
  const db = testDb();
  const user = async (email: string) =>
    (await db.selectFrom("users").select("id").where("email", "=", email).executeTakeFirstOrThrow())
      .id;
  cookies.manager = await mintSessionCookie(await user("manager@demo.sward.test"));
  cookies.tech = await mintSessionCookie(await user("tech1@demo.sward.test"));
  cookies.owner1 = await mintSessionCookie(await user("owner1@demo.sward.test"));
  cookies.owner2 = await mintSessionCookie(await user("owner2@demo.sward.test"));
  cookies.owner3 = await mintSessionCookie(await user("owner3@demo.sward.test"));
  cookies.otherManager = await mintSessionCookie(await user("manager@other.sward.test"));
  cookies.anonymous = "";
  const company = await db
    .selectFrom("companies")
    .select("id")
    .where("slug", "=", "larkmoor-lawn")
    .executeTakeFirstOrThrow();
  const properties = await db
    .selectFrom("properties")
    .select("id")
    .where("company_id", "=", company.id)
    .orderBy("name")
    .execute();
  const zones = await db
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", properties[0]!.id)
    .orderBy("name")
    .execute();
  const visits = await db
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select(["visits.id", "visits.status", "visits.technician_id"])
    .where("properties.company_id", "=", company.id)
    .orderBy("visits.scheduled_for", "desc")
    .execute();
  // Every status at least once, and the latest completed visits (each reads differently).
  const seen = new Map<string, number>();
  const someVisits = visits.filter((v) => {
    const count = seen.get(v.status) ?? 0;
    seen.set(v.status, count + 1);
    return count < (v.status === "completed" ? 4 : 1);
  });
  const manager = [
    "/book",
    "/book?sort=index&dir=asc",
    "/visits",
    "/schedule",
    "/risk-alerts",
    "/risk-alerts?status=resolved",
    "/products",
    "/rule-sets",
    "/records",
    "/settings",
    "/people",
    "/properties/new",
    "/dev/mail",
    ...properties.map((p) => `/properties/${p.id}`),
    `/properties/${properties[0]!.id}/edit`,
    ...zones.slice(0, 2).map((z) => `/properties/${properties[0]!.id}/zones/${z.id}`),
    ...someVisits.map((v) => `/visits/${v.id}`),
  ];
  pages.push(...manager.map((p): [Who, string] => ["manager", p]));
  pages.push(
    ...["/today", "/properties", "/risk-alerts", "/no-such-page"].map((p): [Who, string] => [
      "tech",
      p,
    ]),
  );
  pages.push(...properties.slice(0, 2).map((p): [Who, string] => ["tech", `/properties/${p.id}`]));
  const techVisits = someVisits.filter((v) => v.status !== "completed").slice(0, 3);
  pages.push(...techVisits.map((v): [Who, string] => ["tech", `/visits/${v.id}`]));
  for (const owner of ["owner1", "owner2", "owner3"] as const) pages.push([owner, "/my-lawn"]);
  const reports = await db
    .selectFrom("visits")
    .innerJoin("property_homeowners", "property_homeowners.property_id", "visits.property_id")
    .innerJoin("users", "users.id", "property_homeowners.user_id")
    .select(["visits.id", "users.email"])
    .where("visits.status", "=", "completed")
    .orderBy("visits.scheduled_for", "desc")
    .execute();
  const perOwner = new Map<string, number>();
  for (const r of reports) {
    const n = perOwner.get(r.email) ?? 0;
    perOwner.set(r.email, n + 1);
    if (n >= 2) continue;
    const who = r.email.split("@")[0] as Who;
    if (who in cookies) pages.push([who, `/my-lawn/reports/${r.id}`]);
  }
  pages.push(["otherManager", "/book"]);
  pages.push(["anonymous", "/sign-in"], ["anonymous", "/sign-in/link"], ["anonymous", "/nowhere"]);
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

describe("plain words", () => {
  it("no page of any role shows a British spelling or an internal name", async () => {
    const failures: string[] = [];
    for (const [who, path] of pages) {
      const context = await browser.newContext({ viewport: DESKTOP });
      if (cookies[who])
        await context.addCookies([
          { name: SESSION_COOKIE, value: cookies[who].split("=").slice(1).join("="), url: BASE },
        ]);
      const page = await context.newPage();
      const res = await page.goto(`${BASE}${path}`, { waitUntil: "load" });
      await page.waitForLoadState("networkidle", { timeout: 5_000 }).catch(() => undefined);
      if (!res || res.status() >= 500) failures.push(`${who} ${path}: status ${res?.status()}`);
      // Open every <details> so what it hides is read too, then read text and spoken attributes.
      const text = await page.evaluate(() => {
        document.querySelectorAll("details").forEach((d) => (d.open = true));
        const body = document.body.cloneNode(true) as HTMLElement;
        body.querySelectorAll("script,style,noscript,template").forEach((n) => n.remove());
        const attrs = [...document.querySelectorAll("[aria-label],[title],[alt],[placeholder]")]
          .flatMap((el) =>
            ["aria-label", "title", "alt", "placeholder"].map((a) => el.getAttribute(a) ?? ""),
          )
          .join("\n");
        return `${document.title}\n${body.innerText || body.textContent}\n${body.textContent}\n${attrs}`;
      });
      findings.push(...scanWords(`${who} ${path}`, text, { homeowner: who.startsWith("owner") }));
      await context.close();
    }
    const pageFindings = findings.filter(
      (f) => !f.where.startsWith("mail") && !f.where.startsWith("csv"),
    );
    console.log(
      `plain words: ${pages.length} pages read as ${new Set(pages.map(([w]) => w)).size} people; ${pageFindings.length} findings`,
    );
    expect(failures).toEqual([]);
    expect(report(pageFindings)).toBe("");
  }, 900_000);

  it("no e-mail (visit report, sign-in link, alert digest) does either", async () => {
    const { testDb } = await import("../helpers/factories");
    const { queueHighAlertDigests } = await import("@/lib/risk-alerts/digest");
    const db = testDb();
    // Only the e-mails written here are read (other suites leave e-mails to people they invented).
    const since = new Date(Date.now() - 1000);
    // The sign-in link e-mail, asked for as a homeowner does.
    const context = await browser.newContext({ viewport: DESKTOP });
    const page = await context.newPage();
    await page.goto(`${BASE}/sign-in?callbackUrl=/my-lawn`);
    await page.getByLabel("Your e-mail address").fill("owner3@demo.sward.test");
    await page.getByRole("button", { name: /sign-in link/i }).click();
    await page.waitForLoadState("networkidle");
    await context.close();
    // The visit report e-mail: a visit of its own (tomorrow, at tech2's Brandvold lawn, whose
    // homeowner's latest report no other test reads), every zone checked, finished.
    const brandvold = await db
      .selectFrom("properties")
      .innerJoin("companies", "companies.id", "properties.company_id")
      .select("properties.id")
      .where("companies.slug", "=", "larkmoor-lawn")
      .where("properties.name", "=", "Brandvold residence")
      .executeTakeFirstOrThrow();
    const tech2 = (
      await db
        .selectFrom("users")
        .select("id")
        .where("email", "=", "tech2@demo.sward.test")
        .executeTakeFirstOrThrow()
    ).id;
    const tech2Cookie = await mintSessionCookie(tech2);
    const stop = { id: crypto.randomUUID(), property_id: brandvold.id };
    const scheduled = await fetch(`${BASE}/api/v1/visits`, {
      method: "POST",
      headers: { cookie: cookies.manager, origin: BASE, "content-type": "application/json" },
      body: JSON.stringify({
        id: stop.id,
        propertyId: stop.property_id,
        scheduledFor: addDays(todayIn("America/New_York"), 1),
        technicianId: tech2,
        plannedService: "inspection",
        stopOrder: 1,
        notes: "",
        confirmSameDay: true,
      }),
    });
    expect(scheduled.status, await scheduled.clone().text()).toBeLessThan(300);
    const stopZones = await db
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", stop.property_id)
      .where("archived_at", "is", null)
      .execute();
    const api = (method: string, path: string, body: unknown) =>
      fetch(`${BASE}${path}`, {
        method,
        headers: { cookie: tech2Cookie, origin: BASE, "content-type": "application/json" },
        body: JSON.stringify(body),
      });
    for (const z of stopZones)
      expect(
        (
          await api(
            "PUT",
            `/api/v1/visits/${stop.id}/zone-checks/${crypto.randomUUID()}`,
            doneCheck(z.id),
          )
        ).status,
      ).toBe(200);
    expect((await api("POST", `/api/v1/visits/${stop.id}/finish`, {})).status).toBe(200);
    // The managers' digest of high alerts, as the morning job writes it.
    await db
      .updateTable("risk_alerts")
      .set({ notified_at: null })
      .where("severity", "=", "high")
      .execute();
    await queueHighAlertDigests(db, { appUrl: BASE });
    const mails = await db
      .selectFrom("mail_outbox")
      .select(["kind", "subject", "text_body", "html_body", "to_address"])
      .where("created_at", ">=", since)
      .execute();
    const kinds = new Set(mails.map((m) => m.kind));
    const mailFindings = mails.flatMap((m) => {
      const homeowner = m.kind !== "alert_digest";
      const html = m.html_body.replace(/<[^>]+>/g, " ").replace(/&nbsp;/g, " ");
      return [
        ...scanWords(`mail ${m.kind} subject`, m.subject, { homeowner }),
        ...scanWords(`mail ${m.kind} text`, m.text_body, { homeowner }),
        ...scanWords(`mail ${m.kind} html`, html, { homeowner }),
      ];
    });
    console.log(
      `plain words: ${mails.length} e-mails of ${kinds.size} kinds (${[...kinds].join(", ")}); ${mailFindings.length} findings`,
    );
    expect([...kinds].sort()).toEqual(
      expect.arrayContaining(["alert_digest", "visit_report"].sort()),
    );
    expect(mails.some((m) => /sign/i.test(m.subject))).toBe(true);
    expect(report(mailFindings)).toBe("");
  }, 120_000);

  it("no CSV export (the book, the application records) does either, headers and values", async () => {
    const get = (path: string) => fetch(`${BASE}${path}`, { headers: { cookie: cookies.manager } });
    const exports = [
      "/api/v1/book/export",
      "/api/v1/records/applications?from=2026-01-01&to=2026-12-31",
    ];
    const csvFindings: WordFinding[] = [];
    for (const path of exports) {
      const res = await get(path);
      expect(res.status, path).toBe(200);
      const text = await res.text();
      expect(text.split("\n").length, `${path} has rows`).toBeGreaterThan(1);
      csvFindings.push(...scanWords(`csv ${path}`, text));
    }
    console.log(`plain words: ${exports.length} CSV exports; ${csvFindings.length} findings`);
    expect(report(csvFindings)).toBe("");
  });
});
