// The manager's book in the browser: needs-attention order with reasons, a filter kept in the
// URL, sorting by a column, and the CSV of the same view; at phone and desktop size.
import type { Browser, Locator } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";

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

// The demo company's six properties in name order (fixtures/demo/scenario.ts). Other tests may
// add properties of their own to the same company; the order of these six among them must hold.
const DEMO_BY_NAME = demoCompany.properties.map((p) => p.name).sort((a, b) => a.localeCompare(b));
const demoNamesIn = async (rows: Locator) =>
  (await rows.evaluateAll((els) => els.map((e) => e.getAttribute("data-property") ?? ""))).filter(
    (name) => DEMO_BY_NAME.includes(name),
  );

describe("the book", () => {
  for (const [size, viewport] of [
    ["phone", PHONE],
    ["desktop", DESKTOP],
  ] as const) {
    it(`finds the problem properties and exports them at ${size} size`, async () => {
      const context = await browser.newContext({
        viewport,
        baseURL: baseUrl,
        acceptDownloads: true,
      });
      const page = await context.newPage();
      await signIn(page, baseUrl, "manager@demo.sward.test");
      await page.waitForURL("**/book");
      // A table row at desktop size, a card on a phone: whichever is shown.
      const rows = page.locator("[data-property]:visible");
      await rows.first().waitFor();
      expect(await rows.first().getAttribute("data-property")).toBe("Haddad residence");
      expect(await rows.first().innerText()).toMatch(/Declining \d+\.\d points \/ 30 days/);
      await snap(page, `book-${size}`);
      if (size === "phone") {
        // Cards, not a table wider than the screen: nothing on the page scrolls sideways.
        expect(await page.locator("table:visible").count()).toBe(0);
        expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(
          PHONE.width,
        );
        // The table's sorts are links on the phone too.
        await page
          .getByRole("navigation", { name: "Sort the book" })
          .getByRole("link", { name: "Name" })
          .click();
        await page.waitForURL(/sort=name/);
        expect(await demoNamesIn(rows)).toEqual(DEMO_BY_NAME);
        await page.goBack();
        await page.waitForURL((u) => !u.search.includes("sort=name"));
      }

      await page
        .getByRole("form", { name: "Filter the book" })
        .getByLabel("Trend")
        .selectOption("declining");
      await page.getByRole("button", { name: "Show" }).click();
      await page.waitForURL(/trend=declining/);
      // Only declining properties remain (the Haddad lawn among them; a visit finished today by
      // another test may add one).
      // (An empty list passes `every`: while the filtered page replaces the old one no row is
      // shown for a moment, and a count taken then was 0 — wait for rows, all declining.)
      await expect
        .poll(async () => {
          const texts = await rows.allInnerTexts();
          return texts.length > 0 && texts.every((t) => t.includes("Declining"));
        })
        .toBe(true);
      const shown = await rows.count();
      expect(await rows.first().getAttribute("data-property")).toBe("Haddad residence");
      const download = page.waitForEvent("download");
      await page.getByRole("link", { name: "Export this view (CSV)" }).click();
      const csv = await (await download).path();
      const { readFile } = await import("node:fs/promises");
      const text = (await readFile(csv, "utf8")).replace(/^\uFEFF/, "");
      expect(text.trim().split("\n")).toHaveLength(shown + 1); // the header and the same rows
      expect(text).toMatch(/^Property,Street,City,Technician,/);

      await page.goto("/book?sort=name");
      await rows.first().waitFor();
      expect(await demoNamesIn(rows)).toEqual(DEMO_BY_NAME);
      await context.close();
    });
  }
});
