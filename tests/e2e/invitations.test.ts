// A homeowner joins through an invitation, end to end against the production server: the manager
// invites an address from the property page, opens the invitation e-mail in the development inbox,
// and the person — in a browser of their own, on a phone — opens its link, chooses a password
// (a too-short one is refused in words first), and lands on My lawn with the property. The manager
// then sees them linked and no longer pending; the link does not work a second time.
import type { Browser } from "playwright-core";
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
let propertyId = "";
let propertyName = "";

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  password = factories.TEST_PASSWORD;
  c = await factories.createTestCompany();
  propertyId = c.propertyIds["okafor"]!;
  propertyName = (
    await factories
      .testDb()
      .selectFrom("properties")
      .select("name")
      .where("id", "=", propertyId)
      .executeTakeFirstOrThrow()
  ).name;
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

describe("inviting a homeowner", () => {
  it("manager invites → the person opens the e-mailed link → sets a password → sees My lawn", async () => {
    const invitee = `new-homeowner-${c.companyId.slice(0, 8)}@test.sward.test`;
    const office = await browser.newContext({
      viewport: { width: 1440, height: 900 },
      baseURL: BASE,
    });
    const manager = await office.newPage();
    await signIn(manager, BASE, c.emails["manager"]!, password);
    await manager.waitForURL(/\/book/);
    await manager.goto(`/properties/${propertyId}`);
    const form = manager.getByRole("form", { name: "Invite a homeowner" });
    await form.getByLabel("Homeowner name").fill("Adaeze Okafor");
    await form.getByLabel("E-mail").fill(invitee);
    await form.getByRole("button", { name: "Invite" }).click();
    await expect
      .poll(() => form.getByRole("status").textContent(), { timeout: 15_000 })
      .toContain(`Invitation sent to ${invitee}`);
    const pending = manager.getByRole("region", { name: "Pending invitations" });
    await expect.poll(() => pending.textContent(), { timeout: 15_000 }).toContain(invitee);
    await manager.getByRole("heading", { name: "Homeowners" }).scrollIntoViewIfNeeded();
    await snap(manager, "invitation-pending-1440");

    // The development inbox shows the invitation; its link is the one the person gets.
    let href: string | null = null;
    await expect
      .poll(
        async () => {
          await manager.goto("/dev/mail");
          const item = manager.getByRole("link", { name: /invites you to follow your lawn/ });
          if (!(await item.count())) return false;
          await item.first().click();
          await manager.waitForURL(/\/dev\/mail\?id=/);
          href = await manager
            .getByRole("link", { name: /\/invitation\?token=/ })
            .first()
            .getAttribute("href");
          return Boolean(href);
        },
        { timeout: 20_000, interval: 500 },
      )
      .toBe(true);
    expect(new URL(href!).origin).toBe(new URL(BASE).origin);

    // The person, in their own browser on a phone.
    const home = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const phone = await home.newPage();
    await phone.goto(href!);
    await expect
      .poll(() => phone.getByRole("heading", { level: 1 }).textContent())
      .toContain("invites you");
    expect(await phone.textContent("main")).toContain(invitee);
    await snap(phone, "invitation-accept-390");
    expect(await seriousViolations(phone)).toEqual([]);
    await phone.getByLabel("Your name").fill("Adaeze Okafor");
    await phone.getByLabel("Choose a password").fill("too-short");
    await phone.getByRole("button", { name: "Accept and create my account" }).click();
    await expect
      .poll(() => phone.locator("#password-error").textContent(), { timeout: 15_000 })
      .toMatch(/at least 15 characters/);
    await phone.getByLabel("Choose a password").fill("copper kettle under maple");
    await phone.getByRole("button", { name: "Accept and create my account" }).click();
    await phone.waitForURL(/\/my-lawn/, { timeout: 30_000 });
    await expect.poll(() => phone.getByRole("heading", { level: 1 }).textContent()).toBe("My lawn");
    await expect.poll(() => phone.textContent("main")).toContain(propertyName);
    await snap(phone, "invitation-my-lawn-390");

    // The link works once.
    const again = await browser.newContext({ viewport: DESKTOP, baseURL: BASE });
    const second = await again.newPage();
    await second.goto(href!);
    expect(await second.getByRole("heading", { level: 1 }).textContent()).toBe(
      "This invitation link no longer works",
    );
    await snap(second, "invitation-used-1440");

    // The manager sees them linked, and no longer pending.
    await manager.goto(`/properties/${propertyId}`);
    expect(await manager.getByRole("list", { name: "Linked homeowners" }).textContent()).toContain(
      invitee,
    );
    expect(await manager.getByRole("region", { name: "Pending invitations" }).count()).toBe(0);
    await Promise.all([office.close(), home.close(), again.close()]);
  }, 120_000);

  it("the invitation page at 1440×900 and the property's homeowners at 390×844 (screenshots)", async () => {
    const invitee = `second-homeowner-${c.companyId.slice(0, 8)}@test.sward.test`;
    const office = await browser.newContext({ viewport: PHONE, baseURL: BASE });
    const manager = await office.newPage();
    await signIn(manager, BASE, c.emails["manager"]!, password);
    await manager.waitForURL(/\/book/);
    await manager.goto(`/properties/${propertyId}`);
    const form = manager.getByRole("form", { name: "Invite a homeowner" });
    await form.getByLabel("Homeowner name").fill("Chidi Okafor");
    await form.getByLabel("E-mail").fill(invitee);
    await form.getByRole("button", { name: "Invite" }).click();
    const pending = manager.getByRole("region", { name: "Pending invitations" });
    await expect.poll(() => pending.textContent(), { timeout: 15_000 }).toContain(invitee);
    await pending.scrollIntoViewIfNeeded();
    await snap(manager, "invitation-pending-390");
    expect(await seriousViolations(manager)).toEqual([]);

    const { testDb } = await import("../helpers/factories");
    const { invitationLinkFor } = await import("../helpers/invitations");
    let link: URL | undefined;
    await expect
      .poll(async () => {
        link = await invitationLinkFor(testDb(), invitee).catch(() => undefined);
        return Boolean(link);
      })
      .toBe(true);
    const wide = await browser.newContext({
      viewport: { width: 1440, height: 900 },
      baseURL: BASE,
    });
    const page = await wide.newPage();
    await page.goto(link!.toString());
    expect(await page.getByRole("button", { name: "Accept and create my account" }).count()).toBe(
      1,
    );
    await snap(page, "invitation-accept-1440");

    // Withdrawn from the property page: the link then says so.
    manager.once("dialog", (d) => void d.accept());
    await manager.getByRole("button", { name: `Withdraw the invitation to ${invitee}` }).click();
    await expect
      .poll(() => form.getByRole("status").textContent(), { timeout: 15_000 })
      .toContain("was withdrawn");
    await page.reload();
    expect(await page.textContent("main")).toContain("It was withdrawn.");
    await Promise.all([office.close(), wide.close()]);
  }, 120_000);
});
