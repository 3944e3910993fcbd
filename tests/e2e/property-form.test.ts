// A manager adds a New Jersey property by typing its address: the ZIP code "@08540" is refused in
// words, the location is found from the address through the local fake of the Census Bureau's
// geocoder and confirmed (never written over typed coordinates silently), the New Jersey rule set
// is proposed with its reason once the state is chosen, and the property is saved with them.
// Screenshots at phone (390×844) and desktop (1440×900) size.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
const SIZES = [
  ["phone", { width: 390, height: 844 }],
  ["desktop", { width: 1440, height: 900 }],
] as const;

let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function managerPage(viewport: { width: number; height: number }): Promise<Page> {
  const context = await browser.newContext({ viewport, baseURL: baseUrl });
  const page = await context.newPage();
  await signIn(page, baseUrl, "manager@demo.sward.test");
  await page.waitForURL("**/book");
  return page;
}

describe("the new property form", () => {
  for (const [size, viewport] of SIZES) {
    it(
      `a New Jersey address: ZIP checked, location found and confirmed, rule set proposed, saved (${size})`,
      { timeout: 120_000 },
      async () => {
        const page = await managerPage(viewport);
        await page.goto("/properties/new");
        await page.getByRole("heading", { level: 1, name: "New property" }).waitFor();
        const name = `Bramblecote residence ${size} ${Date.now()}`;
        await page.getByLabel("Property name").fill(name);
        await page.getByLabel("Street address").fill("77 Bramblecote Road");
        await page.getByLabel("Town or city").fill("Larkfield");
        await page.getByLabel("ZIP code").fill("@08540");

        // The state proposes its rule set, with the reason.
        const ruleSet = page.getByLabel("Fertilizer rule set");
        expect(await ruleSet.locator("option:checked").textContent()).toBe("Company default");
        await page.getByLabel("State").selectOption("NJ");
        await page
          .getByText(
            "Proposed because the property is in New Jersey and “New Jersey turf fertilizer law” is the company's rule set for New Jersey. You can choose another.",
          )
          .waitFor();
        expect(await ruleSet.locator("option:checked").textContent()).toBe(
          "New Jersey turf fertilizer law",
        );

        // A malformed ZIP is refused in words naming the field; nothing is saved.
        await page.getByRole("button", { name: "Add property" }).click();
        await page
          .getByText("ZIP code: five digits, e.g. 08540, or ZIP+4, e.g. 08540-1234.")
          .waitFor();
        expect(page.url()).toMatch(/\/properties\/new$/);
        await page.getByLabel("ZIP code").fill("10001");
        await page.getByText(/ZIP code 10001 is a New York ZIP code, but State is NJ/).waitFor();
        await page.getByLabel("ZIP code").fill("08561");
        await page.getByText(/is a New York ZIP code/).waitFor({ state: "detached" });

        // Coordinates typed first are not replaced until the manager says so.
        await page.getByLabel("Latitude (°)").fill("40.1");
        await page.getByLabel("Longitude (°)").fill("-74.2");
        await page.getByRole("button", { name: "Find the location from the address" }).click();
        await page.getByText("77 BRAMBLECOTE RD, LARKFIELD, NJ, 08561").waitFor();
        await page.getByText("Latitude 40.33780°, longitude -74.73260°").waitFor();
        expect(await page.getByLabel("Latitude (°)").inputValue()).toBe("40.1");
        await snap(page, `property-form-match-${size}`, true);
        await page.getByRole("button", { name: "Replace the coordinates with these" }).click();
        expect(await page.getByLabel("Latitude (°)").inputValue()).toBe("40.3378");
        expect(await page.getByLabel("Longitude (°)").inputValue()).toBe("-74.7326");
        await page
          .getByText(
            "Location set from the address found: 77 BRAMBLECOTE RD, LARKFIELD, NJ, 08561.",
          )
          .waitFor();

        // An address the service does not know says so, and keeps the coordinates.
        await page.getByLabel("Street address").fill("1 Nowhere Street");
        await page.getByRole("button", { name: "Find the location from the address" }).click();
        await page.getByText(/^No match for “1 Nowhere Street, Larkfield, NJ 08561”/).waitFor();
        expect(await page.getByLabel("Latitude (°)").inputValue()).toBe("40.3378");
        await page.getByLabel("Street address").fill("77 Bramblecote Road");

        await page.getByRole("button", { name: "Add property" }).click();
        await page.waitForURL(/\/properties\/[0-9a-f-]{36}$/);
        await page.getByRole("heading", { level: 1, name }).waitFor();

        useE2eDatabase();
        const { testDb } = await import("../helpers/factories");
        const saved = await testDb()
          .selectFrom("properties")
          .innerJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
          .select([
            "properties.region",
            "properties.postal_code",
            "properties.latitude",
            "properties.longitude",
            "rule_sets.name as ruleSet",
          ])
          .where("properties.name", "=", name)
          .executeTakeFirstOrThrow();
        expect({
          ...saved,
          latitude: Number(saved.latitude),
          longitude: Number(saved.longitude),
        }).toEqual({
          region: "NJ",
          postal_code: "08561",
          latitude: 40.3378,
          longitude: -74.7326,
          ruleSet: "New Jersey turf fertilizer law",
        });

        // Archived again as a manager would, so the book other tests read keeps its six demo
        // properties: the button asks first, the property leaves the book, its record stays.
        page.once("dialog", (dialog) => void dialog.accept());
        await page.getByRole("button", { name: "Archive property" }).click();
        await page.getByRole("button", { name: "Restore property" }).waitFor();
        await page.goto("/book");
        await page.getByRole("heading", { level: 1, name: "Book" }).waitFor();
        await page.locator("[data-property]:visible").first().waitFor();
        expect(await page.locator(`[data-property="${name}"]`).count()).toBe(0);
        await page.context().close();
      },
    );
  }
});
