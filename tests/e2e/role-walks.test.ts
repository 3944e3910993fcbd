// A walk of each role's pages at phone (390×844) and desktop (1440×900) size: every page renders
// its heading, axe finds no serious or critical violation, and a full-page screenshot of each is
// kept under tests/.artifacts/screenshots/walk-<role>-<size>-<page>.png to look at. The manager's
// property page carries the weather panel (from the local fake), the nitrogen to date per zone and
// the watering log.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
const SIZES = [
  ["phone", PHONE],
  ["desktop", { width: 1440, height: 900 }],
] as const;
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Opens each page, waits for its heading, checks axe and keeps a screenshot. */
async function walk(
  page: Page,
  role: string,
  size: string,
  stops: readonly (readonly [name: string, path: string, heading: string | RegExp])[],
): Promise<string[]> {
  const found: string[] = [];
  for (const [name, path, heading] of stops) {
    await page.goto(path);
    await page.getByRole("heading", { level: 1, name: heading }).waitFor();
    // Today saves the day ahead for offline use in the background (components/pwa/offline-ready):
    // the network goes quiet only once that save ends, which its own status says. A save that
    // never ends fails here, by name, rather than as a network that never goes idle.
    if (path === "/today")
      await page
        .locator('[data-offline-status]:not([data-offline-status="working"])')
        .waitFor({ timeout: 90_000 });
    found.push(...(await seriousViolations(page, path)));
    await snap(page, `walk-${role}-${size}-${name}`, true);
  }
  return found;
}

describe("role walks", () => {
  for (const [size, viewport] of SIZES) {
    it(`the manager's pages at ${size} size`, { timeout: 300_000 }, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "manager@demo.sward.test");
      await page.waitForURL("**/book");
      await page.locator("[data-property]:visible").first().waitFor();
      await page.getByRole("link", { name: /Okafor residence/ }).click();
      await page.waitForURL(/\/properties\/[0-9a-f-]+$/);
      const propertyUrl = new URL(page.url()).pathname;
      await page.getByRole("heading", { name: "Weather and water" }).waitFor();
      expect(await page.getByText(/GDD since January 1/).count()).toBe(1);
      expect(await page.getByText(/N in \d{4}:/).count()).toBeGreaterThan(0);
      await page.getByRole("link", { name: "History" }).first().click();
      await page.waitForURL(/\/zones\//);
      const historyUrl = new URL(page.url()).pathname;
      await page.goto("/visits");
      await page.getByRole("heading", { level: 1, name: "Visits" }).waitFor();
      const visitLink = page.locator('a[href^="/visits/"]').first();
      const visitUrl = (await visitLink.count()) ? await visitLink.getAttribute("href") : null;

      const found = await walk(page, "manager", size, [
        ["book", "/book", "Book"],
        ["property", propertyUrl, "Okafor residence"],
        ["zone-history", historyUrl, "Front lawn: history"],
        ["visits", "/visits", "Visits"],
        ["schedule", "/schedule", "Week schedule"],
        ...(visitUrl ? ([["visit", visitUrl, /./]] as const) : []),
        ["risk-alerts", "/risk-alerts", "Risk alerts"],
        ["products", "/products", "Products"],
        ["rule-sets", "/rule-sets", "Rule sets"],
        ["records", "/records", "Application records"],
        ["settings", "/settings", "Company settings"],
        ["people", "/people", "People"],
        ["new-property", "/properties/new", "New property"],
      ]);
      expect(found).toEqual([]);
      await context.close();
    });

    it(`the technician's pages at ${size} size`, { timeout: 300_000 }, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "tech1@demo.sward.test");
      await page.waitForURL("**/today");
      await page.getByRole("heading", { level: 1, name: "Today" }).waitFor();
      const stop = page.locator('a[href^="/visits/"]').first();
      const visitUrl = (await stop.count()) ? await stop.getAttribute("href") : null;
      await page.goto("/properties");
      const property = page.locator('a[href^="/properties/"]').first();
      await property.waitFor();
      const propertyUrl = await property.getAttribute("href");

      const found = await walk(page, "technician", size, [
        ["today", "/today", "Today"],
        ...(visitUrl ? ([["visit", visitUrl, /./]] as const) : []),
        ["properties", "/properties", /properties/i],
        ["property", propertyUrl!, /./],
        ["risk-alerts", "/risk-alerts", "Risk alerts"],
      ]);
      expect(found).toEqual([]);
      await context.close();
    });

    it(`the homeowner's pages at ${size} size`, { timeout: 300_000 }, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "owner1@demo.sward.test");
      await page.waitForURL("**/my-lawn");
      const report = page.getByRole("list", { name: "Visit reports" }).getByRole("link").first();
      await report.waitFor();
      const reportUrl = await report.getAttribute("href");

      const found = await walk(page, "homeowner", size, [
        ["my-lawn", "/my-lawn", "My lawn"],
        ["report", reportUrl!, /./],
      ]);
      expect(found).toEqual([]);
      await context.close();
    });
  }
});
