// The book's map data (GET /api/v1/book/map) and pressure areas read from the alerts: scope (the
// manager's own company only), the book's filters, malformed values; the demo's dollar spot area
// (fixtures/demo/scenario.ts) found from its alerts, gone at once when an alert is resolved, and
// changed at once by the company's settings; "Check soon" on the book, the map and the property;
// the managers' digest naming a new area once, in the outbox.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { demoCompany, otherCompany } from "@/fixtures/demo/scenario";
import { seedPressureArea } from "@/fixtures/demo/seed-scenario";
import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import type { BookMapDto } from "@/lib/book/dto";
import { listBook } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";
import { addDays, todayIn } from "@/lib/dates";
import { savePressureSettings } from "@/lib/pressure-areas/mutations";
import { findPropertyCheckSoon, listPressureAreas } from "@/lib/pressure-areas/queries";
import { queuePressureAreaDigests } from "@/lib/risk-alerts/digest";
import { resolveAlert } from "@/lib/risk-alerts/mutations";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const mapRoute = await import("@/app/api/v1/book/map/route");
const get = async (path: string) => mapRoute.GET(new Request(`http://localhost${path}`));
const mapOf = async (path = "/api/v1/book/map") => {
  const res = await get(path);
  expect(res.status, path).toBe(200);
  return (await res.json()) as BookMapDto;
};

let c: TestCompany;
let other: TestCompany;
const today = todayIn("America/New_York");
const AREA = demoCompany.pressureArea!;
const areaKeys = AREA.alerts.map((a) => a.property);

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  for (const id of Object.values(c.propertyIds))
    await evaluateProperty(testDb(), c.companyId, id, { provider: null });
  await seedPressureArea(testDb(), demoCompany, c, today);
});

describe("the map data", () => {
  it("has every property of the manager's book, once, with its location, Index and open alerts", async () => {
    current = await c.actor("manager");
    const data = await mapOf();
    expect(data.points.map((p) => p[0]).sort()).toEqual(Object.values(c.propertyIds).sort());
    const byId = new Map(data.points.map((p) => [p[0], p]));
    for (const p of demoCompany.properties) {
      const point = byId.get(c.propertyIds[p.key]!)!;
      expect(point[1]).toBe(p.name);
      expect(point[2]).toBeCloseTo(p.latitude, 5);
      expect(point[3]).toBeCloseTo(p.longitude, 5);
    }
    // The book's rows say the same about Index and alerts.
    const book = await listBook(current, bookQuery.parse({ limit: 100 }));
    for (const row of book.rows) {
      const point = byId.get(row.propertyId)!;
      expect(point[4]).toBe(row.latestIndex === null ? null : Math.round(row.latestIndex));
      expect(point[5]).toEqual([row.alerts.high, row.alerts.moderate, row.alerts.low]);
      expect(point[6].map((k) => data.kinds[k]).sort()).toEqual([...row.alertKinds].sort());
    }
    // Other companies' properties never appear.
    const otherIds = new Set(Object.values(other.propertyIds));
    expect(data.points.some((p) => otherIds.has(p[0]))).toBe(false);
  });

  it("takes the book's filters: kind, text, technician", async () => {
    current = await c.actor("manager");
    const dollar = await mapOf("/api/v1/book/map?kind=dollar_spot_weather");
    expect(dollar.points.map((p) => p[0]).sort()).toEqual(
      areaKeys.map((k) => c.propertyIds[k]!).sort(),
    );
    const text = await mapOf("/api/v1/book/map?q=sedgefield");
    expect(text.points.map((p) => p[1])).toEqual(["Haddad residence"]);
    const tech = demoCompany.properties.filter((p) => p.technician === "tech1").length;
    const byTech = await mapOf(`/api/v1/book/map?technician=${c.userIds["tech1"]}`);
    expect(byTech.points).toHaveLength(tech);
  });

  it("malformed filter values fall back as on the book; control characters in text are dropped", async () => {
    current = await c.actor("manager");
    const all = await mapOf();
    for (const path of [
      "/api/v1/book/map?kind=not_a_kind",
      "/api/v1/book/map?technician=nope",
      "/api/v1/book/map?severity=%00",
      "/api/v1/book/map?limit=-4&after=%FF%FE",
    ])
      expect((await mapOf(path)).points).toHaveLength(all.points.length);
    const nul = await mapOf("/api/v1/book/map?q=sedge%00field");
    expect(nul.points.map((p) => p[1])).toEqual(["Haddad residence"]);
  });

  it("is the manager's: technicians and homeowners are refused, signed-out people too", async () => {
    for (const who of ["tech1", "owner1"]) {
      current = await c.actor(who);
      expect((await get("/api/v1/book/map")).status, who).toBe(403);
    }
    current = null;
    expect((await get("/api/v1/book/map")).status).toBe(401);
  });
});

describe("pressure areas", () => {
  it("the demo's three dollar spot alerts make one area, with its dates and weather evidence", async () => {
    const manager = await c.actor("manager");
    const view = await listPressureAreas(manager);
    expect(view.settings).toEqual({ distanceMi: AREA.distanceMi, days: 7, minProperties: 3 });
    expect(view.areas).toHaveLength(1);
    const area = view.areas[0]!;
    expect(area.kind).toBe("dollar_spot_weather");
    expect(
      area.properties
        .filter((p) => p.isMember)
        .map((p) => p.id)
        .sort(),
    ).toEqual(areaKeys.map((k) => c.propertyIds[k]!).sort());
    const days = AREA.alerts.map((a) => a.daysAgo);
    expect(area.firstOn).toBe(addDays(today, -Math.max(...days)));
    expect(area.latestOn).toBe(addDays(today, -Math.min(...days)));
    expect(area.alerts).toHaveLength(3);
    for (const a of area.alerts) {
      expect(a.evidence.values.probabilityPct).toBeGreaterThanOrEqual(20);
      expect(a.evidence.values.rhMean5dPct).toBeGreaterThanOrEqual(84);
    }
    // Other companies see none of it.
    expect((await listPressureAreas(await other.actor("manager"))).areas).toEqual([]);
  });

  it("is for managers only", async () => {
    await expect(listPressureAreas(await c.actor("tech1"))).rejects.toMatchObject({
      code: "forbidden",
    });
    expect(await findPropertyCheckSoon(await c.actor("tech1"), c.propertyIds["okafor"]!)).toBe(
      null,
    );
  });

  it("flags Check soon on the book, the map and the property for lawns inside it without a visit in the window", async () => {
    const manager = await c.actor("manager");
    const area = (await listPressureAreas(manager)).areas[0]!;
    const soon = area.properties.filter((p) => p.checkSoon).map((p) => p.id);
    // Each flag agrees with the last visit: none, or more than 7 days ago.
    for (const p of area.properties)
      expect(p.checkSoon, p.name).toBe(
        p.lastVisitOn === null || p.lastVisitOn < addDays(today, -7),
      );
    expect(soon.length).toBeGreaterThan(0); // the demo's lawns are visited every few weeks
    expect(area.properties.length).toBeGreaterThan(3); // Haddad lies inside the drawn circle too
    const book = await listBook(manager, bookQuery.parse({ limit: 100 }));
    expect(
      book.rows
        .filter((r) => r.checkSoon)
        .map((r) => r.propertyId)
        .sort(),
    ).toEqual([...soon].sort());
    current = manager;
    const map = await mapOf();
    expect(
      map.points
        .filter((p) => p[7] === 1)
        .map((p) => p[0])
        .sort(),
    ).toEqual([...soon].sort());
    for (const id of Object.values(c.propertyIds)) {
      const flag = await findPropertyCheckSoon(manager, id);
      expect(flag !== null, id).toBe(soon.includes(id));
    }
    // A visit finished today takes the flag off at once.
    const target = soon[0]!;
    {
      await testDb()
        .updateTable("property_summaries")
        .set({ last_visit_on: today })
        .where("property_id", "=", target)
        .execute();
      expect(await findPropertyCheckSoon(manager, target)).toBe(null);
      const after = await listBook(manager, bookQuery.parse({ limit: 100 }));
      expect(after.rows.find((r) => r.propertyId === target)!.checkSoon).toBe(false);
    }
  });

  it("the digest names a new area once, through the outbox, to each manager", async () => {
    const queued = await queuePressureAreaDigests(testDb(), {
      appUrl: "http://localhost:3000",
      companyIds: [c.companyId],
      today,
    });
    expect(queued).toEqual({ messages: 1, areas: 1 });
    const mails = await testDb()
      .selectFrom("mail_outbox")
      .selectAll()
      .where("company_id", "=", c.companyId)
      .where("kind", "=", "pressure_area_digest")
      .execute();
    expect(mails).toHaveLength(1);
    expect(mails[0]!.to_address).toBe(c.emails["manager"]);
    expect(mails[0]!.subject).toMatch(/^1 new pressure area in Larkmoor Lawn Care/);
    for (const key of areaKeys) {
      const name = demoCompany.properties.find((p) => p.key === key)!.name;
      expect(mails[0]!.text_body).toContain(name);
    }
    expect(mails[0]!.text_body).toMatch(/^• Dollar spot weather: 3 properties/m);
    expect(mails[0]!.text_body).toMatch(/follow the product label/);
    expect(mails[0]!.html_body).toContain(
      'href="http://localhost:3000/risk-alerts#pressure-areas"',
    );
    // Again, and twice at once: nothing new.
    const again = await Promise.all([
      queuePressureAreaDigests(testDb(), {
        appUrl: "http://x.test",
        companyIds: [c.companyId],
        today,
      }),
      queuePressureAreaDigests(testDb(), {
        appUrl: "http://x.test",
        companyIds: [c.companyId],
        today,
      }),
    ]);
    expect(again).toEqual([
      { messages: 0, areas: 0 },
      { messages: 0, areas: 0 },
    ]);
  });

  it("the company's settings change the areas at once", async () => {
    const manager = await c.actor("manager");
    // Oyelaran is 1.40 mi from Okafor, 1.77 from the Commons: at 1 mi it is no one's neighbor.
    await savePressureSettings(manager, { distanceMi: 1, days: 7, minProperties: 3 });
    expect((await listPressureAreas(manager)).areas).toEqual([]);
    await savePressureSettings(manager, { distanceMi: 1.5, days: 1, minProperties: 3 });
    expect((await listPressureAreas(manager)).areas).toEqual([]); // alerts 2 days apart
    await savePressureSettings(manager, { distanceMi: 1.5, days: 7, minProperties: 2 });
    expect((await listPressureAreas(manager)).areas).toHaveLength(1);
    await savePressureSettings(manager, { distanceMi: AREA.distanceMi, days: 7, minProperties: 3 });
    expect((await listPressureAreas(manager)).areas).toHaveLength(1);
  });

  it("resolving one of its alerts takes the area away at once (two lawns are not an area)", async () => {
    const manager = await c.actor("manager");
    const alert = await testDb()
      .selectFrom("risk_alerts")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("property_id", "=", c.propertyIds["okafor"]!)
      .where("kind", "=", "dollar_spot_weather")
      .executeTakeFirstOrThrow();
    await resolveAlert(manager, alert.id, "Looked at the lawn: no dollar spot.");
    expect((await listPressureAreas(manager)).areas).toEqual([]);
    const book = await listBook(manager, bookQuery.parse({ limit: 100 }));
    expect(book.rows.some((r) => r.checkSoon)).toBe(false);
  });
});
