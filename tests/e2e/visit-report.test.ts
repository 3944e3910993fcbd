// The homeowner reads the latest visit report on a phone and in print: what was seen, the
// photos, the matching care notes with their safety cautions; nothing of another lawn.
import type { Browser } from "playwright-core";
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

describe("visit report", () => {
  it("owner2 reads the latest report on a phone, with photos and care notes", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "owner2@demo.sward.test");
    await page.waitForURL("**/my-lawn");
    await page.getByRole("list", { name: "Visit reports" }).getByRole("link").first().click();
    await page.waitForURL(/\/my-lawn\/reports\//);
    await page.getByRole("heading", { level: 1, name: /Haddad residence/ }).waitFor();
    expect(
      await page
        .getByText(
          /Mowing: cut at 2\.5 in, mowed the same way as last time, grass matted and laid over\./,
        )
        .count(),
    ).toBe(1);
    const note = page.getByRole("listitem").filter({
      has: page.getByRole("heading", { name: "Change the mowing direction every few mowings" }),
    });
    await note.waitFor();
    expect(await note.innerText()).toMatch(/Mower safety/);
    expect(await page.locator('ul[aria-label^="Photos of"] img').count()).toBeGreaterThan(0);
    await snap(page, "report-phone", true);
    await page.emulateMedia({ media: "print" });
    expect(await page.getByRole("button", { name: "Print this report" }).isVisible()).toBe(false);
    expect(await page.getByRole("navigation", { name: "Main" }).isVisible()).toBe(false);
    await snap(page, "report-print", true);
    // Another homeowner's report is not found.
    const url = new URL(page.url()).pathname;
    // A link in an e-mail sent before reports moved (/my-lawn/visits/…) opens the same report.
    await page.goto(url.replace("/my-lawn/reports/", "/my-lawn/visits/"));
    expect(new URL(page.url()).pathname).toBe(url);
    await page.getByRole("heading", { level: 1, name: /Haddad residence/ }).waitFor();
    await context.close();
    const other = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page2 = await other.newPage();
    await signIn(page2, baseUrl, "owner1@demo.sward.test");
    await page2.waitForURL("**/my-lawn");
    const res = await page2.goto(url);
    expect(res?.status()).toBe(404);
    await other.close();
  });
});
