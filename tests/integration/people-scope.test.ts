// GET /api/v1/people as each role: managers list their whole company; a technician only the
// homeowners of the properties in their scope (and themselves) — never every homeowner's name and
// e-mail; homeowners are refused.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";

import { createTestCompany, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const people = await import("@/app/api/v1/people/route");

let main: TestCompany;
let other: TestCompany;
beforeAll(async () => {
  [main, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
});

async function list(query = ""): Promise<{ status: number; emails: string[] }> {
  const res = await people.GET(new Request(`http://localhost/api/v1/people${query}`));
  if (res.status !== 200) return { status: res.status, emails: [] };
  const body = (await res.json()) as { items: { email: string }[] };
  return { status: 200, emails: body.items.map((p) => p.email).sort() };
}

/** The homeowners the scenario links to the properties a technician is assigned. */
function homeownersOf(c: TestCompany, tech: string): string[] {
  const keys = new Set(
    c.scenario.properties.filter((p) => p.technician === tech).flatMap((p) => p.homeowners),
  );
  return [...keys].map((k) => c.emails[k]!).sort();
}

describe("GET /api/v1/people", () => {
  it("a technician lists only the homeowners of their own properties", async () => {
    for (const tech of ["tech1", "tech2"]) {
      current = await main.actor(tech);
      const expected = homeownersOf(main, tech);
      expect(expected.length).toBeGreaterThan(0);
      expect(await list("?role=homeowner")).toEqual({ status: 200, emails: expected });
      // Without a role filter: the same homeowners and themselves, no other staff.
      expect((await list()).emails).toEqual([...expected, main.emails[tech]!].sort());
      expect((await list("?role=manager")).emails).toEqual([]);
    }
  });

  it("a manager lists every homeowner of the company, none of another company", async () => {
    current = await main.actor("manager");
    const { emails } = await list("?role=homeowner");
    const all = main.scenario.people
      .filter((p) => p.role === "homeowner")
      .map((p) => main.emails[p.key]!)
      .sort();
    expect(emails).toEqual(all);
    expect(emails.some((e) => Object.values(other.emails).includes(e))).toBe(false);
  });

  it("a homeowner is refused", async () => {
    current = await main.actor("owner1");
    expect((await list()).status).toBe(403);
  });
});
