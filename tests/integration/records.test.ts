// Application records as CSV through the route: manager only, the date range, UTF-8 BOM,
// ISO dates, formula-like cells neutralised, required record fields enforced per rule set.
import { parse } from "csv-parse/sync";
import { sql } from "kysely";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { recordApplication } from "@/lib/applications/mutations";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";

import { RECORD_KEYS } from "../helpers/csv-columns";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const route = await import("@/app/api/v1/records/applications/route");

let c: TestCompany;
let visitId: string;
let zoneId: string;

beforeAll(async () => {
  c = await createTestCompany();
  const manager = await c.actor("manager");
  visitId = (
    await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["oyelaran"]!)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow()
  ).id;
  // The visit was under way that morning: an application is recorded at the time of its visit.
  await testDb()
    .updateTable("visits")
    .set({ status: "in_progress", started_at: new Date("2026-05-12T08:00:00-04:00") })
    .where("id", "=", visitId)
    .execute();
  zoneId = (
    await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", c.propertyIds["oyelaran"]!)
      .orderBy("sort_order")
      .executeTakeFirstOrThrow()
  ).id;
  const products = await listProducts(manager);
  const grub = products.find((p) => p.name.startsWith("Grubward"))!;
  const feed = products.find((p) => p.name.startsWith("Larkmoor Steadyfeed"))!;
  await recordApplication(manager, visitId, {
    id: newId(),
    zoneId,
    productId: feed.id,
    rateAmount: 3,
    rateUnit: "lb/1000ft2",
    appliedAt: "2026-05-12T09:15:00-04:00",
    windMph: 3,
    temperatureF: 66,
    isEstablishing: false,
    applicatorName: "",
    applicatorLicence: "",
    overrideReason: null,
  });
  await recordApplication(manager, visitId, {
    id: newId(),
    zoneId,
    productId: grub.id,
    rateAmount: 2,
    rateUnit: "lb/1000ft2",
    appliedAt: "2026-05-12T10:40:00-04:00",
    windMph: 4,
    temperatureF: 70,
    isEstablishing: false,
    applicatorName: '=HYPERLINK("x")',
    applicatorLicence: "NJ-DEMO-1",
    overrideReason: null,
  });
});

const get = (q: string) =>
  route.GET(new Request(`http://localhost/api/v1/records/applications?${q}`));

describe("GET /api/v1/records/applications", () => {
  it("exports the range as CSV with a BOM, ISO dates and neutralised formula cells", async () => {
    current = await c.actor("manager");
    const res = await get("from=2026-05-01&to=2026-05-31");
    expect(res.status).toBe(200);
    expect(res.headers.get("content-type")).toBe("text/csv; charset=utf-8");
    expect(res.headers.get("content-disposition")).toContain(
      "application-records-2026-05-01-to-2026-05-31.csv",
    );
    const bytes = new Uint8Array(await res.arrayBuffer());
    expect([...bytes.slice(0, 3)]).toEqual([0xef, 0xbb, 0xbf]);
    const rows = parse(new TextDecoder().decode(bytes), { columns: RECORD_KEYS }) as Record<
      string,
      string
    >[];
    expect(rows).toHaveLength(2);
    expect(rows[0]).toMatchObject({
      applied_on: "05/12/2026",
      applied_at_local: "05/12/2026, 9:15 AM",
      zone: "Front lawn",
      area_ft2: "2400",
      n_lb_per_1000ft2: "0.72",
      wind_mph: "3",
      keep_until: "05/12/2028",
    });
    expect(rows[1]!.applicator).toBe('\'=HYPERLINK("x")');
    expect(rows[1]!.applicator_license).toBe("NJ-DEMO-1");
    // Findings in words, never internal keys (the New Jersey ground-and-rain reminder here).
    expect(rows[0]!.findings).toMatch(/^Warning: Not on frozen or saturated ground/);
    expect(rows[0]!.findings).not.toMatch(/conditions|\(warning\)/);
    expect(rows[1]!.registration_number).toBe("DEMO-0000-1");
  });

  it("a manager's override shows with its category in words", async () => {
    const manager = await c.actor("manager");
    const quick = (await listProducts(manager)).find((p) => p.name.startsWith("Quickgreen"))!;
    await recordApplication(manager, visitId, {
      id: newId(),
      zoneId,
      productId: quick.id,
      rateAmount: 4, // 1.12 lb N: above New Jersey's 0.9 lb
      rateUnit: "lb/1000ft2",
      appliedAt: "2026-05-12T11:00:00-04:00",
      windMph: 3,
      temperatureF: 70,
      isEstablishing: false,
      applicatorName: "",
      applicatorLicence: "",
      overrideReason: "University trial strip, plot 4",
      overrideCategory: "research_plot",
    });
    current = manager;
    const text = await (await get("from=2026-05-12&to=2026-05-12")).text();
    const rows = parse(text.replace(/^\uFEFF/, ""), { columns: RECORD_KEYS }) as Record<
      string,
      string
    >[];
    const row = rows.find((r) => r.product === quick.name)!;
    expect(row).toMatchObject({
      override_reason: "University trial strip, plot 4",
      override_category: "Research or trial plot",
    });
    expect(row.findings).toContain("Refused (legal limit): 1.12 lb N per 1,000 ft²");
  });

  it("is for managers only and checks the range", async () => {
    current = await c.actor("tech1");
    expect((await get("from=2026-05-01&to=2026-05-31")).status).toBe(403);
    current = await c.actor("manager");
    expect((await get("from=2026-06-01&to=2026-05-01")).status).toBe(422);
    expect((await get("from=yesterday&to=2026-05-01")).status).toBe(422);
  });
});

describe("one row per application", () => {
  it("a property with several homeowners gives one row per application, its homeowners in one cell, across page boundaries", async () => {
    current = await c.actor("manager");
    const propertyId = c.propertyIds["oyelaran"]!;
    const before = await get("from=2026-05-01&to=2026-05-31");
    const baseline = parse(await before.text(), { columns: RECORD_KEYS, bom: true }) as Record<
      string,
      string
    >[];
    // Two more homeowners on the lawn (three in all, or two where the demo has none).
    for (const name of ["Zora Quist", "Abel Ferro"]) {
      const user = await testDb()
        .insertInto("users")
        .values({ email: `${newId()}@test.sward.test`, name })
        .returning("id")
        .executeTakeFirstOrThrow();
      await testDb()
        .insertInto("property_homeowners")
        .values({ property_id: propertyId, user_id: user.id, company_id: c.companyId })
        .execute();
    }
    // 600 more applications on one day: the export reads 500 a page, so pages have a boundary.
    const copied = sql.raw(
      "company_id, visit_id, zone_id, product_id, rate_amount, rate_unit, area_ft2, product_total_lb, product_total_gal, n_lb_per_1000, p2o5_lb_per_1000, k2o_lb_per_1000, wsn_lb_per_1000, wind_mph, temperature_f, is_establishing, applicator_name, applicator_licence, findings, override_reason, override_by, created_by",
    );
    await sql`insert into applications (id, applied_on, applied_at, ${copied})
        select gen_random_uuid(), '2026-05-20', applied_at + interval '8 days' + g * interval '1 second', ${copied}
        from applications, generate_series(1, 600) g
        where applications.id = (select id from applications where visit_id = ${visitId} order by applied_at limit 1)`.execute(
      testDb(),
    );
    const res = await get("from=2026-05-01&to=2026-05-31");
    expect(res.status).toBe(200);
    const rows = parse(await res.text(), { columns: RECORD_KEYS, bom: true }) as Record<
      string,
      string
    >[];
    const expected = await testDb()
      .selectFrom("applications")
      .select((eb) => [
        eb.fn.countAll<number>().as("n"),
        eb.fn.sum<number>("product_total_lb").as("lb"),
      ])
      .where("company_id", "=", c.companyId)
      .where("applied_on", ">=", "2026-05-01")
      .where("applied_on", "<=", "2026-05-31")
      .executeTakeFirstOrThrow();
    expect(rows).toHaveLength(Number(expected.n));
    expect(rows).toHaveLength(baseline.length + 600);
    const total = rows.reduce((sum, r) => sum + Number(r.total_product_lb), 0);
    expect(total).toBeCloseTo(Number(expected.lb), 6);
    for (const r of rows) {
      expect(r.customer).toContain("Abel Ferro, ");
      expect(r.customer).toMatch(/Zora Quist.*\(Oyelaran residence\)$/);
    }
  });
});

describe("required record fields per rule set", () => {
  it("Pennsylvania's rule asks for wind and temperature on pesticide applications", async () => {
    const manager = await c.actor("manager");
    const pa = await testDb()
      .selectFrom("rule_sets")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("name", "=", "Pennsylvania applicator records")
      .executeTakeFirstOrThrow();
    await testDb()
      .updateTable("properties")
      .set({ rule_set_id: pa.id })
      .where("id", "=", c.propertyIds["oyelaran"]!)
      .execute();
    const grub = (await listProducts(manager)).find((p) => p.name.startsWith("Grubward"))!;
    await expect(
      recordApplication(manager, visitId, {
        id: newId(),
        zoneId,
        productId: grub.id,
        rateAmount: 2,
        rateUnit: "lb/1000ft2",
        appliedAt: "2026-05-13T10:00:00-04:00",
        windMph: null,
        temperatureF: null,
        isEstablishing: false,
        applicatorName: "Luis Arroyo",
        applicatorLicence: "PA-DEMO-9",
        overrideReason: null,
      }),
    ).rejects.toMatchObject({
      fieldErrors: { windMph: expect.any(Array), temperatureF: expect.any(Array) },
    });
  });
});
