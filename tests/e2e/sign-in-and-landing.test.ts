// Each role signs in through the real form in Chromium and lands on its own page; wrong
// passwords get a clear error; sign-out ends the session for good; tenancy holds in the API.
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { demoCompany, otherCompany } from "@/fixtures/demo/scenario";

import { seriousViolations } from "../helpers/axe";
import { DESKTOP, launchBrowser, PHONE, signIn } from "../helpers/browser";

const baseUrl = inject("baseUrl");
let browser: Browser;

beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

async function freshPage(viewport = DESKTOP): Promise<{ context: BrowserContext; page: Page }> {
  const context = await browser.newContext({ viewport, baseURL: baseUrl });
  return { context, page: await context.newPage() };
}

const namesFor = (pred: (p: (typeof demoCompany.properties)[number]) => boolean) =>
  demoCompany.properties.filter(pred).map((p) => p.name);

describe("landing pages by role", () => {
  const cases = [
    {
      email: "manager@demo.sward.test",
      path: "/book",
      heading: "Book",
      expected: namesFor(() => true),
      viewport: DESKTOP,
    },
    {
      email: "tech1@demo.sward.test",
      path: "/today",
      heading: "Today",
      expected: demoCompany.schedule!.today.tech1!.map(
        (k) => demoCompany.properties.find((p) => p.key === k)!.name,
      ),
      api: namesFor((p) => p.technician === "tech1"),
      viewport: PHONE,
    },
    {
      email: "tech2@demo.sward.test",
      path: "/today",
      heading: "Today",
      expected: demoCompany.schedule!.today.tech2!.map(
        (k) => demoCompany.properties.find((p) => p.key === k)!.name,
      ),
      api: namesFor((p) => p.technician === "tech2"),
      viewport: DESKTOP,
    },
    {
      email: "owner1@demo.sward.test",
      path: "/my-lawn",
      heading: "My lawn",
      expected: namesFor((p) => p.homeowners.includes("owner1")),
      viewport: PHONE,
    },
    {
      email: "owner2@demo.sward.test",
      path: "/my-lawn",
      heading: "My lawn",
      expected: namesFor((p) => p.homeowners.includes("owner2")),
      viewport: PHONE,
    },
    {
      email: "owner3@demo.sward.test",
      path: "/my-lawn",
      heading: "My lawn",
      expected: namesFor((p) => p.homeowners.includes("owner3")),
      viewport: DESKTOP,
    },
    {
      email: "manager@other.sward.test",
      path: "/book",
      heading: "Book",
      expected: otherCompany.properties.map((p) => p.name),
      viewport: DESKTOP,
    },
  ];

  for (const c of cases) {
    it(`${c.email} lands on ${c.path} and sees exactly their properties`, async () => {
      const { context, page } = await freshPage(c.viewport);
      await signIn(page, baseUrl, c.email);
      await page.waitForURL(`**${c.path}`);
      // The list pages stream their rows behind a skeleton: wait for the page, not the first paint.
      await page.getByRole("heading", { level: 1, name: c.heading, exact: true }).waitFor();
      const api = await page.request.get("/api/v1/properties");
      expect(api.status()).toBe(200);
      const names = ((await api.json()) as { items: { name: string }[] }).items
        .map((p) => p.name)
        .sort();
      expect(names).toEqual([...("api" in c && c.api ? c.api : c.expected)].sort());
      // Visible on the page (the book summary also names properties in a table that starts closed).
      // My lawn checks the account first, then streams its body: wait for each name to show.
      for (const name of c.expected)
        await page.getByText(name, { exact: true }).filter({ visible: true }).first().waitFor();
      const visible = "api" in c && c.api ? c.api : c.expected;
      const others = demoCompany.properties
        .concat(otherCompany.properties)
        .filter((p) => !visible.includes(p.name));
      for (const p of others)
        await expect(page.getByText(p.name, { exact: true }).count()).resolves.toBe(0);
      expect(await seriousViolations(page)).toEqual([]);
      await context.close();
    });
  }
});

describe("sign-in errors and sign-out", () => {
  it("a wrong password shows a clear error and keeps the e-mail", async () => {
    const { context, page } = await freshPage(PHONE);
    await signIn(page, baseUrl, "tech2@demo.sward.test", "not-the-password");
    const alert = page.locator("form").getByRole("alert");
    await alert.waitFor();
    expect(await alert.innerText()).toContain("do not match an account");
    expect(await page.getByLabel("E-mail", { exact: true }).inputValue()).toBe(
      "tech2@demo.sward.test",
    );
    expect(new URL(page.url()).pathname).toBe("/sign-in");
    expect(await seriousViolations(page)).toEqual([]);
    await context.close();
  });

  it("an unknown e-mail gets the very same message", async () => {
    const { context, page } = await freshPage();
    await signIn(page, baseUrl, "nobody@demo.sward.test", "whatever-password");
    const alert = page.locator("form").getByRole("alert");
    await alert.waitFor();
    expect(await alert.innerText()).toContain("do not match an account");
    await context.close();
  });

  it("the sign-in page passes axe at phone and desktop sizes", async () => {
    for (const viewport of [PHONE, DESKTOP]) {
      const { context, page } = await freshPage(viewport);
      await page.goto("/sign-in");
      expect(await seriousViolations(page)).toEqual([]);
      await context.close();
    }
  });

  it("sign-out returns to sign-in and the old session cookie can do nothing", async () => {
    const { context, page } = await freshPage(PHONE);
    await signIn(page, baseUrl, "manager@demo.sward.test");
    await page.waitForURL("**/book");
    const oldCookies = await context.cookies();
    await page.getByRole("button", { name: "Sign out" }).click();
    await page.waitForURL("**/sign-in");
    await page.goto("/book");
    expect(new URL(page.url()).pathname).toBe("/sign-in");

    // Replay the pre-sign-out cookies in a new context: the session row is gone, so 401.
    const replay = await browser.newContext({ baseURL: baseUrl });
    await replay.addCookies(oldCookies);
    const response = await replay.request.get("/api/v1/properties");
    expect(response.status()).toBe(401);
    expect(await response.json()).toEqual({
      error: { code: "unauthenticated", message: "Sign in to continue." },
    });
    await replay.close();
    await context.close();
  });
});

describe("tenancy and scope through the API", () => {
  async function propertyIdsSeenBy(email: string): Promise<Record<string, string>> {
    const { context, page } = await freshPage();
    await signIn(page, baseUrl, email);
    await page.waitForURL((url) => url.pathname !== "/sign-in");
    const items = (
      (await (await page.request.get("/api/v1/properties")).json()) as {
        items: { id: string; name: string }[];
      }
    ).items;
    await context.close();
    return Object.fromEntries(items.map((p) => [p.name, p.id]));
  }

  it("a homeowner asking for another property's API gets 404", async () => {
    const ids = await propertyIdsSeenBy("manager@demo.sward.test");
    const { context, page } = await freshPage();
    await signIn(page, baseUrl, "owner1@demo.sward.test");
    await page.waitForURL("**/my-lawn");
    const own = await page.request.get(`/api/v1/properties/${ids["Oyelaran residence"]}`);
    expect(own.status()).toBe(200);
    expect(((await own.json()) as { zones: unknown[] }).zones).toHaveLength(3);
    const other = await page.request.get(`/api/v1/properties/${ids["Haddad residence"]}`);
    expect(other.status()).toBe(404);
    expect(((await other.json()) as { error: { code: string } }).error.code).toBe("not_found");
    const malformed = await page.request.get("/api/v1/properties/not-a-uuid");
    expect(malformed.status()).toBe(404);
    await context.close();
  });

  it("the other company's manager sees none of the first company's properties", async () => {
    const ids = await propertyIdsSeenBy("manager@demo.sward.test");
    const { context, page } = await freshPage();
    await signIn(page, baseUrl, "manager@other.sward.test");
    await page.waitForURL("**/book");
    for (const id of Object.values(ids)) {
      expect((await page.request.get(`/api/v1/properties/${id}`)).status()).toBe(404);
      const html = await page.goto(`/properties/${id}`);
      expect(html?.status()).toBe(404);
    }
    const me = (await (await page.request.get("/api/v1/me")).json()) as {
      email: string;
      role: string;
    };
    expect(me).toMatchObject({ email: "manager@other.sward.test", role: "manager" });
    await context.close();
  });

  it("anonymous API calls get 401 JSON, never a page or a stack trace", async () => {
    for (const path of [
      "/api/v1/me",
      "/api/v1/properties",
      "/api/v1/properties/00000000-0000-4000-8000-000000000000",
    ]) {
      const response = await fetch(`${baseUrl}${path}`);
      expect(response.status).toBe(401);
      expect(response.headers.get("content-type")).toContain("application/json");
      const body = await response.text();
      expect(body).not.toMatch(/at \w+ \(|node_modules|stack/i);
    }
  });
});
