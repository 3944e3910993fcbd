// The book on a map in the browser (MapLibre GL through Chromium's software WebGL): the demo's
// properties rendered as points over the fake map service's base style, the demo's pressure area
// drawn and listed on the Alerts page, a click on a point opening its popup and the property, the
// same list as a table; axe on the new pages; at phone and desktop size.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";

import { seriousViolations } from "../helpers/axe";
import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
const DESKTOP = { width: 1280, height: 800 };
const DEMO_NAMES = demoCompany.properties.map((p) => p.name);
const AREA_NAMES = demoCompany.pressureArea!.alerts.map(
  (a) => demoCompany.properties.find((p) => p.key === a.property)!.name,
);
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

interface MapState {
  names: string[];
  areas: number;
  baseLayers: string[];
  outlinesLoaded: boolean;
}

/** What the map has drawn, read from MapLibre itself once it is idle. */
async function renderedState(page: Page, expectedPoints: number): Promise<MapState> {
  await page.locator('[data-book-map][data-map-state="ready"]').waitFor({ timeout: 30_000 });
  const handle = await page.waitForFunction(
    (n) => {
      const el = document.querySelector("[data-book-map]") as
        (HTMLElement & { swardMap?: import("maplibre-gl").Map }) | null;
      const m = el?.swardMap;
      if (!m || !m.loaded() || !m.areTilesLoaded()) return null;
      const points = m.queryRenderedFeatures({ layers: ["properties"] });
      if (points.length < n) return null;
      return {
        names: points.map((f) => String(f.properties.name)),
        areas: m.queryRenderedFeatures({ layers: ["pressure-area-fill"] }).length,
        baseLayers: m.getStyle().layers.map((l) => l.id),
        outlinesLoaded: m.isSourceLoaded("counties") && m.isSourceLoaded("states"),
      };
    },
    expectedPoints,
    { timeout: 30_000, polling: 250 },
  );
  return (await handle.jsonValue()) as MapState;
}

describe("the book on a map", () => {
  for (const [size, viewport] of [
    ["phone", PHONE],
    ["desktop", DESKTOP],
  ] as const) {
    it(`shows the demo book and its pressure area, and a point opens its property, at ${size} size`, async () => {
      const context = await browser.newContext({ viewport, baseURL: baseUrl });
      const page = await context.newPage();
      const errors: string[] = [];
      page.on("pageerror", (e) => errors.push(e.message));
      page.on("console", (m) => {
        if (m.type() === "error" && /Content Security Policy|Refused/.test(m.text()))
          errors.push(m.text());
      });
      await signIn(page, baseUrl, "manager@demo.sward.test");
      await page.waitForURL("**/book");
      await page.getByRole("link", { name: "Show on a map" }).click();
      await page.waitForURL("**/book/map");
      await page.getByRole("heading", { name: "Book map" }).waitFor();

      const state = await renderedState(page, DEMO_NAMES.length);
      expect(state.names).toEqual(expect.arrayContaining(DEMO_NAMES));
      expect(state.areas).toBeGreaterThanOrEqual(1);
      // The base style came from the fake map service (its key accepted), outlines and all.
      expect(state.baseLayers).toEqual(
        expect.arrayContaining(["background", "county-lines", "state-lines"]),
      );
      expect(state.outlinesLoaded).toBe(true);
      await snap(page, `book-map-${size}`);

      // The legend names each band in words; the list beside the map holds every property.
      const legend = page.getByRole("region", { name: "Legend" });
      for (const word of ["Good", "Fair", "Low", "Not rated yet"])
        await expect.poll(() => legend.getByText(word, { exact: true }).count()).toBe(1);
      const table = page.getByRole("table", { name: "Properties on the map, by name" });
      for (const name of DEMO_NAMES)
        expect(await table.getByRole("link", { name, exact: true }).count(), name).toBe(1);
      const areaList = page.getByRole("region", { name: "Pressure areas" });
      for (const name of AREA_NAMES) expect(await areaList.innerText()).toContain(name);

      // Click the Okafor lawn's point: its popup, then the property.
      const okafor = demoCompany.properties.find((p) => p.key === "okafor")!;
      await page.locator("[data-book-map]").scrollIntoViewIfNeeded();
      const at = await page.evaluate(
        ([lng, lat]) => {
          const el = document.querySelector("[data-book-map]") as HTMLElement & {
            swardMap: import("maplibre-gl").Map;
          };
          const p = el.swardMap.project([lng!, lat!]);
          const box = el.getBoundingClientRect();
          return { x: box.left + p.x, y: box.top + p.y };
        },
        [okafor.longitude, okafor.latitude],
      );
      await page.mouse.click(at.x, at.y);
      const popup = page.locator(".maplibregl-popup");
      await popup.waitFor();
      expect(await popup.innerText()).toContain(okafor.name);
      expect(await popup.innerText()).toMatch(
        /Sward Index (\d+ \((good|fair|low)\)|: not rated yet)/,
      );
      await snap(page, `book-map-popup-${size}`);
      await popup.getByRole("link", { name: "Open the property" }).click();
      await page.waitForURL(/\/properties\/[0-9a-f-]{36}$/);
      await page.getByRole("heading", { name: okafor.name }).waitFor();
      expect(errors).toEqual([]);
      await context.close();
    }, 90_000);
  }

  it("lists the demo's pressure area on the Alerts page with its evidence; axe finds nothing serious on the new pages", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.goto("/risk-alerts");
    const section = page.locator("#pressure-areas");
    await section.getByRole("heading", { name: "Pressure areas" }).waitFor();
    const area = section.locator("[data-pressure-area]").first();
    expect(await area.getByRole("heading").innerText()).toBe("Dollar spot weather: 3 properties");
    for (const name of AREA_NAMES) expect(await area.innerText()).toContain(name);
    await area.getByText(/Weather evidence of its 3 alerts/).click();
    expect(await area.innerText()).toMatch(/Probability \(%\)\s+\d+(\.\d)?/);
    await snap(page, "risk-alerts-pressure-areas-desktop", true);
    const violations = [...(await seriousViolations(page, "risk-alerts"))];
    await page.goto("/book/map");
    await renderedState(page, DEMO_NAMES.length);
    violations.push(...(await seriousViolations(page, "book-map")));
    await page.goto("/settings");
    await page.getByRole("heading", { name: "Pressure areas" }).waitFor();
    violations.push(...(await seriousViolations(page, "settings")));
    expect(violations).toEqual([]);
    await context.close();
  }, 120_000);

  it("a technician sees no pressure areas on Alerts and cannot open the map", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech1@demo.sward.test");
    await page.waitForURL("**/today");
    await page.goto("/risk-alerts");
    await page.getByRole("heading", { name: "Risk alerts", level: 1 }).waitFor();
    expect(await page.locator("#pressure-areas").count()).toBe(0);
    const res = await page.goto("/book/map");
    expect(page.url()).not.toMatch(/\/book\/map$/);
    expect(res?.status()).toBeLessThan(500);
    await context.close();
  });
});
