// A whole visit on a phone (390×844): tech1 opens today, starts a visit, fills two zone checks,
// skips a third with a reason, reloads mid-way and finds the draft intact, finishes; the manager
// then sees the finished visit and its checks. Screenshots of each step go to tests/.artifacts.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { exposedImage, lawnImage } from "../helpers/images";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
let visitUrl = "";

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function rate(page: Page, label: string, value: number) {
  const group = value >= 6 ? `${label}, acceptable` : `${label}, below acceptable`;
  await page
    .getByRole("radiogroup", { name: group, exact: true })
    .getByRole("radio", { name: String(value), exact: true })
    .click();
}

async function waitSaved(page: Page) {
  await page
    .getByRole("status")
    .filter({ hasText: /^Saved/ })
    .waitFor({ timeout: 10_000 });
}

describe("a technician runs a visit on a phone", () => {
  it("today → start → two zones checked, one skipped, reload keeps the draft → finish; the manager sees it", async () => {
    const context = await browser.newContext({
      viewport: PHONE,
      baseURL: baseUrl,
      permissions: ["geolocation"],
      geolocation: { latitude: 40.3511, longitude: -74.7026 },
    });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech1@demo.sward.test");
    await page.waitForURL("**/today");
    await expect(page.getByText("Open concerns from last visit").first().isVisible()).resolves.toBe(
      true,
    );
    await snap(page, "visit-01-today");
    expect(await seriousViolations(page)).toEqual([]);

    // Kowalczyk residence has four zones: check two, skip one, check the fourth.
    await page.getByRole("link", { name: /Kowalczyk residence/ }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]+$/);
    visitUrl = new URL(page.url()).pathname;
    await snap(page, "visit-02-before-start");
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.waitForURL(/zone=/);
    await page.getByRole("heading", { name: "Front lawn" }).waitFor();

    // Zone 1: Front lawn
    await rate(page, "Overall quality", 7);
    await rate(page, "Color", 8);
    await rate(page, "Density", 7);
    await rate(page, "Uniformity", 6);
    await page.getByRole("button", { name: "Weeds: more" }).click();
    await page.getByRole("button", { name: "Weeds: more" }).click();
    await page
      .getByRole("radiogroup", { name: "Soil moisture" })
      .getByRole("radio", { name: "Moist" })
      .click();
    await page.getByRole("button", { name: "Height of cut: more" }).click(); // first tap sets 3.00 in
    await page.getByRole("button", { name: "Height of cut: more" }).click(); // 3.25 in
    await page
      .getByRole("radiogroup", { name: "Mowing direction" })
      .getByRole("radio", { name: "Changed" })
      .click();
    // Three photos at once from the library (one taken too dark to measure), and one file that
    // is not a photo.
    await page.getByLabel("Choose photos from the library").setInputFiles([
      { name: "front-1.jpg", mimeType: "image/jpeg", buffer: await lawnImage(2400, 1800, 0.3) },
      { name: "front-2.jpg", mimeType: "image/jpeg", buffer: await lawnImage(1600, 1200, 0.1) },
      {
        name: "front-dusk.jpg",
        mimeType: "image/jpeg",
        buffer: await exposedImage(await lawnImage(640, 480, 0.1), 0.12, "jpeg"),
      },
      {
        name: "notes.jpg",
        mimeType: "image/jpeg",
        buffer: Buffer.from("a text file with a photo's name"),
      },
    ]);
    const photos = page.getByRole("list", { name: "Photos of this zone check" });
    await expect
      .poll(
        async () =>
          await photos
            .getByRole("listitem")
            .count()
            .catch(() => 0),
        { timeout: 20_000 },
      )
      .toBe(3);
    expect(await photos.innerText()).toMatch(/\d+\.\d % green canopy cover · DGCI 0\.\d{3}/);
    // The lighting caution shows where the figures show (lib/photo-analysis/color.ts, LIGHTING).
    await photos.getByRole("note").filter({ hasText: "Too dark to measure" }).waitFor();
    expect(await photos.getByRole("note").count()).toBe(1);
    await page.getByRole("alert").filter({ hasText: "not a photo Sward can read" }).waitFor();
    await snap(page, "visit-03a-photos");
    await page.getByRole("button", { name: "Mark zone done" }).click();
    await waitSaved(page);
    await snap(page, "visit-03-front-lawn-done");
    expect(await seriousViolations(page)).toEqual([]);

    // Zone 2: Under the oaks — with a symptom; reload before marking it done.
    await page.getByRole("button", { name: /Next: Under the oaks/ }).click();
    await page.getByRole("heading", { name: "Under the oaks" }).waitFor();
    await rate(page, "Overall quality", 5);
    await rate(page, "Density", 4);
    await page.getByRole("button", { name: "Add a symptom" }).click();
    await page.getByRole("button", { name: "Shade thinning", exact: true }).click();
    await page
      .getByRole("radiogroup", { name: "Severity" })
      .getByRole("radio", { name: "2 moderate" })
      .click();
    await page
      .getByPlaceholder("What stood out in this zone")
      .fill("Thin under the two oaks; suggest shade-tolerant fine fescue overseeding.");
    // Reload at once: the last keystrokes may not have reached the server; the phone kept them.
    await page.reload();
    await page.getByRole("heading", { name: "Under the oaks" }).waitFor();
    // The form opens once this phone's copy has been read (its fields are disabled until then).
    const notes = page.getByPlaceholder("What stood out in this zone");
    await expect.poll(() => notes.isEnabled(), { timeout: 10_000 }).toBe(true);
    expect(await notes.inputValue()).toBe(
      "Thin under the two oaks; suggest shade-tolerant fine fescue overseeding.",
    );
    await expect(
      page
        .getByRole("radiogroup", { name: "Density, below acceptable" })
        .getByRole("radio", { name: "4", exact: true })
        .getAttribute("aria-checked"),
    ).resolves.toBe("true");
    await expect(page.getByText("Shade thinning", { exact: true }).isVisible()).resolves.toBe(true);
    await snap(page, "visit-04-after-reload");
    await rate(page, "Color", 6);
    await rate(page, "Uniformity", 5);
    await page.getByRole("button", { name: "Mark zone done" }).click();
    await waitSaved(page);

    // Zone 3: Back yard — skipped with a reason.
    await page.getByRole("button", { name: /Next: Back yard/ }).click();
    await page.getByRole("heading", { name: "Back yard" }).waitFor();
    await page.getByRole("button", { name: "Skip this zone" }).click();
    await page
      .getByRole("radiogroup", { name: "Why was the zone skipped?" })
      .getByRole("radio", { name: "Dog in yard" })
      .click();
    await waitSaved(page);
    await snap(page, "visit-05-skipped");

    // Zone 4: Pool surround.
    await page.getByRole("button", { name: /Next: Pool surround/ }).click();
    await page.getByRole("heading", { name: "Pool surround" }).waitFor();
    for (const label of ["Overall quality", "Color", "Density", "Uniformity"])
      await rate(page, label, 8);
    await page.getByRole("button", { name: "Mark zone done" }).click();
    await waitSaved(page);

    await page.getByRole("button", { name: "Review and finish" }).click();
    await page.getByRole("button", { name: "Finish visit" }).waitFor();
    await snap(page, "visit-06-ready-to-finish");
    await page.getByRole("button", { name: "Finish visit" }).click();
    await page.getByText(/^Finished at/).waitFor();
    await snap(page, "visit-07-finished", true);
    expect(await seriousViolations(page)).toEqual([]);

    // The technician can no longer change the finished visit.
    const locked = await page.request.get(`/api/v1${visitUrl}`);
    expect(((await locked.json()) as { canEdit: boolean; status: string }).canEdit).toBe(false);
    await context.close();
  }, 90_000); // the whole visit with two photo uploads: 15–32 s here, more on a loaded machine

  it("the manager sees the finished visit with every check", async () => {
    expect(visitUrl).not.toBe("");
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.goto("/visits");
    await page
      .getByRole("link", { name: /Kowalczyk residence/ })
      .first()
      .waitFor();
    expect(
      await page.getByRole("link", { name: /Kowalczyk residence.*4 of 4 zones/ }).count(),
    ).toBe(1);
    await page.goto(visitUrl);
    const checks = page.getByRole("list", { name: "Zone checks" });
    await checks.waitFor();
    const text = await checks.innerText();
    expect(text).toContain("Front lawn");
    expect(text).toContain("Shade thinning (moderate, 5 %)");
    expect(text).toContain("Skipped: Dog in yard");
    expect(text).toContain("3.25 in");
    const frontPhotos = page.getByRole("list", { name: "Photos of Front lawn" });
    expect(await frontPhotos.getByRole("listitem").count()).toBe(3);
    expect(await frontPhotos.getByRole("note").innerText()).toMatch(
      /^Too dark to measure\s+\d+ % of the photo is too dark to read \(the limit is 25 %\)/,
    );
    await expect(page.getByText("Finished", { exact: true }).first().isVisible()).resolves.toBe(
      true,
    );
    await snap(page, "visit-08-manager-view", true);
    expect(await seriousViolations(page)).toEqual([]);
    await context.close();
  });
});
