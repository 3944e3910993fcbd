// The week's schedule through the route handlers the page posts to: a rained-out day's stops go to
// the next working day in their order after that day's own stops, each with its technician; a
// preview writes nothing; warnings (a second visit that day, the no-fertilizer window, capacity)
// refuse the move until confirmed; started stops, past days, another company's stops and
// technicians, and people who are not managers are refused; each moved stop is audited and reads
// in words; the week reads back as the page shows it.
import { beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { scheduleVisit } from "@/lib/visits/mutations";
import { listVisitAudit } from "@/lib/visits/queries";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { callRoute, type RouteAnswer } from "../helpers/route-call";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const weekRoute = await import("@/app/api/v1/schedule/route");
const movesRoute = await import("@/app/api/v1/schedule/moves/route");
const rainRoute = await import("@/app/api/v1/schedule/rain-delays/route");
const capacityRoute =
  await import("@/app/api/v1/schedule/technicians/[technicianId]/capacity/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
const db = testDb();
const today = todayIn("America/New_York");

/** The first day at least `ahead` days from today that falls on `weekday` (0 = Sunday). */
function dayAhead(ahead: number, weekday: number): string {
  let d = addDays(today, ahead);
  while (new Date(`${d}T00:00:00Z`).getUTCDay() !== weekday) d = addDays(d, 1);
  return d;
}

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1] = await Promise.all([c.actor("manager"), c.actor("tech1")]);
});

type Answer = RouteAnswer<{
  items?: { moves: { stopId: string; stopOrder: number }[]; warnings: string[] }[];
}>;

async function send(
  as: Actor | null,
  handler: Parameters<typeof callRoute>[0],
  body: unknown,
  opts: { method?: string; params?: Record<string, string> } = {},
): Promise<Answer> {
  current = as;
  return callRoute(handler, body, opts);
}

const stopAt = (
  key: string,
  day: string,
  tech: "tech1" | "tech2",
  stopOrder: number,
  plannedService: "inspection" | "feeding_round" = "inspection",
) =>
  scheduleVisit(manager, {
    propertyId: c.propertyIds[key]!,
    scheduledFor: day,
    technicianId: c.userIds[tech]!,
    plannedService,
    stopOrder,
    notes: "",
    confirmSameDay: true,
    confirmBlackout: true,
  });

const where = async (id: string) =>
  db
    .selectFrom("visits")
    .select(["scheduled_for", "stop_order", "technician_id"])
    .where("id", "=", id)
    .executeTakeFirstOrThrow();

describe("rain delay", () => {
  it("moves one technician's Friday to Saturday, in order after Saturday's own stop; preview writes nothing", async () => {
    const friday = dayAhead(40, 5);
    const saturday = addDays(friday, 1);
    const a = await stopAt("oyelaran", friday, "tech1", 1);
    const b = await stopAt("haddad", friday, "tech1", 2);
    const d = await stopAt("kowalczyk", friday, "tech1", 3);
    const others = await stopAt("okafor", friday, "tech2", 1);
    const there = await stopAt("brandvold", saturday, "tech1", 1);

    const preview = await send(manager, rainRoute.POST, {
      date: friday,
      technicianId: c.userIds["tech1"],
      preview: true,
    });
    expect(preview.status).toBe(200);
    expect(preview.body.items![0]!.moves.map((m) => [m.stopId, m.stopOrder])).toEqual([
      [a.id, 2],
      [b.id, 3],
      [d.id, 4],
    ]);
    expect((await where(a.id)).scheduled_for).toBe(friday);

    const made = await send(manager, rainRoute.POST, {
      date: friday,
      technicianId: c.userIds["tech1"],
    });
    expect(made.status, JSON.stringify(made.body)).toBe(200);
    for (const [visit, order] of [
      [there, 1],
      [a, 2],
      [b, 3],
      [d, 4],
    ] as const)
      expect(await where(visit.id)).toEqual({
        scheduled_for: saturday,
        stop_order: order,
        technician_id: c.userIds["tech1"],
      });
    expect((await where(others.id)).scheduled_for).toBe(friday); // tech2's stop stays

    // Audited, and read in words on the visit's trail.
    const trail = await listVisitAudit(manager, a.id);
    expect(trail.map((e) => e.sentence)).toEqual([
      expect.stringMatching(/^Stop moved by a rain delay: day .+ → .+ — by Dana Whitcombe$/),
    ]);
  });

  it("a Saturday for everyone goes to Monday, each stop with its own technician", async () => {
    const saturday = dayAhead(60, 6);
    const monday = addDays(saturday, 2);
    const a = await stopAt("oyelaran", saturday, "tech1", 1);
    const b = await stopAt("okafor", saturday, "tech2", 1);
    const made = await send(manager, rainRoute.POST, { date: saturday });
    expect(made.status, JSON.stringify(made.body)).toBe(200);
    expect(await where(a.id)).toMatchObject({
      scheduled_for: monday,
      technician_id: c.userIds["tech1"],
    });
    expect(await where(b.id)).toMatchObject({
      scheduled_for: monday,
      technician_id: c.userIds["tech2"],
    });
  });

  it("a day with nothing left to move says so", async () => {
    const empty = dayAhead(300, 3);
    const answer = await send(manager, rainRoute.POST, { date: empty });
    expect(answer.status).toBe(422);
    expect(answer.body.error!.message).toMatch(/^No stops left to move on /);
  });
});

describe("moving stops", () => {
  it("warns for a second visit that day and moves only once confirmed, to another technician", async () => {
    const day = dayAhead(80, 2);
    const next = addDays(day, 1);
    const moving = await stopAt("haddad", day, "tech1", 1);
    await stopAt("haddad", next, "tech2", 1);
    const refused = await send(manager, movesRoute.POST, {
      visitIds: [moving.id],
      toDate: next,
      technicianId: c.userIds["tech2"],
    });
    expect(refused.status).toBe(422);
    expect(refused.body.error!.fieldErrors!.confirm).toEqual([
      expect.stringMatching(/^Haddad residence already has a visit on /),
    ]);
    expect((await where(moving.id)).scheduled_for).toBe(day);
    const made = await send(manager, movesRoute.POST, {
      visitIds: [moving.id],
      toDate: next,
      technicianId: c.userIds["tech2"],
      confirm: true,
    });
    expect(made.status).toBe(200);
    expect(await where(moving.id)).toEqual({
      scheduled_for: next,
      stop_order: 2,
      technician_id: c.userIds["tech2"],
    });
    const [event] = await listVisitAudit(manager, moving.id);
    expect(event!.sentence).toMatch(
      /^Stop moved on the schedule: technician “Luis Arroyo” → “Priya Nandakumar”, day .+ → .+ — by Dana Whitcombe$/,
    );
  });

  it("warns for a feeding moved into New Jersey's no-fertilizer window (after December 1)", async () => {
    // The next December 15 at least 10 days away: inside N.J.S.A. 58:10A-62b's window.
    let dec15 = `${today.slice(0, 4)}-12-15`;
    if (dec15 < addDays(today, 10)) dec15 = `${Number(today.slice(0, 4)) + 1}-12-15`;
    const ruleSet = await db
      .selectFrom("properties")
      .innerJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
      .select("rule_sets.pro_no_fertilizer_after")
      .where("properties.id", "=", c.propertyIds["haddad"]!)
      .executeTakeFirstOrThrow();
    expect(ruleSet.pro_no_fertilizer_after).toBe("12-01");
    const feeding = await stopAt("haddad", addDays(dec15, 3), "tech1", 1, "feeding_round");
    const answer = await send(manager, movesRoute.POST, {
      visitIds: [feeding.id],
      toDate: dec15,
      preview: true,
    });
    expect(answer.body.items![0]!.warnings).toEqual(
      expect.arrayContaining([
        expect.stringMatching(/^Haddad residence: .+ is inside its no-fertilizer window/),
      ]),
    );
  });

  it("warns past the technician's stops a day, set on the schedule and bounded", async () => {
    const tech = c.userIds["tech1"]!;
    for (const [value, words] of [
      [0, "Stops a day: at least 1."],
      [41, "Stops a day: at most 40."],
      [2.5, "Stops a day: a whole number from 1 to 40."],
      ["abc", "Stops a day: a whole number from 1 to 40."],
    ] as const) {
      const bad = await send(
        manager,
        capacityRoute.PUT,
        { capacity: value },
        { method: "PUT", params: { technicianId: tech } },
      );
      expect(bad.status, String(value)).toBe(422);
      expect(bad.body.error!.fieldErrors!.capacity).toEqual([words]);
    }
    const set = await send(
      manager,
      capacityRoute.PUT,
      { capacity: 2 },
      { method: "PUT", params: { technicianId: tech } },
    );
    expect(set).toEqual({ status: 200, body: { technicianId: tech, capacity: 2 } });
    // The change is in the audit trail, once: setting the same number again records nothing.
    await send(
      manager,
      capacityRoute.PUT,
      { capacity: 2 },
      { method: "PUT", params: { technicianId: tech } },
    );
    const trail = await db
      .selectFrom("audit_events")
      .select(["action", "changes", "actor_id"])
      .where("entity", "=", "person")
      .where("entity_id", "=", tech)
      .where("action", "=", "set_capacity")
      .execute();
    expect(trail).toEqual([
      {
        action: "set_capacity",
        changes: { dailyStopCapacity: { from: 10, to: 2 } },
        actor_id: c.userIds["manager"],
      },
    ]);
    const day = dayAhead(100, 4);
    const stops = await Promise.all([
      stopAt("oyelaran", day, "tech2", 1),
      stopAt("kowalczyk", day, "tech2", 2),
      stopAt("okafor", day, "tech2", 3),
    ]);
    const answer = await send(manager, movesRoute.POST, {
      visitIds: stops.map((s) => s.id),
      toDate: addDays(day, 1),
      technicianId: tech,
      preview: true,
    });
    expect(answer.body.items![0]!.warnings).toEqual([
      expect.stringMatching(
        /^Luis Arroyo would have 3 stops on .+, more than the 2 a day set for them\.$/,
      ),
    ]);
    await send(
      manager,
      capacityRoute.PUT,
      { capacity: 10 },
      { method: "PUT", params: { technicianId: tech } },
    );
  });

  it("refuses what cannot move, in words", async () => {
    const day = dayAhead(120, 2);
    const started = await stopAt("oyelaran", day, "tech1", 1);
    await db
      .updateTable("visits")
      .set({ status: "in_progress", started_at: new Date() })
      .where("id", "=", started.id)
      .execute();
    const fresh = await stopAt("kowalczyk", day, "tech1", 2);

    const conflict = await send(manager, movesRoute.POST, {
      visitIds: [started.id, fresh.id],
      toDate: addDays(day, 1),
    });
    expect(conflict.status).toBe(409);
    expect(conflict.body.error!.message).toBe(
      "Only stops not yet started can be moved: Oyelaran residence (in progress).",
    );
    const past = await send(manager, movesRoute.POST, {
      visitIds: [fresh.id],
      toDate: addDays(today, -1),
    });
    expect(past.status).toBe(422);
    expect(past.body.error!.fieldErrors!.toDate![0]).toMatch(
      /^Move to: today \(.+\) or a later day, not in the past\.$/,
    );
    const none = await send(manager, movesRoute.POST, { visitIds: [], toDate: day });
    expect(none.body.error!.fieldErrors!.visitIds).toEqual([
      "Stops: choose at least one stop to move.",
    ]);

    // Another company's stop is not found; its technician is not one of ours.
    const theirs = await scheduleVisit(await other.actor("manager"), {
      propertyId: Object.values(other.propertyIds)[0]!,
      scheduledFor: day,
      technicianId: null,
      plannedService: "inspection",
      stopOrder: 1,
      notes: "",
    });
    expect(
      (await send(manager, movesRoute.POST, { visitIds: [theirs.id], toDate: day })).status,
    ).toBe(404);
    const theirTech = (await other.actor("manager")).userId;
    const wrongTech = await send(manager, movesRoute.POST, {
      visitIds: [fresh.id],
      toDate: day,
      technicianId: theirTech,
    });
    expect(wrongTech.status).toBe(422);
    expect(wrongTech.body.error!.fieldErrors!.technicianId).toEqual([
      "Technician: choose one of your technicians.",
    ]);

    // Only managers change the schedule.
    expect((await send(tech1, movesRoute.POST, { visitIds: [fresh.id], toDate: day })).status).toBe(
      403,
    );
    expect((await send(await c.actor("owner2"), rainRoute.POST, { date: day })).status).toBe(403);
    expect((await where(fresh.id)).scheduled_for).toBe(day);
  });
});

describe("the week", () => {
  it("reads Monday to Sunday with the technicians' capacity and the stops in order", async () => {
    const day = dayAhead(140, 3);
    const s = await stopAt("okafor", day, "tech2", 1);
    current = manager;
    const res = await weekRoute.GET(new Request(`http://localhost/api/v1/schedule?week=${day}`), {
      params: Promise.resolve({}),
    });
    const week = (await res.json()) as {
      weekStart: string;
      days: string[];
      technicians: { name: string; capacity: number }[];
      stops: { id: string }[];
    };
    expect(week.days).toHaveLength(7);
    expect(new Date(`${week.weekStart}T00:00:00Z`).getUTCDay()).toBe(1);
    expect(week.days).toContain(day);
    expect(week.technicians.map((t) => t.name)).toEqual(["Luis Arroyo", "Priya Nandakumar"]);
    expect(week.stops.map((x) => x.id)).toContain(s.id);
    current = tech1;
    const refused = await weekRoute.GET(
      new Request(`http://localhost/api/v1/schedule?week=${day}`),
      {
        params: Promise.resolve({}),
      },
    );
    expect(refused.status).toBe(403);
  });
});
