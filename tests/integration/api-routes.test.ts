// The JSON routes under app/api/v1, called as Next calls them, with the session stubbed to a
// real actor from the database: status codes, error shape, and scope.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";

import { createTestCompany, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const me = await import("@/app/api/v1/me/route");
const list = await import("@/app/api/v1/properties/route");
const detail = await import("@/app/api/v1/properties/[propertyId]/route");
const book = await import("@/app/api/v1/book/route");

let main: TestCompany;
let other: TestCompany;
beforeAll(async () => {
  [main, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});

const get = (path: string) => new Request(`http://localhost${path}`);
const withId = (propertyId: string) => ({ params: Promise.resolve({ propertyId }) });

describe("GET /api/v1/me", () => {
  it("401 JSON without a session", async () => {
    current = null;
    const res = await me.GET(get("/api/v1/me"));
    expect(res.status).toBe(401);
    expect(await res.json()).toEqual({
      error: { code: "unauthenticated", message: "Sign in to continue." },
    });
  });

  it("returns id, email, role and company", async () => {
    current = await main.actor("tech2");
    const res = await me.GET(get("/api/v1/me"));
    expect(res.status).toBe(200);
    expect(await res.json()).toMatchObject({
      id: main.userIds.tech2,
      email: main.emails.tech2,
      role: "technician",
      companyId: main.companyId,
    });
    expect(res.headers.get("cache-control")).toContain("no-store");
  });
});

describe("GET /api/v1/properties[/:id]", () => {
  it("lists the actor's scope", async () => {
    current = await main.actor("tech1");
    const body = (await (await list.GET(get("/api/v1/properties"))).json()) as {
      items: { name: string }[];
    };
    expect(body.items.map((p) => p.name).sort()).toEqual(
      main.scenario.properties
        .filter((p) => p.technician === "tech1")
        .map((p) => p.name)
        .sort(),
    );
  });

  it("returns a property with its zones, and 404 outside scope or for a malformed id", async () => {
    current = await main.actor("owner2");
    const own = await detail.GET(get("/x"), withId(main.propertyIds["haddad"]!));
    expect(own.status).toBe(200);
    expect(((await own.json()) as { zones: unknown[] }).zones).toHaveLength(2);

    for (const id of [
      main.propertyIds["oyelaran"]!,
      other.propertyIds["aaland"]!,
      "not-a-uuid",
      "' or 1=1 --",
    ]) {
      const res = await detail.GET(get("/x"), withId(id));
      expect(res.status).toBe(404);
      expect(await res.json()).toEqual({
        error: { code: "not_found", message: "That property was not found." },
      });
    }
  });

  it("refuses a cross-site POST before anything else happens", async () => {
    current = await main.actor("manager");
    const res = await list.GET(
      new Request("http://localhost/api/v1/properties", {
        method: "POST",
        headers: { origin: "https://evil.example", host: "localhost" },
      }),
    );
    expect(res.status).toBe(403);
  });
});

describe("GET /api/v1/book", () => {
  it("gives managers a page of their own company's book with the next cursor and the total; others are refused", async () => {
    current = await main.actor("manager");
    const first = (await (await book.GET(get("/api/v1/book?limit=4"))).json()) as {
      rows: { name: string }[];
      nextCursor: string | null;
      total: number;
    };
    expect(first.total).toBe(main.scenario.properties.length);
    expect(first.rows).toHaveLength(4);
    expect(first.nextCursor).toEqual(expect.any(String));
    const rest = (await (
      await book.GET(get(`/api/v1/book?limit=4&after=${first.nextCursor}`))
    ).json()) as { rows: { name: string }[]; nextCursor: string | null };
    expect([...first.rows, ...rest.rows].map((r) => r.name).sort()).toEqual(
      main.scenario.properties.map((p) => p.name).sort(),
    );
    expect(rest.nextCursor).toBeNull();
    const declining = (await (await book.GET(get("/api/v1/book?trend=declining"))).json()) as {
      rows: { name: string }[];
    };
    expect(declining.rows.map((r) => r.name)).toEqual(["Haddad residence"]); // the demo story's declining lawn

    current = await main.actor("tech1");
    expect((await book.GET(get("/api/v1/book"))).status).toBe(403);
    current = await main.actor("owner1");
    expect((await book.GET(get("/api/v1/book"))).status).toBe(403);
    current = null;
    expect((await book.GET(get("/api/v1/book"))).status).toBe(401);
  });
});
