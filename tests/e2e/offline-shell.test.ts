// The installable field app with no signal (app/sw.ts, components/pwa/): on a phone-sized
// Chromium, a technician opens Today with a signal and waits for "Ready offline"; with the network
// cut, Today, a stop's visit page and a zone of it still open from what the phone kept, and an
// office page shows the offline page. The manifest is linked and its icons served; signing out
// (or another person signing in) deletes the kept field data; a new service worker version
// offers "Reload".
import type { Browser, BrowserContext, Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser, PHONE, signIn } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { snap } from "../helpers/screenshots";

const baseUrl = inject("baseUrl");
let browser: Browser;
beforeAll(async () => {
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

const FIELD_CACHE = /^sward-field-/;

const newPhone = () =>
  browser.newContext({ viewport: PHONE, baseURL: baseUrl, serviceWorkers: "allow" });

async function cacheNames(page: Page): Promise<string[]> {
  return page.evaluate(() => caches.keys());
}

/** Every address kept in the field caches (pathname + search). */
async function keptUrls(page: Page): Promise<string[]> {
  return page.evaluate(async () => {
    const out: string[] = [];
    for (const name of await caches.keys()) {
      if (!name.startsWith("sward-field-")) continue;
      const cache = await caches.open(name);
      for (const req of await cache.keys()) {
        const u = new URL(req.url);
        out.push(u.pathname + u.search);
      }
    }
    return out;
  });
}

const READY = /^Ready offline — \d+ stops?, saved \d{1,2}:\d{2} [AP]M$/;

/** Waits for Today's save-ahead to end in "Ready offline"; a save that ends otherwise fails the
 * test at once with what the status said (not after the whole wait). */
async function waitReady(page: Page, timeout = 90_000): Promise<void> {
  const settled = page.locator('[data-offline-status]:not([data-offline-status="working"])');
  await settled.waitFor({ timeout });
  const text = (await settled.locator("p").textContent())?.trim() ?? "";
  expect(text, "Today's offline status").toMatch(READY);
}

async function signInReady(context: BrowserContext, email: string): Promise<Page> {
  const page = await context.newPage();
  await signIn(page, baseUrl, email, ownPassword);
  await page.waitForURL("**/today");
  await waitReady(page);
  return page;
}

// A company of the suite's own, seeded from the demo scenario: the suites before this one start,
// finish and skip the demo's stops in the shared e2e database, and a finished stop's page has no
// zones to open.
let own: TestCompany;
let ownPassword: string;
beforeAll(async () => {
  useE2eDatabase();
  const { createTestCompany, TEST_PASSWORD } = await import("../helpers/factories");
  own = await createTestCompany();
  ownPassword = TEST_PASSWORD;
}, 120_000);

describe("the field app with no signal", () => {
  it(
    "Today, a stop and a zone open offline; an office page shows the offline page",
    { timeout: 150_000 },
    async () => {
      const context = await newPhone();
      const page = await signInReady(context, own.emails["tech1"]!);
      const stopLinks = page.getByRole("list", { name: "Stops" }).getByRole("link");
      const stopCount = await stopLinks.count();
      expect(stopCount).toBeGreaterThan(0);
      const href = (await stopLinks.first().getAttribute("href"))!;
      const visitId = href.split("/").pop()!;
      const visit = await page.evaluate(async (id) => {
        const res = await fetch(`/api/v1/visits/${id}`);
        return (await res.json()) as {
          propertyName: string;
          zones: { id: string; name: string }[];
        };
      }, visitId);
      expect(await cacheNames(page)).toEqual(
        expect.arrayContaining(["sward-field-pages", "sward-field-data"]),
      );
      expect(await keptUrls(page)).toEqual(
        expect.arrayContaining(["/today", href, `/api/v1/visits/${visitId}`, "/api/v1/products"]),
      );

      await context.setOffline(true);
      await page.reload();
      await page.getByRole("heading", { level: 1, name: "Today" }).waitFor();
      expect(await stopLinks.count()).toBe(stopCount);
      await page.getByText(/^No signal — working from the copy saved at/).waitFor();

      await stopLinks.first().click();
      await page.waitForURL(`**${href}`);
      await page.getByRole("heading", { level: 1, name: visit.propertyName }).waitFor();
      await page.getByRole("list", { name: "Zones of this visit" }).waitFor();

      const zone = visit.zones[0]!;
      await page.goto(`${href}?zone=${zone.id}`);
      await page.getByRole("heading", { level: 1, name: zone.name }).waitFor();
      await page.getByText(`Zone 1 of ${visit.zones.length}`).waitFor();

      // Not a field page: nothing kept, and the network is gone — the offline page.
      await page.goto("/risk-alerts");
      await page.getByRole("heading", { level: 1, name: "No connection" }).waitFor();
      await page.getByText("What you enter is kept on this phone", { exact: false }).waitFor();

      await context.setOffline(false);
      await context.close();
    },
  );

  it("answers redirects and 404s unchanged and keeps neither", { timeout: 150_000 }, async () => {
    const context = await newPhone();
    const page = await signInReady(context, own.emails["tech1"]!);
    const missing = "/visits/00000000-0000-4000-8000-000000000000";
    const statuses = await page.evaluate(async (path) => {
      const notFound = await fetch(path);
      const api = await fetch(`/api/v1${path}`);
      return [notFound.status, api.status];
    }, missing);
    expect(statuses).toEqual([404, 404]);
    expect((await keptUrls(page)).filter((u) => u.includes(missing.slice(8)))).toEqual([]);
    // Signed out, Today redirects to sign-in through the worker.
    await context.clearCookies();
    await page.goto("/today");
    await page.waitForURL("**/sign-in**");
    await context.close();
  });

  it("serves the manifest with its icons, linked from the page; the worker's script is never cached", async () => {
    const context = await newPhone();
    const page = await context.newPage();
    await page.goto("/sign-in");
    const link = await page.locator('link[rel="manifest"]').getAttribute("href");
    expect(link).toBe("/manifest.webmanifest");
    expect(await page.locator('link[rel="apple-touch-icon"]').count()).toBe(1);
    const res = await page.request.get(link!);
    expect(res.status()).toBe(200);
    const manifest = (await res.json()) as {
      start_url: string;
      display: string;
      icons: { src: string; sizes: string; type: string }[];
    };
    expect(manifest).toMatchObject({ start_url: "/today", display: "standalone" });
    for (const icon of manifest.icons) {
      const r = await page.request.get(icon.src);
      expect(r.status(), icon.src).toBe(200);
      expect(r.headers()["content-type"], icon.src).toBe("image/png");
    }
    const sw = await page.request.get("/serwist/sw.js");
    expect(sw.status()).toBe(200);
    expect(sw.headers()["content-type"]).toMatch(/javascript/);
    expect(sw.headers()["cache-control"]).toBe("no-cache");
    expect(sw.headers()["content-security-policy"]).toContain("connect-src 'self'");
    await context.close();
  });

  it(
    "signing out deletes every kept field response; so does another person signing in",
    { timeout: 150_000 },
    async () => {
      const context = await newPhone();
      const page = await signInReady(context, own.emails["tech1"]!);
      expect((await keptUrls(page)).length).toBeGreaterThan(3);
      await page.evaluate(() => localStorage.setItem("sward:zone-check:x:y", "{}"));
      await page.getByRole("button", { name: "Sign out" }).click();
      await page.waitForURL("**/sign-in**");
      expect((await cacheNames(page)).filter((n) => FIELD_CACHE.test(n))).toEqual([]);
      expect(await page.evaluate(() => localStorage.getItem("sward:zone-check:x:y"))).toBeNull();

      // tech1 again, then tech2 on the same phone without signing out.
      const again = await signInReady(context, own.emails["tech1"]!);
      const tech1Urls = (await keptUrls(again)).filter((u) => u.startsWith("/visits/"));
      expect(tech1Urls.length).toBeGreaterThan(0);
      await context.clearCookies();
      const other = await signInReady(context, own.emails["tech2"]!);
      const kept = await keptUrls(other);
      for (const u of tech1Urls) expect(kept, u).not.toContain(u);
      await context.close();
    },
  );

  it("offers a new version with a Reload button", { timeout: 150_000 }, async () => {
    const context = await newPhone();
    const page = await signInReady(context, own.emails["tech1"]!);
    // A second version of the worker, as after a deploy: the browser installs a worker whose
    // script address changed, and it waits while the current one controls the page.
    await page.evaluate(async () => {
      await navigator.serviceWorker.register("/serwist/sw.js?version=2", { scope: "/" });
    });
    const banner = page.getByRole("status").filter({ hasText: "A new version of Sward is ready" });
    await banner.waitFor({ timeout: 60_000 });
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL)).not.toContain(
      "version=2",
    );
    const reloaded = page.waitForEvent("load");
    await banner.getByRole("button", { name: "Reload" }).click();
    await reloaded;
    await page.getByRole("heading", { level: 1, name: "Today" }).waitFor();
    expect(await page.evaluate(() => navigator.serviceWorker.controller?.scriptURL)).toContain(
      "version=2",
    );
    await context.close();
  });
});

// A day of many stops and stops that fail, on a company of the test's own (its technician's day
// is not the demo's): Today's save-ahead stays within its limits (lib/pwa/save-ahead.ts), ends,
// says which stops it could not keep, and keeps them on "Retry" once they answer.
describe("saving a long day ahead", () => {
  const STOPS = 24;
  let c: TestCompany;

  beforeAll(async () => {
    useE2eDatabase();
    const { createTestCompany } = await import("../helpers/factories");
    const { scheduleVisit } = await import("@/lib/visits/mutations");
    const { todayIn } = await import("@/lib/dates");
    c = await createTestCompany();
    const manager = await c.actor("manager");
    const today = todayIn(manager.companyTimeZone);
    const keys = Object.keys(c.propertyIds);
    for (let i = 0; i < STOPS; i += 1) {
      await scheduleVisit(manager, {
        propertyId: c.propertyIds[keys[i % keys.length]!]!,
        scheduledFor: today,
        technicianId: c.userIds["tech1"]!,
        plannedService: "inspection",
        stopOrder: i + 1,
        notes: "",
        confirmSameDay: true,
      });
    }
  }, 120_000);

  /** tech1 of the test's company on a fresh phone, `script` run in every page before its own. */
  async function techPhone(script?: { fail: string; hang: string }): Promise<Page> {
    const context = await newPhone();
    const cookie = await mintSessionCookie(c.userIds["tech1"]!);
    await context.addCookies([
      { name: SESSION_COOKIE, value: cookie.split("=").slice(1).join("="), url: baseUrl },
    ]);
    // Counts the save-ahead's requests in flight (its own addresses, not the router's ?_rsc=
    // prefetches) and, when asked, fails one stop's page with a 500 and leaves another stop's
    // detail unanswered until the request is given up; `window.__liftFailures` ends both.
    await context.addInitScript((s) => {
      const w = window as unknown as {
        __saveAhead: { now: number; most: number; urls: string[] };
        __liftFailures?: boolean;
      };
      w.__saveAhead = { now: 0, most: 0, urls: [] };
      const original = window.fetch.bind(window);
      const own = /^\/(?:visits\/[0-9a-f-]+$|api\/v1\/(?:visits|photos|products|rule-sets|me)\/?)/;
      window.fetch = (input, init) => {
        const url =
          typeof input === "string" ? input : input instanceof URL ? input.href : input.url;
        const path = new URL(url, location.href);
        const counted = own.test(path.pathname) && !path.search.includes("_rsc");
        if (counted) {
          w.__saveAhead.now += 1;
          w.__saveAhead.most = Math.max(w.__saveAhead.most, w.__saveAhead.now);
          w.__saveAhead.urls.push(path.pathname);
        }
        let answer: Promise<Response>;
        if (s && !w.__liftFailures && path.pathname === `/visits/${s.fail}`) {
          answer = Promise.resolve(new Response("Server error", { status: 500 }));
        } else if (s && !w.__liftFailures && path.pathname === `/api/v1/visits/${s.hang}`) {
          answer = new Promise((_, reject) =>
            init?.signal?.addEventListener("abort", () =>
              reject(new DOMException("The operation was aborted.", "AbortError")),
            ),
          );
        } else answer = original(input, init);
        return counted
          ? answer.finally(() => {
              w.__saveAhead.now -= 1;
            })
          : answer;
      };
    }, script);
    const page = await context.newPage();
    await page.goto("/today");
    return page;
  }

  const dayStops = async (page: Page) =>
    (
      await page.evaluate(
        async () =>
          (await (await fetch("/api/v1/today")).json()) as {
            items: { id: string; propertyName: string }[];
          },
      )
    ).items;

  const seen = (page: Page) =>
    page.evaluate(
      () => (window as unknown as { __saveAhead: { most: number; urls: string[] } }).__saveAhead,
    );

  it(
    `saves a day of ${STOPS} stops, a few requests at a time, and says so`,
    { timeout: 150_000 },
    async () => {
      const page = await techPhone();
      await waitReady(page);
      const stops = await dayStops(page);
      // The demo's own stops of the day and the test's.
      expect(stops.length).toBeGreaterThanOrEqual(STOPS);
      await page.getByText(`Ready offline — ${stops.length} stops, saved`).waitFor();
      const kept = await keptUrls(page);
      for (const s of stops) {
        expect(kept, s.id).toContain(`/visits/${s.id}`);
        expect(kept, s.id).toContain(`/api/v1/visits/${s.id}`);
      }
      const { most, urls } = await seen(page);
      // lib/pwa/save-ahead.ts: SAVE_AHEAD_LIMITS.concurrency = 3.
      expect(most).toBeGreaterThan(0);
      expect(most).toBeLessThanOrEqual(3);
      // Each stop's page and detail once; the managers' audit trail never.
      for (const s of stops) expect(urls.filter((u) => u === `/visits/${s.id}`)).toHaveLength(1);
      expect(urls.filter((u) => u.endsWith("/audit"))).toEqual([]);

      // Back on Today a moment later with the same stops: nothing fetched again.
      const before = urls.length;
      await page.reload();
      await waitReady(page);
      expect((await seen(page)).urls).toEqual([]); // only the list, to compare the stops
      expect(before).toBeGreaterThan(STOPS * 2);
      await page.context().close();
    },
  );

  it(
    "a stop whose page fails and one that never answers: the rest are saved, the two are named, Retry keeps them",
    { timeout: 150_000 },
    async () => {
      // Two stops at different properties (the list is read on a phone with no failures).
      const probe = await techPhone();
      await waitReady(probe);
      const stops = await dayStops(probe);
      await probe.context().close();
      const byName = new Map(stops.map((s) => [s.propertyName, s]));
      const [failing, hanging] = [...byName.values()] as [
        (typeof stops)[number],
        (typeof stops)[number],
      ];
      const page = await techPhone({ fail: failing.id, hang: hanging.id });
      const status = page.locator('[data-offline-status]:not([data-offline-status="working"])');
      await status.waitFor({ timeout: 90_000 });
      const text = (await status.locator("p").textContent())?.trim() ?? "";
      expect(text).toMatch(
        new RegExp(
          `^${stops.length - 2} of ${stops.length} stops ready offline, saved \\d{1,2}:\\d{2} [AP]M — 2 could not be saved: `,
        ),
      );
      expect(text).toContain(failing.propertyName);
      expect(text).toContain(hanging.propertyName);
      const kept = await keptUrls(page);
      expect(kept).not.toContain(`/visits/${failing.id}`);
      expect(kept).not.toContain(`/api/v1/visits/${hanging.id}`);
      expect((await seen(page)).most).toBeLessThanOrEqual(3);
      await snap(page, "offline-partial-phone");

      // The signal is back: Retry saves the two.
      await page.evaluate(() => {
        (window as unknown as { __liftFailures: boolean }).__liftFailures = true;
      });
      await status.getByRole("button", { name: "Retry" }).click();
      await page
        .getByText(`Ready offline — ${stops.length} stops, saved`)
        .waitFor({ timeout: 90_000 });
      expect(await keptUrls(page)).toEqual(
        expect.arrayContaining([`/visits/${failing.id}`, `/api/v1/visits/${hanging.id}`]),
      );
      await page.context().close();
    },
  );
});
