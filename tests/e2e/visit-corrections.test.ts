// Corrections on screen, in a company of its own: a manager corrects an application on a finished
// visit — the dialog asks a reason, and the audit trail shows the correction as a sentence at once,
// without a reload; a technician deletes their own photo on an open visit, and a file that is not
// a photo fails with Dismiss and no Retry (a retry could never succeed). Screenshots go to
// tests/.artifacts.
import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import type { Database } from "@/db/schema";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { lawnImage } from "../helpers/images";
import { snap } from "../helpers/screenshots";
import { doneCheck } from "../helpers/zone-checks";

const BASE = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let db: Kysely<Database>;
let zone: { id: string; name: string };
let limeId: string;

beforeAll(async () => {
  useE2eDatabase();
  const { createTestCompany, testDb } = await import("../helpers/factories");
  db = testDb();
  c = await createTestCompany();
  zone = await db
    .selectFrom("zones")
    .select(["id", "name"])
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .where("archived_at", "is", null)
    .orderBy("sort_order")
    .executeTakeFirstOrThrow();
  limeId = (
    await db
      .selectFrom("products")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("name", "like", "Larkmoor Pelletized Lime%")
      .executeTakeFirstOrThrow()
  ).id;
  browser = await launchBrowser();
}, 120_000);

afterAll(async () => {
  await browser?.close();
});

/** A visit of tech1 at the Haddad residence, under way since an hour ago, with the first zone checked. */
async function openVisit(): Promise<{ visitId: string; checkId: string }> {
  const { saveZoneCheck } = await import("@/lib/visits/mutations");
  const visitId = randomUUID();
  await db
    .insertInto("visits")
    .values({
      id: visitId,
      company_id: c.companyId,
      property_id: c.propertyIds["haddad"]!,
      technician_id: c.userIds["tech1"]!,
      scheduled_for: new Date().toISOString().slice(0, 10),
      planned_service: "liming",
      status: "in_progress",
      started_at: new Date(Date.now() - 3_600_000),
      started_by: c.userIds["tech1"]!,
    })
    .execute();
  const checkId = randomUUID();
  await saveZoneCheck(await c.actor("tech1"), visitId, checkId, doneCheck(zone.id));
  return { visitId, checkId };
}

async function pageAs(who: "manager" | "tech1", viewport: typeof PHONE, path: string) {
  const context = await browser.newContext({ viewport, baseURL: BASE });
  const cookie = await mintSessionCookie(c.userIds[who]!);
  await context.addCookies([
    { name: SESSION_COOKIE, value: cookie.split("=").slice(1).join("="), url: BASE },
  ]);
  const page = await context.newPage();
  const res = await page.goto(`${BASE}${path}`, { waitUntil: "networkidle" });
  expect(res?.status(), path).toBe(200);
  return page;
}

async function reloads(page: Page): Promise<() => number> {
  let count = 0;
  page.on("framenavigated", (frame) => {
    if (frame === page.mainFrame()) count++;
  });
  return () => count;
}

describe("correcting a finished visit", () => {
  it("a manager corrects an application's rate with a reason; the trail shows it at once, in words", async () => {
    const { visitId } = await openVisit();
    const { recordApplication } = await import("@/lib/applications/mutations");
    await recordApplication(await c.actor("tech1"), visitId, {
      id: randomUUID(),
      zoneId: zone.id,
      productId: limeId,
      rateAmount: 25,
      rateUnit: "lb/1000ft2",
      windMph: 3,
      temperatureF: 45,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: null,
    });
    await db
      .updateTable("visits")
      .set({ status: "completed", completed_at: new Date(), completed_by: c.userIds["tech1"]! })
      .where("id", "=", visitId)
      .execute();

    const page = await pageAs("manager", DESKTOP, `/visits/${visitId}`);
    const navigations = await reloads(page);
    const list = page.getByRole("list", { name: `Applications on ${zone.name}` });
    await expect(list.textContent()).resolves.toMatch(
      /Larkmoor Pelletized Lime \(calcitic\): 25 lb \/ 1,000 ft²/,
    );
    await expect(list.textContent()).resolves.toMatch(/no nutrients/);
    await page
      .getByRole("button", {
        name: "Correct the application of Larkmoor Pelletized Lime (calcitic)",
      })
      .click();
    const dialog = page.getByRole("dialog", { name: /Correct the application/ });
    await dialog.getByLabel(/^Rate/).fill("20");
    // Without a reason the dialog says what is missing and nothing is sent.
    await dialog.getByRole("button", { name: "Save the correction" }).click();
    await expect(dialog.getByRole("alert").textContent()).resolves.toMatch(
      /^Reason for the correction: required/,
    );
    await dialog.getByLabel(/Reason for the correction/).fill("bag weighed after the visit");
    await snap(page, "visit-corrections-01-dialog");
    expect(await seriousViolations(page)).toEqual([]);
    await dialog.getByRole("button", { name: "Save the correction" }).click();
    await dialog.waitFor({ state: "hidden" });

    const trail = page.getByRole("list", { name: "Audit trail" });
    const sentence = `${zone.name} · application of Larkmoor Pelletized Lime (calcitic): rate 25 lb / 1,000 ft² → 20 lb / 1,000 ft² — corrected by ${c.scenario.people.find((p) => p.key === "manager")!.name}: bag weighed after the visit`;
    await trail.getByText(sentence, { exact: true }).waitFor({ timeout: 10_000 });
    await expect(list.textContent()).resolves.toMatch(/: 20 lb \/ 1,000 ft²/);
    expect(navigations(), "no reload").toBe(0);
    await snap(page, "visit-corrections-02-trail");
    const stored = await db
      .selectFrom("audit_events")
      .select(["reason", "actor_id"])
      .where("visit_id", "=", visitId)
      .execute();
    expect(stored).toEqual([
      { reason: "bag weighed after the visit", actor_id: c.userIds["manager"]! },
    ]);
  });
});

describe("correcting a finished visit's zone check", () => {
  it("a rating changed before the reason is kept, and sent once the reason is given", async () => {
    const { visitId, checkId } = await openVisit();
    await db
      .updateTable("visits")
      .set({ status: "completed", completed_at: new Date(), completed_by: c.userIds["tech1"]! })
      .where("id", "=", visitId)
      .execute();
    const page = await pageAs("manager", PHONE, `/visits/${visitId}`);
    await page.getByRole("button", { name: "Correct this check" }).first().click();
    await page.getByRole("heading", { level: 1, name: zone.name }).waitFor();

    // Color 7 → 4 with no reason yet: refused by the server, kept on the page, said in words.
    await page
      .getByRole("radiogroup", { name: "Color, below acceptable", exact: true })
      .getByRole("radio", { name: "4", exact: true })
      .click();
    await page
      .getByText(/a correction needs its reason/)
      .first()
      .waitFor();
    const color = async () =>
      (
        await db
          .selectFrom("zone_checks")
          .select("color")
          .where("id", "=", checkId)
          .executeTakeFirstOrThrow()
      ).color;
    expect(await color()).toBe(7);

    // The reason, then leaving the field: the waiting change goes without touching the rating again.
    await page.getByLabel("Reason for the correction (required)").fill("misread in shade");
    await page.getByLabel("Reason for the correction (required)").press("Tab");
    await expect.poll(color, { timeout: 10_000 }).toBe(4);
    const events = await db
      .selectFrom("audit_events")
      .select(["reason", "action"])
      .where("visit_id", "=", visitId)
      .execute();
    expect(events).toEqual([{ reason: "misread in shade", action: "edit_after_finish" }]);
    await snap(page, "visit-corrections-03-check-reason-after");
    await page.context().close();
  });
});

describe("an open visit on a phone", () => {
  it("the technician deletes their own photo; a file that is not a photo can be dismissed and offers no retry", async () => {
    const { visitId, checkId } = await openVisit();
    const cookie = await mintSessionCookie(c.userIds["tech1"]!);
    const uploaded = await fetch(`${BASE}/api/v1/visits/${visitId}/zone-checks/${checkId}/photos`, {
      method: "POST",
      body: new Uint8Array(await lawnImage(320, 240, 0.2, "jpeg", 91)),
      headers: { cookie, origin: BASE, "content-type": "image/jpeg" },
    });
    expect(uploaded.status).toBe(201);
    const photo = (await uploaded.json()) as { id: string };

    const page = await pageAs("tech1", PHONE, `/visits/${visitId}?zone=${zone.id}`);
    const photos = page.getByRole("list", { name: "Photos of this zone check" });
    await expect(photos.getByRole("listitem").count()).resolves.toBe(1);
    await photos.getByRole("button", { name: /^Delete this photo/ }).click();
    const dialog = page.getByRole("dialog", { name: "Delete this photo?" });
    // An open visit needs no reason.
    await expect(dialog.getByLabel(/Reason for the correction/).count()).resolves.toBe(0);
    await dialog.getByRole("button", { name: "Delete photo" }).click();
    await dialog.waitFor({ state: "hidden" });
    await photos.waitFor({ state: "detached", timeout: 10_000 });
    expect(await db.selectFrom("photos").select("id").where("id", "=", photo.id).execute()).toEqual(
      [],
    );

    // A text file offered as a photo: refused by the server; Dismiss, no Retry.
    await page.getByLabel("Choose photos from the library").setInputFiles({
      name: "notes.jpg",
      mimeType: "image/jpeg",
      buffer: Buffer.from("this is not a picture"),
    });
    const uploads = page.getByRole("list", { name: "Uploads" });
    await uploads.getByRole("alert").waitFor({ timeout: 15_000 });
    await expect(uploads.getByRole("button", { name: "Retry notes.jpg" }).count()).resolves.toBe(0);
    await snap(page, "visit-corrections-03-failed-upload");
    await uploads.getByRole("button", { name: "Dismiss notes.jpg" }).click();
    await uploads.waitFor({ state: "detached" });
  });
});
