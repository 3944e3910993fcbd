// Applications against the real database: nutrients computed on the server, rule sets of the
// property (New Jersey P.L.2010, c.112 in the demo), refusal with citation, manager override
// with an audit row, pesticide record fields, idempotency and scope.
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
let visitId: string;
let zone: { id: string; area_ft2: number };
let product: (name: string) => string;

const MAY = "2026-05-12T14:00:00-04:00"; // outside New Jersey's blackout
const DECEMBER = "2026-12-10T14:00:00-05:00"; // inside it

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [tech1, manager] = await Promise.all([c.actor("tech1"), c.actor("manager")]);
  visitId = (
    await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow()
  ).id;
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
  appliedAt: MAY,
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
    const a = await recordApplication(tech1, visitId, input({}));
    expect(a.per1000.nLb).toBeCloseTo(0.72, 6);
    expect(a.per1000.wsnLb).toBeCloseTo(0.504, 6);
    expect(a.per1000.k2oLb).toBeCloseTo(0.24, 6);
    expect(a.productTotalLb).toBeCloseTo(15.6, 3);
    expect(a.findings).toEqual([]);
    expect(a.appliedOn).toBe("2026-05-12");
  });

  it("is idempotent by id: a retry returns the same application", async () => {
    const body = input({});
    const first = await recordApplication(tech1, visitId, body);
    const again = await recordApplication(tech1, visitId, body);
    expect(again.id).toBe(first.id);
    expect(
      (await testDb().selectFrom("applications").select("id").where("id", "=", body.id).execute())
        .length,
    ).toBe(1);
  });

  it("refuses an application over New Jersey's 0.9 lb N limit, with the citation, and stores nothing", async () => {
    const body = input({ productId: product("Quickgreen"), rateAmount: 4 }); // 1.12 lb N, all water-soluble, 0 % slow-release
    await expect(recordApplication(tech1, visitId, body)).rejects.toMatchObject({
      code: "invalid_input",
      details: {
        findings: expect.arrayContaining([
          expect.objectContaining({
            key: "max_n",
            severity: "refusal",
            source: expect.stringContaining("P.L.2010, c.112"),
          }),
        ]),
      },
    });
    expect(
      (await testDb().selectFrom("applications").select("id").where("id", "=", body.id).execute())
        .length,
    ).toBe(0);
  });

  it("a technician's override reason is not enough; a manager's is recorded with an audit row", async () => {
    const body = input({
      productId: product("Quickgreen"),
      rateAmount: 4,
      overrideReason: "Agronomist's written recommendation for sod repair",
    });
    await expect(recordApplication(tech1, visitId, body)).rejects.toMatchObject({
      code: "invalid_input",
    });
    const a = await recordApplication(manager, visitId, body);
    expect(a.overrideReason).toBe("Agronomist's written recommendation for sod repair");
    expect(a.overrideBy).toBe(manager.name);
    const audit = await testDb()
      .selectFrom("audit_events")
      .select(["action", "actor_id"])
      .where("entity_id", "=", body.id)
      .execute();
    expect(audit).toEqual([{ action: "override_legal_limit", actor_id: manager.userId }]);
  });

  it("refuses fertiliser in New Jersey's professional blackout (1 Dec – 1 Mar)", async () => {
    await expect(
      recordApplication(tech1, visitId, input({ appliedAt: DECEMBER })),
    ).rejects.toMatchObject({
      details: { findings: expect.arrayContaining([expect.objectContaining({ key: "blackout" })]) },
    });
  });

  it("phosphorus needs a soil test or establishment", async () => {
    await expect(
      recordApplication(tech1, visitId, input({ productId: product("Rootstart"), rateAmount: 2 })),
    ).rejects.toMatchObject({
      details: {
        findings: expect.arrayContaining([expect.objectContaining({ key: "phosphorus" })]),
      },
    });
    const a = await recordApplication(
      tech1,
      visitId,
      input({ productId: product("Rootstart"), rateAmount: 2, isEstablishing: true }),
    );
    expect(a.per1000.p2o5Lb).toBeCloseTo(0.48, 6);
  });

  it("a pesticide needs the applicator's name and certification number", async () => {
    await expect(
      recordApplication(tech1, visitId, input({ productId: product("Grubward"), rateAmount: 2 })),
    ).rejects.toMatchObject({
      fieldErrors: { applicatorName: expect.any(Array), applicatorLicence: expect.any(Array) },
    });
    const a = await recordApplication(
      tech1,
      visitId,
      input({
        productId: product("Grubward"),
        rateAmount: 2,
        applicatorName: "Luis Arroyo",
        applicatorLicence: "NJ-DEMO-55120",
      }),
    );
    expect(a.product.registrationNumber).toBe("DEMO-0000-1");
  });

  it("a volume rate for a granular product is refused with a clear message", async () => {
    await expect(
      recordApplication(tech1, visitId, input({ rateUnit: "floz/1000ft2" })),
    ).rejects.toMatchObject({
      fieldErrors: { rateUnit: ["A rate by volume needs the product's density (lb/gal)."] },
    });
  });

  it("out of scope: another technician and another company get not found", async () => {
    await expect(
      recordApplication(await c.actor("tech2"), visitId, input({})),
    ).rejects.toMatchObject({ code: "not_found" });
    await expect(
      recordApplication(await other.actor("manager"), visitId, input({})),
    ).rejects.toMatchObject({ code: "not_found" });
  });

  it("a product of another company cannot be used", async () => {
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
