// Applications against the real database: the time bound to the visit, nutrients computed on the
// server, the property's rule set (New Jersey in the demo) on the application's real date, the
// product label (refusals no one overrides), a manager's override with its category and an audit
// row, pesticide record fields, idempotency and scope. Visits are dated in 2025 so the demo
// season's own feedings (dated relative to today) stay out of the label's interval and year.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import { recordApplication } from "@/lib/applications/mutations";
import { listPropertyApplications } from "@/lib/applications/queries";
import type { ApplicationInput } from "@/lib/applications/schemas";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { newId } from "../helpers/zone-checks";

let c: TestCompany;
let other: TestCompany;
let tech1: Actor;
let manager: Actor;
let zone: { id: string; area_ft2: number };
let product: (name: string) => string;

/** A visit of tech1 at the Haddad residence (New Jersey), under way since `startedAt`. */
async function visitStarted(startedAt: string, completedAt?: string): Promise<string> {
  const id = randomUUID();
  const start = new Date(startedAt);
  await testDb()
    .insertInto("visits")
    .values({
      id,
      company_id: c.companyId,
      property_id: c.propertyIds["haddad"]!,
      technician_id: c.userIds["tech1"]!,
      scheduled_for: startedAt.slice(0, 10),
      planned_service: "feeding_round",
      status: completedAt ? "completed" : "in_progress",
      started_at: start,
      started_by: c.userIds["tech1"]!,
      completed_at: completedAt ? new Date(completedAt) : null,
      completed_by: completedAt ? c.userIds["tech1"]! : null,
    })
    .execute();
  return id;
}

const stored = async (id: string) =>
  (await testDb().selectFrom("applications").select("id").where("id", "=", id).execute()).length;

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [tech1, manager] = await Promise.all([c.actor("tech1"), c.actor("manager")]);
  zone = await testDb()
    .selectFrom("zones")
    .select(["id", "area_ft2"])
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .where("name", "=", "Back yard")
    .executeTakeFirstOrThrow();
  const products = await listProducts(manager);
  product = (name: string) => products.find((p) => p.name.startsWith(name))!.id;
});

const input = (overrides: Partial<ApplicationInput>): ApplicationInput => ({
  id: newId(),
  zoneId: zone.id,
  productId: product("Larkmoor Steadyfeed"),
  rateAmount: 3,
  rateUnit: "lb/1000ft2",
  windMph: 4,
  temperatureF: 68,
  isEstablishing: false,
  applicatorName: "",
  applicatorLicence: "",
  overrideReason: null,
  ...overrides,
});

describe("recordApplication", () => {
  it("computes nutrients and totals on the server (24-0-8, 30 % slow-release, 3 lb per 1,000 ft² on 5,200 ft²)", async () => {
    const visitId = await visitStarted("2025-05-12T13:00:00-04:00");
    const a = await recordApplication(
      tech1,
      visitId,
      input({ appliedAt: "2025-05-12T14:00:00-04:00" }),
    );
    expect(a.per1000.nLb).toBeCloseTo(0.72, 6);
    expect(a.per1000.wsnLb).toBeCloseTo(0.504, 6);
    expect(a.per1000.k2oLb).toBeCloseTo(0.24, 6);
    expect(a.productTotalLb).toBeCloseTo(15.6, 3);
    // The standing reminders about ground and rain (New Jersey's and the label's), nothing else.
    expect(a.findings.map((f) => `${f.key}:${f.severity}`)).toEqual([
      "conditions:warning",
      "label_conditions:warning",
    ]);
    expect(a.appliedOn).toBe("2025-05-12");
  });

  it("is idempotent by id: a retry returns the same application", async () => {
    const visitId = await visitStarted("2025-06-12T13:00:00-04:00");
    const body = input({ appliedAt: "2025-06-12T13:30:00-04:00" });
    const first = await recordApplication(tech1, visitId, body);
    const again = await recordApplication(tech1, visitId, body);
    expect(again.id).toBe(first.id);
    expect(await stored(body.id)).toBe(1);
  });

  it("refuses an application over New Jersey's 0.9 lb N limit, with the section, and stores nothing", async () => {
    const visitId = await visitStarted("2025-04-02T09:00:00-04:00");
    const body = input({
      productId: product("Quickgreen"),
      rateAmount: 4, // 1.12 lb N, all water-soluble, 0 % slow-release
      appliedAt: "2025-04-02T10:00:00-04:00",
    });
    await expect(recordApplication(tech1, visitId, body)).rejects.toMatchObject({
      code: "invalid_input",
      details: {
        findings: expect.arrayContaining([
          expect.objectContaining({
            key: "max_n",
            severity: "refusal",
            source: expect.stringContaining("P.L.2010, c.112, s.11a"),
          }),
        ]),
      },
    });
    expect(await stored(body.id)).toBe(0);
  });

  it("a technician cannot override; a manager needs a category and a reason, both kept and audited", async () => {
    const visitId = await visitStarted("2025-04-03T09:00:00-04:00");
    const body = input({
      productId: product("Quickgreen"),
      rateAmount: 4,
      appliedAt: "2025-04-03T10:00:00-04:00",
      overrideReason: "Agronomist's written recommendation for sod repair",
    });
    await expect(recordApplication(tech1, visitId, body)).rejects.toMatchObject({
      code: "invalid_input",
    });
    await expect(recordApplication(manager, visitId, body)).rejects.toMatchObject({
      fieldErrors: { overrideCategory: ["Choose why the override applies."] },
    });
    expect(await stored(body.id)).toBe(0);
    const a = await recordApplication(manager, visitId, {
      ...body,
      overrideCategory: "documented_exemption",
    });
    expect(a.overrideReason).toBe("Agronomist's written recommendation for sod repair");
    expect(a.overrideCategory).toBe("documented_exemption");
    expect(a.overrideBy).toBe(manager.name);
    const audit = await testDb()
      .selectFrom("audit_events")
      .select(["action", "actor_id", "changes"])
      .where("entity_id", "=", body.id)
      .execute();
    // The override, and the time given away from now on this long-open visit.
    expect(audit.map((e) => [e.action, e.actor_id]).sort()).toEqual([
      ["applied_at_differs", manager.userId],
      ["override_legal_limit", manager.userId],
    ]);
    expect(
      JSON.stringify(audit.find((e) => e.action === "override_legal_limit")!.changes),
    ).toContain("documented_exemption");
  });

  it('New Jersey\'s professional dates through the API: "after December 1st" — Dec 1 recorded, Dec 2 refused', async () => {
    const dec1 = await visitStarted("2025-12-01T09:00:00-05:00");
    const a = await recordApplication(
      tech1,
      dec1,
      input({ appliedAt: "2025-12-01T10:00:00-05:00" }),
    );
    expect(a.appliedOn).toBe("2025-12-01");
    const dec2 = await visitStarted("2025-12-02T09:00:00-05:00");
    await expect(
      recordApplication(
        tech1,
        dec2,
        input({ productId: product("Autumn Anchor"), appliedAt: "2025-12-02T10:00:00-05:00" }),
      ),
    ).rejects.toMatchObject({
      details: {
        findings: expect.arrayContaining([
          expect.objectContaining({
            key: "blackout",
            source: expect.stringContaining("58:10A-62b"),
          }),
        ]),
      },
    });
  });

  it("phosphorus needs a soil test, first establishment or (in New Jersey) repair", async () => {
    const visitId = await visitStarted("2025-09-10T09:00:00-04:00");
    const at = "2025-09-10T10:00:00-04:00";
    await expect(
      recordApplication(
        tech1,
        visitId,
        input({ productId: product("Rootstart"), rateAmount: 2, appliedAt: at }),
      ),
    ).rejects.toMatchObject({
      details: {
        findings: expect.arrayContaining([expect.objectContaining({ key: "phosphorus" })]),
      },
    });
    const a = await recordApplication(
      tech1,
      visitId,
      input({ productId: product("Rootstart"), rateAmount: 2, isRepairing: true, appliedAt: at }),
    );
    expect(a.per1000.p2o5Lb).toBeCloseTo(0.48, 6);
    expect(a.isRepairing).toBe(true);
  });

  it("the label: above its maximum rate is refused for everyone, a manager's override included", async () => {
    const visitId = await visitStarted("2025-08-01T09:00:00-04:00");
    const body = input({
      productId: product("Autumn Anchor"), // label: at most 5 lb per 1,000 ft²
      rateAmount: 5.2,
      appliedAt: "2025-08-01T10:00:00-04:00",
      overrideReason: "Research plot",
      overrideCategory: "research_plot",
    });
    await expect(recordApplication(manager, visitId, body)).rejects.toMatchObject({
      code: "invalid_input",
      message: expect.stringContaining("no one can override a label limit"),
      details: {
        findings: expect.arrayContaining([
          expect.objectContaining({ key: "label_max_rate", basis: "label" }),
        ]),
      },
    });
    expect(await stored(body.id)).toBe(0);
  });

  it("the label's interval between applications of a product on a zone (Larkmoor: 28 days)", async () => {
    const first = await visitStarted("2025-03-10T09:00:00-04:00");
    await recordApplication(tech1, first, input({ appliedAt: "2025-03-10T10:00:00-04:00" }));
    const second = await visitStarted("2025-03-31T09:00:00-04:00");
    const body = input({ appliedAt: "2025-03-31T10:00:00-04:00", rateAmount: 1 });
    await expect(recordApplication(manager, second, body)).rejects.toMatchObject({
      details: {
        findings: expect.arrayContaining([
          expect.objectContaining({ key: "label_interval", value: 21 }),
        ]),
      },
    });
    expect(await stored(body.id)).toBe(0);
  });

  it("a pesticide's rate is checked against its label, and the record needs the applicator", async () => {
    const visitId = await visitStarted("2025-06-20T09:00:00-04:00");
    const at = "2025-06-20T10:00:00-04:00";
    await expect(
      recordApplication(
        tech1,
        visitId,
        input({ productId: product("Grubward"), rateAmount: 2, appliedAt: at }),
      ),
    ).rejects.toMatchObject({
      fieldErrors: { applicatorName: expect.any(Array), applicatorLicence: expect.any(Array) },
    });
    const applicator = { applicatorName: "Luis Arroyo", applicatorLicence: "NJ-DEMO-55120" };
    await expect(
      recordApplication(
        tech1,
        visitId,
        input({ productId: product("Grubward"), rateAmount: 3.5, appliedAt: at, ...applicator }),
      ),
    ).rejects.toMatchObject({
      details: {
        findings: expect.arrayContaining([expect.objectContaining({ key: "label_max_rate" })]),
      },
    });
    const a = await recordApplication(
      tech1,
      visitId,
      input({ productId: product("Grubward"), rateAmount: 2, appliedAt: at, ...applicator }),
    );
    expect(a.product.registrationNumber).toBe("DEMO-0000-1");
  });

  it("a volume rate for a granular product, and a weight rate for a liquid, are refused with a clear message", async () => {
    const visitId = await visitStarted("2025-06-21T09:00:00-04:00");
    const at = "2025-06-21T10:00:00-04:00";
    await expect(
      recordApplication(tech1, visitId, input({ rateUnit: "floz/1000ft2", appliedAt: at })),
    ).rejects.toMatchObject({
      fieldErrors: { rateUnit: ["A rate by volume needs the product's density (lb/gal)."] },
    });
    await expect(
      recordApplication(
        tech1,
        visitId,
        input({
          productId: product("Brookline Liquid"),
          rateUnit: "oz/1000ft2",
          rateAmount: 18,
          appliedAt: at,
        }),
      ),
    ).rejects.toMatchObject({
      fieldErrors: { rateUnit: ["A liquid is measured by volume: use fl oz, gal or L."] },
    });
  });

  it("out of scope: another technician and another company get not found", async () => {
    const visitId = await visitStarted("2025-06-22T09:00:00-04:00");
    await expect(
      recordApplication(await c.actor("tech2"), visitId, input({})),
    ).rejects.toMatchObject({ code: "not_found" });
    await expect(
      recordApplication(await other.actor("manager"), visitId, input({})),
    ).rejects.toMatchObject({ code: "not_found" });
  });

  it("a product of another company cannot be used", async () => {
    const visitId = await visitStarted("2025-06-23T09:00:00-04:00");
    const foreign = (await listProducts(await other.actor("manager")))[0]!.id;
    await expect(
      recordApplication(tech1, visitId, input({ productId: foreign })),
    ).rejects.toMatchObject({ fieldErrors: { productId: expect.any(Array) } });
  });
});

describe("listPropertyApplications", () => {
  it("lists the year's applications of a property, newest first, for staff in scope only", async () => {
    // The year of the demo season's feedings (they are dated relative to today).
    const latest = await testDb()
      .selectFrom("applications")
      .select("applied_on")
      .where("company_id", "=", c.companyId)
      .where(
        "zone_id",
        "in",
        testDb()
          .selectFrom("zones")
          .select("id")
          .where("property_id", "=", c.propertyIds["oyelaran"]!),
      )
      .orderBy("applied_on", "desc")
      .executeTakeFirstOrThrow();
    const year = latest.applied_on.slice(0, 4);
    const rows = await listPropertyApplications(
      await c.actor("manager"),
      c.propertyIds["oyelaran"]!,
      year,
    );
    expect(rows.length).toBeGreaterThanOrEqual(3); // the demo season: feedings on three zones
    expect(rows.map((r) => r.appliedOn)).toEqual(
      [...rows.map((r) => r.appliedOn)].sort().reverse(),
    );
    expect(rows[0]).toMatchObject({
      productName: "Autumn Anchor 20-0-10",
      nLb: 0.9,
      rate: "4.5 lb/1,000 ft²",
    });
    expect(
      await listPropertyApplications(await c.actor("owner1"), c.propertyIds["oyelaran"]!, year),
    ).toEqual([]);
    expect(
      await listPropertyApplications(await c.actor("tech2"), c.propertyIds["oyelaran"]!, year),
    ).toEqual([]);
  });
});
