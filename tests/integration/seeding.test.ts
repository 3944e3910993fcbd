// The seeding checks through the route the visit page posts to (POST
// /api/v1/visits/:visitId/applications): a pre-emergence herbicide recorded on a zone seeded
// within its label interval is stored with a warning naming the seeding's date and product, and
// the property gets a risk alert with that evidence; a seed rate outside the species' range is a
// warning; a zone not seeded gets neither; another company's manager is refused. Intervals:
// the demo prodiamine's label says 112 days (16 weeks — Weed Technology 19(1), 2005 for the
// typical figure); tall fescue overseeding 3–4 lb/1,000 ft² (Cornell table, halved per
// Nebraska Extension).
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { ApplicationDto } from "@/lib/applications/dto";
import type { ApplicationInput } from "@/lib/applications/schemas";
import type { Actor } from "@/lib/auth/actor";
import { addDays, formatDate, todayIn } from "@/lib/dates";
import { listProducts } from "@/lib/products/queries";
import { saveZoneCheck } from "@/lib/visits/mutations";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { callRoute } from "../helpers/route-call";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const applicationsRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");
const finishRoute = await import("@/app/api/v1/visits/[visitId]/finish/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let zones: Record<string, string>;
let product: (name: string) => string;
const today = todayIn("America/New_York");
const SEED = "Larkmoor Turf-Type Tall Fescue (seed)";
const PRE = "Fencepost Crabgrass Preventer (demo prodiamine)";

/** An open visit of tech1 at the Haddad residence (New Jersey) started `daysAgo` at 9:00 local. */
async function visit(daysAgo: number): Promise<{ id: string; at: string }> {
  const id = randomUUID();
  const day = addDays(today, -daysAgo);
  const start = new Date(`${day}T14:00:00Z`); // 9 or 10 a.m. in New Jersey
  await testDb()
    .insertInto("visits")
    .values({
      id,
      company_id: c.companyId,
      property_id: c.propertyIds["haddad"]!,
      technician_id: c.userIds["tech1"]!,
      scheduled_for: day,
      planned_service: "aeration_overseeding",
      status: "in_progress",
      started_at: start,
      started_by: c.userIds["tech1"]!,
    })
    .execute();
  return { id, at: new Date(start.getTime() + 30 * 60_000).toISOString() };
}

const body = (over: Partial<ApplicationInput>): ApplicationInput => ({
  id: randomUUID(),
  zoneId: zones["Back yard"]!,
  productId: product(SEED),
  rateAmount: 3.5,
  rateUnit: "lb/1000ft2",
  windMph: 4,
  temperatureF: 66,
  isEstablishing: false,
  applicatorName: "Sam Ortiz",
  applicatorLicence: "NJ-DEMO-1",
  overrideReason: null,
  ...over,
});

async function post(as: Actor, visitId: string, b: ApplicationInput) {
  current = as;
  return callRoute<ApplicationDto>(applicationsRoute.POST, b, { params: { visitId } });
}

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1] = await Promise.all([c.actor("manager"), c.actor("tech1")]);
  const rows = await testDb()
    .selectFrom("zones")
    .select(["id", "name"])
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .execute();
  zones = Object.fromEntries(rows.map((r) => [r.name, r.id]));
  const products = await listProducts(manager);
  product = (name: string) => products.find((p) => p.name === name)!.id;
});

describe("a pre-emergence herbicide and a seeding on one zone", () => {
  it("seeding at 3.5 lb/1,000 ft² is within tall fescue's overseeding range: no seeding warning", async () => {
    const v = await visit(20);
    const res = await post(tech1, v.id, body({ appliedAt: v.at }));
    expect(res.status).toBe(201);
    const keys = (res.body as ApplicationDto).findings.map((f) => f.key);
    expect(keys).not.toContain("seed_rate");
    expect(keys).not.toContain("seeding_conflict");
  });

  it("the pre-emergence 18 days later is recorded with a warning naming the seeding's date and product, and raises the alert", async () => {
    const v = await visit(2);
    const res = await post(
      manager,
      v.id,
      body({ productId: product(PRE), rateAmount: 2, appliedAt: v.at }),
    );
    expect(res.status).toBe(201);
    const f = (res.body as ApplicationDto).findings.find((x) => x.key === "seeding_conflict");
    expect(f).toMatchObject({ severity: "warning", basis: "label", limit: 112 });
    expect(f!.message).toContain(SEED);
    expect(f!.message).toContain(formatDate(addDays(today, -20), "en-US"));
    expect(f!.message).toContain("18 days before this");
    expect(f!.message).toContain("the label asks for 112 days");

    // The visit's alerts are evaluated when it is finished (zone checks done, then Finish).
    for (const zoneId of Object.values(zones))
      await saveZoneCheck(tech1, v.id, newId(), doneCheck(zoneId));
    current = tech1;
    const finished = await callRoute(finishRoute.POST, {}, { params: { visitId: v.id } });
    expect(finished.status).toBe(200);
    const alert = await testDb()
      .selectFrom("risk_alerts")
      .selectAll()
      .where("company_id", "=", c.companyId)
      .where("zone_id", "=", zones["Back yard"]!)
      .where("kind", "=", "seeding_conflict")
      .executeTakeFirstOrThrow();
    expect(alert.status).toBe("open");
    expect(alert.severity).toBe("moderate");
    expect(alert.evidence).toMatchObject({
      values: {
        seededOn: addDays(today, -20),
        seedProduct: SEED,
        preEmergenceOn: addDays(today, -2),
        preEmergenceProduct: PRE,
        daysApart: 18,
        intervalDays: 112,
        intervalFrom: "the product label",
      },
    });
  });

  it("a seeding on the other zone, never treated, gets no conflict; 6 lb/1,000 ft² warns on the rate", async () => {
    const v = await visit(1);
    const front = Object.keys(zones).find((n) => n !== "Back yard")!;
    const res = await post(
      tech1,
      v.id,
      body({ zoneId: zones[front]!, rateAmount: 6, appliedAt: v.at }),
    );
    expect(res.status).toBe(201);
    const findings = (res.body as ApplicationDto).findings;
    expect(findings.map((x) => x.key)).not.toContain("seeding_conflict");
    const rate = findings.find((x) => x.key === "seed_rate");
    // The rate check reads the seed's species (tall fescue), whatever the zone's grass.
    expect(rate).toMatchObject({ severity: "warning", value: 6, limit: "3–4" });
    const alerts = await testDb()
      .selectFrom("risk_alerts")
      .select("id")
      .where("zone_id", "=", zones[front]!)
      .where("kind", "=", "seeding_conflict")
      .execute();
    expect(alerts).toHaveLength(0);
  });

  it("another company's manager is refused (404) and nothing is stored", async () => {
    const v = await visit(1);
    const b = body({ productId: product(PRE), rateAmount: 2, appliedAt: v.at });
    const res = await post(await other.actor("manager"), v.id, b);
    expect(res.status).toBe(404);
    const rows = await testDb()
      .selectFrom("applications")
      .select("id")
      .where("id", "=", b.id)
      .execute();
    expect(rows).toHaveLength(0);
  });
});
