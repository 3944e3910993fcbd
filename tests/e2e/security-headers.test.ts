// The security headers of every page type, against the production server (lib/http/security-headers.ts,
// proxy.ts, next.config.ts): a Content-Security-Policy whose script nonce is fresh per response and
// is on every <script> Next writes, Permissions-Policy and the rest; and in Chromium each page runs
// with no policy violation and hydrates (Next's client runtime is up).
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { launchBrowser } from "../helpers/browser";
import { mintSessionCookie, SESSION_COOKIE, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";

const BASE = inject("baseUrl");
let c: TestCompany;
let browser: Browser;
const cookies: Record<string, string> = {};

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  c = await factories.createTestCompany();
  for (const who of ["manager", "tech1", "owner1"])
    cookies[who] = await mintSessionCookie(c.userIds[who]!);
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

/** Headers every response carries, whatever it is. */
const COMMON: Record<string, RegExp> = {
  "x-content-type-options": /^nosniff$/,
  "referrer-policy": /^same-origin$/,
  "x-frame-options": /^DENY$/,
  "permissions-policy": /geolocation=\(self\).*microphone=\(\).*payment=\(\)/,
  "cross-origin-opener-policy": /^same-origin$/,
  "cross-origin-resource-policy": /^same-origin$/,
  "x-permitted-cross-domain-policies": /^none$/,
};

/** Directives a page's policy must hold (script-src is checked with its nonce below). */
const PAGE_DIRECTIVES = [
  "default-src 'self'",
  "object-src 'none'",
  "base-uri 'none'",
  "form-action 'self'",
  "frame-ancestors 'none'",
];

interface PageType {
  name: string;
  path: () => string;
  who?: string;
}

const PAGES: PageType[] = [
  { name: "sign-in (signed out)", path: () => "/sign-in" },
  { name: "sign-in link confirmation", path: () => "/sign-in/link?token=t&email=a%40b.test" },
  { name: "manager: book", path: () => "/book", who: "manager" },
  {
    name: "manager: property",
    path: () => `/properties/${c.propertyIds["oyelaran"]}`,
    who: "manager",
  },
  { name: "manager: development inbox", path: () => "/dev/mail", who: "manager" },
  { name: "technician: today", path: () => "/today", who: "tech1" },
  { name: "technician: risk alerts", path: () => "/risk-alerts", who: "tech1" },
  { name: "homeowner: my lawn", path: () => "/my-lawn", who: "owner1" },
  { name: "not found", path: () => "/no-such-page", who: "manager" },
];

let headersChecked = 0;

describe("headers of every page type", () => {
  it.each(PAGES)(
    "$name: policy with a fresh nonce on every script, and the common headers",
    async (p) => {
      const get = () =>
        fetch(`${BASE}${p.path()}`, {
          headers: p.who ? { cookie: cookies[p.who]! } : {},
          redirect: "manual",
        });
      const [a, b] = [await get(), await get()];
      expect(a.status, p.name).toBeLessThan(400 + (p.name === "not found" ? 5 : 0));
      const html = await a.text();
      await b.arrayBuffer();
      for (const [name, pattern] of Object.entries(COMMON)) {
        expect(a.headers.get(name), `${p.name}: ${name}`).toMatch(pattern);
        headersChecked++;
      }
      const csp = a.headers.get("content-security-policy") ?? "";
      for (const d of PAGE_DIRECTIVES) expect(csp, `${p.name}: ${d}`).toContain(d);
      const nonce = /script-src 'self' 'nonce-([A-Za-z0-9+/=]+)' 'strict-dynamic'/.exec(csp)?.[1];
      expect(nonce, `${p.name}: script-src with a nonce, got ${csp}`).toBeTruthy();
      expect(csp).not.toMatch(/script-src[^;]*'unsafe-inline'/);
      expect(csp).not.toMatch(/script-src[^;]*'unsafe-eval'/);
      headersChecked++;
      // Fresh per response.
      const other = /'nonce-([^']+)'/.exec(b.headers.get("content-security-policy") ?? "")?.[1];
      expect(other).toBeTruthy();
      expect(other).not.toBe(nonce);
      // Every script tag Next wrote carries this response's nonce.
      const scripts = [...html.matchAll(/<script\b[^>]*>/g)].map((m) => m[0]);
      expect(scripts.length, p.name).toBeGreaterThan(0);
      for (const tag of scripts) expect(tag, p.name).toContain(`nonce="${nonce}"`);
    },
  );

  it("JSON, an error, a redirect and a static file: a policy under which nothing runs, and the common headers", async () => {
    const html = await (await fetch(`${BASE}/sign-in`)).text();
    const chunk = /src="(\/_next\/static\/[^"]+\.js)"/.exec(html)?.[1];
    expect(chunk).toBeTruthy();
    const responses: [string, Response][] = [
      ["JSON", await fetch(`${BASE}/api/v1/me`, { headers: { cookie: cookies.manager! } })],
      ["JSON 401", await fetch(`${BASE}/api/v1/me`)],
      ["CSV", await fetch(`${BASE}/api/v1/book/export`, { headers: { cookie: cookies.manager! } })],
      ["static script", await fetch(`${BASE}${chunk}`)],
    ];
    for (const [name, res] of responses) {
      await res.arrayBuffer();
      for (const [h, pattern] of Object.entries(COMMON)) {
        expect(res.headers.get(h), `${name}: ${h}`).toMatch(pattern);
        headersChecked++;
      }
      expect(res.headers.get("content-security-policy"), name).toBe(
        "default-src 'none'; frame-ancestors 'none'",
      );
      headersChecked++;
    }
    const redirect = await fetch(`${BASE}/`, { redirect: "manual" });
    expect([303, 307, 308]).toContain(redirect.status);
    for (const [h, pattern] of Object.entries(COMMON)) {
      expect(redirect.headers.get(h), `redirect: ${h}`).toMatch(pattern);
      headersChecked++;
    }
    console.log(
      `security headers: ${PAGES.length} page types × ${Object.keys(COMMON).length + 1} headers, plus JSON, JSON error, CSV, static script and redirect; ${headersChecked} header checks`,
    );
  });
});

describe("in Chromium, under that policy", () => {
  it.each(PAGES)("$name: no policy violation, and the page's scripts run", async (p) => {
    const context = await browser.newContext();
    if (p.who)
      await context.addCookies([
        {
          name: SESSION_COOKIE,
          value: cookies[p.who]!.slice(SESSION_COOKIE.length + 1),
          url: BASE,
        },
      ]);
    const page = await context.newPage();
    const violations: string[] = [];
    page.on("console", (m) => {
      if (/Content Security Policy|Refused to (execute|load|apply)/i.test(m.text()))
        violations.push(m.text());
    });
    try {
      await page.addInitScript(() => {
        document.addEventListener("securitypolicyviolation", (e) => {
          console.error(
            `Content Security Policy violation: ${e.violatedDirective} ${e.blockedURI}`,
          );
        });
      });
      await page.goto(`${BASE}${p.path()}`, { waitUntil: "networkidle" });
      // React has hydrated: Next's router is on the window only once its scripts ran.
      await page.waitForFunction(() => "next" in window, undefined, { timeout: 15_000 });
      expect(violations, `${p.name}: ${violations.join("\n")}`).toEqual([]);
    } finally {
      await context.close();
    }
  });
});
