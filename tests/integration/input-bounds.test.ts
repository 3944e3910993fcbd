// Bounds on what a person types, through the API routes the forms post to: at each bound the last
// value accepted and the first refused, with a message that names the field, what is expected and
// the unit; refused writes change no row. Dates: a visit from today to 18 months ahead, a watering
// from a year back to today, a records range that runs forward. Numbers: the stop number. Warnings
// a manager confirms: a second visit on a day, a feeding round inside the rule set's
// no-fertilizer window (with the next allowed day). The zone check: the probe reading (0–100 %),
// height of cut and height before mowing (lib/visits/zone-check-bounds.ts states the ranges'
// sources), notes up to 4,000 characters. The day's route: a property's customer phone (a US
// number) and access notes (500 characters), the yard's coordinates, the length of a day's order.
import { randomUUID } from "node:crypto";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { inNoFertilizerWindow } from "@/lib/agronomy/rules";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { DAY_ORDER_MAX_STOPS } from "@/lib/day-route/schemas";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";
import { SOIL_TEST_BACK_DAYS } from "@/lib/soil-tests/schemas";
import { startVisit } from "@/lib/visits/mutations";
import { SCHEDULE_AHEAD_DAYS } from "@/lib/visits/schemas";
import { WATERING_BACK_DAYS } from "@/lib/watering/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const visits = await import("@/app/api/v1/visits/route");
const waterings = await import("@/app/api/v1/properties/[propertyId]/waterings/route");
const soilTests = await import("@/app/api/v1/properties/[propertyId]/soil-tests/route");
const records = await import("@/app/api/v1/records/applications/route");
const zoneChecks = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/route");
const pressureSettings = await import("@/app/api/v1/company-settings/pressure-areas/route");
const propertyRoute = await import("@/app/api/v1/properties/[propertyId]/route");
const yardRoute = await import("@/app/api/v1/company-settings/yard/route");
const startPointRoute = await import("@/app/api/v1/people/[personId]/start-point/route");
const orderRoute = await import("@/app/api/v1/today/order/route");
const programsRoute = await import("@/app/api/v1/programs/route");
const zoneProgramRoute = await import("@/app/api/v1/zones/[zoneId]/program/route");
const productsRoute = await import("@/app/api/v1/products/route");

let c: TestCompany;
const today = todayIn("America/New_York"); // the demo properties' zone
beforeAll(async () => {
  c = await createTestCompany();
});

interface Answer {
  status: number;
  fieldErrors: Record<string, string[]>;
}

async function post(
  handler: (req: Request, ctx: { params: Promise<Record<string, string>> }) => Promise<Response>,
  body: unknown,
  params: Record<string, string> = {},
  method = "POST",
): Promise<Answer> {
  const res = await handler(
    new Request("http://localhost/api", {
      method,
      body: JSON.stringify(body),
      headers: {
        origin: "http://localhost:3000",
        host: "localhost",
        "content-type": "application/json",
      },
    }),
    { params: Promise.resolve(params) },
  );
  const json = (await res.json()) as { error?: { fieldErrors?: Record<string, string[]> } };
  return { status: res.status, fieldErrors: json.error?.fieldErrors ?? {} };
}

const visitCount = async () =>
  Number(
    (
      await testDb()
        .selectFrom("visits")
        .select((eb) => eb.fn.countAll().as("n"))
        .where("company_id", "=", c.companyId)
        .executeTakeFirstOrThrow()
    ).n,
  );

/** A visit at Okafor (no demo stop on the days tried here unless a test adds one). */
const visit = (o: Record<string, unknown>) => ({
  id: randomUUID(),
  propertyId: c.propertyIds["okafor"],
  scheduledFor: addDays(today, 3),
  technicianId: null,
  plannedService: "inspection",
  ...o,
});

describe("scheduling a visit", () => {
  it("date: today and 18 months ahead are accepted; yesterday and a day past 18 months are refused", async () => {
    current = await c.actor("manager");
    expect((await post(visits.POST, visit({ scheduledFor: addDays(today, 1) }))).status).toBe(200);
    const last = addDays(today, SCHEDULE_AHEAD_DAYS);
    expect((await post(visits.POST, visit({ scheduledFor: last }))).status).toBe(200);
    const before = await visitCount();
    const past = await post(visits.POST, visit({ scheduledFor: addDays(today, -1) }));
    expect(past.status).toBe(422);
    expect(past.fieldErrors.scheduledFor?.[0]).toMatch(/^Date: .*today.*not in the past\.$/);
    const tooFar = await post(visits.POST, visit({ scheduledFor: addDays(last, 1) }));
    expect(tooFar.status).toBe(422);
    expect(tooFar.fieldErrors.scheduledFor?.[0]).toMatch(/^Date: at most 18 months ahead/);
    const years = await post(visits.POST, visit({ scheduledFor: "2019-01-01" }));
    expect(years.fieldErrors.scheduledFor?.[0]).toMatch(/not in the past/);
    expect(await visitCount()).toBe(before);
  });

  it("stop number: 1 and 200 accepted; 0, 201, −3 and 2.5 refused, saying what is expected", async () => {
    current = await c.actor("manager");
    const day = addDays(today, 5);
    expect((await post(visits.POST, visit({ scheduledFor: day, stopOrder: 1 }))).status).toBe(200);
    expect(
      (await post(visits.POST, visit({ scheduledFor: addDays(day, 1), stopOrder: 200 }))).status,
    ).toBe(200);
    const before = await visitCount();
    for (const [stopOrder, message] of [
      [0, /^Stop number: 1 or more/],
      [-3, /^Stop number: 1 or more/],
      [201, /^Stop number: at most 200 stops in a day\.$/],
      [2.5, /^Stop number: a whole number/],
    ] as const) {
      const answer = await post(visits.POST, visit({ scheduledFor: addDays(day, 2), stopOrder }));
      expect(answer.status, String(stopOrder)).toBe(422);
      expect(answer.fieldErrors.stopOrder?.[0], String(stopOrder)).toMatch(message);
    }
    expect(await visitCount()).toBe(before);
  });

  it("notes: 4,000 characters accepted, 4,001 refused naming the limit", async () => {
    current = await c.actor("manager");
    const day = addDays(today, 8);
    expect(
      (await post(visits.POST, visit({ scheduledFor: day, notes: "n".repeat(4000) }))).status,
    ).toBe(200);
    const long = await post(
      visits.POST,
      visit({ scheduledFor: addDays(day, 1), notes: "n".repeat(4001) }),
    );
    expect(long.status).toBe(422);
    expect(long.fieldErrors.notes?.[0]).toBe("Note: at most 4,000 characters; shorten it.");
  });

  it("a second visit at a property on one day is warned and refused until confirmed", async () => {
    current = await c.actor("manager");
    const day = addDays(today, 12);
    expect((await post(visits.POST, visit({ scheduledFor: day }))).status).toBe(200);
    const before = await visitCount();
    const again = await post(visits.POST, visit({ scheduledFor: day }));
    expect(again.status).toBe(422);
    expect(again.fieldErrors.confirmSameDay?.[0]).toMatch(
      /^Okafor residence already has a visit on [A-Z][a-z]+ \d{1,2}, \d{4} \(Inspection\)\. Confirm/,
    );
    expect(await visitCount()).toBe(before);
    expect(
      (await post(visits.POST, visit({ scheduledFor: day, confirmSameDay: true }))).status,
    ).toBe(200);
    // Resending the same request (same id) is not a second visit.
    const id = randomUUID();
    const once = visit({ id, scheduledFor: addDays(day, 1) });
    expect((await post(visits.POST, once)).status).toBe(200);
    expect((await post(visits.POST, once)).status).toBe(200);
  });

  // N.J.S.A. 58:10A-62b: no professional application of fertilizer containing nitrogen or
  // phosphorus "before March 1st or after December 1st in any calendar year".
  it("a feeding round inside New Jersey's window is warned with the next allowed day; lime is not", async () => {
    current = await c.actor("manager");
    const nj = SHIPPED_RULE_SETS.find((r) => r.name.startsWith("New Jersey"))!;
    // The next December 2 (inside the window) and December 1 (the named day, allowed).
    const year = Number(today.slice(0, 4)) + (today.slice(5) >= "12-01" ? 1 : 0);
    const inside = `${year}-12-02`;
    const namedDay = `${year}-12-01`;
    expect(inNoFertilizerWindow(inside.slice(5), nj.proBlackout!)).toBe(true);
    const before = await visitCount();
    const warned = await post(
      visits.POST,
      visit({ scheduledFor: inside, plannedService: "feeding_round" }),
    );
    expect(warned.status).toBe(422);
    expect(warned.fieldErrors.confirmBlackout?.[0]).toMatch(
      new RegExp(
        `^December 2, ${year} is inside the no-fertilizer window of New Jersey.*after December 1 or before March 1\\. The next allowed day is March 1, ${year + 1}\\.`,
      ),
    );
    expect(await visitCount()).toBe(before);
    for (const plannedService of ["liming", "soil_sampling", "inspection"])
      expect(
        (
          await post(
            visits.POST,
            visit({ scheduledFor: inside, plannedService, confirmSameDay: true }),
          )
        ).status,
        plannedService,
      ).toBe(200);
    expect(
      (
        await post(
          visits.POST,
          visit({ scheduledFor: namedDay, plannedService: "fall_feeding", confirmSameDay: true }),
        )
      ).status,
    ).toBe(200);
    expect(
      (
        await post(
          visits.POST,
          visit({
            scheduledFor: inside,
            plannedService: "feeding_round",
            confirmBlackout: true,
            confirmSameDay: true,
          }),
        )
      ).status,
    ).toBe(200);
  });
});

describe("logging a watering", () => {
  const watering = (o: Record<string, unknown>) => ({
    id: randomUUID(),
    zoneId: null,
    wateredOn: today,
    depthIn: 0.5,
    runMinutes: null,
    precipitationRateInPerHour: null,
    notes: "",
    ...o,
  });
  const params = () => ({ propertyId: c.propertyIds["haddad"]! });

  it("date: today and a year back accepted; tomorrow and a day more than a year back refused", async () => {
    current = await c.actor("tech1");
    expect((await post(waterings.POST, watering({}), params())).status).toBe(201);
    expect(
      (
        await post(
          waterings.POST,
          watering({ wateredOn: addDays(today, -WATERING_BACK_DAYS) }),
          params(),
        )
      ).status,
    ).toBe(201);
    const future = await post(waterings.POST, watering({ wateredOn: addDays(today, 1) }), params());
    expect(future.status).toBe(422);
    expect(future.fieldErrors.wateredOn?.[0]).toMatch(/^Date watered: not in the future/);
    const old = await post(
      waterings.POST,
      watering({ wateredOn: addDays(today, -WATERING_BACK_DAYS - 1) }),
      params(),
    );
    expect(old.status).toBe(422);
    expect(old.fieldErrors.wateredOn?.[0]).toMatch(/^Date watered: within the last year/);
    const far = await post(waterings.POST, watering({ wateredOn: "2030-06-01" }), params());
    expect(far.fieldErrors.wateredOn?.[0]).toMatch(/not in the future/);
  });

  it("depth: 10 in accepted; 10.01 in and 0 in refused with the unit", async () => {
    current = await c.actor("tech1");
    expect((await post(waterings.POST, watering({ depthIn: 10 }), params())).status).toBe(201);
    const deep = await post(waterings.POST, watering({ depthIn: 10.01 }), params());
    expect(deep.fieldErrors.depthIn?.[0]).toBe(
      "Depth: at most 10 in of water at once; check the number.",
    );
    const none = await post(waterings.POST, watering({ depthIn: 0 }), params());
    expect(none.fieldErrors.depthIn?.[0]).toBe("Depth: above 0 in.");
  });
});

describe("recording a soil test", () => {
  let n = 0;
  const soilTest = (o: Record<string, unknown>) => ({
    id: randomUUID(),
    zoneId: null,
    sampledOn: addDays(today, -1),
    lab: `Bounds lab ${++n}`, // one sample per lab, date and zone
    sampleDepthIn: 4,
    extractant: "mehlich3",
    ph: 6.2,
    bufferPh: null,
    bufferMethod: null,
    organicMatterPct: null,
    pPpm: 20,
    kPpm: null,
    caPpm: null,
    mgPpm: null,
    sPpm: null,
    labLimeLbPer1000: null,
    labPhosphorusNeeded: null,
    notes: "",
    ...o,
  });
  const params = () => ({ propertyId: c.propertyIds["haddad"]! });
  const cases: [string, Record<string, unknown>, Record<string, unknown>, string][] = [
    [
      "sampledOn",
      { sampledOn: today },
      { sampledOn: addDays(today, 1) },
      "Date sampled: not in the future",
    ],
    [
      "sampledOn",
      { sampledOn: addDays(today, -SOIL_TEST_BACK_DAYS) },
      { sampledOn: addDays(today, -SOIL_TEST_BACK_DAYS - 1) },
      "Date sampled: within the last ten years",
    ],
    ["ph", { ph: 10 }, { ph: 10.01 }, "Soil pH: at most 10."],
    ["ph", { ph: 3 }, { ph: 2.99 }, "Soil pH: at least 3."],
    [
      "bufferPh",
      { bufferPh: 8, bufferMethod: "smp" },
      { bufferPh: 8.01, bufferMethod: "smp" },
      "Buffer pH: at most 8.",
    ],
    ["kPpm", { kPpm: 20_000 }, { kPpm: 20_000.01 }, "Potassium (K): at most 20,000 ppm."],
    ["pPpm", { pPpm: 0 }, { pPpm: -0.01 }, "Phosphorus (P): at least 0 ppm."],
    [
      "organicMatterPct",
      { organicMatterPct: 100 },
      { organicMatterPct: 100.01 },
      "Organic matter: at most 100 %.",
    ],
    [
      "sampleDepthIn",
      { sampleDepthIn: 12 },
      { sampleDepthIn: 12.01 },
      "Sample depth: at most 12 in.",
    ],
    [
      "sampleDepthIn",
      { sampleDepthIn: 1 },
      { sampleDepthIn: 0.99 },
      "Sample depth: at least 1 in.",
    ],
    [
      "labLimeLbPer1000",
      { labLimeLbPer1000: 500 },
      { labLimeLbPer1000: 500.01 },
      "Lab's lime recommendation: at most 500 lb per 1,000 ft².",
    ],
    [
      "notes",
      { notes: "n".repeat(1000) },
      { notes: "n".repeat(1001) },
      "Notes: at most 1,000 characters.",
    ],
  ];
  it.each(cases)("%s: %j accepted, %j refused in words", async (field, ok, refused, words) => {
    current = await c.actor("tech1");
    expect((await post(soilTests.POST, soilTest(ok), params())).status).toBe(201);
    const answer = await post(soilTests.POST, soilTest(refused), params());
    expect(answer.status).toBe(422);
    expect(answer.fieldErrors[field]?.[0]).toMatch(
      new RegExp(`^${words.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}`),
    );
  });
});

describe("a season program", () => {
  let n = 0;
  let productId = "";
  const round = (o: Record<string, unknown>) => ({
    kind: "feeding",
    windowKind: "dates",
    startMd: "04-01",
    endMd: "04-30",
    triggerBaseF: null,
    triggerValue: null,
    windowDays: null,
    granular: { productId, target: "lb", nLb: 0.5 },
    liquid: { productId: null, target: "none", nLb: null },
    ...o,
  });
  const program = (o: Record<string, unknown>, r: Record<string, unknown> = {}) => ({
    id: randomUUID(),
    name: `Bounds program ${++n}`,
    grassSeason: "cool",
    notes: "",
    rounds: [round(r)],
    ...o,
  });
  const gdd = {
    windowKind: "gdd",
    startMd: null,
    endMd: null,
    triggerBaseF: 50,
    triggerValue: 200,
    windowDays: 21,
  };
  // [field, accepted program, refused program, words]: round fields are named rounds.0.<field>.
  const cases: [string, Record<string, unknown>, Record<string, unknown>, string][] = [
    [
      "name",
      program({ name: "n".repeat(80) }),
      program({ name: "n".repeat(81) }),
      "Name: at most 80 characters.",
    ],
    [
      "notes",
      program({ notes: "n".repeat(1000) }),
      program({ notes: "n".repeat(1001) }),
      "Notes: at most 1,000 characters.",
    ],
    [
      "rounds.0.granular.nLb",
      program({}, { granular: { productId: "P", target: "lb", nLb: 3 } }),
      program({}, { granular: { productId: "P", target: "lb", nLb: 3.01 } }),
      "Granular N: at most 3 lb per 1,000 ft².",
    ],
    [
      "rounds.0.granular.nLb",
      program({}, { granular: { productId: "P", target: "lb", nLb: 0.01 } }),
      program({}, { granular: { productId: "P", target: "lb", nLb: 0 } }),
      "Granular N: more than 0 lb per 1,000 ft².",
    ],
    [
      "rounds.0.endMd",
      program({}, { startMd: "04-30", endMd: "04-30" }),
      program({}, { startMd: "04-30", endMd: "04-29" }),
      "Window to: on or after the window's first day",
    ],
    [
      "rounds.0.startMd",
      program({}, { startMd: "02-29", endMd: "03-01" }),
      program({}, { startMd: "02-30", endMd: "03-01" }),
      "Window from: a month and day like 04-15",
    ],
    [
      "rounds.0.triggerBaseF",
      program({}, { ...gdd, triggerBaseF: 70 }),
      program({}, { ...gdd, triggerBaseF: 70.1 }),
      "GDD base: at most 70 °F.",
    ],
    [
      "rounds.0.triggerValue",
      program({}, { ...gdd, triggerValue: 6000 }),
      program({}, { ...gdd, triggerValue: 6000.1 }),
      "Trigger: at most 6,000.",
    ],
    [
      "rounds.0.triggerValue",
      program(
        {},
        { ...gdd, windowKind: "soil_temperature", triggerBaseF: null, triggerValue: 110 },
      ),
      program(
        {},
        { ...gdd, windowKind: "soil_temperature", triggerBaseF: null, triggerValue: 110.1 },
      ),
      "Trigger: a temperature of at most 110 °F.",
    ],
    [
      "rounds.0.windowDays",
      program({}, { ...gdd, windowDays: 120 }),
      program({}, { ...gdd, windowDays: 121 }),
      "Days open: at most 120 days.",
    ],
    [
      "rounds",
      program({ rounds: Array.from({ length: 30 }, () => round({})) }),
      program({ rounds: Array.from({ length: 31 }, () => round({})) }),
      "Rounds: at most 30 in one program.",
    ],
  ];
  const withProduct = (body: Record<string, unknown>) =>
    JSON.parse(
      JSON.stringify({ ...body, id: randomUUID() })
        .replaceAll('"P"', JSON.stringify(productId))
        .replaceAll('"productId":""', `"productId":${JSON.stringify(productId)}`),
    ) as Record<string, unknown>;
  it.each(cases)(
    "%s: accepted at the bound, refused past it in words",
    async (field, ok, refused, words) => {
      current = await c.actor("manager");
      productId ||= (
        await testDb()
          .selectFrom("products")
          .select("id")
          .where("company_id", "=", c.companyId)
          .where("name", "like", "Larkmoor Steadyfeed%")
          .executeTakeFirstOrThrow()
      ).id;
      const accepted = await post(programsRoute.POST, withProduct(ok));
      expect(accepted.status, JSON.stringify(accepted.fieldErrors)).toBe(201);
      const answer = await post(programsRoute.POST, withProduct(refused));
      expect(answer.status).toBe(422);
      expect(answer.fieldErrors[field]?.[0]).toMatch(
        new RegExp(`^${words.replace(/[.*+?^${}()|[\]\\]/g, "\\$&")}`),
      );
    },
  );

  it("a zone left out: the reason up to 200 characters, the year 2000–2100", async () => {
    current = await c.actor("manager");
    const zoneId = (
      await testDb()
        .selectFrom("zones")
        .select("id")
        .where("property_id", "=", c.propertyIds["haddad"]!)
        .executeTakeFirstOrThrow()
    ).id;
    const put = (body: unknown) => post(zoneProgramRoute.PUT, body, { zoneId }, "PUT");
    const left = (year: number, reason: string) => ({
      method: "granular",
      excludedYear: year,
      excludedReason: reason,
    });
    expect((await put(left(2100, "r".repeat(200)))).status).toBe(200);
    const long = await put(left(2100, "r".repeat(201)));
    expect(long.status).toBe(422);
    expect(long.fieldErrors["excludedReason"]?.[0]).toBe("Reason: at most 200 characters.");
    const late = await put(left(2101, "New sod"));
    expect(late.fieldErrors["excludedYear"]?.[0]).toBe("Left out for: 2100 or earlier.");
    expect(
      (await put({ method: "granular", excludedYear: null, excludedReason: null })).status,
    ).toBe(200);
  });
});

describe("the records export", () => {
  it("a range that runs forward (one day included) is a CSV; a reversed one is 422 naming To", async () => {
    current = await c.actor("manager");
    const get = (from: string, to: string) =>
      records.GET(
        new Request(`http://localhost/api/v1/records/applications?from=${from}&to=${to}`),
        {
          params: Promise.resolve({}),
        },
      );
    expect((await get(today, today)).status).toBe(200);
    const reversed = await get(today, addDays(today, -1));
    expect(reversed.status).toBe(422);
    const body = (await reversed.json()) as { error: { fieldErrors: Record<string, string[]> } };
    expect(body.error.fieldErrors.to?.[0]).toBe(
      "To: on or after the From date (the range runs forward).",
    );
  });
});

describe("the zone check", () => {
  let visitId: string;
  let zoneId: string;
  beforeAll(async () => {
    const tech1 = await c.actor("tech1");
    const visit = await testDb()
      .selectFrom("visits")
      .innerJoin("zones", "zones.property_id", "visits.property_id")
      .select(["visits.id", "zones.id as zoneId"])
      .where("visits.company_id", "=", c.companyId)
      .where("visits.technician_id", "=", tech1.userId)
      .where("visits.status", "=", "scheduled")
      .where("visits.scheduled_for", "=", today)
      .executeTakeFirstOrThrow();
    visitId = visit.id;
    zoneId = visit.zoneId;
    await startVisit(tech1, visitId, { latitude: null, longitude: null });
  });

  const row = () =>
    testDb()
      .selectFrom("zone_checks")
      .select(["id", "version"])
      .where("visit_id", "=", visitId)
      .where("zone_id", "=", zoneId)
      .executeTakeFirst();

  /**
   * Saves the zone's check (created at the first save, then edited from its latest version) with
   * the values; the answer, and whether the stored row changed.
   */
  async function save(o: Record<string, unknown>) {
    current = await c.actor("tech1");
    const before = await row();
    const answer = await post(
      zoneChecks.PUT,
      { ...doneCheck(zoneId), baseVersion: before?.version ?? 0, ...o },
      { visitId, zoneCheckId: before?.id ?? newId() },
      "PUT",
    );
    const after = await row();
    return { ...answer, saved: after?.version !== before?.version };
  }

  it("probe reading: 0 and 100 % are kept; -5 and 250 % are 422 naming the field, nothing saved", async () => {
    for (const ok of [0, 100])
      expect(await save({ soilMoisturePct: ok })).toMatchObject({ status: 200, saved: true });
    for (const bad of [-5, 250]) {
      const r = await save({ soilMoisturePct: bad });
      expect(r).toMatchObject({ status: 422, saved: false });
      expect(r.fieldErrors.soilMoisturePct?.[0]).toMatch(
        /^Soil moisture probe reading: between 0 and 100 %/,
      );
    }
  });

  it("height of cut: 0.25 and 6 in kept; 0 and 6.25 in refused with the unit", async () => {
    for (const ok of [0.25, 6])
      expect(await save({ heightOfCutIn: ok })).toMatchObject({ status: 200, saved: true });
    const low = await save({ heightOfCutIn: 0 });
    expect(low).toMatchObject({ status: 422, saved: false });
    expect(low.fieldErrors.heightOfCutIn?.[0]).toBe(
      "Height of cut: at least 0.25 in (lawns are cut at 0.5–4 in); check the reading.",
    );
    const high = await save({ heightOfCutIn: 6.25 });
    expect(high.fieldErrors.heightOfCutIn?.[0]).toMatch(/^Height of cut: at most 6 in/);
  });

  it("height before mowing: 24 in kept; 24.25 in refused with the unit", async () => {
    const mowed = { mowedToday: true, heightOfCutIn: 3 };
    expect(await save({ ...mowed, heightBeforeMowingIn: 24 })).toMatchObject({
      status: 200,
      saved: true,
    });
    const tall = await save({ ...mowed, heightBeforeMowingIn: 24.25 });
    expect(tall).toMatchObject({ status: 422, saved: false });
    expect(tall.fieldErrors.heightBeforeMowingIn?.[0]).toBe(
      "Height before mowing: at most 24 in; check the reading.",
    );
  });

  it("notes: 4,000 characters kept whole; 4,001 refused (not cut), naming the field", async () => {
    const kept = await save({ notes: "n".repeat(4000) });
    expect(kept).toMatchObject({ status: 200, saved: true });
    const long = await save({ notes: "n".repeat(4001) });
    expect(long).toMatchObject({ status: 422, saved: false });
    expect(long.fieldErrors.notes?.[0]).toBe("Zone notes: at most 4,000 characters; shorten them.");
  });
});

describe("pressure-area settings", () => {
  const settings = async () =>
    testDb()
      .selectFrom("companies")
      .select(["pressure_distance_mi", "pressure_days", "pressure_min_properties"])
      .where("id", "=", c.companyId)
      .executeTakeFirstOrThrow();
  const put = (body: Record<string, unknown>) =>
    post(pressureSettings.PUT, { distanceMi: 1, days: 7, minProperties: 3, ...body }, {}, "PUT");

  it("distance 0.1 and 25 mi, days 1 and 30, properties 2 and 20 are kept; one step past each is refused, naming the field and the unit", async () => {
    current = await c.actor("manager");
    for (const ok of [
      { distanceMi: 0.1 },
      { distanceMi: 25 },
      { days: 1 },
      { days: 30 },
      { minProperties: 2 },
      { minProperties: 20 },
    ])
      expect((await put(ok)).status, JSON.stringify(ok)).toBe(200);
    const before = await settings();
    for (const [body, field, message] of [
      [{ distanceMi: 0.09 }, "distanceMi", /^Distance: at least 0.1 mi\.$/],
      [{ distanceMi: 25.01 }, "distanceMi", /^Distance: at most 25 mi\.$/],
      [{ distanceMi: 0.125 }, "distanceMi", /^Distance: in hundredths of a mile/],
      [{ distanceMi: "" }, "distanceMi", /^Distance: a number of miles/],
      [{ days: 0 }, "days", /^Days: at least 1 day\.$/],
      [{ days: 31 }, "days", /^Days: at most 30 days\.$/],
      [{ days: 2.5 }, "days", /^Days: a whole number/],
      [{ minProperties: 1 }, "minProperties", /^Properties: at least 2\.$/],
      [{ minProperties: 21 }, "minProperties", /^Properties: at most 20\.$/],
    ] as const) {
      const answer = await put(body);
      expect(answer.status, JSON.stringify(body)).toBe(422);
      expect(answer.fieldErrors[field]?.[0], JSON.stringify(body)).toMatch(message);
    }
    expect(await settings()).toEqual(before);
  });

  it("a technician cannot change them", async () => {
    current = await c.actor("tech1");
    expect((await put({ distanceMi: 2 })).status).toBe(403);
  });
});

describe("the day's route: a property's phone and access notes, the yard, the day's order", () => {
  /** The Okafor property as its form would send it, with `over` changed. */
  async function property(over: Record<string, unknown>) {
    const p = await testDb()
      .selectFrom("properties")
      .selectAll()
      .where("id", "=", c.propertyIds["okafor"]!)
      .executeTakeFirstOrThrow();
    return {
      name: p.name,
      street: p.street,
      city: p.city,
      region: p.region,
      postalCode: p.postal_code,
      latitude: p.latitude,
      longitude: p.longitude,
      timeZone: p.time_zone,
      ruleSetId: p.rule_set_id,
      technicianId: p.technician_id,
      notes: p.notes,
      ...over,
    };
  }
  const stored = async () =>
    testDb()
      .selectFrom("properties")
      .select(["customer_phone", "access_notes"])
      .where("id", "=", c.propertyIds["okafor"]!)
      .executeTakeFirstOrThrow();
  const put = async (over: Record<string, unknown>) =>
    post(propertyRoute.PUT, await property(over), { propertyId: c.propertyIds["okafor"]! }, "PUT");

  it("customer phone: a 10-digit US number kept in E.164; 9 digits, an area code starting with 1 and another country refused", async () => {
    current = await c.actor("manager");
    expect((await put({ customerPhone: "(609) 555-0185" })).status).toBe(200);
    expect((await stored()).customer_phone).toBe("+16095550185");
    for (const [customerPhone, message] of [
      ["609-555-018", /^Customer phone: a US number of 10 digits/],
      ["(109) 555-0185", /^Customer phone: a US number of 10 digits/],
      ["+44 20 7946 0958", /^Customer phone: a US number of 10 digits/],
      ["609-555-0185\u0000", /control characters/],
    ] as const) {
      const answer = await put({ customerPhone });
      expect(answer.status, customerPhone).toBe(422);
      expect(answer.fieldErrors.customerPhone?.[0], customerPhone).toMatch(message);
    }
    expect((await stored()).customer_phone).toBe("+16095550185");
    expect((await put({ customerPhone: "" })).status).toBe(200);
    expect((await stored()).customer_phone).toBeNull();
  });

  it("access notes: 500 characters kept whole; 501 refused naming the field", async () => {
    current = await c.actor("manager");
    expect((await put({ accessNotes: "g".repeat(500) })).status).toBe(200);
    const long = await put({ accessNotes: "g".repeat(501) });
    expect(long.status).toBe(422);
    expect(long.fieldErrors.accessNotes?.[0]).toBe("Access notes: at most 500 characters.");
    expect((await stored()).access_notes).toBe("g".repeat(500));
  });

  it("yard: latitude 90 and longitude −180 accepted; 90.01 and −180.01 refused; one coordinate without the other refused", async () => {
    current = await c.actor("manager");
    const yard = (o: Record<string, unknown>) => ({
      address: "61 Tanager Road",
      latitude: 40.3,
      longitude: -74.7,
      ...o,
    });
    expect(
      (await post(yardRoute.PUT, yard({ latitude: 90, longitude: -180 }), {}, "PUT")).status,
    ).toBe(200);
    const north = await post(yardRoute.PUT, yard({ latitude: 90.01 }), {}, "PUT");
    expect(north.fieldErrors.latitude?.[0]).toBe("Yard latitude: between -90 and 90.");
    const west = await post(yardRoute.PUT, yard({ longitude: -180.01 }), {}, "PUT");
    expect(west.fieldErrors.longitude?.[0]).toBe("Yard longitude: between -180 and 180.");
    const half = await post(yardRoute.PUT, yard({ longitude: null }), {}, "PUT");
    expect(half.status).toBe(422);
    expect(half.fieldErrors.longitude?.[0]).toMatch(
      /both the latitude and the longitude, or neither/,
    );
    const address = await post(yardRoute.PUT, yard({ address: "a".repeat(201) }), {}, "PUT");
    expect(address.fieldErrors.address?.[0]).toBe("Yard address: at most 200 characters.");
    const row = await testDb()
      .selectFrom("companies")
      .select(["yard_latitude", "yard_longitude"])
      .where("id", "=", c.companyId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ yard_latitude: 90, yard_longitude: -180 });
  });

  it("a technician's start point: latitude −90 and longitude 180 accepted; −90.01 and 180.01 refused; one coordinate without the other refused", async () => {
    current = await c.actor("manager");
    const params = { personId: c.userIds["tech1"]! };
    const start = (o: Record<string, unknown>) => ({
      address: "Home, 14 Reed Lane",
      latitude: 40.3,
      longitude: -74.7,
      ...o,
    });
    expect(
      (await post(startPointRoute.PUT, start({ latitude: -90, longitude: 180 }), params, "PUT"))
        .status,
    ).toBe(200);
    const south = await post(startPointRoute.PUT, start({ latitude: -90.01 }), params, "PUT");
    expect(south.fieldErrors.latitude?.[0]).toBe("Start point latitude: between -90 and 90.");
    const east = await post(startPointRoute.PUT, start({ longitude: 180.01 }), params, "PUT");
    expect(east.fieldErrors.longitude?.[0]).toBe("Start point longitude: between -180 and 180.");
    const half = await post(startPointRoute.PUT, start({ latitude: null }), params, "PUT");
    expect(half.fieldErrors.latitude?.[0]).toMatch(
      /both the latitude and the longitude, or neither/,
    );
    const row = await testDb()
      .selectFrom("memberships")
      .select(["start_latitude", "start_longitude"])
      .where("company_id", "=", c.companyId)
      .where("user_id", "=", params.personId)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ start_latitude: -90, start_longitude: 180 });
    // Back to the yard, so the day's route cases below start from it.
    expect(
      (
        await post(
          startPointRoute.PUT,
          start({ address: "", latitude: null, longitude: null }),
          params,
          "PUT",
        )
      ).status,
    ).toBe(200);
  });

  it(`the day's order: at most ${DAY_ORDER_MAX_STOPS} stops in one list; none refused`, async () => {
    current = await c.actor("tech1");
    const many = Array.from({ length: DAY_ORDER_MAX_STOPS + 1 }, () => randomUUID());
    const long = await post(orderRoute.PUT, { date: today, visitIds: many }, {}, "PUT");
    expect(long.fieldErrors.visitIds?.[0]).toBe(
      `Stops: at most ${DAY_ORDER_MAX_STOPS} in one day.`,
    );
    // The last accepted length is checked against the day: 100 ids that are not its stops → 409.
    const atBound = await post(orderRoute.PUT, { date: today, visitIds: many.slice(1) }, {}, "PUT");
    expect(atBound.status).toBe(409);
    const none = await post(orderRoute.PUT, { date: today, visitIds: [] }, {}, "PUT");
    expect(none.fieldErrors.visitIds?.[0]).toBe("Stops: list the day's stops, first to last.");
  });

  it("a product's days between it and seeding: 0–366 whole days, only for a pre-emergence; a seed species from the table", async () => {
    current = await c.actor("manager");
    const pre = (o: Record<string, unknown>) => ({
      name: `Bound pre ${randomUUID().slice(0, 8)}`,
      form: "granular",
      nPct: 0,
      p2o5Pct: 0,
      k2oPct: 0,
      slowReleasePctOfN: 0,
      densityLbPerGal: null,
      isPesticide: true,
      registrationNumber: "DEMO-B-1",
      labelCautions: "Demo label text.",
      reentryGuidance: "Keep off until dry.",
      labelMaxRate: 3,
      labelRateUnit: "lb/1000ft2",
      preEmergenceActive: "dithiopyr",
      ...o,
    });
    const count = async () =>
      Number(
        (
          await testDb()
            .selectFrom("products")
            .select((eb) => eb.fn.countAll().as("n"))
            .where("company_id", "=", c.companyId)
            .executeTakeFirstOrThrow()
        ).n,
      );
    expect((await post(productsRoute.POST, pre({ seedingIntervalDays: 366 }))).status).toBe(200);
    expect((await post(productsRoute.POST, pre({ seedingIntervalDays: 0 }))).status).toBe(200);
    const before = await count();
    const over = await post(productsRoute.POST, pre({ seedingIntervalDays: 367 }));
    expect(over.fieldErrors.seedingIntervalDays?.[0]).toBe(
      "Days between this product and seeding: at most 366.",
    );
    const under = await post(productsRoute.POST, pre({ seedingIntervalDays: -1 }));
    expect(under.fieldErrors.seedingIntervalDays?.[0]).toBe(
      "Days between this product and seeding: 0 or more.",
    );
    const part = await post(productsRoute.POST, pre({ seedingIntervalDays: 10.5 }));
    expect(part.fieldErrors.seedingIntervalDays?.[0]).toMatch(/whole days/);
    const notPre = await post(
      productsRoute.POST,
      pre({ preEmergenceActive: null, seedingIntervalDays: 30 }),
    );
    expect(notPre.fieldErrors.seedingIntervalDays?.[0]).toMatch(/only for a pre-emergence/);
    const other = await post(productsRoute.POST, pre({ preEmergenceActive: "other" }));
    expect(other.fieldErrors.seedingIntervalDays?.[0]).toMatch(/enter the label's interval/);
    const both = await post(productsRoute.POST, pre({ seedSpecies: "tall_fescue" }));
    expect(both.fieldErrors.seedSpecies?.[0]).toMatch(/either seed or a pre-emergence/);
    const sod = await post(
      productsRoute.POST,
      pre({ preEmergenceActive: null, isPesticide: false, seedSpecies: "st_augustinegrass" }),
    );
    expect(sod.fieldErrors.seedSpecies?.[0]).toMatch(/grown from seed/);
    expect(await count()).toBe(before);
  });
});
