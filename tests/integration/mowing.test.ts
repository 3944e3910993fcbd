// The height before mowing, through the route technicians' phones hit
// (PUT /api/v1/visits/:visitId/zone-checks/:zoneCheckId): stored with its "mowed today" state, read
// by the one-third rule (lib/reference/mowing.ts: the rule as extension services teach it) at once
// in the alerts API; a body from a form older than the field still saves; contradictory readings
// get a clear 422 and change nothing.
import { beforeAll, describe, expect, it, vi } from "vitest";

import type { Actor } from "@/lib/auth/actor";
import { valuesOf } from "@/lib/visits/map";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const alerts = await import("@/app/api/v1/alerts/route");
const zoneCheck = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");

let c: TestCompany;
let visitId: string;
let checkId: string;
let zoneId: string;
const headers = {
  origin: "http://localhost:3000",
  host: "localhost",
  "content-type": "application/json",
};

async function call<P>(
  handler: (req: Request, ctx: { params: Promise<P> }) => Promise<Response>,
  params: P,
  init: { method?: string; body?: unknown; url?: string } = {},
) {
  const res = await handler(
    new Request(`http://localhost${init.url ?? "/api/x"}`, {
      method: init.method ?? "GET",
      headers,
      body: init.body === undefined ? undefined : JSON.stringify(init.body),
    }),
    { params: Promise.resolve(params) },
  );
  return { status: res.status, json: await res.json() };
}

const row = () =>
  testDb()
    .selectFrom("zone_checks")
    .selectAll()
    .where("id", "=", checkId)
    .executeTakeFirstOrThrow();

/** A manager's correction of the finished visit's check: it carries its reason. */
async function put(body: Record<string, unknown>) {
  return call(
    zoneCheck.PUT,
    { visitId, zoneCheckId: checkId },
    { method: "PUT", body: { correctionReason: "Readings taken again at the lawn.", ...body } },
  );
}

async function mowingAlert() {
  const list = await call(alerts.GET, {}, { url: "/api/v1/alerts?status=all" });
  return (
    list.json as {
      items: {
        kind: string;
        status: string;
        severity: string;
        summary: string;
        zone: { id: string } | null;
        evidence: { values: Record<string, unknown> };
      }[];
    }
  ).items.find(
    (a) => a.kind === "mowing_too_short" && a.zone?.id === zoneId && a.status === "open",
  );
}

beforeAll(async () => {
  c = await createTestCompany();
  const latest = await testDb()
    .selectFrom("zone_checks")
    .innerJoin("visits", "visits.id", "zone_checks.visit_id")
    .innerJoin("zones", "zones.id", "zone_checks.zone_id")
    .select(["zone_checks.id", "zone_checks.visit_id", "zone_checks.zone_id", "visits.status"])
    .where("visits.property_id", "=", c.propertyIds["oyelaran"]!)
    .where("zones.grass_species", "=", "tall_fescue")
    .where("zone_checks.status", "=", "done")
    .orderBy("visits.scheduled_for", "desc")
    .executeTakeFirstOrThrow();
  expect(latest.status).toBe("completed");
  visitId = latest.visit_id;
  checkId = latest.id;
  zoneId = latest.zone_id;
  current = await c.actor("manager"); // a manager's correction of a finished visit
});

describe("height before mowing and the one-third rule, through the zone-check route", () => {
  it("5 in before mowing, cut to 3 in: stored, and a mowing alert with the readings at once", async () => {
    const before = await row();
    expect(await mowingAlert()).toBeUndefined();
    const res = await put({
      ...valuesOf(before),
      mowedToday: true,
      heightBeforeMowingIn: 5,
      heightOfCutIn: 3,
      baseVersion: before.version,
    });
    expect(res.status).toBe(200);
    expect(res.json).toMatchObject({ mowedToday: true, heightBeforeMowingIn: 5, heightOfCutIn: 3 });
    const saved = await row();
    expect(saved.mowed_today).toBe(true);
    expect(Number(saved.height_before_mowing_in)).toBe(5);
    const alert = await mowingAlert();
    expect(alert).toMatchObject({ severity: "low" });
    expect(alert!.evidence.values).toMatchObject({ heightBeforeMowingIn: 5, removedPct: 40 });
    expect(alert!.summary).toMatch(/taking off 40 % of the blade/);
  });

  it("contradictory readings get a 422 that says what to fix, and nothing changes", async () => {
    const before = await row();
    const base = { ...valuesOf(before), baseVersion: before.version };
    const shorter = await put({ ...base, heightBeforeMowingIn: 2.5, heightOfCutIn: 3 });
    expect(shorter.status).toBe(422);
    expect(shorter.json.error.fieldErrors.heightBeforeMowingIn[0]).toMatch(
      /cannot be shorter than the height of cut/,
    );
    const notMowed = await put({ ...base, mowedToday: false, heightBeforeMowingIn: 5 });
    expect(notMowed.status).toBe(422);
    expect(notMowed.json.error.fieldErrors.heightBeforeMowingIn[0]).toMatch(/mowed today/);
    const text = await put({ ...base, heightBeforeMowingIn: "tall" });
    expect(text.status).toBe(422);
    expect(await row()).toEqual(before);
  });

  it("not mowed today is a state of its own; a body from a form older than the field still saves", async () => {
    const before = await row();
    const res = await put({
      ...valuesOf(before),
      mowedToday: false,
      heightBeforeMowingIn: null,
      baseVersion: before.version,
    });
    expect(res.status).toBe(200);
    expect((await row()).mowed_today).toBe(false);

    // What a form loaded before the field existed sends: no mowedToday, no heightBeforeMowingIn.
    const now = await row();
    const { mowedToday: _m, heightBeforeMowingIn: _h, ...old } = valuesOf(now);
    const oldClient = await put({
      ...old,
      notes: "sent by an older page",
      baseVersion: now.version,
    });
    expect(oldClient.status).toBe(200);
    const saved = await row();
    expect(saved.notes).toBe("sent by an older page");
    expect(saved.mowed_today).toBe(false); // kept: that form cannot erase what it does not show
    expect(saved.height_before_mowing_in).toBeNull();
  });

  it("an older form's body keeps a stored height before mowing, and must still agree with it", async () => {
    const before = await row();
    expect(
      (
        await put({
          ...valuesOf(before),
          mowedToday: true,
          heightBeforeMowingIn: 4,
          heightOfCutIn: 3,
          baseVersion: before.version,
        })
      ).status,
    ).toBe(200);
    const now = await row();
    const { mowedToday: _m, heightBeforeMowingIn: _h, ...old } = valuesOf(now);
    // Cut raised to 4.5 in by a page that cannot see the 4 in before mowing: refused, not stored.
    const res = await put({ ...old, heightOfCutIn: 4.5, baseVersion: now.version });
    expect(res.status).toBe(422);
    expect(res.json.error.fieldErrors.heightBeforeMowingIn[0]).toMatch(/cannot be shorter/);
    expect(await row()).toEqual(now);
    const ok = await put({ ...old, heightOfCutIn: 3.25, baseVersion: now.version });
    expect(ok.status).toBe(200);
    const saved = await row();
    expect(saved.mowed_today).toBe(true);
    expect(Number(saved.height_of_cut_in)).toBe(3.25);
    expect(Number(saved.height_before_mowing_in)).toBe(4);
  });

  it("the database refuses a height before mowing without a mowing, whatever writes it", async () => {
    await expect(
      testDb()
        .updateTable("zone_checks")
        .set({ mowed_today: false, height_before_mowing_in: 4 })
        .where("id", "=", checkId)
        .execute(),
    ).rejects.toThrow(/zone_checks_height_before_mowing_needs_mowing/);
  });
});
