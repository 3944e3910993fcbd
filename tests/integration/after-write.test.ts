// The after-write step, through the route handlers users hit: a correction on a finished visit, a
// photo that drops cover, a watering, an application and a zone archive each show in the book API
// (GET /api/v1/book) and the alerts API (GET /api/v1/alerts) at once — and a full evaluation run
// straight afterwards (the daily sweep's path) changes neither, so nothing was left for it to do.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";
import { listProducts } from "@/lib/products/queries";
import { propertyIndex } from "@/lib/scoring/sward-index";
import { valuesOf } from "@/lib/visits/map";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { uniformImage } from "../helpers/images";
import { newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const book = await import("@/app/api/v1/book/route");
const alerts = await import("@/app/api/v1/alerts/route");
const zoneCheck = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");
const photos = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route");
const waterings = await import("@/app/api/v1/properties/[propertyId]/waterings/route");
const applications = await import("@/app/api/v1/visits/[visitId]/applications/route");
const zoneArchive = await import("@/app/api/v1/zones/[zoneId]/archive/route");

let c: TestCompany;
let propertyId: string;
let visitId: string; // the property's latest finished visit
const headers = {
  origin: "http://localhost:3000",
  host: "localhost",
  "content-type": "application/json",
};

async function call<P>(
  handler: (req: Request, ctx: { params: Promise<P> }) => Promise<Response>,
  params: P,
  init: { method?: string; body?: unknown; bytes?: Uint8Array<ArrayBuffer>; url?: string } = {},
) {
  const res = await handler(
    new Request(`http://localhost${init.url ?? "/api/x"}`, {
      method: init.method ?? "GET",
      headers: init.bytes ? { ...headers, "content-type": "image/jpeg" } : headers,
      body: init.bytes ?? (init.body === undefined ? undefined : JSON.stringify(init.body)),
    }),
    { params: Promise.resolve(params) },
  );
  const json = await res.json();
  if (res.status >= 300) throw new Error(`${res.status}: ${JSON.stringify(json)}`);
  return json;
}

interface BookRowJson {
  propertyId: string;
  latestIndex: number | null;
  nYtdLb: number;
  alerts: { high: number; moderate: number; low: number };
  alertKinds: string[];
  attentionScore: number;
  reasons: string[];
}
interface AlertJson {
  id: string;
  kind: string;
  status: string;
  severity: string;
  summary: string;
  zone: { id: string } | null;
  property: { id: string };
}

/** What the two APIs say about the property right now. */
async function seen() {
  const page = (await call(book.GET, {}, { url: "/api/v1/book?limit=100" })) as {
    rows: BookRowJson[];
  };
  const row = page.rows.find((r) => r.propertyId === propertyId)!;
  const list = (await call(alerts.GET, {}, { url: "/api/v1/alerts?status=all" })) as {
    items: AlertJson[];
  };
  const live = list.items
    .filter((a) => a.property.id === propertyId && a.status !== "resolved")
    .map((a) => ({
      id: a.id,
      kind: a.kind,
      zone: a.zone?.id ?? null,
      status: a.status,
      severity: a.severity,
      summary: a.summary,
    }))
    .sort((a, b) => a.id.localeCompare(b.id));
  return { row, live };
}

/** The sweep's path finds nothing to change: the write had already brought everything up to date. */
async function expectNothingLeftForTheSweep(before: Awaited<ReturnType<typeof seen>>) {
  const s = await evaluateProperty(testDb(), c.companyId, propertyId, { provider: null });
  expect(s.raised + s.reopened + s.updated + s.cleared + s.autoResolved).toBe(0);
  expect(await seen()).toEqual(before);
}

/** The property index of a visit from its stored checks (area-weighted, active zones). */
async function storedVisitIndex(id: string) {
  const rows = await testDb()
    .selectFrom("zone_checks")
    .innerJoin("zones", "zones.id", "zone_checks.zone_id")
    .select(["zone_checks.sward_index", "zones.area_ft2"])
    .where("zone_checks.visit_id", "=", id)
    .where("zones.archived_at", "is", null)
    .where("zone_checks.sward_index", "is not", null)
    .execute();
  return propertyIndex(rows.map((r) => ({ index: r.sward_index!, areaFt2: Number(r.area_ft2) })));
}

beforeAll(async () => {
  c = await createTestCompany();
  propertyId = c.propertyIds["oyelaran"]!;
  await evaluateProperty(testDb(), c.companyId, propertyId, { provider: null });
  const latest = await testDb()
    .selectFrom("visits")
    .innerJoin("zone_checks", "zone_checks.visit_id", "visits.id")
    .select(["visits.id", "visits.status"])
    .where("visits.property_id", "=", propertyId)
    .where("visits.status", "!=", "cancelled")
    .where("zone_checks.sward_index", "is not", null)
    .orderBy("visits.scheduled_for", "desc")
    .executeTakeFirstOrThrow();
  expect(latest.status).toBe("completed");
  visitId = latest.id;
  current = await c.actor("manager");
});

describe("a write shows in the book and the alerts at once", () => {
  it("a manager's correction of a rating on a finished visit", async () => {
    const before = await seen();
    // A zone without torn tips so far.
    const check = (
      await testDb()
        .selectFrom("zone_checks")
        .selectAll()
        .where("visit_id", "=", visitId)
        .where("status", "=", "done")
        .orderBy("id")
        .execute()
    ).find((c) => !before.live.some((a) => a.kind === "torn_tips" && a.zone === c.zone_id))!;
    expect(check).toBeDefined();

    await call(
      zoneCheck.PUT,
      { visitId, zoneCheckId: check.id },
      {
        method: "PUT",
        body: {
          ...valuesOf(check),
          quality: 2,
          color: 3,
          density: 2,
          hasTornTips: true,
          baseVersion: check.version,
          correctionReason: "Torn tips missed at the visit; the crew's photos show them.",
        },
      },
    );

    const after = await seen();
    expect(after.row.latestIndex).not.toBeCloseTo(before.row.latestIndex!, 3);
    expect(after.row.latestIndex).toBeCloseTo((await storedVisitIndex(visitId))!, 6);
    expect(after.live).toContainEqual(
      expect.objectContaining({ kind: "torn_tips", zone: check.zone_id, status: "open" }),
    );
    expect(after.row.alerts.low).toBe(before.row.alerts.low + 1);
    expect(after.row.alertKinds).toContain("torn_tips");
    await expectNothingLeftForTheSweep(after);
  });

  it("a photo that shows little green cover, added to the finished visit", async () => {
    const before = await seen();
    const check = await testDb()
      .selectFrom("zone_checks")
      .select(["id", "sward_index"])
      .where("visit_id", "=", visitId)
      .where("status", "=", "done")
      .orderBy("created_at", "desc")
      .executeTakeFirstOrThrow();
    const bare = await uniformImage([150, 120, 80], 96); // dry soil: no green pixels
    const photo = (await call(
      photos.POST,
      { visitId, zoneCheckId: check.id },
      {
        method: "POST",
        bytes: new Uint8Array(bare),
        url: `/api/x?correctionReason=${encodeURIComponent("The bare patch's photo was left out.")}`,
      },
    )) as { greenCoverPct: number };
    expect(photo.greenCoverPct).toBeLessThan(5);

    const stored = await testDb()
      .selectFrom("zone_checks")
      .select("sward_index")
      .where("id", "=", check.id)
      .executeTakeFirstOrThrow();
    expect(stored.sward_index!).toBeLessThan(check.sward_index!);
    const after = await seen();
    expect(after.row.latestIndex!).toBeLessThan(before.row.latestIndex!);
    expect(after.row.latestIndex).toBeCloseTo((await storedVisitIndex(visitId))!, 6);
    await expectNothingLeftForTheSweep(after);
  });

  it("an application recorded on the finished visit", async () => {
    const before = await seen();
    const zone = await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", propertyId)
      .where("archived_at", "is", null)
      .orderBy("sort_order")
      .executeTakeFirstOrThrow();
    const product = (await listProducts(current!)).find((p) => p.name.startsWith("Quickgreen"))!;
    await call(
      applications.POST,
      { visitId },
      {
        method: "POST",
        body: {
          id: newId(),
          zoneId: zone.id,
          productId: product.id,
          rateAmount: 4,
          rateUnit: "lb/1000ft2",
          windMph: 3,
          temperatureF: 70,
          isEstablishing: false,
          applicatorName: "",
          applicatorLicence: "",
          overrideReason: "Test of the book's N to date.",
          overrideCategory: "research_plot",
          correctionReason: "Recorded on paper at the visit; entered afterwards.",
        },
      },
    );
    const after = await seen();
    expect(after.row.nYtdLb).toBeGreaterThan(before.row.nYtdLb);
    await expectNothingLeftForTheSweep(after);
  });

  it("a watering", async () => {
    await call(
      waterings.POST,
      { propertyId },
      {
        method: "POST",
        body: {
          id: newId(),
          zoneId: null,
          wateredOn: todayIn("America/New_York"),
          depthIn: 1.5,
          runMinutes: null,
          precipitationRateInPerHour: null,
          notes: "",
        },
      },
    );
    await expectNothingLeftForTheSweep(await seen());
  });

  it("a zone archived: its checks leave the property index", async () => {
    const before = await seen();
    const zoneId = before.live.find((a) => a.kind === "torn_tips")!.zone!;
    await call(zoneArchive.POST, { zoneId }, { method: "POST", body: { archived: true } });
    const after = await seen();
    expect(after.row.latestIndex).toBeCloseTo((await storedVisitIndex(visitId))!, 6);
    expect(after.row.latestIndex).not.toBeCloseTo(before.row.latestIndex!, 3);
    await expectNothingLeftForTheSweep(after);
  });
});
