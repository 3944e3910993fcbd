// The property page in sections: an "On this page" row of links to every section (each link's
// target exists), one "Zones" heading, and long lists shown a page at a time with their count —
// the demo's Kowalczyk lawn has a season of waterings. Phone size, as a manager in the field.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

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

describe("the property page", () => {
  it("has section links, one Zones heading and paged long lists", { timeout: 60_000 }, async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.getByRole("link", { name: /Kowalczyk residence/ }).click();
    await page.waitForURL(/\/properties\/[0-9a-f-]+$/);

    const nav = page.getByRole("navigation", { name: "On this page" });
    await nav.waitFor(); // past the loading skeleton
    const hrefs = await nav
      .getByRole("link")
      .evaluateAll((links) => links.map((a) => a.getAttribute("href")!));
    expect(hrefs).toEqual(
      expect.arrayContaining(["#alerts", "#zones", "#index", "#visits", "#watering"]),
    );
    for (const href of hrefs) expect(await page.locator(href).count(), href).toBe(1);
    expect(await page.getByRole("heading", { name: "Zones", exact: true }).count()).toBe(1);

    await nav.getByRole("link", { name: "Watering log" }).click();
    await page.waitForURL(/#watering$/);

    const waterings = page.getByRole("list", { name: "Waterings" }).getByRole("listitem");
    const total = await page.evaluate(
      async (url) => {
        const res = await fetch(url);
        return ((await res.json()) as { items: unknown[] }).items.length;
      },
      `/api/v1/properties/${page.url().match(/properties\/([0-9a-f-]+)/)![1]}/waterings`,
    );
    expect(total).toBeGreaterThan(10); // the demo lawn's season of waterings
    expect(await waterings.count()).toBe(10);
    await page.getByText(`Showing 10 of ${total} waterings.`).waitFor();
    await page.getByRole("button", { name: "Show 10 more" }).last().click();
    await expect.poll(() => waterings.count()).toBe(Math.min(20, total));
    await snap(page, "property-page-phone", true);
    await context.close();
  });
});
