// Stored text that contains HTML renders inert (OWASP ASVS 5.0 V1.2 output encoding): markup
// typed into property, zone, person, product, rule-set, watering, alert and zone-check fields is
// shown as text on every page that displays it, and in the visit-report e-mail it is escaped.
// Chromium loads each page as the person who may see it; a page fails if any payload ran
// (a dialog, a global set) or became an element.
import { randomUUID } from "node:crypto";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { addDays, todayIn } from "@/lib/dates";
import { readInbox } from "@/lib/mail/inbox-folder";

import { DESKTOP, launchBrowser } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import { doneCheck } from "../helpers/zone-checks";

const BASE = inject("baseUrl");
const MAIL_DIR = inject("mailDir");
const PAYLOAD = `<img src=x onerror="window.__pwned=1"><script>window.__pwned=2</script>"><svg onload="window.__pwned=3">`;
const tagged = (label: string) => `${label} ${PAYLOAD}`.slice(0, 190);

let browser: Browser;
const t = { propertyId: "", zoneId: "", visitId: "", ownerEmail: "" };
const cookies: Record<"manager" | "tech" | "owner", string> = { manager: "", tech: "", owner: "" };

beforeAll(async () => {
  useE2eDatabase();
  const { createTestCompany, testDb } = await import("../helpers/factories");
  const { evaluateProperty } = await import("@/lib/after-write/sweep");
  const db = testDb();
  const c = await createTestCompany();
  t.propertyId = c.propertyIds["oyelaran"]!;
  t.ownerEmail = c.emails["owner1"]!;
  await evaluateProperty(db, c.companyId, t.propertyId, { provider: null });
  const zones = await db
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", t.propertyId)
    .orderBy("sort_order")
    .execute();
  t.zoneId = zones[0]!.id;
  t.visitId = (
    await db
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", t.propertyId)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow()
  ).id;
  // Markup in every kind of stored text a page or an e-mail shows.
  await db
    .updateTable("properties")
    .set({
      name: tagged("Oyelaran"),
      street: tagged("14 Quillwort Lane"),
      notes: tagged("Gate code"),
    })
    .where("id", "=", t.propertyId)
    .execute();
  await db
    .updateTable("zones")
    .set({ name: tagged("Front") })
    .where("id", "=", t.zoneId)
    .execute();
  await db
    .updateTable("users")
    .set({ name: tagged("Margaret") })
    .where("id", "=", c.userIds["owner1"]!)
    .execute();
  await db
    .updateTable("users")
    .set({ name: tagged("Luis") })
    .where("id", "=", c.userIds["tech1"]!)
    .execute();
  const product = await db
    .selectFrom("products")
    .select("id")
    .where("company_id", "=", c.companyId)
    .orderBy("name")
    .executeTakeFirstOrThrow();
  await db
    .updateTable("products")
    .set({ name: tagged("Feed") })
    .where("id", "=", product.id)
    .execute();
  const ruleSet = await db
    .selectFrom("rule_sets")
    .select("id")
    .where("company_id", "=", c.companyId)
    .orderBy("name")
    .executeTakeFirstOrThrow();
  await db
    .updateTable("rule_sets")
    .set({ name: tagged("Rules") })
    .where("id", "=", ruleSet.id)
    .execute();
  cookies.manager = await mintSessionCookie(c.userIds["manager"]!);
  cookies.tech = await mintSessionCookie(c.userIds["tech1"]!);
  cookies.owner = await mintSessionCookie(c.userIds["owner1"]!);
  const api = (cookie: string, method: string, path: string, body: unknown) =>
    fetch(`${BASE}${path}`, {
      method,
      headers: { cookie, origin: BASE, "content-type": "application/json" },
      body: JSON.stringify(body),
    });
  const alert = await db
    .selectFrom("risk_alerts")
    .select("id")
    .where("property_id", "=", t.propertyId)
    .where("status", "=", "open")
    .executeTakeFirstOrThrow();
  expect(
    (
      await api(cookies.tech, "POST", `/api/v1/alerts/${alert.id}/acknowledge`, {
        note: tagged("Seen"),
      })
    ).status,
  ).toBe(200);
  expect(
    (
      await api(cookies.tech, "POST", `/api/v1/properties/${t.propertyId}/waterings`, {
        id: randomUUID(),
        zoneId: null,
        wateredOn: addDays(todayIn("America/New_York"), -1),
        depthIn: 0.5,
        runMinutes: null,
        precipitationRateInPerHour: null,
        notes: tagged("Hose"),
      })
    ).status,
  ).toBe(201);
  // The visit: every zone checked with markup in its notes, then finished — the report e-mail goes to owner1.
  for (const z of zones)
    expect(
      (
        await api(
          cookies.tech,
          "PUT",
          `/api/v1/visits/${t.visitId}/zone-checks/${randomUUID()}`,
          doneCheck(z.id, { notes: tagged("Notes") }),
        )
      ).status,
    ).toBe(200);
  expect((await api(cookies.tech, "POST", `/api/v1/visits/${t.visitId}/finish`, {})).status).toBe(
    200,
  );
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

describe("stored HTML", () => {
  it("is shown as text, never run or turned into elements, on every page that shows it", async () => {
    const pages: [keyof typeof cookies, string][] = [
      ["manager", "/book"],
      ["manager", `/book?q=${encodeURIComponent("<img")}`],
      ["manager", `/properties/${t.propertyId}`],
      ["manager", `/properties/${t.propertyId}/edit`],
      ["manager", `/properties/${t.propertyId}/zones/${t.zoneId}`],
      ["manager", `/visits/${t.visitId}`],
      ["manager", "/visits"],
      ["manager", "/risk-alerts"],
      ["manager", "/products"],
      ["manager", "/rule-sets"],
      ["manager", "/records"],
      ["manager", "/dev/mail"],
      ["tech", "/today"],
      ["tech", "/properties"],
      ["tech", `/properties/${t.propertyId}`],
      ["tech", `/visits/${t.visitId}`],
      ["owner", "/my-lawn"],
      ["owner", `/my-lawn/reports/${t.visitId}`],
    ];
    const problems: string[] = [];
    let showingText = 0;
    for (const [who, path] of pages) {
      const context = await browser.newContext({ viewport: DESKTOP });
      await context.addCookies([
        { name: SESSION_COOKIE, value: cookies[who].split("=").slice(1).join("="), url: BASE },
      ]);
      const page = await context.newPage();
      let dialogs = 0;
      page.on("dialog", (d) => {
        dialogs++;
        void d.dismiss();
      });
      const res = await page.goto(`${BASE}${path}`, { waitUntil: "networkidle" });
      const found = await page.evaluate(() => ({
        pwned: (window as unknown as { __pwned?: number }).__pwned ?? null,
        images: document.querySelectorAll('img[src="x"]').length,
        svgs: document.querySelectorAll("svg[onload]").length,
        scripts: [...document.querySelectorAll("script")].filter(
          (s) =>
            (s.textContent ?? "").includes("window.__pwned=") &&
            !(s.textContent ?? "").startsWith("self.__next_f"),
        ).length,
        text: document.body.innerText.includes("<img src=x"),
      }));
      if (found.text) showingText++;
      if (
        !res?.ok() ||
        found.pwned !== null ||
        found.images ||
        found.svgs ||
        found.scripts ||
        dialogs
      )
        problems.push(
          `${who} ${path}: status ${res?.status()}, ${JSON.stringify(found)}, dialogs ${dialogs}`,
        );
      await context.close();
    }
    console.log(
      `stored HTML: ${pages.length} pages loaded as their readers, ${showingText} show the markup as text; ran or became elements on ${problems.length} pages`,
    );
    expect(problems).toEqual([]);
    expect(showingText).toBeGreaterThanOrEqual(12);
  }, 180_000);

  it("is escaped in the visit-report e-mail, and plain in its text part", async () => {
    let mail: Awaited<ReturnType<typeof readInbox>>[number] | undefined;
    for (let i = 0; i < 100 && !mail; i++) {
      mail = (await readInbox(MAIL_DIR)).find(
        (m) => m.to.includes(t.ownerEmail) && /visit report/i.test(m.subject),
      );
      if (!mail) await new Promise((r) => setTimeout(r, 200));
    }
    expect(mail, "the report e-mail arrives").toBeDefined();
    const html = mail!.html;
    const raw = [/<img[^>]*src=["']?x/i, /<script>window/i, /<svg[^>]*onload/i].filter((re) =>
      re.test(html),
    );
    console.log(
      `stored HTML: report e-mail — raw markup found ${raw.length}, escaped copies ${(html.match(/&lt;img/g) ?? []).length}; subject ${JSON.stringify(mail!.subject.slice(0, 60))}…`,
    );
    expect(raw).toEqual([]);
    expect(html).toContain("&lt;img");
    expect(mail!.text).toContain("<img src=x"); // the text part shows what was typed, as text
  });
});
