// The forms as a manager uses them: each validates in the browser with its shared schema and says
// what is wrong in plain words (never the validator's own text), and a saved entry shows at once —
// the catalogue and the rule sets through the React Query cache (no page reload), the watering log
// by refreshing the server-rendered property page. Screenshots at phone (390×844) and desktop
// (1440×900) size of the product and watering forms with their messages.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
const SIZES = [
  ["phone", { width: 390, height: 844 }],
  ["desktop", { width: 1440, height: 900 }],
] as const;
const RAW = /invalid input|expected (number|string)|received|NaN/i;

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

/** Counts the documents the browser loaded: a React Query update loads none. */
/** Document loads of the page (a reload or a hard navigation); the router's own same-document
 * URL updates are not reloads, and `framenavigated` counted those too. */
function countNavigations(page: Page): () => number {
  let n = 0;
  page.on("domcontentloaded", () => {
    n += 1;
  });
  return () => n;
}

describe("forms", () => {
  for (const [size, viewport] of SIZES) {
    it(
      `a product: plain messages, then it joins the list without a reload (${size})`,
      { timeout: 90_000 },
      async () => {
        const page = await managerPage(viewport);
        await page.goto("/products");
        await page.getByRole("heading", { level: 1, name: "Products" }).waitFor();
        const navigations = countNavigations(page);
        await page.getByRole("button", { name: "Add a product" }).click();
        const form = page.getByRole("form", { name: "New product" });
        const name = `Test feed ${size} ${Date.now()}`;
        await form.getByLabel("Product name").fill(name);
        await form.getByLabel("N %").fill("");
        await form.getByRole("button", { name: "Add product" }).click();
        await form.getByText("Enter N as a number.").waitFor();
        expect(await form.textContent()).not.toMatch(RAW);
        await snap(page, `form-product-errors-${size}`, true);

        await form.getByLabel("N %").fill("24");
        await form.getByLabel("P₂O₅ %").fill("0");
        await form.getByLabel("K₂O %").fill("6");
        await form.getByLabel("Slow-release share of N (%)").fill("30");
        await form.getByRole("button", { name: "Add product" }).click();
        await page.getByRole("list", { name: "Products" }).getByRole("heading", { name }).waitFor();
        expect(await form.count()).toBe(0);
        expect(navigations()).toBe(0);
        await page.context().close();
      },
    );
  }

  it(
    "a rule set with a malformed blackout window is refused in words, then saved into the list",
    { timeout: 90_000 },
    async () => {
      const page = await managerPage(SIZES[1][1]);
      await page.goto("/rule-sets");
      await page.getByRole("heading", { level: 1, name: "Rule sets" }).waitFor();
      const navigations = countNavigations(page);
      await page.getByRole("button", { name: "Add a rule set" }).click();
      const form = page.getByRole("form", { name: "New rule set" });
      const name = `Test town rules ${Date.now()}`;
      await form.getByLabel("Name", { exact: true }).fill(name);
      await form.getByLabel("Max lb N / 1,000 ft² per application").fill("lots");
      await form.getByLabel("Professionals: no fertilizer after").fill("13-01");
      await form.getByLabel("Professionals: nor before").fill("03-01");
      await form.getByRole("button", { name: "Add rule set" }).click();
      await form
        .getByText("Type month and day as two digits each, e.g. 12-01 for December 1.")
        .waitFor();
      await form.getByText("Enter a number.").waitFor();
      expect(await form.textContent()).not.toMatch(RAW);

      await form.getByLabel("Max lb N / 1,000 ft² per application").fill("0.9");
      await form.getByLabel("Professionals: no fertilizer after").fill("12-01");
      await form.getByRole("button", { name: "Add rule set" }).click();
      await form.waitFor({ state: "detached", timeout: 10_000 }).catch(async () => {
        await snap(page, "form-rule-set-not-saved", true);
        throw new Error(`the rule set was not saved: ${await form.textContent()}`);
      });
      await page.getByRole("heading", { name }).waitFor();
      await page
        .getByText("no fertilizer by professionals after December 1 or before March 1")
        .first()
        .waitFor();
      expect(await form.count()).toBe(0);
      expect(navigations()).toBe(0);
      await page.context().close();
    },
  );

  for (const [size, viewport] of SIZES) {
    it(
      `a watering: text where a number belongs is refused in words; a depth is logged (${size})`,
      { timeout: 90_000 },
      async () => {
        const page = await managerPage(viewport);
        await page.getByRole("link", { name: /Okafor residence/ }).click();
        await page.waitForURL(/\/properties\/[0-9a-f-]+$/);
        const form = page.getByRole("form", { name: "Log a watering" });
        await form.getByLabel("Depth of water (in)").fill("half an inch");
        await form.getByRole("button", { name: "Log watering" }).click();
        await form.getByText("Enter the depth as a number.").waitFor();
        expect(await form.textContent()).not.toMatch(RAW);
        await form.scrollIntoViewIfNeeded();
        await snap(page, `form-watering-errors-${size}`);

        const note = `test ${size} ${Date.now()}`;
        await form.getByRole("radio", { name: "Run time × rate" }).click();
        await form.getByLabel("Run time (min)").fill("20");
        await form.getByLabel("Precipitation rate (in/h)").fill("1.5");
        await form.getByText("0.50 in ≈").waitFor(); // the preview: 20 min at 1.5 in/h
        await form.getByLabel("Notes (optional)").fill(note);
        await form.getByRole("button", { name: "Log watering" }).click();
        const entry = page
          .getByRole("list", { name: "Waterings" })
          .getByRole("listitem")
          .filter({ hasText: note });
        await entry.waitFor();
        expect(await entry.textContent()).toMatch(/20 min at 1\.5 in\/h.*0\.50 in/);
        expect(await form.getByLabel("Notes (optional)").inputValue()).toBe("");
        await page.context().close();
      },
    );
  }
});
