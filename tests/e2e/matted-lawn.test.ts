// A matted lawn, end to end. The lawn has been mowed the same way before and tech1 finds it matted
// again, with a photo; the weather service has reported a warm, humid week for the lawn's cell
// (written to the weather cache here, as the provider would). On finishing, the alert shows on the
// visit summary with its evidence; the manager acknowledges it with a note and resolves it. The
// homeowner's report e-mail arrives in the fake inbox; its link leads to sign-in, where an
// e-mailed sign-in link signs her in and lands on the report with the care note and the photo.
// A used, an expired and a tampered link are refused with a clear message.
import type { Browser, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { createDb } from "@/db/client";
import { demoCompany } from "@/fixtures/demo/scenario";
import { addDays, todayIn } from "@/lib/dates";
import { readInbox } from "@/lib/mail/inbox-folder";
import { cellOf, weatherDayRow } from "@/lib/weather/map";

import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { lawnImage } from "../helpers/images";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
const mailDir = inject("mailDir");
const db = createDb(inject("databaseUrl"), { max: 2 });
const OWNER = "owner1@demo.sward.test";

/** Waits for the newest message to `to` whose subject matches, received after `since`. */
async function waitForMail(to: string, subject: RegExp, since: number) {
  let found: Awaited<ReturnType<typeof readInbox>>[number] | undefined;
  await expect
    .poll(
      async () => {
        found = (await readInbox(mailDir))
          .filter(
            (m) =>
              m.to.includes(to) && subject.test(m.subject) && Date.parse(m.receivedAt) >= since,
          )
          .at(-1);
        return Boolean(found);
      },
      { timeout: 20_000, interval: 250 },
    )
    .toBe(true);
  return found!;
}
const HOURS = Array.from({ length: 24 }, (_, h) => h);
const linkIn = (text: string, pattern: RegExp) => text.match(pattern)?.[0] ?? "";

beforeAll(async () => {
  browser = await launchBrowser();
  const oyelaran = demoCompany.properties.find((p) => p.key === "oyelaran")!;
  const today = todayIn(oyelaran.timeZone);
  const cell = cellOf(oyelaran.latitude, oyelaran.longitude);
  // A warm, humid spell: highs 29 °C, lows 21 °C, humidity 65–95 % (mean 80 %), no rain.
  const rows = Array.from({ length: 31 }, (_, i) => addDays(today, i - 25)).map((date) => ({
    ...weatherDayRow(cell, {
      date,
      tmaxC: 29,
      tminC: 21,
      rhMaxPct: 95,
      rhMinPct: 65,
      rhMeanPct: 80,
      windMs: 2,
      windHeightM: 10,
      sunshineH: 7,
      solarMJ: null,
      precipMm: 0,
      isForecast: date > today,
      // The hours the service gives with such days (the cache asks again for recent days without them).
      hourly: {
        time: HOURS.map((h) => `${String(h).padStart(2, "0")}:00`),
        tempC: HOURS.map((h) => 25 + 4 * Math.sin((Math.PI * (h - 9)) / 12)),
        rhPct: HOURS.map((h) => 80 - 15 * Math.sin((Math.PI * (h - 9)) / 12)),
      },
      serviceEt0Mm: 4.2,
    }),
    fetched_at: new Date(),
  }));
  await db
    .insertInto("weather_days")
    .values(rows)
    .onConflict((oc) =>
      oc.columns(["cell", "day"]).doUpdateSet((eb) => ({
        tmax_c: eb.ref("excluded.tmax_c"),
        tmin_c: eb.ref("excluded.tmin_c"),
        rh_max_pct: eb.ref("excluded.rh_max_pct"),
        rh_min_pct: eb.ref("excluded.rh_min_pct"),
        rh_mean_pct: eb.ref("excluded.rh_mean_pct"),
        precip_mm: eb.ref("excluded.precip_mm"),
        is_forecast: eb.ref("excluded.is_forecast"),
        hourly: eb.ref("excluded.hourly"),
        service_et0_mm: eb.ref("excluded.service_et0_mm"),
        fetched_at: eb.ref("excluded.fetched_at"),
      })),
    )
    .execute();
});
afterAll(async () => {
  await browser?.close();
  await db.destroy();
});

async function rate(page: Page, label: string, value: number) {
  await page
    .getByRole("radiogroup", {
      name: `${label}, ${value >= 6 ? "acceptable" : "below acceptable"}`,
      exact: true,
    })
    .getByRole("radio", { name: String(value), exact: true })
    .click();
}

let finishedAt = 0;

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
    for (const label of ["Overall quality", "Color", "Density", "Uniformity"])
      await rate(page, label, 7);
    await page
      .getByRole("radiogroup", { name: "Mowing direction" })
      .getByRole("radio", { name: "Same as last check" })
      .click();
    await page.getByRole("button", { name: "Lay-over / matting" }).click();
    await page
      .getByLabel("Choose photos from the library")
      .setInputFiles([
        { name: "matted.jpg", mimeType: "image/jpeg", buffer: await lawnImage(1600, 1200, 0.05) },
      ]);
    await expect
      .poll(
        async () =>
          page
            .getByRole("list", { name: "Photos of this zone check" })
            .getByRole("listitem")
            .count()
            .catch(() => 0),
        { timeout: 20_000 },
      )
      .toBe(1);
    await page.getByRole("button", { name: "Mark zone done" }).click();
    await page
      .getByRole("status")
      .filter({ hasText: /^Saved/ })
      .waitFor({ timeout: 10_000 });
    for (const zone of ["Back yard", "Side strip"]) {
      await page.getByRole("button", { name: new RegExp(`Next: ${zone}`) }).click();
      await page.getByRole("heading", { name: zone }).waitFor();
      await page.getByRole("button", { name: "Skip this zone" }).click();
      await page
        .getByRole("radiogroup", { name: "Why was the zone skipped?" })
        .getByRole("radio", { name: "No access" })
        .click();
      await page
        .getByRole("status")
        .filter({ hasText: /^Saved/ })
        .waitFor({ timeout: 10_000 });
    }
    await page.getByRole("button", { name: "Review and finish" }).click();
    finishedAt = Date.now() - 1000;
    await page.getByRole("button", { name: "Finish visit" }).click();
    await page.getByText(/^Finished at/).waitFor();
    const alerts = page.locator("section[aria-labelledby=visit-alerts-title]");
    const matted = alerts.getByRole("listitem").filter({ hasText: "Matted canopy: fungus risk" });
    await matted.waitFor({ timeout: 15_000 });
    expect(await matted.innerText()).toMatch(/Front lawn/);
    expect(await matted.innerText()).toMatch(
      /Matted, laid-over grass seen while the disease models read dollar spot weather at 64 % \(77 °F, 80 % humidity over 5 days\): a matted canopy holds moisture \(common practice\)/,
    );
    await matted.getByText("Evidence and source").click();
    const evidence = await matted.innerText();
    expect(evidence).toMatch(/Matting seen\s*yes/);
    expect(evidence).toMatch(/5-day mean humidity \(%\)\s*80/);
    expect(evidence).toMatch(/Basis\s*common practice \(no published threshold\)/);
    expect(evidence).toMatch(/Probability \(%\)\s*64/); // Smith et al. (2018): logit −11.4041 + 0.0894·80 + 0.1932·25
    expect(evidence).toMatch(/Kansas State University/);
    await alerts.scrollIntoViewIfNeeded();
    await snap(page, "alert-01-visit-summary", true);
    await context.close();
    // A whole visit with a photo upload: 30 s on a loaded 2-core machine (load average 12–17).
  }, 60_000);

  it("the manager acknowledges it with a note, then resolves it", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.goto("/risk-alerts?kind=matted_canopy");
    const card = page
      .getByRole("list", { name: "Risk alerts" })
      .getByRole("listitem")
      .filter({ hasText: "Oyelaran residence" });
    await card.waitFor();
    await snap(page, "alert-02-alerts-page");
    await card.getByRole("button", { name: "Acknowledge" }).click();
    await card.getByLabel(/Note \(optional\)/).fill("Told the mowing crew to alternate stripes.");
    await card.getByRole("button", { name: "Acknowledge" }).click();
    await card.getByText("· Acknowledged").waitFor();
    await card.getByRole("button", { name: "Resolve" }).click();
    await card.getByRole("button", { name: "Resolve" }).click(); // without a note
    await card.getByRole("alert").filter({ hasText: "Say how it was resolved." }).waitFor();
    await card
      .getByLabel("How was it resolved?")
      .fill("Direction changed at the next two mowings; canopy upright again.");
    await card.getByRole("button", { name: "Resolve" }).click();
    // Resolved alerts leave the default (live) view; the resolved view keeps the history.
    await expect.poll(() => card.count(), { timeout: 10_000 }).toBe(0);
    await page.goto("/risk-alerts?kind=matted_canopy&status=resolved");
    const resolved = page
      .getByRole("list", { name: "Risk alerts" })
      .getByRole("listitem")
      .filter({ hasText: "Oyelaran residence" });
    await resolved.getByText("Evidence and source").click();
    const text = await resolved.innerText();
    expect(text).toMatch(/Acknowledged.*Dana Whitcombe[\s\S]*Told the mowing crew/);
    expect(text).toMatch(/Resolved.*Dana Whitcombe[\s\S]*Direction changed/);
    await snap(page, "alert-03-resolved", true);
    await context.close();
  });
});

describe("the homeowner's report e-mail and sign-in link", () => {
  let reportPath = "";

  async function askForLink(page: import("playwright-core").Page): Promise<string> {
    const since = Date.now() - 1000;
    await page.getByLabel("Your e-mail address").fill(OWNER);
    await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
    await page.getByRole("status").filter({ hasText: "Check your e-mail" }).waitFor();
    const mail = await waitForMail(OWNER, /^Your sign-in link for /, since);
    expect(mail.text).toMatch(/works once, within 15 minutes/);
    const link = linkIn(mail.text, /https?:\/\/\S+\/sign-in\/link\?\S+/);
    expect(link).not.toBe("");
    return link;
  }

  it("the report e-mail arrives; its link and an e-mailed sign-in link land owner1 on the report, with the care note and the photo", async () => {
    const report = await waitForMail(
      OWNER,
      /^Your lawn visit report — Oyelaran residence, /,
      finishedAt,
    );
    expect(report.text).toMatch(/Change the mowing direction every few mowings/);
    expect(report.text).toMatch(/Front lawn: https?:\/\/\S+\/api\/v1\/photos\//); // photos as links
    expect(report.html).toContain("Read your visit report");
    const reportUrl = linkIn(report.text, /https?:\/\/\S+\/my-lawn\/reports\/[0-9a-f-]+/);
    reportPath = new URL(reportUrl).pathname;

    // The e-mail's button signs owner1 in once and opens the report: no second e-mail to ask for.
    const signed = linkIn(report.text, /https?:\/\/\S+\/sign-in\/link\?\S+/);
    expect(report.text).toMatch(/signs you in once, within 72 hours/);
    const direct = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const directPage = await direct.newPage();
    await directPage.goto(signed);
    await directPage.getByRole("heading", { name: "Finish signing in" }).waitFor();
    await directPage.getByRole("button", { name: "Continue to my lawn" }).click();
    await directPage.waitForURL(`**${reportPath}`);
    await directPage.getByRole("heading", { level: 1, name: /Oyelaran residence/ }).waitFor();
    await snap(directPage, "mail-00-report-from-its-email-link", true);
    await direct.close();
    // Used once: the same button again signs no one in.
    const reused = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const reusedPage = await reused.newPage();
    await reusedPage.goto(signed);
    await reusedPage.getByRole("button", { name: "Continue to my lawn" }).click();
    await reusedPage.waitForURL(/\/sign-in\?.*error=Verification/);
    expect((await reusedPage.request.get(reportPath, { maxRedirects: 0 })).status()).toBe(307);
    await reused.close();

    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await page.goto(reportUrl);
    await page.waitForURL(/\/sign-in\?callbackUrl=/);
    await snap(page, "mail-01-sign-in-from-report", true);
    const link = await askForLink(page);
    await snap(page, "mail-02-check-your-email");

    await page.goto(link);
    await page.getByRole("heading", { name: "Finish signing in" }).waitFor();
    expect(await page.getByText(`You are signing in as ${OWNER}.`).count()).toBe(1);
    await snap(page, "mail-03-finish-signing-in");
    await page.getByRole("button", { name: "Continue to my lawn" }).click();
    await page.waitForURL(`**${reportPath}`);
    await page.getByRole("heading", { level: 1, name: /Oyelaran residence/ }).waitFor();
    const note = page.getByRole("listitem").filter({
      has: page.getByRole("heading", { name: "Change the mowing direction every few mowings" }),
    });
    await note.waitFor();
    expect(await note.innerText()).toMatch(/Mower safety/);
    const photo = page.locator('ul[aria-label="Photos of Front lawn"] img').first();
    await photo.waitFor();
    expect(
      await photo.evaluate((img: HTMLImageElement) => img.complete && img.naturalWidth > 0),
    ).toBe(true);
    await snap(page, "mail-04-report-after-link", true);

    // The same link a second time: refused, in words, and nobody is signed in by it.
    const again = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page2 = await again.newPage();
    await page2.goto(link);
    await page2.getByRole("button", { name: "Continue to my lawn" }).click();
    await page2.waitForURL(/\/sign-in\?.*error=Verification/);
    await page2
      .getByRole("alert")
      .filter({ hasText: "That sign-in link has expired or has already been used." })
      .waitFor();
    await snap(page2, "mail-05-link-used");
    expect((await page2.request.get(reportPath, { maxRedirects: 0 })).status()).toBe(307);
    await again.close();
    await context.close();
  });

  it("an expired link and a link whose e-mail was changed are refused; neither signs anyone in", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: baseUrl });
    const page = await context.newPage();
    await page.goto("/sign-in");

    const tampered = await askForLink(page);
    const other = new URL(tampered);
    other.searchParams.set("email", "owner2@demo.sward.test");
    await page.goto(other.toString());
    await page.getByRole("button", { name: "Continue to my lawn" }).click();
    await page.waitForURL(/\/sign-in\?.*error=Verification/);
    await page.getByRole("alert").filter({ hasText: "expired or has already been used" }).waitFor();
    expect((await page.request.get("/my-lawn", { maxRedirects: 0 })).status()).toBe(307);

    // Sixteen minutes later (the token's expiry moved back, as the clock would).
    await page.goto("/sign-in");
    const expired = await askForLink(page);
    await db
      .updateTable("verification_tokens")
      .set({ expires: new Date(Date.now() - 60_000) })
      .where("identifier", "=", OWNER)
      .execute();
    await page.goto(expired);
    await page.getByRole("button", { name: "Continue to my lawn" }).click();
    await page.waitForURL(/\/sign-in\?.*error=Verification/);
    await page
      .getByRole("alert")
      .filter({ hasText: "A link works once, within 15 minutes" })
      .waitFor();
    expect((await page.request.get("/my-lawn", { maxRedirects: 0 })).status()).toBe(307);

    // That was the third link for this address in 15 minutes: a fourth is refused, in words.
    await page.getByLabel("Your e-mail address").fill(OWNER);
    await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
    await page
      .getByRole("alert")
      .filter({ hasText: "Too many sign-in links were asked for" })
      .waitFor();
    await snap(page, "mail-06-link-throttled");
    await context.close();
  });

  it("the report's e-mail link works only for its own homeowner", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "owner2@demo.sward.test");
    await page.waitForURL("**/my-lawn");
    expect((await page.goto(reportPath))?.status()).toBe(404);
    await context.close();
  });

  it("the manager reads the same mail in the development inbox; the other company's manager sees none of it", async () => {
    const context = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page = await context.newPage();
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    await page.goto("/dev/mail");
    const list = page.getByRole("list", { name: "Messages, newest first" });
    await list.getByRole("link", { name: /Your lawn visit report — Oyelaran residence/ }).click();
    await page
      .getByRole("heading", { level: 2, name: /Your lawn visit report — Oyelaran residence/ })
      .waitFor();
    expect(await page.locator("pre").innerText()).toMatch(
      /Change the mowing direction every few mowings/,
    );
    expect(await list.getByRole("link", { name: /Your sign-in link for/ }).count()).toBe(3);
    await snap(page, "mail-07-development-inbox");
    await context.close();

    const other = await browser.newContext({ viewport: DESKTOP, baseURL: baseUrl });
    const page2 = await other.newPage();
    await signIn(page2, baseUrl, "manager@other.sward.test");
    await page2.waitForURL("**/book");
    await page2.goto("/dev/mail");
    await page2.getByText("No mail yet.").waitFor();
    await other.close();
  });
});
