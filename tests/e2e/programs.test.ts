// Season programs against the production server: at desktop size a manager creates a program
// through the form (a reversed window refused in words, nothing typed lost); at phone size the
// manager has a property follow it and its Season program section shows each zone's planned
// nitrogen per round and the product to load, with the late-fall round stopping at New Jersey's
// December 1 (N.J.S.A. 58:10A-62b), and the property's technician sees the same plan without the
// manager's controls. axe: 0 serious or critical violations; screenshots of each step.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const BASE = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let password = "";
const NAME = `Spring and fall ${Date.now().toString(36)}`;

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  password = factories.TEST_PASSWORD;
  c = await factories.createTestCompany();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("season programs", () => {
  it("desktop: a manager creates a program with two rounds; a reversed window is refused in words", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: BASE });
    const page = await context.newPage();
    await signIn(page, BASE, c.emails["manager"]!, password);
    await page.waitForURL(/\/book/);
    await page.getByRole("link", { name: "Programs" }).first().click();
    await page.getByRole("heading", { level: 1, name: "Season programs" }).waitFor();
    // The demo's two programs, in words.
    await page.getByRole("heading", { name: /Larkmoor Four Seasons \(cool-season\)/ }).waitFor();
    await page.getByRole("heading", { name: /Larkmoor Warm-Season Plan/ }).waitFor();
    expect(await page.getByText("100 GDD (base 50 °F)").count()).toBeGreaterThan(0);
    expect(await seriousViolations(page, "programs")).toEqual([]);
    await snap(page, "programs-list-desktop", true);

    await page.getByRole("button", { name: "New program" }).click();
    const form = page.getByRole("form", { name: "New program" });
    await form.getByLabel("Program name").fill(NAME);
    await form.getByLabel("From (MM-DD)").fill("05-20");
    await form.getByLabel("To (MM-DD)").fill("04-10");
    await form
      .getByRole("group", { name: "Granular zones" })
      .getByLabel("Product")
      .selectOption({ label: "Larkmoor Steadyfeed 24-0-8" });
    await form
      .getByRole("group", { name: "Liquid zones" })
      .getByLabel("Product")
      .selectOption({ label: "Brookline Liquid 20-0-0" });
    await form.getByRole("button", { name: "Add a round" }).click();
    const second = form
      .getByRole("listitem")
      .filter({ has: page.getByRole("heading", { name: "Round 2" }) });
    await second.getByLabel("What the round does").selectOption("fall_feeding");
    await second.getByLabel("From (MM-DD)").fill("11-01");
    await second.getByLabel("To (MM-DD)").fill("12-10");
    await second
      .getByRole("group", { name: "Granular zones" })
      .getByLabel("Product")
      .selectOption({ label: "Autumn Anchor 20-0-10" });
    await second
      .getByRole("group", { name: "Liquid zones" })
      .getByLabel("Product")
      .selectOption({ label: "Brookline Liquid 20-0-0" });
    await form.getByRole("button", { name: "Create program" }).click();
    await form
      .getByText("Window to: on or after the window's first day (in the same year).")
      .waitFor();
    expect(await form.getByLabel("Program name").inputValue()).toBe(NAME);
    await snap(page, "programs-refused-desktop", true);
    await form.getByLabel("From (MM-DD)").first().fill("04-10");
    await form.getByLabel("To (MM-DD)").first().fill("05-20");
    await form.getByRole("button", { name: "Create program" }).click();
    const card = page
      .getByRole("listitem")
      .filter({ has: page.getByRole("heading", { name: NAME }) });
    await card.waitFor();
    const text = (await card.textContent()) ?? "";
    expect(text).toMatch(/1\. Feeding — April 10 to May 20/);
    expect(text).toMatch(/2\. Fall feeding — November 1 to December 10/);
    expect(text).toMatch(/Granular: Autumn Anchor 20-0-10, from growth potential/);
    await snap(page, "programs-created-desktop", true);
    await context.close();
  }, 120_000);

  it("phone: the property follows it and shows each zone's planned N; its technician sees the same", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const page = await context.newPage();
    await signIn(page, BASE, c.emails["manager"]!, password);
    await page.waitForURL(/\/book/);
    await page.goto(`${BASE}/properties/${c.propertyIds["haddad"]}#program`);
    await page.getByRole("heading", { level: 2, name: "Season program" }).waitFor();
    await page.getByLabel("Program this property follows").selectOption({ label: NAME });
    await page.getByRole("button", { name: "Use this program" }).click();
    await page.getByText(new RegExp(`${NAME}, \\d{4}`)).waitFor();
    const zones = page.getByRole("list", { name: "Planned nitrogen by zone" });
    const table = zones.getByRole("table").first();
    await table.waitFor();
    const rows = await table.getByRole("row").allTextContents();
    expect(rows[0]).toMatch(/Round.*Window.*lb N \/ 1,000 ft².*Product to load/);
    // Feeding: a positive amount by growth potential or at the limit, and pounds of Steadyfeed to load.
    expect(rows[1]).toMatch(
      /1\. FeedingApr 10 – May 20\d\.\d\d(By growth potential|Held at the per-application limit)[\d.]+ lb of Larkmoor Steadyfeed 24-0-8/,
    );
    // Fall feeding: the window runs to Dec 10, nitrogen only until Dec 1 (New Jersey).
    expect(rows[2]).toMatch(/2\. Fall feedingNov 1 – Dec 10nitrogen by Dec 1/);
    await page
      .locator("#program")
      .getByText("Read and follow the product label: the label is the law.")
      .waitFor();
    await page.getByRole("heading", { level: 2, name: "Season program" }).scrollIntoViewIfNeeded();
    expect(await seriousViolations(page, "season plan")).toEqual([]);
    await snap(page, "programs-property-phone");
    await zones
      .locator("li")
      .first()
      .screenshot({ path: "tests/.artifacts/screenshots/programs-zone-phone.png" });
    await context.close();

    const tech = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const techPage = await tech.newPage();
    await signIn(techPage, BASE, c.emails["tech1"]!, password);
    await techPage.waitForURL(/\/today/);
    await techPage.goto(`${BASE}/properties/${c.propertyIds["haddad"]}#program`);
    await techPage.getByText(new RegExp(`${NAME}, \\d{4}`)).waitFor();
    expect(await techPage.getByLabel("Program this property follows").count()).toBe(0);
    expect(await techPage.getByText("Method or leave out").count()).toBe(0);
    const techRows = await techPage
      .getByRole("list", { name: "Planned nitrogen by zone" })
      .getByRole("table")
      .first()
      .getByRole("row")
      .allTextContents();
    expect(techRows).toEqual(rows);
    await tech.close();
  }, 120_000);
});
