// The day's route on Today (phone size): the demo's first technician sees the total distance and
// driving time from the yard and back, each stop's drive, "Directions" (a Maps URL to the
// property's location), "Call" (a tel: link) and the access notes; puts the day in driving order,
// which persists; moves a stop by hand with the buttons (no dragging), which persists too; and the
// yard is set on Settings by a manager. The suite works on a company of its own, seeded from the
// demo scenario: the shared e2e database's demo day is changed by the suites before it (a stop
// started or finished is no longer reordered, so "Put in driving order" may not be offered).
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let password: string;
beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  c = await factories.createTestCompany();
  password = factories.TEST_PASSWORD;
  browser = await launchBrowser();
}, 120_000);
afterAll(async () => {
  await browser?.close();
});

const stops = (page: Page) => page.getByRole("list", { name: "Stops" }).locator(":scope > li");

/** The stops' names, first to last, once the route has loaded. */
async function stopNames(page: Page): Promise<string[]> {
  await page.getByTestId("route-total").waitFor();
  return stops(page)
    .locator("[id^='stop-name-']")
    .allInnerTexts()
    .then((names) => names.map((n) => n.trim()));
}

describe("the day's route on Today", () => {
  it("shows the ordered route with distance, time, Directions, Call and access notes; the driving order and a move by hand persist", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, c.emails["tech1"]!, password);
    await page.waitForURL("**/today");

    const route = page.getByRole("region", { name: "Route" });
    await route.getByTestId("route-total").waitFor();
    expect(await route.getByTestId("route-total").innerText()).toMatch(
      /^\d+\.\d mi · (\d+ min|\d+ h( \d+ min)?) driving$/,
    );
    await route.getByText("From the yard (61 Tanager Road, Larkfield) and back.").waitFor();
    expect(await stopNames(page)).toEqual([
      "Oyelaran residence",
      "Haddad residence",
      "Kowalczyk residence",
    ]);

    const oyelaran = stops(page).filter({ hasText: "Oyelaran residence" });
    const directions = oyelaran.getByRole("link", { name: "Directions" });
    expect(await directions.getAttribute("href")).toBe(
      "https://www.google.com/maps/dir/?api=1&destination=40.334200%2C-74.739100&travelmode=driving",
    );
    expect(await oyelaran.getByRole("link", { name: /^Call / }).getAttribute("href")).toBe(
      "tel:+16095550141",
    );
    await oyelaran.getByText("Side gate code 4127", { exact: false }).waitFor();
    expect(await oyelaran.getByText(/^\d+\.\d mi · \d+ min from the start$/).count()).toBe(1);
    // Haddad has a phone but no access notes.
    const haddad = stops(page).filter({ hasText: "Haddad residence" });
    expect(await haddad.getByText("Access:").count()).toBe(0);
    await snap(page, "route-01-today-phone");
    expect(await seriousViolations(page)).toEqual([]);

    // The demo day is stored out of driving order: Sward proposes a shorter one.
    const before = await route.getByTestId("route-total").innerText();
    await route.getByRole("button", { name: "Put in driving order" }).click();
    await route.getByTestId("route-in-order").waitFor();
    const ordered = await stopNames(page);
    expect(ordered).not.toEqual(["Oyelaran residence", "Haddad residence", "Kowalczyk residence"]);
    const after = await route.getByTestId("route-total").innerText();
    expect(Number.parseFloat(after)).toBeLessThanOrEqual(Number.parseFloat(before));
    await snap(page, "route-02-in-driving-order");
    await page.reload();
    expect(await stopNames(page)).toEqual(ordered);

    // Move the last stop up by hand; the order persists and the route offers its order again.
    const last = ordered[2]!;
    await stops(page).filter({ hasText: last }).getByRole("button", { name: "Move up" }).click();
    await page.waitForFunction(
      (name) => document.querySelectorAll("[id^='stop-name-']")[1]?.textContent?.trim() === name,
      last,
    );
    const byHand = [ordered[0]!, last, ordered[1]!];
    expect(await stopNames(page)).toEqual(byHand);
    // The first stop cannot go higher, the last no lower.
    expect(await stops(page).first().getByRole("button", { name: "Move up" }).isDisabled()).toBe(
      true,
    );
    expect(await stops(page).last().getByRole("button", { name: "Move down" }).isDisabled()).toBe(
      true,
    );
    await page.reload();
    expect(await stopNames(page)).toEqual(byHand);
    await route.getByRole("button", { name: "Put in driving order" }).waitFor();
    await snap(page, "route-03-moved-by-hand");
    await context.close();
  }, 120_000);

  it("a manager sets the yard on Settings (desktop)", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, c.emails["manager"]!, password);
    await page.waitForURL("**/book");
    await page.goto("/settings");
    const yard = page.getByRole("form", { name: "The yard" });
    // Typed at once, before the page has hydrated: the fields wait (components/ui/hydrated-form.tsx)
    // rather than mixing what was typed with the saved value.
    await yard.getByLabel("Latitude").fill("95");
    expect(await yard.getByLabel("Latitude").inputValue()).toBe("95");
    await yard.getByRole("button", { name: "Save the yard" }).click();
    await yard.getByText("Yard latitude: between -90 and 90.").waitFor();
    await yard.getByLabel("Latitude").fill("40.305");
    await yard.getByRole("button", { name: "Save the yard" }).click();
    await yard.getByText("Saved. Today's routes start and end at the yard.").waitFor();
    await snap(page, "route-04-settings-yard-desktop");
    expect(await seriousViolations(page)).toEqual([]);
    await context.close();
  }, 90_000);
});
