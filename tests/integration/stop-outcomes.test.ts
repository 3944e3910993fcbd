// A stop called off as a whole and rescheduled, and the applicator remembered per person, through
// the route handlers the screens post to: a reason is required and bounded, out of scope is 404
// (another company, a technician the stop is not assigned to), a finished visit cannot be rained
// out, saved zone checks are kept but count nowhere, the change is audited, the day offered is
// free; the rescheduled visit copies the stop; the applicator typed on a pesticide record fills the
// next one.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { saveZoneCheck, scheduleVisit } from "@/lib/visits/mutations";
import { getVisit, getZoneHistory, listTodayStops } from "@/lib/visits/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const cancelRoute = await import("@/app/api/v1/visits/[visitId]/cancel/route");
const rescheduleRoute = await import("@/app/api/v1/visits/[visitId]/reschedule/route");
const applicationsRoute = await import("@/app/api/v1/visits/[visitId]/applications/route");
const applicatorRoute = await import("@/app/api/v1/me/applicator/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let owner2: Actor;
const today = todayIn("America/New_York"); // the demo properties' time zone

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, tech2, owner2] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
    c.actor("owner2"),
  ]);
});

interface Answer {
  status: number;
  body: {
    error?: { code: string; message: string; fieldErrors?: Record<string, string[]> };
  } & Record<string, unknown>;
}

async function call(
  as: Actor | null,
  handler: (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>,
  visitId: string,
  body: unknown,
): Promise<Answer> {
  current = as;
  const res = await handler(
    new Request("http://localhost/api", {
      method: "POST",
      body: JSON.stringify(body),
      headers: {
        origin: "http://localhost:3000",
        host: "localhost",
        "content-type": "application/json",
      },
    }),
    { params: Promise.resolve({ visitId }) },
  );
  return { status: res.status, body: (await res.json()) as Answer["body"] };
}
const callOff = (as: Actor | null, visitId: string, body: unknown) =>
  call(as, cancelRoute.POST, visitId, body);
const reschedule = (as: Actor | null, visitId: string, body: unknown) =>
  call(as, rescheduleRoute.POST, visitId, body);

/** tech1's inspection at the Haddad residence today (the demo has its own stop there too). */
const freshVisit = async () =>
  (
    await scheduleVisit(manager, {
      propertyId: c.propertyIds["haddad"]!,
      scheduledFor: today,
      technicianId: tech1.userId,
      plannedService: "inspection",
      stopOrder: 7,
      notes: "Gate code 4410",
      confirmSameDay: true,
    })
  ).id;

const rainedOut = { outcome: "rained_out", reason: "Steady rain since noon, turf saturated" };

describe("POST /api/v1/visits/:visitId/cancel", () => {
  it("needs a reason, within 500 characters, with a message that names the field", async () => {
    const visitId = await freshVisit();
    for (const body of [
      { outcome: "rained_out" },
      { outcome: "rained_out", reason: "  " },
      { outcome: "rained_out", reason: "x".repeat(501) },
    ]) {
      const answer = await callOff(tech1, visitId, body);
      expect(answer.status).toBe(422);
      expect(answer.body.error?.fieldErrors?.reason?.[0]).toMatch(/^Reason: /);
    }
    const noKind = await callOff(tech1, visitId, { outcome: "flooded", reason: "Rain" });
    expect(noKind.status).toBe(422);
    expect(noKind.body.error?.fieldErrors?.outcome?.[0]).toBe(
      "Outcome: choose Rained out or Canceled.",
    );
    // Nothing changed.
    expect((await getVisit(manager, visitId)).status).toBe("scheduled");
    // The last accepted length.
    const ok = await callOff(tech1, visitId, { outcome: "cancelled", reason: "y".repeat(500) });
    expect(ok.status).toBe(200);
  });

  it("is 404 for a technician the stop is not assigned to and for another company; homeowners are refused", async () => {
    const visitId = await freshVisit();
    expect((await callOff(tech2, visitId, rainedOut)).status).toBe(404);
    expect((await callOff(await other.actor("manager"), visitId, rainedOut)).status).toBe(404);
    expect((await callOff(owner2, visitId, rainedOut)).status).toBe(403);
    expect((await callOff(null, visitId, rainedOut)).status).toBe(401);
    expect((await getVisit(manager, visitId)).status).toBe("scheduled");
  });

  it("a finished visit cannot be rained out or canceled", async () => {
    const visitId = randomUUID();
    await testDb()
      .insertInto("visits")
      .values({
        id: visitId,
        company_id: c.companyId,
        property_id: c.propertyIds["haddad"]!,
        technician_id: tech1.userId,
        scheduled_for: addDays(today, -3),
        planned_service: "inspection",
        status: "completed",
        started_at: new Date(),
        completed_at: new Date(),
        completed_by: tech1.userId,
      })
      .execute();
    const answer = await callOff(tech1, visitId, rainedOut);
    expect(answer.status).toBe(409);
    expect(answer.body.error?.message).toBe("A finished visit cannot be rained out.");
    const byManager = await callOff(manager, visitId, { outcome: "cancelled", reason: "Moved" });
    expect(byManager.status).toBe(409);
    expect((await getVisit(manager, visitId)).status).toBe("completed");
  });

  it("rains out a started stop: saved checks kept but not counted, audited, the next free day offered", async () => {
    const visitId = await freshVisit();
    const visit = await getVisit(tech1, visitId);
    const checkId = newId();
    await saveZoneCheck(tech1, visitId, checkId, doneCheck(visit.zones[0]!.id));
    expect((await getZoneHistory(tech1, visit.zones[0]!.id)).entries[0]?.zoneCheckId).toBe(checkId);

    const answer = await callOff(tech1, visitId, rainedOut);
    expect(answer.status).toBe(200);
    expect(answer.body).toMatchObject({
      status: "cancelled",
      savedChecks: 1,
      outcome: {
        kind: "rained_out",
        reason: rainedOut.reason,
        by: "Luis Arroyo",
        keptChecks: 1,
        rescheduled: null,
      },
    });
    // The check is kept, and counts nowhere (the zone's history leaves canceled visits out).
    const kept = await testDb()
      .selectFrom("zone_checks")
      .select("id")
      .where("id", "=", checkId)
      .execute();
    expect(kept).toHaveLength(1);
    expect(
      (await getZoneHistory(tech1, visit.zones[0]!.id)).entries.map((e) => e.zoneCheckId),
    ).not.toContain(checkId);

    const audit = await testDb()
      .selectFrom("audit_events")
      .select(["action", "changes", "actor_id", "reason", "visit_id"])
      .where("entity", "=", "visit")
      .where("entity_id", "=", visitId)
      .execute();
    expect(audit).toEqual([
      {
        action: "rain_out",
        actor_id: tech1.userId,
        changes: {
          status: { from: "in_progress", to: "cancelled" },
          outcome: { from: null, to: "rained_out" },
        },
        reason: rainedOut.reason,
        visit_id: visitId,
      },
    ]);

    // The day offered: after today, not a Sunday, not a day the property has a visit.
    const offered = (answer.body.outcome as { nextFreeDay: string }).nextFreeDay;
    expect(offered > today).toBe(true);
    expect(new Date(`${offered}T00:00:00Z`).getUTCDay()).not.toBe(0);
    const taken = await testDb()
      .selectFrom("visits")
      .select("scheduled_for")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "!=", "cancelled")
      .execute();
    expect(taken.map((t) => t.scheduled_for)).not.toContain(offered);

    // It stays on the technician's day, with its outcome.
    const stop = (await listTodayStops(tech1, today)).find((s) => s.id === visitId);
    expect(stop?.outcome).toMatchObject({ kind: "rained_out", nextFreeDay: offered });

    // A replay changes nothing; another outcome afterwards is refused; the visit no longer changes.
    expect((await callOff(tech1, visitId, rainedOut)).status).toBe(200);
    const again = await callOff(tech1, visitId, { outcome: "cancelled", reason: "Changed mind" });
    expect(again.status).toBe(409);
    await expect(
      saveZoneCheck(tech1, visitId, newId(), doneCheck(visit.zones[1]!.id)),
    ).rejects.toMatchObject({ code: "conflict" });
  });
});

describe("POST /api/v1/visits/:visitId/reschedule", () => {
  it("only a called-off stop, on a free day within the window; once", async () => {
    const visitId = await freshVisit();
    const notYet = await reschedule(tech1, visitId, { scheduledFor: addDays(today, 2) });
    expect(notYet.status).toBe(409);

    const called = await callOff(tech1, visitId, rainedOut);
    const offered = (called.body.outcome as { nextFreeDay: string }).nextFreeDay;

    const past = await reschedule(tech1, visitId, { scheduledFor: addDays(today, -1) });
    expect(past.status).toBe(422);
    expect(past.body.error?.fieldErrors?.scheduledFor?.[0]).toMatch(
      /^Date: the new visit is today .* The next free day is /,
    );
    // A day the property already has a visit (the demo's stop today).
    const taken = await reschedule(tech1, visitId, { scheduledFor: today });
    expect(taken.status).toBe(422);
    expect(taken.body.error?.fieldErrors?.scheduledFor?.[0]).toContain("already has a visit");
    const malformed = await reschedule(tech1, visitId, { scheduledFor: "next week" });
    expect(malformed.status).toBe(422);
    expect(malformed.body.error?.fieldErrors?.scheduledFor?.[0]).toMatch(/^Date: /);
    expect((await reschedule(tech2, visitId, { scheduledFor: offered })).status).toBe(404);

    const done = await reschedule(tech1, visitId, { scheduledFor: offered });
    expect(done.status).toBe(200);
    expect(done.body).toMatchObject({
      scheduledFor: offered,
      status: "scheduled",
      plannedService: "inspection",
      stopOrder: 7,
      notes: "Gate code 4410",
      technician: { id: tech1.userId },
    });
    const old = await getVisit(tech1, visitId);
    expect(old.outcome?.rescheduled).toEqual({ visitId: done.body.id, scheduledFor: offered });
    expect(old.outcome?.nextFreeDay).toBeNull();
    const twice = await reschedule(tech1, visitId, { scheduledFor: addDays(offered, 1) });
    expect(twice.status).toBe(409);

    // The book shows the next visit.
    const summary = await testDb()
      .selectFrom("property_summaries")
      .select("next_visit_on")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .executeTakeFirstOrThrow();
    expect(summary.next_visit_on! <= offered).toBe(true);
    const audit = await testDb()
      .selectFrom("audit_events")
      .select(["action", "changes"])
      .where("entity_id", "=", visitId)
      .where("action", "=", "reschedule")
      .executeTakeFirstOrThrow();
    expect(audit.changes).toEqual({ scheduledFor: { from: today, to: offered } });
  });
});

describe("the applicator remembered per person", () => {
  // A technician's applicator license on record (People page) fills their records; the applicator
  // typed on a record is remembered for someone without one (here the manager, who records on a
  // technician's visit).
  it("a pesticide record's applicator fills the next one; a changed value replaces it", async () => {
    current = manager;
    const empty = await applicatorRoute.GET(new Request("http://localhost/api/v1/me/applicator"), {
      params: Promise.resolve({}),
    });
    expect(await empty.json()).toEqual({ name: "", license: "" });

    // A visit of tech2 in June 2025 (the label's interval and the demo's season stay clear of it).
    const visitId = randomUUID();
    await testDb()
      .insertInto("visits")
      .values({
        id: visitId,
        company_id: c.companyId,
        property_id: c.propertyIds["haddad"]!,
        technician_id: tech2.userId,
        scheduled_for: "2025-06-20",
        planned_service: "insect_control",
        status: "in_progress",
        started_at: new Date("2025-06-20T13:00:00Z"),
        started_by: tech2.userId,
      })
      .execute();
    const zones = await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .orderBy("sort_order")
      .execute();
    const product = await testDb()
      .selectFrom("products")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("name", "like", "Grubward%")
      .executeTakeFirstOrThrow();
    const record = (
      applicator: { applicatorName: string; applicatorLicence: string },
      at: string,
      zoneId: string,
    ) =>
      call(manager, applicationsRoute.POST, visitId, {
        id: randomUUID(),
        zoneId,
        productId: product.id,
        rateAmount: 2,
        rateUnit: "lb/1000ft2",
        windMph: 4,
        temperatureF: 70,
        isEstablishing: false,
        applicatorName: applicator.applicatorName,
        applicatorLicence: applicator.applicatorLicence,
        overrideReason: null,
        appliedAt: at,
      });
    const first = await record(
      { applicatorName: "Priya Nandakumar", applicatorLicence: "NJ-DEMO-61207" },
      "2025-06-20T10:00:00-04:00",
      zones[0]!.id,
    );
    expect(first.status).toBe(201);
    const remembered = async () =>
      (
        await applicatorRoute.GET(new Request("http://localhost/api/v1/me/applicator"), {
          params: Promise.resolve({}),
        })
      ).json();
    current = manager;
    expect(await remembered()).toEqual({ name: "Priya Nandakumar", license: "NJ-DEMO-61207" });
    // Someone else's is untouched: tech1's record starts from their license on record (the demo's).
    current = tech1;
    expect(await remembered()).toEqual({ name: "Luis Arroyo", license: "DEMO-CA-10482" });

    // A changed license number replaces the remembered one.
    const second = await record(
      { applicatorName: "Priya Nandakumar", applicatorLicence: "NJ-DEMO-61299" },
      "2025-06-20T10:30:00-04:00",
      zones[1]!.id,
    );
    expect(second.status).toBe(201);
    current = manager;
    expect(await remembered()).toEqual({ name: "Priya Nandakumar", license: "NJ-DEMO-61299" });
  });
});
