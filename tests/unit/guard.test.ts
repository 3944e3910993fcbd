// The guard that builds every route handler and server action: authentication, role, input
// parsing, origin checks, and error bodies that never carry a stack trace.
import fc from "fast-check";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";
import { z } from "zod";

import type { Actor } from "@/lib/auth/actor";
import { createGuards } from "@/lib/auth/guard";
import { AppError } from "@/lib/http/app-error";
import { isSameSiteWrite, siteOrigins } from "@/lib/http/origin";

const manager: Actor = {
  userId: "u1",
  companyId: "c1",
  companyName: "Co",
  companyTimeZone: "America/New_York",
  companyLocale: "en-US",
  role: "manager",
  email: "m@x.test",
  name: "M",
  sessionId: "s",
};
const homeowner: Actor = { ...manager, userId: "u2", role: "homeowner" };

// The configured site (AUTH_URL) of these tests; the guard reads process.env.
const SITE = "https://lawns.example.com";
beforeAll(() => {
  vi.stubEnv("AUTH_URL", SITE);
});
afterAll(() => {
  vi.unstubAllEnvs();
});

function guardsFor(actor: Actor | null) {
  return createGuards(async () => actor);
}

const ok = async () => ({ fine: true });

describe("route()", () => {
  it("401 without an actor, 403 for a role not allowed, 200 otherwise", async () => {
    const spec = { access: ["manager"] as const };
    expect((await guardsFor(null).route(spec, ok)(new Request("http://h/x"))).status).toBe(401);
    expect((await guardsFor(homeowner).route(spec, ok)(new Request("http://h/x"))).status).toBe(
      403,
    );
    const res = await guardsFor(manager).route(spec, ok)(new Request("http://h/x"));
    expect(res.status).toBe(200);
    expect(await res.json()).toEqual({ fine: true });
  });

  it("a malformed path parameter is 404, like any record out of scope", async () => {
    const handler = guardsFor(manager).route(
      { access: ["manager"], params: z.object({ id: z.uuid() }), resource: "That zone" },
      ok,
    );
    const res = await handler(new Request("http://h/x"), {
      params: Promise.resolve({ id: "1; drop table users" }),
    });
    expect(res.status).toBe(404);
    expect(await res.json()).toEqual({
      error: { code: "not_found", message: "That zone was not found." },
    });
  });

  it("422 with field errors for a bad query or body; 422 for a body that is not JSON", async () => {
    const g = guardsFor(manager);
    const byQuery = g.route(
      { access: ["manager"], query: z.object({ page: z.coerce.number().int().min(1) }) },
      ok,
    );
    const q = await byQuery(new Request("http://h/x?page=zero"));
    expect(q.status).toBe(422);
    expect(
      ((await q.json()) as { error: { fieldErrors: Record<string, string[]> } }).error.fieldErrors
        .page,
    ).toBeDefined();

    const byBody = g.route(
      { access: ["manager"], body: z.object({ name: z.string().min(1) }) },
      ok,
    );
    const post = (body: string) =>
      new Request("http://h/x", {
        method: "POST",
        body,
        headers: { origin: SITE, host: "h" },
      });
    expect((await byBody(post('{"name":""}'))).status).toBe(422);
    expect((await byBody(post("{not json"))).status).toBe(422);
    expect((await byBody(post('{"name":"Front lawn"}'))).status).toBe(200);
  });

  it("refuses cross-site and origin-less mutations", async () => {
    const handler = guardsFor(manager).route({ access: ["manager"] }, ok);
    const post = (headers: Record<string, string>) =>
      handler(new Request("http://h/x", { method: "POST", headers }));
    expect((await post({ origin: "https://elsewhere.test", host: "h" })).status).toBe(403);
    expect((await post({ host: "h" })).status).toBe(403);
    // Origin "null" (sandboxed frames, some redirects) and unparsable origins are refused, not a 500.
    for (const origin of ["null", "::not a url", "http://", "file://"])
      expect((await post({ origin, host: "h" })).status).toBe(403);
    expect((await post({ origin: SITE, host: "h", "sec-fetch-site": "cross-site" })).status).toBe(
      403,
    );
    expect((await post({ origin: SITE, host: "h", "sec-fetch-site": "same-origin" })).status).toBe(
      200,
    );
  });

  it("the site is AUTH_URL's origin: a forged Host or X-Forwarded-Host that matches the Origin is refused", async () => {
    const handler = guardsFor(manager).route({ access: ["manager"] }, ok);
    const post = (headers: Record<string, string>) =>
      handler(new Request("http://h/x", { method: "POST", headers }));
    // What a script sends to make the old Host comparison pass.
    expect((await post({ origin: "https://evil.example", host: "evil.example" })).status).toBe(403);
    expect(
      (
        await post({
          origin: "https://evil.example",
          host: "lawns.example.com",
          "x-forwarded-host": "evil.example",
        })
      ).status,
    ).toBe(403);
    // Same scheme and host but another port or scheme is another origin (RFC 6454 §4).
    expect((await post({ origin: "https://lawns.example.com:8443" })).status).toBe(403);
    expect((await post({ origin: "http://lawns.example.com" })).status).toBe(403);
    // The configured origin is accepted whatever Host says.
    expect((await post({ origin: SITE, host: "evil.example" })).status).toBe(200);
    expect((await post({ origin: SITE, "x-forwarded-host": "evil.example" })).status).toBe(200);
  });
});

describe("siteOrigins / isSameSiteWrite", () => {
  const headers = (origin: string, more: Record<string, string> = {}) =>
    new Headers({ origin, ...more });

  it("production: only AUTH_URL's origin; loopback addresses are not the site", () => {
    const env = {
      NODE_ENV: "production",
      AUTH_URL: "https://lawns.example.com/app/",
      PORT: "3000",
    };
    expect([...siteOrigins(env)]).toEqual(["https://lawns.example.com"]);
    expect(isSameSiteWrite(headers("https://lawns.example.com"), env)).toBe(true);
    expect(isSameSiteWrite(headers("http://localhost:3000"), env)).toBe(false);
    expect(isSameSiteWrite(headers("http://127.0.0.1:3000"), env)).toBe(false);
    // No AUTH_URL in production (the server refuses to start so): nothing is same-site.
    expect(isSameSiteWrite(headers("http://localhost:3000"), { NODE_ENV: "production" })).toBe(
      false,
    );
  });

  it("development and tests: also the loopback origins on the port the server was started on", () => {
    const env = { NODE_ENV: "development", PORT: "3120" };
    for (const origin of ["http://localhost:3120", "http://127.0.0.1:3120", "http://[::1]:3120"])
      expect(isSameSiteWrite(headers(origin, { host: "evil.example" }), env)).toBe(true);
    for (const origin of [
      "http://localhost:3000",
      "https://localhost:3120",
      "http://evil.example:3120",
      "http://localhost.evil.example:3120",
    ])
      expect(isSameSiteWrite(headers(origin, { host: new URL(origin).host }), env)).toBe(false);
    // Forged forwarding headers change nothing.
    expect(
      isSameSiteWrite(
        headers("http://evil.example", {
          host: "evil.example",
          "x-forwarded-host": "evil.example",
        }),
        env,
      ),
    ).toBe(false);
  });

  it("an unexpected failure is a 500 with a plain message: no stack, no SQL, whatever was thrown", async () => {
    await fc.assert(
      fc.asyncProperty(fc.string(), async (secret) => {
        const handler = guardsFor(manager).route({ access: ["manager"] }, async () => {
          throw new Error(`relation "users" does not exist ${secret}`);
        });
        const res = await handler(new Request("http://h/x"));
        const text = await res.text();
        expect(res.status).toBe(500);
        expect(text).not.toContain("relation");
        expect(text).not.toContain("at ");
        expect(JSON.parse(text).error.code).toBe("internal");
      }),
      { numRuns: 50 },
    );
  });

  it("AppErrors map to their status", async () => {
    const cases = [
      ["not_found", 404],
      ["forbidden", 403],
      ["invalid_input", 422],
      ["conflict", 409],
      ["rate_limited", 429],
    ] as const;
    for (const [code, status] of cases) {
      const handler = guardsFor(manager).route({ access: ["manager"] }, async () => {
        throw new AppError(code, "Plain words.");
      });
      const res = await handler(new Request("http://h/x"));
      expect(res.status).toBe(status);
      expect(await res.json()).toEqual({ error: { code, message: "Plain words." } });
    }
  });
});

describe("action()", () => {
  const schema = z.object({ name: z.string().trim().min(1, "Name the zone.") });

  it("parses FormData and plain objects, and returns typed failures", async () => {
    const g = guardsFor(manager);
    const act = g.action({ access: ["manager"], input: schema }, async ({ input }) =>
      input.name.toUpperCase(),
    );
    const form = new FormData();
    form.set("name", " back yard ");
    expect(await act(form)).toEqual({ ok: true, data: "BACK YARD" });
    expect(await act({ name: "" })).toEqual({
      ok: false,
      error: {
        code: "invalid_input",
        message: "Some values need attention.",
        fieldErrors: { name: ["Name the zone."] },
      },
    });
  });

  it("checks the role before running the body", async () => {
    let ran = false;
    const act = guardsFor(homeowner).action(
      { access: ["manager", "technician"], input: schema },
      async () => {
        ran = true;
      },
    );
    expect(await act({ name: "x" })).toMatchObject({ ok: false, error: { code: "forbidden" } });
    expect(ran).toBe(false);
  });

  it("public actions run without an actor", async () => {
    const act = guardsFor(null).action(
      { access: "public", input: schema },
      async ({ actor }) => actor,
    );
    expect(await act({ name: "x" })).toEqual({ ok: true, data: null });
  });
});
