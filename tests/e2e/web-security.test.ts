// Findings of a tester's pass from outside, against the production server: open redirects through
// ?callbackUrl=, sign-in links on a host the request named, a sign-in-link answer whose timing
// told homeowners' addresses apart, a homeowner removed from every property still signing in, and
// sign-in throttles that trusted X-Forwarded-For (requests here come from several loopback
// addresses, 127.0.0.3–5, as separate machines would).
import { request as httpRequest, type IncomingHttpHeaders } from "node:http";
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, describe, expect, inject, it } from "vitest";

import { readInbox } from "@/lib/mail/inbox-folder";

import { launchBrowser, signIn } from "../helpers/browser";
import { mintSessionCookie, useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { passwordSignIn } from "../helpers/password-sign-in";

const BASE = inject("baseUrl");
const ORIGIN = new URL(BASE).origin;
const mailDir = inject("mailDir");
let browser: Browser;
let c: TestCompany;
let db: ReturnType<(typeof import("../helpers/factories"))["testDb"]>;
let password = "";

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  db = factories.testDb();
  password = factories.TEST_PASSWORD;
  c = await factories.createTestCompany();
  browser = await launchBrowser();
});
afterAll(async () => {
  await browser?.close();
});

// Raw query strings, as a tester types them: Next decodes them once before the page sees them.
const REDIRECT_PAYLOADS = [
  "/%09/evil.example/phish",
  "/%09%5Cevil.example/phish",
  "/%5C%09evil.example",
  "/%0A/x",
  "/%0D/x",
  "/%00/x",
  "/%0C/x",
  "/%E2%80%A8/x",
  "/%E2%80%A9/x",
  "%2F%2Fevil.example",
  "/%5Cevil.example",
  "/.//evil.example",
  "/%2e%2e//evil.example",
  "https%3A%2F%2Fevil.example%2F",
  "%2F%09%2Fevil.example",
  "//user@evil.example",
  "/%EF%BC%8F/evil.example",
  "javascript:alert(1)",
  "/my-lawn", // an ordinary one: kept
];

describe("redirects after sign-in (?callbackUrl=)", () => {
  it(`a signed-in homeowner is never sent to another host, and no payload answers 5xx (${REDIRECT_PAYLOADS.length} payloads)`, async () => {
    const cookie = await mintSessionCookie(c.userIds.owner1!);
    for (const payload of REDIRECT_PAYLOADS) {
      const res = await fetch(`${BASE}/sign-in?callbackUrl=${payload}`, {
        headers: { cookie },
        redirect: "manual",
      });
      await res.arrayBuffer();
      expect(res.status, payload).toBeLessThan(500);
      expect([303, 307, 308], payload).toContain(res.status);
      const location = res.headers.get("location") ?? "";
      expect(new URL(location, `${BASE}/sign-in`).origin, `${payload} → ${location}`).toBe(ORIGIN);
      expect(location, payload).not.toMatch(/[\u0000-\u001f\u007f\\]/);
    }
    const kept = await fetch(`${BASE}/sign-in?callbackUrl=/my-lawn`, {
      headers: { cookie },
      redirect: "manual",
    });
    expect(new URL(kept.headers.get("location")!, BASE).pathname).toBe("/my-lawn");
  });

  it("signing in from a hostile link lands on this site (Chromium follows the redirects)", async () => {
    const context = await browser.newContext();
    const page = await context.newPage();
    try {
      await page.goto(`${BASE}/sign-in?callbackUrl=/%09/evil.example/phish`);
      await signIn(page, BASE, c.emails.tech1!, password);
      // The refused target falls back to "/", which sends a technician on to /today.
      await page.waitForURL((u) => u.pathname === "/today" || u.origin !== ORIGIN, {
        timeout: 15_000,
      });
      expect(new URL(page.url()).origin).toBe(ORIGIN);
      expect(new URL(page.url()).pathname).toBe("/today");
    } finally {
      await context.close();
    }
  });
});

/** The link form's server-action request, captured once from Chromium and replayable with fetch. */
interface CapturedAction {
  url: string;
  headers: Record<string, string>;
  body: string;
  email: string;
}

async function captureLinkRequest(email: string): Promise<CapturedAction> {
  const context = await browser.newContext();
  const page = await context.newPage();
  try {
    await page.goto(`${BASE}/sign-in`);
    const posted = page.waitForRequest(
      (r) => r.method() === "POST" && Boolean(r.headers()["next-action"]),
    );
    await page.getByLabel("Your e-mail address").fill(email);
    await page.getByRole("button", { name: "E-mail me a sign-in link" }).click();
    const request = await posted;
    await request.response();
    const headers = await request.allHeaders();
    const keep = ["content-type", "next-action", "next-router-state-tree", "accept", "origin"];
    return {
      url: request.url(),
      headers: Object.fromEntries(keep.filter((k) => headers[k]).map((k) => [k, headers[k]!])),
      body: request.postData() ?? "",
      email,
    };
  } finally {
    await context.close();
  }
}

function replay(action: CapturedAction, email: string, extra: Record<string, string> = {}) {
  return fetch(action.url, {
    method: "POST",
    headers: { ...action.headers, ...extra },
    body: action.body.split(action.email).join(email),
  });
}

async function forgetLinkRequests(): Promise<void> {
  await db.deleteFrom("sign_in_link_requests").execute();
}

async function waitForLinkMail(to: string, since: number) {
  for (let i = 0; i < 80; i++) {
    const found = (await readInbox(mailDir))
      .filter((m) => m.to.includes(to) && /sign-in link/.test(m.subject))
      .filter((m) => Date.parse(m.receivedAt) >= since)
      .at(-1);
    if (found) return found;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`no sign-in link reached ${to}`);
}

describe("asking for a sign-in link", () => {
  let action: CapturedAction;
  beforeAll(async () => {
    await forgetLinkRequests();
    action = await captureLinkRequest("nobody-at-all@nowhere.sward.test");
  });

  it("a forged X-Forwarded-Host (with a matching Origin, as a script sends) does not move the link off this site", async () => {
    await forgetLinkRequests();
    const since = Date.now() - 1000;
    const res = await replay(action, c.emails.owner2!, {
      "x-forwarded-host": "evil.example",
      "x-forwarded-proto": "https",
      origin: "https://evil.example",
      host: "evil.example",
    });
    await res.arrayBuffer();
    // The site is AUTH_URL's origin (lib/http/origin.ts), not the Host the request names: refused
    // as cross-site, and no link is sent at all.
    expect(res.status).toBe(403);
    await new Promise((r) => setTimeout(r, 1500));
    expect(
      (await readInbox(mailDir)).filter(
        (m) => m.to.includes(c.emails.owner2!) && Date.parse(m.receivedAt) >= since,
      ),
    ).toHaveLength(0);
    // The same request from this site gets its link, on this site.
    await forgetLinkRequests();
    const since2 = Date.now() - 1000;
    const ok = await replay(action, c.emails.owner2!);
    expect(ok.status).toBe(200);
    const mail = await waitForLinkMail(c.emails.owner2!, since2);
    expect(new URL(mail.text.match(/https?:\/\/[^\s]+/)![0]).origin).toBe(ORIGIN);
  });

  it("answers a homeowner's address and an unknown one in the same time (median of interleaved pairs)", async () => {
    const PAIRS = 15;
    const known: number[] = [];
    const unknown: number[] = [];
    const time = async (email: string) => {
      await forgetLinkRequests();
      const t0 = performance.now();
      const res = await replay(action, email);
      await res.arrayBuffer();
      const ms = performance.now() - t0;
      expect(res.status).toBe(200);
      await new Promise((r) => setTimeout(r, 600)); // the queued work finishes before the next request
      return ms;
    };
    await time("warm-up@nowhere.sward.test");
    for (let i = 0; i < PAIRS; i++) {
      const owner = [c.emails.owner1!, c.emails.owner2!, c.emails.owner3!][i % 3]!;
      if (i % 2) {
        known.push(await time(owner));
        unknown.push(await time(`nobody-${i}@nowhere.sward.test`));
      } else {
        unknown.push(await time(`nobody-${i}@nowhere.sward.test`));
        known.push(await time(owner));
      }
    }
    const median = (xs: number[]) => [...xs].sort((a, b) => a - b)[Math.floor(xs.length / 2)]!;
    const diff = median(known) - median(unknown);
    console.log(
      `sign-in link answer: homeowner median ${median(known).toFixed(1)} ms, unknown ${median(unknown).toFixed(1)} ms (${PAIRS} pairs)`,
    );
    // Before the work was queued the difference was ~70 ms (the token and its e-mail written
    // before answering); now both answers do the same work. The margin allows for a loaded
    // 2-core machine (a +33 ms difference was seen once under four parallel builds).
    expect(Math.abs(diff)).toBeLessThan(40);
    await forgetLinkRequests();
  }, 90_000);
});

describe("a homeowner removed from every property", () => {
  it("can no longer sign in, and the session they had stops working", async () => {
    const owner = c.userIds.owner3!;
    const cookie = await mintSessionCookie(owner);
    expect((await fetch(`${BASE}/api/v1/me`, { headers: { cookie } })).status).toBe(200);
    expect((await passwordSignIn(BASE, c.emails.owner3!, password)).sessionToken).not.toBe("");

    const manager = await mintSessionCookie(c.userIds.manager!);
    const links = await db
      .selectFrom("property_homeowners")
      .select("property_id")
      .where("user_id", "=", owner)
      .execute();
    expect(links.length).toBeGreaterThan(0);
    for (const { property_id } of links) {
      const res = await fetch(`${BASE}/api/v1/properties/${property_id}/homeowners/${owner}`, {
        method: "DELETE",
        headers: { cookie: manager, origin: ORIGIN },
      });
      expect(res.status).toBe(200);
    }
    expect((await passwordSignIn(BASE, c.emails.owner3!, password)).sessionToken).toBe("");
    expect((await fetch(`${BASE}/api/v1/me`, { headers: { cookie } })).status).toBe(401);
  });
});

// ── Throttles: client addresses come from the socket, not from X-Forwarded-For ────────────────
/** A password sign-in over plain node:http from a chosen loopback source address (a second "machine"). */
async function signInFrom(
  localAddress: string,
  email: string,
  pw: string,
  extraHeaders: Record<string, string> = {},
): Promise<{ ok: boolean; throttled: boolean }> {
  const send = (
    method: string,
    path: string,
    headers: Record<string, string>,
    body?: string,
  ): Promise<{ status: number; headers: IncomingHttpHeaders; text: string }> =>
    new Promise((resolve, reject) => {
      const url = new URL(path, BASE);
      const req = httpRequest(
        {
          host: "127.0.0.1",
          port: url.port,
          path: url.pathname + url.search,
          method,
          localAddress,
          headers: { host: url.host, ...headers },
        },
        (res) => {
          let text = "";
          res.setEncoding("utf8");
          res.on("data", (d: string) => (text += d));
          res.on("end", () => resolve({ status: res.statusCode ?? 0, headers: res.headers, text }));
        },
      );
      req.on("error", reject);
      req.end(body);
    });
  const csrf = await send("GET", "/api/auth/csrf", extraHeaders);
  const jar = (csrf.headers["set-cookie"] ?? []).map((c) => c.split(";")[0]).join("; ");
  const { csrfToken } = JSON.parse(csrf.text) as { csrfToken: string };
  const res = await send(
    "POST",
    "/api/auth/callback/credentials",
    {
      ...extraHeaders,
      "content-type": "application/x-www-form-urlencoded",
      cookie: jar,
      origin: ORIGIN,
    },
    new URLSearchParams({ csrfToken, email, password: pw, callbackUrl: "/" }).toString(),
  );
  const cookies = res.headers["set-cookie"] ?? [];
  const location = String(res.headers.location ?? "");
  return {
    ok: cookies.some((c) => /authjs\.session-token=[^;]+/.test(c)),
    throttled: /code=throttled/.test(location),
  };
}

describe("sign-in throttles and lock-outs", () => {
  it("24 wrong passwords, each with a new X-Forwarded-For, are counted against the real address", async () => {
    const results = [];
    for (let i = 0; i < 24; i++)
      results.push(
        await signInFrom("127.0.0.3", `spray-${i}@nowhere.sward.test`, "wrong-password-123", {
          "x-forwarded-for": `203.0.113.${i + 1}`,
        }),
      );
    const throttled = results.filter((r) => r.throttled).length;
    console.log(`24 wrong passwords from new X-Forwarded-For values: ${throttled} throttled`);
    // Allowed per address: 20 (SIGN_IN_MAX_PER_ADDRESS); the rest are refused.
    expect(throttled).toBe(4);
  });

  it("five wrong passwords from spoofed addresses do not lock the technician out", async () => {
    for (let i = 0; i < 6; i++)
      await signInFrom("127.0.0.4", c.emails.tech2!, "wrong-password-123", {
        "x-forwarded-for": `198.51.100.${i + 10}`,
      });
    // The guesser's own address is locked out of that account…
    const guesser = await signInFrom("127.0.0.4", c.emails.tech2!, password);
    expect(guesser).toEqual({ ok: false, throttled: true });
    // …the technician, from their own address, signs in.
    const owner = await signInFrom("127.0.0.5", c.emails.tech2!, password);
    expect(owner).toEqual({ ok: true, throttled: false });
  });
});
