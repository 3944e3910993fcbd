// A whole visit with no signal (issue 20's own checks), on a phone-sized Chromium with a profile
// on disk (a persistent context, as a phone's browser keeps its data): Today is saved ahead with a
// signal; then, offline, the technician starts a stop, rates three zones, takes two photos,
// records an application, skips a zone and finishes. A reload and a browser restarted on the same
// profile, still offline, show everything still waiting; back online, every operation reaches the
// server exactly once (counted in the database), the photos are measured, the visit is finished
// and the report e-mail is sent once. A second test makes a conflict — the same zone check edited
// from another session while the first is offline — and settles it on screen.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { createDb } from "@/db/client";
import { readInbox } from "@/lib/mail/inbox-folder";

import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { lawnImage } from "../helpers/images";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
const mailDir = inject("mailDir");
const db = createDb(inject("databaseUrl"), { max: 2 });
let c: TestCompany;
let password = "";
const profiles: string[] = [];

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  password = factories.TEST_PASSWORD;
  c = await factories.createTestCompany();
  // Kowalczyk (four zones) has no homeowner in the demo: give it one, so the report goes out.
  await db
    .insertInto("property_homeowners")
    .values({
      property_id: c.propertyIds["kowalczyk"]!,
      user_id: c.userIds["owner1"]!,
      company_id: c.companyId,
    })
    .execute();
});
afterAll(async () => {
  await db.destroy();
  for (const dir of profiles) rmSync(dir, { recursive: true, force: true });
});

/** Chromium on a profile folder, as the phone's browser: what it keeps survives a restart. */
function launchPhone(dir: string, offline: boolean): Promise<BrowserContext> {
  return chromium.launchPersistentContext(dir, {
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--headless",
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
    viewport: PHONE,
    baseURL: baseUrl,
    serviceWorkers: "allow",
    offline,
    permissions: ["geolocation"],
    geolocation: { latitude: 40.3511, longitude: -74.7026 },
  });
}

async function rate(page: Page, label: string, value: number) {
  const group = value >= 6 ? `${label}, acceptable` : `${label}, below acceptable`;
  await page
    .getByRole("radiogroup", { name: group, exact: true })
    .getByRole("radio", { name: String(value), exact: true })
    .click();
}

/** The zone's form has read the phone's copy (its fields are disabled until then). */
async function zoneOpen(page: Page, name: string) {
  await page.getByRole("heading", { level: 1, name }).waitFor({ timeout: 20_000 });
  await expect
    .poll(() => page.getByPlaceholder("What stood out in this zone").isEnabled(), {
      timeout: 10_000,
    })
    .toBe(true);
}

const waitKept = (page: Page) =>
  page
    .getByRole("status")
    .filter({ hasText: "Kept on this phone · sends when there is a signal" })
    .waitFor({ timeout: 10_000 });
const waitSaved = (page: Page) =>
  page
    .getByRole("status")
    .filter({ hasText: /^Saved/ })
    .waitFor({ timeout: 15_000 });

async function rateAll(page: Page, value: number) {
  for (const label of ["Overall quality", "Color", "Density", "Uniformity"])
    await rate(page, label, value);
}

describe("a visit with no signal", () => {
  it(
    "queued offline, kept through a reload and a browser restart, arrives once when online",
    { timeout: 300_000 },
    async () => {
      const dir = mkdtempSync(path.join(os.tmpdir(), "sward-phone-"));
      profiles.push(dir);
      const visitId = (
        await db
          .selectFrom("visits")
          .select("id")
          .where("property_id", "=", c.propertyIds["kowalczyk"]!)
          .where("status", "=", "scheduled")
          .orderBy("scheduled_for")
          .executeTakeFirstOrThrow()
      ).id;
      const lime = (
        await db
          .selectFrom("products")
          .select("id")
          .where("company_id", "=", c.companyId)
          .where("name", "like", "%Pelletized Lime%")
          .executeTakeFirstOrThrow()
      ).id;

      let phone = await launchPhone(dir, false);
      let page = phone.pages()[0] ?? (await phone.newPage());
      await signIn(page, baseUrl, c.emails["tech1"]!, password);
      await page.waitForURL("**/today");
      await page.getByText(/^Ready offline — \d+ stops?, saved/).waitFor({ timeout: 120_000 });

      // No signal from here on.
      await phone.setOffline(true);
      await page.getByRole("link", { name: /Kowalczyk residence/ }).click();
      await page.waitForURL(`**/visits/${visitId}`);
      await page.getByRole("button", { name: "Start visit" }).click();
      await page.waitForURL(/zone=/, { timeout: 20_000 });

      // Zone 1: rated, two photos, an application.
      await zoneOpen(page, "Front lawn");
      await rateAll(page, 7);
      await page.getByRole("button", { name: "Mark zone done" }).click();
      await waitKept(page);
      await page.getByLabel("Choose photos from the library").setInputFiles([
        { name: "front-1.jpg", mimeType: "image/jpeg", buffer: await lawnImage(2400, 1800, 0.3) },
        { name: "front-2.jpg", mimeType: "image/jpeg", buffer: await lawnImage(1200, 900, 0.2) },
      ]);
      const waitingPhotos = page.getByRole("list", { name: "Photos waiting to send" });
      await expect
        .poll(() => waitingPhotos.getByRole("listitem").count(), { timeout: 20_000 })
        .toBe(2);
      await page.getByRole("button", { name: "Record an application" }).click();
      await page.getByLabel("Product").selectOption(lime);
      await page.getByLabel("Rate", { exact: true }).fill("25");
      // The live maths work offline (the shared pure module, lib/agronomy).
      await page
        .getByRole("table", { name: "Nutrients delivered" })
        .or(page.getByText("This product brings no nitrogen"))
        .first()
        .waitFor();
      await page.getByRole("button", { name: "Record application" }).click();
      await page
        .getByRole("list", { name: "Applications waiting to send" })
        .getByText("Waiting to send")
        .waitFor();
      await snap(page, "offline-01-zone-waiting");

      // Zone 2 rated, zone 3 skipped, zone 4 rated.
      await page.getByRole("button", { name: /Next: Under the oaks/ }).click();
      await zoneOpen(page, "Under the oaks");
      await rateAll(page, 6);
      await page.getByRole("button", { name: "Mark zone done" }).click();
      await waitKept(page);
      await page.getByRole("button", { name: /Next: Back yard/ }).click();
      await zoneOpen(page, "Back yard");
      await page.getByRole("button", { name: "Skip this zone" }).click();
      await page
        .getByRole("radiogroup", { name: "Why was the zone skipped?" })
        .getByRole("radio", { name: "Dog in yard" })
        .click();
      await waitKept(page);
      await page.getByRole("button", { name: /Next: Pool surround/ }).click();
      await zoneOpen(page, "Pool surround");
      await rateAll(page, 8);
      await page.getByRole("button", { name: "Mark zone done" }).click();
      await waitKept(page);

      await page.getByRole("button", { name: "Review and finish" }).click();
      await page.getByRole("button", { name: "Finish visit" }).click();
      await page.getByText(/^Finished on this phone/).waitFor();
      const waitingWords = "7 changes and 2 photos waiting";
      await page.getByText(waitingWords).waitFor();
      const zones = page.getByRole("list", { name: "Zones of this visit" });
      expect(await zones.getByText("Done", { exact: true }).count()).toBe(3);
      expect(await zones.getByText("Skipped", { exact: true }).count()).toBe(1);
      await snap(page, "offline-02-finished-waiting");

      // A reload, still offline: all still there.
      await page.reload();
      await page.getByText(waitingWords).waitFor({ timeout: 20_000 });

      // The browser closed and started again on the same profile, still offline.
      await phone.close();
      phone = await launchPhone(dir, true);
      page = phone.pages()[0] ?? (await phone.newPage());
      await page.goto("/today");
      await page
        .getByRole("list", { name: "Stops" })
        .getByText(waitingWords)
        .waitFor({ timeout: 20_000 });
      await page.goto(`/visits/${visitId}`);
      await page.getByText(waitingWords).waitFor({ timeout: 20_000 });
      await page.getByText(/^Finished on this phone/).waitFor();
      await snap(page, "offline-03-after-restart");
      expect(
        await db.selectFrom("zone_checks").select("id").where("visit_id", "=", visitId).execute(),
      ).toHaveLength(0); // nothing reached the server yet

      // The signal is back: everything goes, once.
      await phone.setOffline(false);
      await page.getByText(/^Finished at/).waitFor({ timeout: 60_000 });
      await expect.poll(() => page.getByText(/waiting/).count(), { timeout: 20_000 }).toBe(0);
      await snap(page, "offline-04-sent");

      const visit = await db
        .selectFrom("visits")
        .select(["status", "started_at"])
        .where("id", "=", visitId)
        .executeTakeFirstOrThrow();
      expect(visit.status).toBe("completed");
      expect(visit.started_at).not.toBeNull();
      const checks = await db
        .selectFrom("zone_checks")
        .select(["status", "quality"])
        .where("visit_id", "=", visitId)
        .execute();
      expect(checks.map((k) => k.status).sort()).toEqual(["done", "done", "done", "skipped"]);
      const photos = await db
        .selectFrom("photos")
        .select(["green_cover_pct", "width", "height"])
        .where("visit_id", "=", visitId)
        .execute();
      expect(photos).toHaveLength(2);
      for (const p of photos) {
        expect(p.green_cover_pct).toBeGreaterThan(0);
        expect(Math.max(p.width, p.height)).toBeLessThanOrEqual(1600); // downscaled on the phone
      }
      expect(
        await db.selectFrom("applications").select("id").where("visit_id", "=", visitId).execute(),
      ).toHaveLength(1);
      expect(
        await db
          .selectFrom("audit_events")
          .select("id")
          .where("visit_id", "=", visitId)
          .where("action", "=", "finish")
          .execute(),
      ).toHaveLength(1);
      const owner = c.emails["owner1"]!;
      await expect
        .poll(
          async () =>
            (await readInbox(mailDir)).filter(
              (m) => m.to.includes(owner) && /Kowalczyk/.test(m.subject),
            ).length,
          { timeout: 30_000, interval: 500 },
        )
        .toBe(1);
      // A further replay (another focus, the timer) sends nothing more.
      await page.reload();
      await page.getByText(/^Finished at/).waitFor();
      await new Promise((r) => setTimeout(r, 2000));
      expect(
        (await readInbox(mailDir)).filter(
          (m) => m.to.includes(owner) && /Kowalczyk/.test(m.subject),
        ),
      ).toHaveLength(1);
      await phone.close();
    },
  );

  it("a zone check changed on another device while this one was offline: both shown, the technician keeps theirs", async () => {
    const browser = await launchBrowser();
    try {
      const visitId = (
        await db
          .selectFrom("visits")
          .select("id")
          .where("property_id", "=", c.propertyIds["haddad"]!)
          .where("status", "=", "scheduled")
          .orderBy("scheduled_for")
          .executeTakeFirstOrThrow()
      ).id;
      const phoneA = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
      const a = await phoneA.newPage();
      await signIn(a, baseUrl, c.emails["tech1"]!, password);
      await a.waitForURL("**/today");
      await a.goto(`/visits/${visitId}`);
      await a.getByRole("button", { name: "Start visit" }).click();
      await a.waitForURL(/zone=/);
      const zoneUrl = new URL(a.url()).pathname + new URL(a.url()).search;
      await zoneOpen(a, "Front slope");
      await rateAll(a, 7);
      await a.getByRole("button", { name: "Mark zone done" }).click();
      await waitSaved(a);

      // A loses the signal and changes the overall quality.
      await phoneA.setOffline(true);
      await rate(a, "Overall quality", 5);
      await waitKept(a);

      // Meanwhile another device changes it too, with a signal.
      const phoneB = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
      const b = await phoneB.newPage();
      await signIn(b, baseUrl, c.emails["tech1"]!, password);
      await b.waitForURL("**/today");
      await b.goto(zoneUrl);
      await zoneOpen(b, "Front slope");
      await rate(b, "Overall quality", 9);
      await waitSaved(b);

      // A's signal is back: its queued change is refused as a conflict and shown side by side.
      await phoneA.setOffline(false);
      const conflict = a.getByRole("table", {
        name: "This zone check was changed on another device while this phone had changes.",
      });
      await conflict.waitFor({ timeout: 30_000 });
      const row = conflict.getByRole("row", { name: /overall quality/ });
      expect((await row.getByRole("cell").allInnerTexts()).map((t) => t.trim())).toEqual([
        "9",
        "5",
      ]);
      await snap(a, "offline-05-conflict");
      await a.getByRole("button", { name: "Keep mine" }).click();
      await waitSaved(a);
      const check = await db
        .selectFrom("zone_checks")
        .select(["quality", "version"])
        .where("visit_id", "=", visitId)
        .where("zone_id", "=", (await zoneIdOf(visitId, "Front slope"))!)
        .executeTakeFirstOrThrow();
      expect(check).toEqual({ quality: 5, version: 3 });
      await phoneA.close();
      await phoneB.close();
    } finally {
      await browser.close();
    }
  }, 120_000);
});

async function zoneIdOf(visitId: string, name: string) {
  const row = await db
    .selectFrom("zones")
    .innerJoin("visits", "visits.property_id", "zones.property_id")
    .select("zones.id")
    .where("visits.id", "=", visitId)
    .where("zones.name", "=", name)
    .executeTakeFirst();
  return row?.id;
}
