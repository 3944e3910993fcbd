// Every manager page at phone and desktop size: it renders its heading and axe finds no serious
// or critical violation. The property page carries the weather panel (from the local fake),
// the nitrogen to date per zone and the watering log.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("manager pages", () => {
  for (const [size, viewport] of [
    ["phone", PHONE],
    ["desktop", DESKTOP],
  ] as const) {
    it(`render and pass axe at ${size} size`, { timeout: 90_000 }, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "manager@demo.sward.test");
      await page.waitForURL("**/book");
      await page.getByRole("link", { name: /Okafor residence/ }).click();
      await page.waitForURL(/\/properties\/[0-9a-f-]+$/);
      const propertyUrl = new URL(page.url()).pathname;
      await page.getByRole("heading", { name: "Weather and water" }).waitFor();
      expect(await page.getByText(/GDD since 1 January/).count()).toBe(1);
      expect(await page.getByText(/N in \d{4}:/).count()).toBeGreaterThan(0);
      await snap(page, `manager-property-${size}`, true);
      await page.getByRole("link", { name: "History" }).first().click();
      await page.waitForURL(/\/zones\//);
      const historyUrl = new URL(page.url()).pathname;

      for (const [path, heading] of [
        [propertyUrl, "Okafor residence"],
        [historyUrl, "Front lawn: history"],
        ["/visits", "Visits"],
        ["/products", "Products"],
        ["/rule-sets", "Rule sets"],
        ["/records", "Application records"],
        ["/properties/new", "New property"],
      ] as const) {
        await page.goto(path);
        await page.getByRole("heading", { level: 1, name: heading }).waitFor();
        expect(await seriousViolations(page, path)).toEqual([]);
      }
      await context.close();
    });
  }
});
