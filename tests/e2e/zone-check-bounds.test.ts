// The zone check's bounds on a phone (390×844), as the technician types: a probe reading of -5 or
// 250 % is refused with the field's name and unit (never clamped; the last good reading stays
// saved), and notes show a counter against the 4,000-character limit, the server refusing a longer
// note by the field's name. A company of its own (tests/helpers/factories.ts), so no other test's
// visit is touched.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
let c: TestCompany;
let password = "";
let visitId = "";

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  password = factories.TEST_PASSWORD;
  c = await factories.createTestCompany();
  const { todayIn } = await import("@/lib/dates");
  visitId = (
    await factories
      .testDb()
      .selectFrom("visits")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("technician_id", "=", c.userIds["tech1"]!)
      .where("status", "=", "scheduled")
      .where("scheduled_for", "=", todayIn("America/New_York"))
      .orderBy("stop_order")
      .executeTakeFirstOrThrow()
  ).id;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("zone check bounds on a phone", () => {
  it(
    "probe -5 and 250 % refused in words, 35 % kept; notes counted, 4,001 refused",
    { timeout: 90_000 },
    async () => {
      const context = await browser.newContext({
        viewport: PHONE,
        baseURL: baseUrl,
        permissions: ["geolocation"],
        geolocation: { latitude: 40.33, longitude: -74.74 },
      });
      const page = await context.newPage();
      await signIn(page, baseUrl, c.emails["tech1"]!, password);
      await page.waitForURL("**/today");
      await page.goto(`/visits/${visitId}`);
      await page.getByRole("button", { name: "Start visit" }).click();
      await page.waitForURL(/zone=/);

      const probe = page.getByLabel("Soil moisture probe reading in percent");
      await probe.scrollIntoViewIfNeeded();
      const refusal = page
        .getByRole("alert")
        .filter({ hasText: /^Soil moisture probe reading: between 0 and 100 %/ });
      await probe.fill("35");
      await page
        .getByRole("status")
        .filter({ hasText: /^Saved/ })
        .waitFor({ timeout: 10_000 });
      for (const bad of ["-5", "250"]) {
        await probe.fill(bad);
        await refusal.waitFor();
        expect(await probe.inputValue()).toBe(bad); // kept as typed, not clamped
      }
      await snap(page, "zone-check-probe-refused");
      const stored = async () =>
        (
          (await (await page.request.get(`/api/v1/visits/${visitId}`)).json()) as {
            checks: { soilMoisturePct: number | null; notes: string }[];
          }
        ).checks[0]!;
      expect((await stored()).soilMoisturePct).toBe(35);
      await probe.fill("40");
      await refusal.waitFor({ state: "detached" });
      await page
        .getByRole("status")
        .filter({ hasText: /^Saved/ })
        .waitFor({ timeout: 10_000 });
      await expect.poll(async () => (await stored()).soilMoisturePct).toBe(40);

      const notes = page.getByPlaceholder("What stood out in this zone");
      await notes.fill("Thin by the drive.");
      await page.getByText("18 of 4,000 characters").waitFor();
      await expect
        .poll(async () => (await stored()).notes, { timeout: 10_000 })
        .toBe("Thin by the drive.");
      await notes.fill("n".repeat(4001));
      await page.getByText("1 character over the 4,000-character limit").waitFor();
      await page
        .getByRole("alert")
        .filter({ hasText: "Zone notes: at most 4,000 characters; shorten them." })
        .waitFor({ timeout: 10_000 });
      await snap(page, "zone-check-notes-over");
      expect((await stored()).notes).toBe("Thin by the drive.");
      await context.close();
    },
  );
});
