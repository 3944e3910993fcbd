// The day's route through the route handlers Today calls: the demo's first technician's day read
// from the yard (the routing service's fake, then no service: estimated, with the reason), "Put in
// driving order" stored and audited in words, the order set by hand (move up / down), two orders
// sent at once, a day that changed meanwhile, another technician's day, a manager naming whose day,
// and the technician's own start point taking the yard's place.
import type { Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";
import type { DayRouteDto } from "@/lib/day-route/dto";
import { useServices } from "@/lib/services";
import { osrmRouting } from "@/lib/services/routing/client";
import { listVisitAudit } from "@/lib/visits/queries";

import { startFakeRouting } from "../harness/routing-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { callRoute } from "../helpers/route-call";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const routeRoute = await import("@/app/api/v1/today/route/route");
const orderRoute = await import("@/app/api/v1/today/order/route");
const startPointRoute = await import("@/app/api/v1/people/[personId]/start-point/route");

let c: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let fake: Server;
let restore: () => void;
const db = testDb();
const today = todayIn("America/New_York");

beforeAll(async () => {
  c = await createTestCompany();
  [manager, tech1, tech2] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
  ]);
  fake = await startFakeRouting(0);
  restore = useServices({
    routing: osrmRouting({ baseUrl: `http://127.0.0.1:${(fake.address() as AddressInfo).port}` }),
  });
});

afterAll(async () => {
  restore();
  await new Promise<void>((resolve) => fake.close(() => resolve()));
});

const headers = {
  origin: "http://localhost:3000",
  host: "localhost",
  "content-type": "application/json",
};
type Handler = (
  req: Request,
  ctx: { params: Promise<Record<string, string>> },
) => Promise<Response>;

/** A route's answer: the DTO or { changed }, or an error with its field messages. */
type Answer = Record<string, unknown> & {
  changed?: number;
  error: { message: string; fieldErrors: Record<string, string[]> };
};

async function call(
  as: Actor | null,
  handler: Handler,
  method: string,
  body?: unknown,
  query = "",
) {
  current = as;
  const res = await handler(
    new Request(`http://localhost/api${query}`, {
      method,
      headers,
      body: body === undefined ? undefined : JSON.stringify(body),
    }),
    { params: Promise.resolve({}) },
  );
  return { status: res.status, body: (await res.json()) as Answer };
}

const readRoute = async (as: Actor, query = `?date=${today}`) => {
  const r = await call(as, routeRoute.GET as Handler, "GET", undefined, query);
  expect(r.status).toBe(200);
  return r.body as unknown as DayRouteDto;
};

async function storedOrder(technicianKey: string): Promise<string[]> {
  const rows = await db
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select(["properties.name", "visits.stop_order"])
    .where("visits.company_id", "=", c.companyId)
    .where("visits.technician_id", "=", c.userIds[technicianKey]!)
    .where("visits.scheduled_for", "=", today)
    .orderBy("visits.stop_order")
    .execute();
  expect(rows.map((r) => r.stop_order)).toEqual(rows.map((_, i) => i + 1));
  return rows.map((r) => r.name);
}

describe("the day's route", () => {
  it("reads tech1's day from the yard, in stored order, with the service's figures", async () => {
    const route = await readRoute(tech1);
    expect(route.start).toEqual({ kind: "yard", label: "61 Tanager Road, Larkfield" });
    expect(route.estimated).toBe(false);
    expect(route.stops.map((s) => s.propertyName)).toEqual([
      "Oyelaran residence",
      "Haddad residence",
      "Kowalczyk residence",
    ]);
    // Every stop has its drive; the total is their sum and the drive home.
    const sum = route.stops.reduce((m, s) => m + s.leg!.meters, route.returnLeg!.meters);
    expect(route.total.meters).toBeCloseTo(sum, 3);
    // Stored out of driving order on purpose (tests/unit/day-route.test.ts).
    expect(route.inDrivingOrder).toBe(false);
    expect(route.proposed.total.seconds).toBeLessThan(route.total.seconds);
  });

  it("says 'estimated' and why when no routing service is set up", async () => {
    const back = useServices({ routing: null });
    try {
      const route = await readRoute(tech1);
      expect(route).toMatchObject({
        estimated: true,
        estimateReason: "no routing service is set up",
      });
    } finally {
      back();
    }
  });

  it("Put in driving order stores the proposal, audits each stop in words, and is then a no-op", async () => {
    const before = await readRoute(tech1);
    const r = await call(tech1, routeRoute.POST as Handler, "POST", { date: today });
    expect(r.status).toBe(200);
    expect(r.body.changed).toBeGreaterThan(0);
    const after = await readRoute(tech1);
    expect(after.inDrivingOrder).toBe(true);
    expect(after.stops.map((s) => s.visitId)).toEqual(before.proposed.visitIds);
    expect(after.total.seconds).toBeCloseTo(before.proposed.total.seconds, 3);
    const trail = await listVisitAudit(manager, before.proposed.visitIds[0]!);
    expect(trail.map((e) => e.sentence).join("\n")).toMatch(
      /Stop put in driving order: stop number \d → 1/,
    );
    const again = await call(tech1, routeRoute.POST as Handler, "POST", { date: today });
    expect(again.body.changed).toBe(0);
  });

  it("the order set by hand is stored and audited; a list that is not the day's is refused", async () => {
    const route = await readRoute(tech1);
    const ids = route.stops.map((s) => s.visitId);
    const swapped = [ids[1]!, ids[0]!, ids[2]!];
    const r = await call(tech1, orderRoute.PUT as Handler, "PUT", {
      date: today,
      visitIds: swapped,
    });
    expect(r).toEqual({ status: 200, body: { changed: 2 } });
    expect((await readRoute(tech1)).stops.map((s) => s.visitId)).toEqual(swapped);
    const trail = await listVisitAudit(manager, ids[0]!);
    expect(trail.map((e) => e.sentence).join("\n")).toMatch(
      /Stop order changed by hand: stop number 1 → 2/,
    );

    const missing = await call(tech1, orderRoute.PUT as Handler, "PUT", {
      date: today,
      visitIds: swapped.slice(0, 2),
    });
    expect(missing.status).toBe(409);
    expect(missing.body.error.message).toMatch(/reload Today/);
    const twice = await call(tech1, orderRoute.PUT as Handler, "PUT", {
      date: today,
      visitIds: [ids[0], ids[0], ids[1]],
    });
    expect(twice.status).toBe(422);
    expect(twice.body.error.fieldErrors.visitIds?.[0]).toMatch(/each stop of the day once/);
    expect((await readRoute(tech1)).stops.map((s) => s.visitId)).toEqual(swapped);
  });

  it("two orders sent at once: both land one after the other, the numbers stay 1…n", async () => {
    const ids = (await readRoute(tech1)).stops.map((s) => s.visitId);
    const a = [ids[2]!, ids[1]!, ids[0]!];
    const b = [ids[1]!, ids[2]!, ids[0]!];
    const [ra, rb] = await Promise.all([
      call(tech1, orderRoute.PUT as Handler, "PUT", { date: today, visitIds: a }),
      call(tech1, orderRoute.PUT as Handler, "PUT", { date: today, visitIds: b }),
    ]);
    expect([ra.status, rb.status]).toEqual([200, 200]);
    const final = (await readRoute(tech1)).stops.map((s) => s.visitId);
    expect([a, b]).toContainEqual(final);
    await storedOrder("tech1");
  });

  it("another technician's day is not found; a manager must say whose day", async () => {
    const r = await call(
      tech2,
      routeRoute.GET as Handler,
      "GET",
      undefined,
      `?date=${today}&technicianId=${c.userIds.tech1}`,
    );
    expect(r.status).toBe(404);
    const noTech = await call(
      manager,
      routeRoute.GET as Handler,
      "GET",
      undefined,
      `?date=${today}`,
    );
    expect(noTech.status).toBe(422);
    expect(noTech.body.error.fieldErrors.technicianId?.[0]).toMatch(/whose day/);
    const asManager = await readRoute(manager, `?date=${today}&technicianId=${c.userIds.tech1}`);
    expect(asManager.stops).toHaveLength(3);
    const foreign = await call(
      manager,
      routeRoute.GET as Handler,
      "GET",
      undefined,
      `?date=${today}&technicianId=00000000-0000-4000-8000-000000000000`,
    );
    expect(foreign.status).toBe(422);
    // tech2 cannot reorder tech1's day either.
    const ids = asManager.stops.map((s) => s.visitId);
    const reorder = await call(tech2, orderRoute.PUT as Handler, "PUT", {
      date: today,
      visitIds: ids,
      technicianId: c.userIds.tech1,
    });
    expect(reorder.status).toBe(404);
  });

  it("a technician's own start point takes the yard's place", async () => {
    const route = await readRoute(tech2);
    expect(route.start).toEqual({ kind: "start_point", label: "Home, Cattail Court" });
    expect(route.stops.map((s) => s.propertyName)).toEqual([
      "Hollis Mill Commons (HOA green)",
      "Brandvold residence",
    ]);
  });

  it("a day far from today and a date that is not one", async () => {
    const far = await readRoute(tech1, "?date=2031-06-15");
    expect(far).toMatchObject({
      stops: [],
      total: { meters: 0, seconds: 0 },
      inDrivingOrder: true,
    });
    const bad = await call(tech1, routeRoute.GET as Handler, "GET", undefined, "?date=2026-02-30");
    expect(bad.status).toBe(422);
    const nul = await call(tech1, routeRoute.POST as Handler, "POST", { date: "2026-12-03\u0000" });
    expect(nul.status).toBe(422);
  });

  it("a manager sets, refuses, and clears a technician's start point on People; the route follows", async () => {
    const put = (as: Actor | null, personId: string, body: unknown) => {
      current = as;
      return callRoute(startPointRoute.PUT as Handler, body, {
        method: "PUT",
        params: { personId },
      });
    };
    const tech1Id = c.userIds.tech1!;
    const saved = await put(manager, tech1Id, {
      address: "Home, 14 Reed Lane",
      latitude: 40.3189,
      longitude: -74.7012,
    });
    expect(saved.status).toBe(200);
    expect((await readRoute(tech1)).start).toEqual({
      kind: "start_point",
      label: "Home, 14 Reed Lane",
    });
    const audit = await db
      .selectFrom("audit_events")
      .select(["action", "changes"])
      .where("entity_id", "=", tech1Id)
      .where("action", "like", "%start_point")
      .orderBy("id")
      .execute();
    expect(audit.map((a) => a.action)).toEqual(["set_start_point"]);
    expect(audit[0]!.changes).toEqual({
      startPoint: {
        from: null,
        to: { address: "Home, 14 Reed Lane", location: [40.3189, -74.7012] },
      },
    });

    // Refusals name the field and keep what was saved.
    const half = await put(manager, tech1Id, { address: "", latitude: 40.1, longitude: null });
    expect(half.status).toBe(422);
    expect(half.body.error?.fieldErrors?.longitude?.[0]).toBe(
      "Start point location: give both the latitude and the longitude, or neither.",
    );
    const far = await put(manager, tech1Id, { address: "", latitude: 95, longitude: -74.7 });
    expect(far.body.error?.fieldErrors?.latitude?.[0]).toBe(
      "Start point latitude: between -90 and 90.",
    );
    const text = await put(manager, tech1Id, { address: "", latitude: "forty", longitude: -74.7 });
    expect(text.status).toBe(422);
    const nul = await put(manager, tech1Id, {
      address: "Home\u0000",
      latitude: 40,
      longitude: -74,
    });
    expect(nul.status).toBe(422);
    const long = await put(manager, tech1Id, {
      address: "x".repeat(201),
      latitude: 40,
      longitude: -74,
    });
    expect(long.body.error?.fieldErrors?.address?.[0]).toBe(
      "Start point address: at most 200 characters.",
    );
    // A manager has no route; a technician cannot set anyone's; a person of no company of ours.
    expect(
      (await put(manager, c.userIds.manager!, { address: "", latitude: 40, longitude: -74 }))
        .status,
    ).toBe(422);
    expect((await put(tech1, tech1Id, { address: "", latitude: 40, longitude: -74 })).status).toBe(
      403,
    );
    expect(
      (
        await put(manager, "00000000-0000-4000-8000-000000000000", {
          address: "",
          latitude: 40,
          longitude: -74,
        })
      ).status,
    ).toBe(404);
    expect((await readRoute(tech1)).start).toEqual({
      kind: "start_point",
      label: "Home, 14 Reed Lane",
    });

    // Cleared: the yard again.
    const cleared = await put(manager, tech1Id, { address: "", latitude: null, longitude: null });
    expect(cleared.status).toBe(200);
    expect((await readRoute(tech1)).start).toEqual({
      kind: "yard",
      label: "61 Tanager Road, Larkfield",
    });
  });
});
