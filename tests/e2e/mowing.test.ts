// The mowing readings on a phone (390×844): tech2 records that a zone was mowed at the visit, the
// grass height before mowing and the height of cut, and sees the one-third rule's reading at once
// (the rule as extension services teach it: no more than a third of the blade at one mowing;
// lib/reference/mowing.ts). A draft kept on the phone by a form older than the mowing fields
// still loads and saves. Screenshots go to tests/.artifacts/screenshots.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function waitSaved(page: Page) {
  await page
    .getByRole("status")
    .filter({ hasText: /^Saved/ })
    .waitFor({ timeout: 10_000 });
}

const tap = async (page: Page, name: string, times: number) => {
  for (let i = 0; i < times; i++) await page.getByRole("button", { name }).click();
};

describe("mowing readings on a phone", () => {
  it("mowed today: 5 in before mowing, cut to 3 in, is read as more than a third; an old draft still loads", async () => {
    const context = await browser.newContext({
      viewport: PHONE,
      baseURL: baseUrl,
      permissions: ["geolocation"],
      geolocation: { latitude: 40.2, longitude: -74.7 },
    });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech2@demo.sward.test");
    await page.waitForURL("**/today");
    await page.getByRole("link", { name: /Hollis Mill Commons/ }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]+$/);
    const visitId = new URL(page.url()).pathname.split("/").at(-1)!;
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.waitForURL(/zone=/);
    await page.getByRole("heading", { name: "Entrance beds edge" }).waitFor();

    const mowing = page.getByRole("radiogroup", { name: "Mowed at this visit" });
    await mowing.scrollIntoViewIfNeeded();
    // No height before mowing until the zone is marked as mowed today.
    expect(await page.getByRole("group", { name: "Height before mowing" }).count()).toBe(0);
    await mowing.getByRole("radio", { name: "Mowed today", exact: true }).click();
    await tap(page, "Height before mowing: more", 5); // first tap 4.00 in, then 4.25 … 5.00
    await tap(page, "Height of cut: more", 1); // 3.00 in
    const reading = page.getByRole("status").filter({ hasText: /before mowing, cut to/ });
    await reading.waitFor();
    expect(await reading.innerText()).toBe(
      "5.00 in before mowing, cut to 3.00 in: 40 % of the blade taken off (more than the third the one-third rule allows; at this height mow by 4.50 in).",
    );
    await waitSaved(page);
    await reading.scrollIntoViewIfNeeded();
    await snap(page, "mowing-01-more-than-a-third");
    expect(await seriousViolations(page)).toEqual([]);

    // Grass that was shorter before mowing than the cut: said at once, and the server agrees.
    await tap(page, "Height of cut: more", 12); // 6.00 in
    await page
      .getByRole("alert")
      .filter({ hasText: "cannot be shorter than the height of cut" })
      .first()
      .waitFor();
    await snap(page, "mowing-02-contradiction");
    await tap(page, "Height of cut: less", 12); // back to 3.00 in
    await waitSaved(page);

    // "Not mowed today" clears the height before mowing.
    await mowing.getByRole("radio", { name: "Not mowed today", exact: true }).click();
    expect(await page.getByRole("group", { name: "Height before mowing" }).count()).toBe(0);
    await waitSaved(page);
    const saved = (await (await page.request.get(`/api/v1/visits/${visitId}`)).json()) as {
      checks: { mowedToday: boolean | null; heightBeforeMowingIn: number | null }[];
    };
    expect(saved.checks[0]).toMatchObject({ mowedToday: false, heightBeforeMowingIn: null });

    // A draft written by a form older than the mowing fields, left on this phone for zone 2.
    await page.getByRole("button", { name: /Next: Central green/ }).click();
    await page.getByRole("heading", { name: "Central green" }).waitFor();
    const zoneId = new URL(page.url()).searchParams.get("zone")!;
    await page.evaluate(
      ([key, zone]) => {
        window.localStorage.setItem(
          key!,
          JSON.stringify({
            id: crypto.randomUUID(),
            values: {
              zoneId: zone,
              status: "draft",
              quality: 7,
              color: null,
              density: null,
              uniformity: null,
              barePct: null,
              weedsPct: null,
              thatchIn: null,
              soilMoisture: null,
              soilMoisturePct: null,
              heightOfCutIn: 3.5,
              mowingDirection: null,
              isMatted: false,
              isScalped: false,
              hasTornTips: false,
              hasClumpedClippings: false,
              symptoms: [],
              notes: "kept on the phone by the older form",
              skipReason: null,
              skipNote: "",
            },
            baseVersion: 0,
            isDirty: true,
            savedLocallyAt: "2026-06-01T09:00:00.000Z",
          }),
        );
      },
      [`sward:zone-check:${visitId}:${zoneId}`, zoneId],
    );
    await page.reload();
    await page.getByText("Restored the unsaved changes kept on this phone.").waitFor();
    const notes = page.getByPlaceholder("What stood out in this zone");
    await expect.poll(() => notes.isEnabled(), { timeout: 10_000 }).toBe(true);
    expect(await notes.inputValue()).toBe("kept on the phone by the older form");
    await waitSaved(page);
    const after = (await (await page.request.get(`/api/v1/visits/${visitId}`)).json()) as {
      checks: { zoneId: string; notes: string; mowedToday: boolean | null }[];
    };
    expect(after.checks.find((c) => c.zoneId === zoneId)).toMatchObject({
      notes: "kept on the phone by the older form",
      mowedToday: null,
    });
    await context.close();
  });
});
