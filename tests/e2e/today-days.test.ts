// Today has day navigation: a technician steps to the next and the previous day (the URL keeps
// the day, so a reload or a shared link shows the same stops) and back to today. Pages of each
// area stream their loading skeleton first.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { addDays, formatDate, todayIn } from "@/lib/dates";

import { launchBrowser, PHONE, signIn } from "../helpers/browser";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("Today's day navigation", () => {
  it("steps to the next and previous day and back to today", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech1@demo.sward.test");
    await page.waitForURL("**/today");
    const today = todayIn("America/New_York"); // the demo company's time zone
    const days = page.getByRole("navigation", { name: "Other days" });

    await days.getByRole("link", { name: "Next day" }).click();
    await page.waitForURL(`**/today?date=${addDays(today, 1)}`);
    await page.getByRole("heading", { level: 1, name: formatDate(addDays(today, 1)) }).waitFor();
    await page.getByText("A coming day").waitFor();

    await days.getByRole("link", { name: "Previous day" }).click();
    await page.waitForURL((u) => u.pathname === "/today" && !u.search);
    await page.getByRole("heading", { level: 1, name: "Today" }).waitFor();

    await days.getByRole("link", { name: "Previous day" }).click();
    await page.waitForURL(`**/today?date=${addDays(today, -1)}`);
    await page.getByText("A past day").waitFor();
    await days.getByRole("link", { name: "Back to today" }).click();
    await page.waitForURL((u) => u.pathname === "/today" && !u.search);
    expect(await page.getByRole("heading", { level: 1 }).innerText()).toBe("Today");
    await context.close();
  });

  it("pages that wait on data stream a skeleton first (the route's loading state)", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    for (const [email, path] of [
      ["manager@demo.sward.test", "/book"],
      ["owner1@demo.sward.test", "/my-lawn"],
    ] as const) {
      await context.clearCookies();
      await signIn(page, baseUrl, email);
      await page.waitForURL(`**${path}`);
      // The streamed HTML holds the loading state before the page's content replaces it.
      const html = await (await page.request.get(path)).text();
      expect(html, path).toContain("data-skeleton");
    }
    await context.close();
  });

  it("a page that checks before it streams still answers 404 and redirects with their status", async () => {
    // A loading state above a page sends 200 before the page runs: detail pages check the record
    // first and stream their body after, so "not found" is a real 404 and a redirect a real 307.
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    const property = page.locator("[data-property]:visible").first();
    await property.getByRole("link").first().click();
    await page.waitForURL(/\/properties\/[0-9a-f-]+$/);
    const propertyPath = new URL(page.url()).pathname;
    const streamed = await page.request.get(propertyPath);
    expect(streamed.status()).toBe(200);
    expect(await streamed.text()).toContain("data-skeleton");
    const missing = "00000000-0000-4000-8000-000000000000";
    for (const path of [
      `/properties/${missing}`,
      `/properties/${missing}/zones/${missing}`,
      `/visits/${missing}`,
    ])
      expect((await page.request.get(path, { maxRedirects: 0 })).status(), path).toBe(404);
    // A manager opening a homeowner's page, a homeowner a list page: redirected, not 200.
    expect((await page.request.get("/my-lawn", { maxRedirects: 0 })).status()).toBe(307);
    await context.clearCookies();
    await signIn(page, baseUrl, "owner1@demo.sward.test");
    await page.waitForURL("**/my-lawn");
    for (const path of [
      "/book",
      "/today",
      "/risk-alerts",
      "/records",
      `/my-lawn/reports/${missing}`,
    ])
      expect((await page.request.get(path, { maxRedirects: 0 })).status(), path).toBe(
        path.includes("reports") ? 404 : 307,
      );
    await context.close();
  });
});
