// Soil tests on the property page against the production server, at phone and desktop size: the
// demo's acid, low-potassium test reads against the MLSN guidelines with the Mehlich-buffer lime
// amount and the usual cautions; a manager records a test through the form (a wrong pH first, told
// in words, nothing lost); a technician imports a lab's CSV file (previewed, then imported, then
// the same file adds nothing). axe: 0 serious or critical violations; screenshots of each step.
import type { Browser, Page } from "playwright-core";
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

async function openSoilTests(page: Page, who: "manager" | "tech1", property: string) {
  await signIn(page, BASE, c.emails[who]!, password);
  await page.waitForURL(/\/(book|today)/);
  await page.goto(`${BASE}/properties/${c.propertyIds[property]}#soil`);
  await page.getByRole("heading", { level: 2, name: "Soil tests" }).waitFor();
}

for (const [size, viewport] of [
  ["desktop", DESKTOP],
  ["phone", PHONE],
] as const) {
  describe(`soil tests at ${size} size`, () => {
    it("the demo's test reads against the guidelines; a manager records one through the form", async () => {
      const context = await browser.newContext({ viewport, baseURL: BASE });
      const page = await context.newPage();
      await openSoilTests(page, "manager", "haddad");
      // The demo's whole-property test: pH 5.2, Mehlich buffer 6.3, K 29 ppm (guideline 37).
      const demo = page.getByRole("article").filter({ hasText: "Whole property" }).first();
      await demo.waitFor();
      const text = (await demo.textContent()) ?? "";
      expect(text).toMatch(/Cedar Hollow Soil Lab · Mehlich-3 · sampled to 4 in/);
      expect(text).toMatch(/Potassium \(K\)29 ppm37 ppm▼ Below: about [\d.]+ lb K₂O per 1,000 ft²/);
      expect(text).toMatch(
        /pH 5\.2, Mehlich buffer pH 6\.3: about [\d.]+ lb of calcium carbonate per 1,000 ft² brings it to pH 6\.0/,
      );
      await page.getByRole("complementary", { name: "Safety cautions" }).waitFor();
      await snap(page, `soil-tests-demo-${size}`);

      // Record a test: a pH out of range is refused in words, the rest stays typed.
      await page.getByText("Record a soil test").first().click();
      const form = page.getByRole("form", { name: "Record a soil test" });
      const lab = `Form lab ${size}`;
      await form.getByLabel("Lab", { exact: true }).fill(lab);
      await form.getByLabel("Where the sample came from").selectOption({ label: "Front slope" });
      await form.getByLabel("Soil pH").fill("11");
      await form.getByLabel("Phosphorus (P)").fill("12");
      await form.getByLabel("Potassium (K)").fill("60");
      await form.getByRole("button", { name: "Save soil test" }).click();
      await form.getByText("Soil pH: at most 10.").waitFor();
      expect(await form.getByLabel("Phosphorus (P)").inputValue()).toBe("12");
      await form.getByLabel("Soil pH").fill("6.4");
      await form.getByRole("button", { name: "Save soil test" }).click();
      const saved = page.getByRole("article").filter({ hasText: lab });
      await saved.waitFor();
      const savedText = (await saved.textContent()) ?? "";
      expect(savedText).toMatch(/Front slope/);
      expect(savedText).toMatch(/Phosphorus \(P\)12 ppm21 ppm▼ Below/);
      expect(savedText).toMatch(/Phosphorus: needed — below the guideline\./);
      expect(savedText).toMatch(/pH 6\.4: at or above the guideline of 5\.5 — no lime needed\./);
      expect(await seriousViolations(page, `soil tests ${size}`)).toEqual([]);
      await snap(page, `soil-tests-recorded-${size}`);
      await context.close();
    }, 120_000);

    it("a technician imports a lab's CSV file: previewed, imported, and the same file adds nothing", async () => {
      const context = await browser.newContext({ viewport, baseURL: BASE });
      const page = await context.newPage();
      await openSoilTests(page, "tech1", "kowalczyk");
      // The demo's older test with the lab's own lime figure (SMP buffer).
      expect(
        await page
          .getByRole("article")
          .filter({ hasText: "Millbrook Agronomy Services" })
          .textContent(),
      ).toMatch(/the lab recommends 25 lb of lime per 1,000 ft² \(SMP buffer\)/);
      const lab = `Import lab ${size}`;
      const csv = [
        "Sampled on,Lab,Zone,Depth (in),Extractant,pH,Buffer pH,Buffer method,P ppm,K ppm,Ca ppm,Mg ppm,S ppm",
        `3/2/2026,${lab},,4,Mehlich-3,5.0,6.3,Mehlich,30,20,400,40,5`,
        `3/2/2026,${lab},Front lawn,4,Mehlich-3,6.1,,,25,45,900,90,9`,
      ].join("\n");
      await page.getByText("Import a lab's file (CSV)").click();
      const chooser = page.getByLabel("Choose the file");
      await chooser.setInputFiles({
        name: "lab-results.csv",
        mimeType: "text/csv",
        buffer: Buffer.from(csv),
      });
      await page.getByText("lab-results.csv: 2 rows read — 2 new.").waitFor();
      await page.getByRole("button", { name: "Import 2 soil tests" }).click();
      await page
        .getByRole("status")
        .filter({ hasText: "2 soil tests imported from lab-results.csv." })
        .waitFor();
      const imported = page.getByRole("article").filter({ hasText: lab });
      await imported.first().waitFor();
      await expect.poll(() => imported.count()).toBe(2);
      expect(await imported.first().getAttribute("aria-label")).toMatch(
        /^Soil test of \w+, Mar 2, 2026$/,
      );
      // The same file again: nothing new to import.
      await chooser.setInputFiles({
        name: "lab-results.csv",
        mimeType: "text/csv",
        buffer: Buffer.from(csv),
      });
      await page.getByText("lab-results.csv: 2 rows read — 0 new, 2 recorded already.").waitFor();
      await page.getByText("Nothing new to import.").waitFor();
      expect(await page.getByRole("button", { name: /^Import \d/ }).count()).toBe(0);
      expect(await seriousViolations(page, `soil import ${size}`)).toEqual([]);
      await snap(page, `soil-tests-import-${size}`);
      await context.close();
    }, 120_000);
  });
}
