// Applications on a phone: tech1 records an application and sees the nutrient maths and the
// cautions; one over New Jersey's legal N limit is refused in the preview (recording disabled, the
// law's section behind a "Why"); the manager records it with an override reason.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { inNoFertilizerWindow } from "@/lib/agronomy/rules";
import { todayIn } from "@/lib/dates";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";

import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
let zoneUrl = "";
const nj = SHIPPED_RULE_SETS.find((r) => r.name.startsWith("New Jersey"))!;
const isBlackoutToday = inNoFertilizerWindow(todayIn("America/New_York").slice(5), nj.proBlackout!);

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function openForm(page: Page, product: string) {
  await page.getByRole("button", { name: "Record an application" }).click();
  await page.getByLabel("Product").selectOption({ label: product });
}

describe("applications", () => {
  it("tech1 sees the maths and cautions; an over-limit application is refused with the citation", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "tech1@demo.sward.test");
    await page.waitForURL("**/today");
    await page.getByRole("link", { name: /Haddad residence/ }).click();
    await page.waitForURL(/\/visits\//);
    await page.getByRole("button", { name: "Start visit" }).click();
    await page.waitForURL(/zone=/);
    zoneUrl = new URL(page.url()).pathname + new URL(page.url()).search;

    await openForm(page, "Larkmoor Steadyfeed 24-0-8 (24-0-8, 30 % slow-release N)");
    await page.getByLabel("Rate", { exact: true }).fill("3");
    const maths = page.getByRole("table", { name: "Nutrients delivered" });
    await maths.waitFor();
    expect(await maths.innerText()).toMatch(/N\s+0\.72 lb\s+1\.30 lb/); // 3 lb × 24 % = 0.72 lb N / 1,000 ft²; 1,800 ft² → 1.30 lb
    expect(
      await page.getByRole("complementary", { name: "Safety cautions" }).innerText(),
    ).toContain("the label is the law");
    await snap(page, "application-01-maths");
    const recordButton = page.getByRole("button", { name: "Record application" });
    if (isBlackoutToday) {
      // Refused in the preview already: the button stays disabled and the rule is named once.
      await page
        .getByText(/may not be applied after December 1 or before March 1/)
        .first()
        .waitFor();
      expect(await recordButton.isDisabled()).toBe(true);
    } else {
      await recordButton.click();
      await page
        .getByRole("list", { name: "Applications on this zone" })
        .getByText("Larkmoor Steadyfeed")
        .waitFor();
    }

    await page
      .getByRole("button", { name: "Cancel" })
      .last()
      .click()
      .catch(() => undefined);
    await openForm(page, "Quickgreen 28-3-6 (28-3-6)");
    await page.getByLabel("Rate", { exact: true }).fill("4");
    const refusal = page.getByRole("list", { name: "Rule checks" });
    await refusal.getByText(/1\.12 lb N per 1,000 ft² is above the 0\.90 lb limit/).waitFor();
    // Refused: nothing to send, and the technician is told what to do instead.
    expect(await page.getByRole("button", { name: "Record application" }).isDisabled()).toBe(true);
    await page.getByText("cannot be recorded").waitFor();
    // The rule's section and statute are behind one "Why" per source, not repeated per finding.
    expect(await refusal.innerText()).not.toContain("P.L.2010, c.112");
    const whys = refusal.getByText("Why", { exact: true });
    await whys.first().click();
    expect(await refusal.innerText()).toMatch(/58:10A/);
    const sources = await refusal.locator("details p").allTextContents();
    expect(new Set(sources).size).toBe(sources.length);
    await snap(page, "application-02-refused");
    await context.close();
  });

  it("the manager records the refused application with an override reason", async () => {
    expect(zoneUrl).not.toBe("");
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.goto(zoneUrl);
    await openForm(page, "Quickgreen 28-3-6 (28-3-6)");
    await page.getByLabel("Rate", { exact: true }).fill("4");
    await page.getByLabel("Override category").selectOption({ label: "Research or trial plot" });
    await page
      .getByLabel(/Override reason/)
      .fill("Sod repair after irrigation work; agronomist's written recommendation on file.");
    await page.getByRole("button", { name: "Record with override" }).click();
    const recorded = page.getByRole("list", { name: "Applications on this zone" });
    await recorded
      .getByText(/Legal limit overridden by Dana Whitcombe \(Research or trial plot\)/)
      .waitFor();
    await snap(page, "application-03-override");
    await context.close();
  });
});
