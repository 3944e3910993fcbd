// The Sward Index charts as a manager and a homeowner see them, at phone and desktop size: the
// property chart with its feeding markers and before/after photo markers, the weather strip on
// the same dates, the zone chart with watering bars and its correlations, the book's figures,
// and the homeowner's simple chart. Each chart has a table alternative. Screenshots are kept.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

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

const chart = (page: Page, id: string) => page.locator(`[data-chart="${id}"] svg[aria-label]`);

describe("Index charts", () => {
  for (const [size, viewport] of [
    ["phone", PHONE],
    ["desktop", DESKTOP],
  ] as const) {
    it(`manager: property, weather strip and zone charts with markers at ${size} size`, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "manager@demo.sward.test");
      await page.waitForURL("**/book");

      // The book: distribution of property indexes and the share of zones following N.
      await page.getByRole("heading", { name: "Across the book" }).waitFor();
      await chart(page, "book-distribution").first().waitFor();
      await expect(
        page.getByText(/of 17 zones with at least 6 checks/).textContent(),
      ).resolves.toMatch(/^\d+ of 17 zones/);
      expect(await page.getByText("Declining: Haddad residence.").count()).toBe(1);

      await page
        .getByRole("link", { name: /Haddad residence/ })
        .first()
        .click();
      await page.waitForURL(/\/properties\/[0-9a-f-]+$/);
      const property = chart(page, "property-index");
      await property.first().waitFor();
      // Each feeding of the season a dashed marker labelled with its N, as many as the summary
      // counts. The demo's past rounds follow the calendar month of their date, so how many of
      // them are feedings depends on the day the demo was seeded (always at least one).
      const feedLabels = await page.locator('[data-chart="property-index"] text').allTextContents();
      const counted = await page.getByText(/\(\d+ feedings?, /).textContent();
      const feedings = Number(/\((\d+) feedings?, /.exec(counted ?? "")?.[1]);
      expect(feedings).toBeGreaterThanOrEqual(1);
      expect(feedLabels.filter((t) => /^\d\.\d\d( lb N)?$/.test(t))).toHaveLength(feedings);
      expect(feedLabels).toEqual(expect.arrayContaining(["before", "after"]));
      // One point per visit: seven past visits.
      expect(
        await page.locator('[data-chart="property-index"] circle').count(),
      ).toBeGreaterThanOrEqual(7);
      expect(await page.getByText(/^Latest \d+ on/).count()).toBeGreaterThan(0);
      await chart(page, "weather-strip").first().waitFor();
      expect(await chart(page, "weather-strip").count()).toBe(2); // rain + ET, and GDD
      // The table alternative opens and lists the visits.
      await page
        .locator("#property-index-title")
        .locator("xpath=ancestor::figure")
        .getByText("Show as a table")
        .click();
      expect(
        await page
          .getByRole("table", { name: "Property index per visit" })
          .locator("tbody tr")
          .count(),
      ).toBe(7);
      await page.locator("section[aria-labelledby=index-title]").scrollIntoViewIfNeeded();
      await snap(page, `index-property-${size}`, true);

      await page
        .getByRole("list", { name: "Zone index" })
        .getByRole("link", { name: "Back yard" })
        .click();
      await page.waitForURL(/\/zones\//);
      await chart(page, "zone-index").first().waitFor();
      expect(await chart(page, "zone-index").count()).toBe(2); // Index, and the watering bars below
      expect(await chart(page, "zone-index").nth(1).locator("rect").count()).toBeGreaterThan(20);
      expect(
        await page
          .getByText(
            /negative pattern with the nitrogen available in the 45 days before each check/,
          )
          .count(),
      ).toBe(1);
      expect(await page.getByText("Correlation is not cause.").count()).toBe(1);
      await snap(page, `index-zone-${size}`, true);
      await context.close();
    });

    it(`homeowner: the simple Sward Index chart at ${size} size`, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      await signIn(page, baseUrl, "owner1@demo.sward.test");
      await page.waitForURL("**/my-lawn");
      await page.getByRole("heading", { name: "Sward Index" }).waitFor();
      await page.locator('[data-chart^="lawn-index-"] svg').first().waitFor();
      // The direction in words with the number of visits behind it, or none when the visits
      // scatter more than they move (the demo lawn: +3 points per 30 days, 90 % interval −0.4 to
      // +6.9 over 6 visits).
      expect(
        await page
          .getByText(
            /(Your lawn (is getting healthier|is holding steady|has slipped lately|is \d+ points? (healthier|lower) than on)|moved up and down without a clear direction|A direction shows after).*(Based on \d+ visits|since|so far)/,
          )
          .count(),
      ).toBe(1);
      // No feeding markers or product names on the homeowner's chart.
      expect(
        await page.locator('[data-chart^="lawn-index-"] text').filter({ hasText: "lb N" }).count(),
      ).toBe(0);
      await snap(page, `index-homeowner-${size}`, true);
      await context.close();
    });
  }
});
