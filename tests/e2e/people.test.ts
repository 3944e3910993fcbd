// The People page end to end against the production server, at desktop and phone size: a manager
// invites a technician; the technician opens the e-mailed link (from the fake SMTP service's
// inbox) in a browser of their own, sets a password that meets the policy, is signed in and lands
// on Today; the manager disables them and their open session ends (the next navigation goes to
// sign-in). The page shows the demo scenario's license warning (tech2's license expires within
// 30 days of the seeding day). axe: 0 serious or critical violations; screenshots of each step.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { readInbox } from "@/lib/mail/inbox-folder";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";
import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const BASE = inject("baseUrl");
const mailDir = inject("mailDir");
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

/** The invitation link in the newest e-mail to `to` received since `since` (the SMTP fake's inbox). */
async function invitationLink(to: string, since: number): Promise<string> {
  let link = "";
  await expect
    .poll(
      async () => {
        const mail = (await readInbox(mailDir))
          .filter(
            (m) =>
              m.to.includes(to) &&
              /invites you to join its team/.test(m.subject) &&
              Date.parse(m.receivedAt) >= since,
          )
          .at(-1);
        link = mail?.text.match(/https?:\/\/\S+\/invitation\?token=[0-9a-f]{64}/)?.[0] ?? "";
        return Boolean(link);
      },
      { timeout: 30_000, interval: 250 },
    )
    .toBe(true);
  return link;
}

for (const [size, viewport] of [
  ["desktop", DESKTOP],
  ["phone", PHONE],
] as const) {
  describe(`people at ${size} size`, () => {
    it("a manager invites a technician, who accepts from the e-mail and lands on Today; disabled, their session ends", async () => {
      const invitee = `tech-${size}-${c.companyId.slice(0, 8)}@test.sward.test`;
      const office = await browser.newContext({ viewport, baseURL: BASE });
      const manager = await office.newPage();
      await signIn(manager, BASE, c.emails["manager"]!, password);
      await manager.waitForURL(/\/book/);
      // From the navigation: on a phone, People is under the bar's "More".
      const nav = manager.getByRole("navigation", { name: "Main" });
      if (size === "phone") await nav.getByText("More", { exact: true }).click();
      await nav.getByRole("link", { name: "People" }).first().click();
      await manager.waitForURL(/\/people$/);
      await manager.getByRole("heading", { level: 1, name: "People" }).waitFor();
      // The demo's license that expires within 30 days is warned about.
      expect(
        await manager.getByRole("status", { name: "Applicator licenses to renew" }).textContent(),
      ).toMatch(/Priya Nandakumar.*DEMO-CA-22107 expires on/);
      expect(await seriousViolations(manager)).toEqual([]);
      await snap(manager, `people-${size}`, true);

      const since = Date.now();
      const form = manager.getByRole("form", { name: "Invite a technician or a manager" });
      // An address already in use is refused in words.
      await form.getByLabel("Name").fill("Someone Else");
      await form.getByLabel("E-mail").fill(c.emails["tech1"]!);
      await form.getByRole("button", { name: "Invite" }).click();
      await expect
        .poll(() => form.getByRole("alert").first().textContent(), { timeout: 15_000 })
        .toContain("already in use");
      await form.getByLabel("Name").fill("Wren Callory");
      await form.getByLabel("E-mail").fill(invitee);
      await form.getByLabel("Role").selectOption("technician");
      await form.getByRole("button", { name: "Invite" }).click();
      await expect
        .poll(() => form.getByRole("status").textContent(), { timeout: 15_000 })
        .toContain(`Invitation sent to ${invitee}`);
      const invited = manager.getByRole("region", { name: "Invited" });
      await expect
        .poll(() => invited.textContent(), { timeout: 15_000 })
        .toMatch(new RegExp(`${invitee}.*Technician.*link works until`));
      await snap(manager, `people-invited-${size}`);

      // The technician, in a browser of their own.
      const link = await invitationLink(invitee, since);
      expect(new URL(link).origin).toBe(new URL(BASE).origin);
      const field = await browser.newContext({ viewport, baseURL: BASE });
      const tech = await field.newPage();
      await tech.goto(link);
      await expect
        .poll(() => tech.getByRole("heading", { level: 1 }).textContent())
        .toContain("invites you to join its team");
      expect(await tech.textContent("main")).toContain("a technician");
      expect(await seriousViolations(tech)).toEqual([]);
      await snap(tech, `people-accept-${size}`);
      await tech.getByLabel("Your name").fill("Wren Callory");
      await tech.getByLabel("Choose a password").fill("too-short");
      await tech.getByRole("button", { name: "Accept and create my account" }).click();
      await expect
        .poll(() => tech.locator("#password-error").textContent(), { timeout: 15_000 })
        .toMatch(/at least 15 characters/);
      await tech.getByLabel("Choose a password").fill("lantern over the clover field");
      await tech.getByRole("button", { name: "Accept and create my account" }).click();
      await tech.waitForURL(/\/today/, { timeout: 30_000 });
      await expect.poll(() => tech.getByRole("heading", { level: 1 }).textContent()).toBe("Today");
      await snap(tech, `people-today-${size}`);

      // The manager sees them active, then disables them.
      await manager.goto("/people");
      const row = manager.getByRole("listitem").filter({ hasText: invitee });
      await expect.poll(() => row.textContent()).toContain("Active");
      manager.once("dialog", (d) => void d.accept());
      await row.getByRole("button", { name: "Disable Wren Callory" }).click();
      await expect.poll(() => row.textContent(), { timeout: 15_000 }).toContain("Disabled");
      await snap(manager, `people-disabled-${size}`);

      // Their open session ends: the next navigation goes to sign-in.
      await tech.goto("/today");
      await tech.waitForURL(/\/sign-in/, { timeout: 15_000 });
      // And the password no longer signs in.
      await signIn(tech, BASE, invitee, "lantern over the clover field");
      await expect
        .poll(() => tech.getByRole("alert").first().textContent(), { timeout: 15_000 })
        .toBeTruthy();
      expect(tech.url()).toMatch(/\/sign-in/);
      await Promise.all([office.close(), field.close()]);
    }, 180_000);
  });
}

describe("the technician's license warning", () => {
  it("shows on Today for the technician whose license expires within 30 days", async () => {
    const context = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const page = await context.newPage();
    await signIn(page, BASE, c.emails["tech2"]!, password);
    await page.waitForURL(/\/today/);
    expect(
      await page.getByRole("status", { name: "Your applicator license" }).textContent(),
    ).toMatch(/DEMO-CA-22107 expires on .* \(in 18 days\)/);
    await snap(page, "people-license-warning-today-phone");
    await context.close();
  }, 60_000);
});

describe("a technician's start point", () => {
  it("a manager sets it on People at phone size; the technician's Today starts from it", async () => {
    const office = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const page = await office.newPage();
    await signIn(page, BASE, c.emails["manager"]!, password);
    await page.waitForURL(/\/book/);
    await page.goto("/people");
    const name = c.scenario.people.find((p) => p.key === "tech1")!.name;
    await page.getByRole("button", { name: `Start point of ${name}` }).click();
    const form = page.getByRole("form", { name: `Start point of ${name}` });
    await form.getByLabel("Address").fill("Home, 14 Reed Lane");
    await form.getByLabel("Latitude").fill("40.3189");
    await form.getByRole("button", { name: "Save start point" }).click();
    // Half a location is refused with the field named, and nothing is lost.
    await form
      .getByText("Start point location: give both the latitude and the longitude, or neither.")
      .waitFor();
    expect(await form.getByLabel("Address").inputValue()).toBe("Home, 14 Reed Lane");
    await form.getByLabel("Longitude").fill("-74.7012");
    await form.getByRole("button", { name: "Save start point" }).click();
    await page.getByText("Day starts and ends at Home, 14 Reed Lane").waitFor();
    await snap(page, "people-start-point-phone");
    expect(await seriousViolations(page)).toEqual([]);

    const field = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const tech = await field.newPage();
    await signIn(tech, BASE, c.emails["tech1"]!, password);
    await tech.waitForURL(/\/today/);
    await tech
      .getByRole("region", { name: "Route" })
      .getByText("From your start point (Home, 14 Reed Lane) and back.")
      .waitFor();
    await Promise.all([office.close(), field.close()]);
  }, 120_000);
});
