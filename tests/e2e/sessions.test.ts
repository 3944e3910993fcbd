// Sessions over HTTP against the production server (OWASP ASVS 5.0 V7 session management, V3.5
// cross-site requests): a session cookie taken before sign-out, before the account is disabled
// or before the role is lowered performs 0 actions afterwards; cross-origin and origin-less writes
// are refused and change nothing, for route handlers and for server actions alike.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, inject, it } from "vitest";

import { useE2eDatabase } from "../helpers/e2e-db";
import type { TestCompany } from "../helpers/factories";
import { passwordSignIn } from "../helpers/password-sign-in";

const BASE = inject("baseUrl");
let c: TestCompany;
let db: Awaited<ReturnType<(typeof import("../helpers/factories"))["testDb"]>>;
let propertyBody: Record<string, unknown>;
let propertyId: string;

/** A real password sign-in through Auth.js's credentials callback, as the sign-in form does. */
async function signIn(email: string, password: string): Promise<string> {
  const result = await passwordSignIn(BASE, email, password);
  expect(result.sessionToken, `sign-in as ${email} failed (${result.status})`).not.toBe("");
  return result.cookie;
}

/** What a manager's session can do; each would succeed with a live session. */
const ACTIONS: {
  name: string;
  managerOnly: boolean;
  run: (cookie: string) => Promise<Response>;
}[] = [
  {
    name: "GET /api/v1/me",
    managerOnly: false,
    run: (cookie) => fetch(`${BASE}/api/v1/me`, { headers: { cookie } }),
  },
  {
    name: "GET /api/v1/properties/:id",
    managerOnly: false,
    run: (cookie) => fetch(`${BASE}/api/v1/properties/${propertyId}`, { headers: { cookie } }),
  },
  {
    name: "GET /api/v1/book",
    managerOnly: true,
    run: (cookie) => fetch(`${BASE}/api/v1/book`, { headers: { cookie } }),
  },
  {
    name: "GET /properties/:id (page)",
    managerOnly: false,
    run: (cookie) =>
      fetch(`${BASE}/properties/${propertyId}`, { headers: { cookie }, redirect: "manual" }),
  },
  {
    name: "POST /api/v1/products",
    managerOnly: true,
    run: (cookie) => post(cookie, "/api/v1/products", productBody()),
  },
  {
    name: "PUT /api/v1/properties/:id",
    managerOnly: true,
    run: (cookie) => post(cookie, `/api/v1/properties/${propertyId}`, propertyBody, "PUT"),
  },
  {
    name: "POST /api/v1/visits",
    managerOnly: true,
    run: (cookie) =>
      post(cookie, "/api/v1/visits", {
        propertyId,
        scheduledFor: "2027-04-01",
        technicianId: null,
        plannedService: "inspection",
      }),
  },
];

const productBody = () => ({
  name: `Session check ${randomUUID().slice(0, 6)}`,
  form: "granular",
  nPct: 20,
  p2o5Pct: 0,
  k2oPct: 5,
  slowReleasePctOfN: 0,
  densityLbPerGal: null,
  isPesticide: false,
  registrationNumber: "",
  labelCautions: "",
  reentryGuidance: "",
});
const post = (
  cookie: string,
  path: string,
  body: unknown,
  method = "POST",
  origin: string | null = BASE,
  extra: Record<string, string> = {},
) =>
  fetch(`${BASE}${path}`, {
    method,
    headers: {
      cookie,
      "content-type": "application/json",
      ...(origin ? { origin } : {}),
      ...extra,
    },
    body: JSON.stringify(body),
    redirect: "manual",
  });
const performed = (res: Response) => res.status >= 200 && res.status < 300;

async function performedCount(
  cookie: string,
  only: (a: (typeof ACTIONS)[number]) => boolean = () => true,
): Promise<{ performed: number; tried: number; statuses: string[] }> {
  let n = 0;
  const statuses: string[] = [];
  const chosen = ACTIONS.filter(only);
  for (const a of chosen) {
    const res = await a.run(cookie);
    await res.arrayBuffer();
    if (performed(res)) n++;
    statuses.push(`${a.name} ${res.status}`);
  }
  return { performed: n, tried: chosen.length, statuses };
}

beforeAll(async () => {
  useE2eDatabase();
  const factories = await import("../helpers/factories");
  db = factories.testDb();
  c = await factories.createTestCompany();
  propertyId = c.propertyIds["oyelaran"]!;
  const p = await db
    .selectFrom("properties")
    .selectAll()
    .where("id", "=", propertyId)
    .executeTakeFirstOrThrow();
  propertyBody = {
    name: p.name,
    street: p.street,
    city: p.city,
    region: p.region,
    postalCode: p.postal_code,
    latitude: p.latitude,
    longitude: p.longitude,
    timeZone: p.time_zone,
    ruleSetId: p.rule_set_id,
    technicianId: p.technician_id,
    notes: p.notes,
  };
}, 60_000);

describe("an old session token", () => {
  it("does everything while live, and nothing after sign-out", async () => {
    const { TEST_PASSWORD } = await import("../helpers/factories");
    const cookie = await signIn(c.emails["manager"]!, TEST_PASSWORD);
    const live = await performedCount(cookie);
    expect(live.performed, live.statuses.join(", ")).toBe(ACTIONS.length);

    const csrf = await fetch(`${BASE}/api/auth/csrf`, { headers: { cookie } });
    const { csrfToken } = (await csrf.json()) as { csrfToken: string };
    const csrfCookie = csrf.headers
      .getSetCookie()
      .map((x) => x.split(";")[0])
      .join("; ");
    const out = await fetch(`${BASE}/api/auth/signout`, {
      method: "POST",
      redirect: "manual",
      headers: {
        cookie: [cookie, csrfCookie].filter(Boolean).join("; "),
        "content-type": "application/x-www-form-urlencoded",
        origin: BASE,
      },
      body: new URLSearchParams({ csrfToken }),
    });
    expect(out.status).toBe(302);

    const after = await performedCount(cookie); // the cookie as it was before signing out
    console.log(
      `sessions: after sign-out the old token performed ${after.performed} of ${after.tried} actions (${after.statuses.join(", ")})`,
    );
    expect(after.performed).toBe(0);
  });

  it("does nothing once the account is disabled", async () => {
    const { TEST_PASSWORD } = await import("../helpers/factories");
    const cookie = await signIn(c.emails["tech1"]!, TEST_PASSWORD);
    const staff = (a: (typeof ACTIONS)[number]) => !a.managerOnly;
    expect((await performedCount(cookie, staff)).performed).toBe(ACTIONS.filter(staff).length);
    await db
      .updateTable("users")
      .set({ disabled_at: new Date() })
      .where("id", "=", c.userIds["tech1"]!)
      .execute();
    const after = await performedCount(cookie);
    console.log(
      `sessions: after the account was disabled the old token performed ${after.performed} of ${after.tried} actions`,
    );
    expect(after.performed).toBe(0);
  });

  it("does nothing a manager may do once the role is lowered to technician", async () => {
    const { createTestCompany, TEST_PASSWORD } = await import("../helpers/factories");
    const d = await createTestCompany();
    const cookie = await signIn(d.emails["manager"]!, TEST_PASSWORD);
    propertyId = d.propertyIds["oyelaran"]!;
    const p = await db
      .selectFrom("properties")
      .selectAll()
      .where("id", "=", propertyId)
      .executeTakeFirstOrThrow();
    propertyBody = {
      name: p.name,
      street: p.street,
      city: p.city,
      region: p.region,
      postalCode: p.postal_code,
      latitude: p.latitude,
      longitude: p.longitude,
      timeZone: p.time_zone,
      ruleSetId: p.rule_set_id,
      technicianId: p.technician_id,
      notes: p.notes,
    };
    const managerOnly = (a: (typeof ACTIONS)[number]) => a.managerOnly;
    expect((await performedCount(cookie, managerOnly)).performed).toBe(
      ACTIONS.filter(managerOnly).length,
    );
    await db
      .updateTable("memberships")
      .set({ role: "technician" })
      .where("user_id", "=", d.userIds["manager"]!)
      .execute();
    const after = await performedCount(cookie, managerOnly);
    const me = (await (await fetch(`${BASE}/api/v1/me`, { headers: { cookie } })).json()) as {
      role: string;
    };
    console.log(
      `sessions: after manager → technician the old token performed ${after.performed} of ${after.tried} manager actions; it now reads as ${me.role}`,
    );
    expect(after.performed).toBe(0);
    expect(me.role).toBe("technician");
  });
});

describe("cross-origin writes", () => {
  it("are refused for route handlers and server actions, and change nothing", async () => {
    const { createTestCompany, TEST_PASSWORD } = await import("../helpers/factories");
    const e = await createTestCompany();
    const cookie = await signIn(e.emails["manager"]!, TEST_PASSWORD);
    const products = async () =>
      Number(
        (
          await db
            .selectFrom("products")
            .select((eb) => eb.fn.countAll<number>().as("n"))
            .where("company_id", "=", e.companyId)
            .executeTakeFirstOrThrow()
        ).n,
      );
    const before = await products();
    const attempts: [string, () => Promise<Response>][] = [
      [
        "foreign Origin",
        () =>
          post(cookie, "/api/v1/products", productBody(), "POST", "https://lawn-offers.example"),
      ],
      ["Origin null", () => post(cookie, "/api/v1/products", productBody(), "POST", "null")],
      ["no Origin", () => post(cookie, "/api/v1/products", productBody(), "POST", null)],
      [
        "Sec-Fetch-Site: cross-site",
        () =>
          post(cookie, "/api/v1/products", productBody(), "POST", BASE, {
            "sec-fetch-site": "cross-site",
          }),
      ],
      [
        "foreign Origin, form-encoded",
        () =>
          fetch(`${BASE}/api/v1/products`, {
            method: "POST",
            headers: {
              cookie,
              origin: "https://lawn-offers.example",
              "content-type": "application/x-www-form-urlencoded",
            },
            body: "name=x",
          }),
      ],
      [
        "foreign Origin, DELETE",
        () =>
          fetch(
            `${BASE}/api/v1/properties/${e.propertyIds["oyelaran"]}/homeowners/${e.userIds["owner1"]}`,
            { method: "DELETE", headers: { cookie, origin: "https://lawn-offers.example" } },
          ),
      ],
    ];
    let refused = 0;
    const statuses: string[] = [];
    for (const [name, attempt] of attempts) {
      const res = await attempt();
      await res.arrayBuffer();
      statuses.push(`${name} ${res.status}`);
      if (res.status === 403) refused++;
    }
    // A server action (sign-out) posted from another origin: Next refuses it, and the session lives on.
    const manifest = (await import("node:fs")).readFileSync(
      ".next/server/server-reference-manifest.json",
      "utf8",
    );
    const signOutId = Object.entries(
      (JSON.parse(manifest) as { node: Record<string, { exportedName?: string }> }).node,
    ).find(([, v]) => v.exportedName === "signOutAction")![0];
    const action = await fetch(`${BASE}/properties`, {
      method: "POST",
      redirect: "manual",
      headers: {
        cookie,
        "next-action": signOutId,
        origin: "https://lawn-offers.example",
        "content-type": "text/plain;charset=UTF-8",
      },
      body: "[]",
    });
    await action.arrayBuffer();
    const stillSignedIn =
      (await fetch(`${BASE}/api/v1/me`, { headers: { cookie } })).status === 200;
    statuses.push(`server action from a foreign Origin ${action.status}`);
    if (action.status === 403) refused++;
    console.log(
      `cross-origin: ${refused} of ${attempts.length + 1} cross-site writes refused with 403 (route handlers and a server action); ${(await products()) - before} rows created; session still valid after the foreign sign-out action: ${stillSignedIn} (${statuses.join(", ")})`,
    );
    expect(refused).toBe(attempts.length + 1);
    expect(await products()).toBe(before);
    expect(stillSignedIn).toBe(true);
    // The link is still there.
    expect(
      await db
        .selectFrom("property_homeowners")
        .select("user_id")
        .where("user_id", "=", e.userIds["owner1"]!)
        .executeTakeFirst(),
    ).toBeDefined();
  });
});
