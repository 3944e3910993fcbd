// The matted-canopy alert from the technician's finish to the manager's resolution. The lawn has
// been mowed the same way before and tech1 finds it matted again; the weather service has
// reported a warm, humid week for the lawn's cell (written to the weather cache here, as the
// provider would). On finishing, the alert shows on the visit summary with its evidence; the
// manager finds it on the alerts page, acknowledges it with a note and resolves it.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";
import { createDb } from "@/db/client";
import { demoCompany } from "@/fixtures/demo-scenario";
import { addDays, todayIn } from "@/lib/dates";
import { cellOf, weatherDayRow } from "@/lib/weather/cache";
import { DESKTOP, PHONE, launchBrowser, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
const db = createDb(`postgres://postgres@127.0.0.1:${process.env.SWARD_PG_PORT ?? "54329"}/sward_e2e`, { max: 2 });

beforeAll(async () => {
  browser = await launchBrowser();
  const oyelaran = demoCompany.properties.find((p) => p.key === "oyelaran")!;
  const today = todayIn(oyelaran.timeZone);
  const cell = cellOf(oyelaran.latitude, oyelaran.longitude);
  // A warm, humid spell: highs 29 °C, lows 21 °C, humidity 65–95 % (mean 80 %), no rain.
  const rows = Array.from({ length: 31 }, (_, i) => addDays(today, i - 25)).map((date) => ({
    ...weatherDayRow(cell, { date, tmaxC: 29, tminC: 21, rhMaxPct: 95, rhMinPct: 65, rhMeanPct: 80, windMs: 2, windHeightM: 10, sunshineH: 7, solarMJ: null, precipMm: 0, isForecast: date > today }),
    fetched_at: new Date(),
  }));
  await db.insertInto("weather_days").values(rows).onConflict((oc) => oc.columns(["cell", "day"]).doUpdateSet((eb) => ({ tmax_c: eb.ref("excluded.tmax_c"), tmin_c: eb.ref("excluded.tmin_c"), rh_max_pct: eb.ref("excluded.rh_max_pct"), rh_min_pct: eb.ref("excluded.rh_min_pct"), rh_mean_pct: eb.ref("excluded.rh_mean_pct"), precip_mm: eb.ref("excluded.precip_mm"), is_forecast: eb.ref("excluded.is_forecast"), fetched_at: eb.ref("excluded.fetched_at") }))).execute();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function rate(page: Page, label: string, value: number) {
  await page.getByRole("radiogroup", { name: `${label}, ${value >= 6 ? "acceptable" : "below acceptable"}`, exact: true }).getByRole("radio", { name: String(value), exact: true }).click();
}

describe("matted canopy alert", () => {
  it("tech1 finishes a visit with matting in humid weather and sees the alert with its evidence", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech1@demo.sward.test");
    await page.waitForURL("**/today");
    await page.getByRole("link", { name: /Oyelaran residence/ }).click();
    await page.waitForURL(/\/visits\/[0-9a-f-]+$/);
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.getByRole("heading", { name: "Front lawn" }).waitFor();
    for (const label of ["Overall quality", "Colour", "Density", "Uniformity"]) await rate(page, label, 7);
    await page.getByRole("radiogroup", { name: "Mowing direction" }).getByRole("radio", { name: "Same as last check" }).click();
    await page.getByRole("button", { name: "Lay-over / matting" }).click();
    await page.getByRole("button", { name: "Mark zone done" }).click();
    await page.getByRole("status").filter({ hasText: /^Saved/ }).waitFor({ timeout: 10_000 });
    for (const zone of ["Back yard", "Side strip"]) {
      await page.getByRole("button", { name: new RegExp(`Next: ${zone}`) }).click();
      await page.getByRole("heading", { name: zone }).waitFor();
      await page.getByRole("button", { name: "Skip this zone" }).click();
      await page.getByRole("radiogroup", { name: "Why was the zone skipped?" }).getByRole("radio", { name: "No access" }).click();
      await page.getByRole("status").filter({ hasText: /^Saved/ }).waitFor({ timeout: 10_000 });
    }
    await page.getByRole("button", { name: "Review and finish" }).click();
    await page.getByRole("button", { name: "Finish visit" }).click();
    await page.getByText(/^Finished at/).waitFor();
    const alerts = page.locator("section[aria-labelledby=visit-alerts-title]");
    const matted = alerts.getByRole("listitem").filter({ hasText: "Matted canopy: fungus risk" });
    await matted.waitFor({ timeout: 15_000 });
    expect(await matted.innerText()).toMatch(/Front lawn/);
    expect(await matted.innerText()).toMatch(/Matted, laid-over grass seen while the weather is warm and humid \(25 °C, 80 % RH over 5 days\)/);
    await matted.getByText("Evidence and source").click();
    const evidence = await matted.innerText();
    expect(evidence).toMatch(/Matting seen\s*yes/);
    expect(evidence).toMatch(/5-day mean humidity \(%\)\s*80/);
    expect(evidence).toMatch(/Kansas State University/);
    await alerts.scrollIntoViewIfNeeded();
    await snap(page, "alert-01-visit-summary", true);
    await context.close();
  });

  it("the manager acknowledges it with a note, then resolves it", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/properties");
    await page.goto("/alerts?kind=matted_canopy");
    const card = page.getByRole("list", { name: "Alerts" }).getByRole("listitem").filter({ hasText: "Oyelaran residence" });
    await card.waitFor();
    await snap(page, "alert-02-alerts-page");
    await card.getByRole("button", { name: "Acknowledge" }).click();
    await card.getByLabel(/Note \(optional\)/).fill("Told the mowing crew to alternate stripes.");
    await card.getByRole("button", { name: "Acknowledge" }).click();
    await card.getByText("· Acknowledged").waitFor();
    await card.getByRole("button", { name: "Resolve" }).click();
    await card.getByRole("button", { name: "Resolve" }).click(); // without a note
    await card.getByRole("alert").filter({ hasText: "Say how it was resolved." }).waitFor();
    await card.getByLabel("How was it resolved?").fill("Direction changed at the next two mowings; canopy upright again.");
    await card.getByRole("button", { name: "Resolve" }).click();
    // Resolved alerts leave the default (live) view; the resolved view keeps the history.
    await expect.poll(() => card.count(), { timeout: 10_000 }).toBe(0);
    await page.goto("/alerts?kind=matted_canopy&status=resolved");
    const resolved = page.getByRole("list", { name: "Alerts" }).getByRole("listitem").filter({ hasText: "Oyelaran residence" });
    await resolved.getByText("Evidence and source").click();
    const text = await resolved.innerText();
    expect(text).toMatch(/Acknowledged.*Dana Whitcombe[\s\S]*Told the mowing crew/);
    expect(text).toMatch(/Resolved.*Dana Whitcombe[\s\S]*Direction changed/);
    await snap(page, "alert-03-resolved", true);
    await context.close();
  });
});
