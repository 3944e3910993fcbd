// Season programs through the route handlers the screens call: who may read and write (a manager
// of another company and a technician are refused), the bounds in words, a replay, two saves at
// once, a followed program that cannot be deleted, a zone left out for the season, and the
// property's plan — nitrogen per round from growth potential on the weather fake's monthly normals,
// capped per application, none after New Jersey's closing day (N.J.S.A. 58:10A-62b: no
// professional application "after December 1st").
import { randomUUID } from "node:crypto";
import type { Server } from "node:http";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { listProducts } from "@/lib/products/queries";
import type { ProgramDto, ProgramPlanDto } from "@/lib/programs/dto";
import type { ProgramInput, ProgramRoundInput } from "@/lib/programs/schemas";
import { useServices } from "@/lib/services";
import { openMeteoProvider } from "@/lib/services/weather/provider";

import { startFakeWeather } from "../harness/weather-fake";
import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { callRoute } from "../helpers/route-call";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));

const listRoute = await import("@/app/api/v1/programs/route");
const oneRoute = await import("@/app/api/v1/programs/[programId]/route");
const propertyRoute = await import("@/app/api/v1/properties/[propertyId]/program/route");
const zoneRoute = await import("@/app/api/v1/zones/[zoneId]/program/route");

let c: TestCompany;
let other: TestCompany;
let manager: Actor;
let tech1: Actor;
let tech2: Actor;
let owner: Actor;
let otherManager: Actor;
let haddad: string;
let backYard: string;
let granular: string;
let liquid: string;
let lime: string;
let server: Server;
let restore: () => void;
const db = testDb();

beforeAll(async () => {
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  [manager, tech1, tech2, owner, otherManager] = await Promise.all([
    c.actor("manager"),
    c.actor("tech1"),
    c.actor("tech2"),
    c.actor("owner2"),
    other.actor("manager"),
  ]);
  haddad = c.propertyIds["haddad"]!; // tech1's, New Jersey
  backYard = (
    await db
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", haddad)
      .where("name", "=", "Back yard")
      .executeTakeFirstOrThrow()
  ).id;
  const products = await listProducts(manager);
  granular = products.find((p) => p.name.startsWith("Larkmoor Steadyfeed"))!.id;
  liquid = products.find((p) => p.name.startsWith("Brookline Liquid"))!.id;
  lime = products.find((p) => p.name.startsWith("Larkmoor Pelletized Lime"))!.id;
  server = await startFakeWeather(0);
  const address = server.address();
  const port = typeof address === "object" && address ? address.port : 0;
  restore = useServices({
    quickWeather: openMeteoProvider({ baseUrl: `http://127.0.0.1:${port}` }),
  });
});
afterAll(async () => {
  restore();
  await new Promise<void>((r) => server.close(() => r()));
});

const gp = (productId: string) => ({ productId, target: "growth_potential" as const, nLb: null });
const noN = { productId: null, target: "none" as const, nLb: null };
const dates = (
  kind: ProgramRoundInput["kind"],
  startMd: string,
  endMd: string,
  over: Partial<ProgramRoundInput> = {},
): ProgramRoundInput => ({
  kind,
  windowKind: "dates",
  startMd,
  endMd,
  triggerBaseF: null,
  triggerValue: null,
  windowDays: null,
  granular: gp(granular),
  liquid: gp(liquid),
  ...over,
});

const coolProgram = (over: Partial<ProgramInput> = {}): ProgramInput => ({
  id: randomUUID(),
  name: `Cool-season ${randomUUID().slice(0, 6)}`,
  grassSeason: "cool",
  notes: "",
  rounds: [
    dates("feeding", "04-01", "04-30"),
    {
      ...dates("pre_emergence", "01-01", "01-01"),
      windowKind: "gdd",
      startMd: null,
      endMd: null,
      triggerBaseF: 50,
      triggerValue: 100,
      windowDays: 21,
      granular: noN,
      liquid: noN,
    },
    dates("feeding", "05-15", "06-10"),
    dates("feeding", "07-01", "07-31"),
    {
      ...dates("lime", "03-01", "03-31"),
      granular: { productId: lime, target: "none", nLb: null },
      liquid: noN,
    },
    dates("feeding", "09-01", "09-30"),
    dates("fall_feeding", "11-15", "12-15"),
  ],
  ...over,
});

const as = (actor: Actor | null) => {
  current = actor;
};

describe("programs: who may read and write", () => {
  it("a manager creates one (201) and a replay of the same id returns it; the list shows it", async () => {
    as(manager);
    const input = coolProgram();
    const made = await callRoute<ProgramDto>(listRoute.POST, input);
    expect(made.status).toBe(201);
    expect(made.body.rounds).toHaveLength(7);
    expect(made.body.rounds[1]!.window).toEqual({ kind: "gdd", baseF: 50, value: 100, days: 21 });
    const again = await callRoute<ProgramDto>(listRoute.POST, input);
    expect(again.status).toBe(201);
    expect(again.body.id).toBe(input.id);
    const list = await callRoute<{ items: ProgramDto[] }>(listRoute.GET, null, { method: "GET" });
    expect(list.body.items.filter((p) => p.id === input.id)).toHaveLength(1);
    const rows = await db
      .selectFrom("program_rounds")
      .select("id")
      .where("program_id", "=", input.id)
      .execute();
    expect(rows).toHaveLength(7);
  });

  it("a technician and a homeowner are refused; a manager of another company finds nothing (404)", async () => {
    as(manager);
    const input = coolProgram();
    await callRoute(listRoute.POST, input);
    for (const actor of [tech1, owner]) {
      as(actor);
      expect((await callRoute(listRoute.POST, coolProgram())).status).toBe(403);
      expect((await callRoute(listRoute.GET, null, { method: "GET" })).status).toBe(403);
      const put = await callRoute(oneRoute.PUT, input, {
        method: "PUT",
        params: { programId: input.id },
      });
      expect(put.status).toBe(403);
      expect(
        (
          await callRoute(
            propertyRoute.PUT,
            { programId: input.id },
            { method: "PUT", params: { propertyId: haddad } },
          )
        ).status,
      ).toBe(403);
    }
    as(otherManager);
    expect(
      (await callRoute(oneRoute.GET, null, { method: "GET", params: { programId: input.id } }))
        .status,
    ).toBe(404);
    expect(
      (
        await callRoute(
          oneRoute.PUT,
          { ...input, name: "Taken over" },
          { method: "PUT", params: { programId: input.id } },
        )
      ).status,
    ).toBe(404);
    expect(
      (
        await callRoute(oneRoute.DELETE, null, {
          method: "DELETE",
          params: { programId: input.id },
        })
      ).status,
    ).toBe(404);
    expect(
      (
        await callRoute(
          propertyRoute.PUT,
          { programId: null },
          { method: "PUT", params: { propertyId: haddad } },
        )
      ).status,
    ).toBe(404);
    // The other company's own property cannot follow this company's program.
    const theirs = Object.values(other.propertyIds)[0]!;
    const cross = await callRoute(
      propertyRoute.PUT,
      { programId: input.id },
      { method: "PUT", params: { propertyId: theirs } },
    );
    expect(cross.status).toBe(422);
    expect(cross.body.error?.fieldErrors?.programId?.[0]).toMatch(
      /Program: choose one of your programs/,
    );
    // Its replay of our id is refused, and ours is unchanged.
    const stolen = await callRoute(listRoute.POST, { ...input, name: "Theirs" });
    expect(stolen.status).toBe(409);
    as(manager);
    const mine = await callRoute<ProgramDto>(oneRoute.GET, null, {
      method: "GET",
      params: { programId: input.id },
    });
    expect(mine.body.name).toBe(input.name);
  });
});

describe("programs: bounds in words", () => {
  const refused = async (input: unknown, field: string, message: RegExp) => {
    as(manager);
    const r = await callRoute(listRoute.POST, input);
    expect(r.status).toBe(422);
    const errors = r.body.error?.fieldErrors ?? {};
    expect(Object.keys(errors)).toContain(field);
    expect(errors[field]!.join(" ")).toMatch(message);
  };

  it("names the field of a bad window, trigger, target or product", async () => {
    const p = coolProgram();
    await refused(
      { ...p, rounds: [dates("feeding", "05-10", "04-30")] },
      "rounds.0.endMd",
      /Window to: on or after/,
    );
    await refused(
      { ...p, rounds: [dates("feeding", "02-30", "03-10")] },
      "rounds.0.startMd",
      /Window from: a month and day/,
    );
    await refused(
      {
        ...p,
        rounds: [
          {
            ...dates("feeding", "04-01", "04-30"),
            windowKind: "gdd",
            startMd: null,
            endMd: null,
            triggerValue: 200,
            windowDays: 14,
          },
        ],
      },
      "rounds.0.triggerBaseF",
      /GDD base/,
    );
    await refused(
      {
        ...p,
        rounds: [
          dates("feeding", "04-01", "04-30", {
            granular: { productId: granular, target: "lb", nLb: 3.01 },
          }),
        ],
      },
      "rounds.0.granular.nLb",
      /at most 3 lb per 1,000 ft²/,
    );
    await refused(
      {
        ...p,
        rounds: [
          dates("feeding", "04-01", "04-30", {
            granular: { productId: granular, target: "lb", nLb: null },
          }),
        ],
      },
      "rounds.0.granular.nLb",
      /enter the lb N/,
    );
    await refused(
      { ...p, rounds: [dates("feeding", "04-01", "04-30", { granular: gp(liquid) })] },
      "rounds.0.granular.productId",
      /is a liquid/,
    );
    await refused(
      { ...p, rounds: [dates("feeding", "04-01", "04-30", { granular: gp(lime) })] },
      "rounds.0.granular.productId",
      /carries no nitrogen/,
    );
    await refused(
      { ...p, rounds: [dates("feeding", "04-01", "04-30", { liquid: gp(randomUUID()) })] },
      "rounds.0.liquid.productId",
      /product of your catalog/,
    );
    await refused({ ...p, rounds: [] }, "rounds", /at least one round/);
    await refused(
      { ...p, rounds: Array.from({ length: 31 }, () => dates("feeding", "04-01", "04-30")) },
      "rounds",
      /at most 30/,
    );
    await refused({ ...p, name: "" }, "name", /Name: the program's name is required/);
    await refused({ ...p, name: "x".repeat(81) }, "name", /at most 80/);
  });

  it("a control character in the name is refused (422) and nothing is saved", async () => {
    as(manager);
    const p = coolProgram({ name: "Spring\u0000program" });
    const r = await callRoute(listRoute.POST, p);
    expect(r.status).toBe(422);
    expect(
      await db.selectFrom("programs").select("id").where("id", "=", p.id).executeTakeFirst(),
    ).toBeUndefined();
  });

  it("a second program with the same name is refused on the name", async () => {
    as(manager);
    const first = coolProgram();
    await callRoute(listRoute.POST, first);
    await refused(
      { ...coolProgram(), name: first.name },
      "name",
      /another program already has this name/,
    );
  });
});

describe("programs: editing", () => {
  it("two saves at once take turns: the rounds are one save's, never a mix or doubled", async () => {
    as(manager);
    const p = coolProgram();
    await callRoute(listRoute.POST, p);
    const a = { ...p, rounds: p.rounds.slice(0, 2) };
    const b = { ...p, rounds: p.rounds.slice(0, 5) };
    const [ra, rb] = await Promise.all([
      callRoute(oneRoute.PUT, a, { method: "PUT", params: { programId: p.id } }),
      callRoute(oneRoute.PUT, b, { method: "PUT", params: { programId: p.id } }),
    ]);
    expect([ra.status, rb.status]).toEqual([200, 200]);
    const rows = await db
      .selectFrom("program_rounds")
      .select("position")
      .where("program_id", "=", p.id)
      .orderBy("position")
      .execute();
    expect([2, 5]).toContain(rows.length);
    expect(rows.map((r) => r.position)).toEqual(
      Array.from({ length: rows.length }, (_, i) => i + 1),
    );
  });

  it("a followed program cannot be deleted (409 naming how many); unfollowed it can", async () => {
    as(manager);
    const p = coolProgram();
    await callRoute(listRoute.POST, p);
    await callRoute(
      propertyRoute.PUT,
      { programId: p.id },
      { method: "PUT", params: { propertyId: haddad } },
    );
    const refused = await callRoute(oneRoute.DELETE, null, {
      method: "DELETE",
      params: { programId: p.id },
    });
    expect(refused.status).toBe(409);
    expect(refused.body.error?.message).toMatch(/1 property follows this program/);
    await callRoute(
      propertyRoute.PUT,
      { programId: null },
      { method: "PUT", params: { propertyId: haddad } },
    );
    expect(
      (await callRoute(oneRoute.DELETE, null, { method: "DELETE", params: { programId: p.id } }))
        .status,
    ).toBe(204);
    expect(
      await db.selectFrom("program_rounds").select("id").where("program_id", "=", p.id).execute(),
    ).toHaveLength(0);
  });
});

describe("the property's season plan", () => {
  it("spreads each zone's yearly N by growth potential, within the cap, none after December 1 in New Jersey", async () => {
    as(manager);
    const p = coolProgram();
    await callRoute(listRoute.POST, p);
    const set = await callRoute<ProgramPlanDto>(
      propertyRoute.PUT,
      { programId: p.id },
      { method: "PUT", params: { propertyId: haddad } },
    );
    expect(set.status).toBe(200);
    const plan = set.body;
    expect(plan.program?.id).toBe(p.id);
    expect(plan.weatherProblem).toBeNull();
    expect(plan.normalsYears).toHaveLength(2);
    expect(plan.ruleSetName).toMatch(/New Jersey/);
    // The GDD round's window is estimated from the normals, in spring.
    const pre = plan.rounds[1]!;
    expect(pre.estimated).toBe(true);
    expect(pre.start! >= `${plan.year}-03-01` && pre.start! <= `${plan.year}-06-30`).toBe(true);
    expect(plan.zones.length).toBeGreaterThan(0);
    for (const z of plan.zones) {
      const [apr, preR, may, jul, limeR, sep, late] = z.rounds;
      expect(preR!.nLb).toBe(0);
      expect(limeR!.nLb).toBe(0);
      expect(limeR!.reason).toBe("no_nitrogen");
      // Cool-season summer heat: July's GP is below late spring's and early fall's, and its N
      // never above theirs (they may all reach the cap when the yearly target is high).
      expect(jul!.gp!).toBeLessThan(may!.gp!);
      expect(jul!.gp!).toBeLessThan(sep!.gp!);
      expect(jul!.nLb).toBeLessThanOrEqual(may!.nLb);
      expect(jul!.nLb).toBeLessThanOrEqual(sep!.nLb);
      expect(apr!.nLb).toBeGreaterThan(0);
      // The late-fall round is planned on its allowed days only.
      expect(late!.allowed).toEqual({ from: `${plan.year}-11-15`, to: `${plan.year}-12-01` });
      for (const r of z.rounds) expect(r.nLb).toBeLessThanOrEqual((z.capLb ?? Infinity) + 1e-9);
      expect(z.totalLb + z.unplacedLb).toBeCloseTo(z.yearlyTargetLb, 6);
      // Product to load: N ÷ 24 % × area (Steadyfeed 24-0-8), for granular zones.
      if (z.method === "granular" && apr!.load)
        expect(apr!.load.lb).toBeCloseTo(((apr!.nLb / 0.24) * z.areaFt2) / 1000, 6);
    }
    as(tech1);
    const seen = await callRoute<ProgramPlanDto>(propertyRoute.GET, null, {
      method: "GET",
      params: { propertyId: haddad },
    });
    expect(seen.status).toBe(200);
    expect(seen.body.zones).toEqual(plan.zones);
    as(tech2); // not the property's technician
    expect(
      (await callRoute(propertyRoute.GET, null, { method: "GET", params: { propertyId: haddad } }))
        .status,
    ).toBe(404);
    as(owner);
    expect(
      (await callRoute(propertyRoute.GET, null, { method: "GET", params: { propertyId: haddad } }))
        .status,
    ).toBe(403);
  });

  it("a zone left out for the season gets nothing; a liquid zone loads gallons; exclusion needs a reason", async () => {
    as(manager);
    const p = coolProgram();
    await callRoute(listRoute.POST, p);
    await callRoute(
      propertyRoute.PUT,
      { programId: p.id },
      { method: "PUT", params: { propertyId: haddad } },
    );
    const first = await callRoute<ProgramPlanDto>(propertyRoute.GET, null, {
      method: "GET",
      params: { propertyId: haddad },
    });
    const year = first.body.year;
    const noReason = await callRoute(
      zoneRoute.PUT,
      { method: "granular", excludedYear: year, excludedReason: null },
      { method: "PUT", params: { zoneId: backYard } },
    );
    expect(noReason.status).toBe(422);
    expect(noReason.body.error?.fieldErrors?.excludedReason?.[0]).toMatch(/Reason: say why/);
    expect(
      (
        await callRoute(
          zoneRoute.PUT,
          { method: "granular", excludedYear: year, excludedReason: "New sod in May" },
          { method: "PUT", params: { zoneId: backYard } },
        )
      ).status,
    ).toBe(200);
    const plan = await callRoute<ProgramPlanDto>(propertyRoute.GET, null, {
      method: "GET",
      params: { propertyId: haddad },
    });
    const back = plan.body.zones.find((z) => z.zoneId === backYard)!;
    expect(back.excluded).toEqual({ year, reason: "New sod in May" });
    expect(back.totalLb).toBe(0);
    expect(back.rounds.every((r) => r.reason === "excluded")).toBe(true);
    // A liquid zone: the liquid product's fl oz and gallons.
    await callRoute(
      zoneRoute.PUT,
      { method: "liquid", excludedYear: null, excludedReason: null },
      { method: "PUT", params: { zoneId: backYard } },
    );
    const liquidPlan = await callRoute<ProgramPlanDto>(propertyRoute.GET, null, {
      method: "GET",
      params: { propertyId: haddad },
    });
    const apr = liquidPlan.body.zones.find((z) => z.zoneId === backYard)!.rounds[0]!;
    expect(apr.product?.id).toBe(liquid);
    expect(apr.rate?.unit).toBe("floz/1000ft2");
    expect(apr.load?.gal).toBeGreaterThan(0);
    as(tech1);
    expect(
      (
        await callRoute(
          zoneRoute.PUT,
          { method: "granular", excludedYear: null, excludedReason: null },
          { method: "PUT", params: { zoneId: backYard } },
        )
      ).status,
    ).toBe(403);
    as(otherManager);
    expect(
      (
        await callRoute(
          zoneRoute.PUT,
          { method: "granular", excludedYear: null, excludedReason: null },
          { method: "PUT", params: { zoneId: backYard } },
        )
      ).status,
    ).toBe(404);
    as(manager);
    await callRoute(
      zoneRoute.PUT,
      { method: "granular", excludedYear: null, excludedReason: null },
      { method: "PUT", params: { zoneId: backYard } },
    );
  });

  it("with the weather service down the growth-potential rounds say so and fixed targets stand", async () => {
    as(manager);
    const p = coolProgram({
      rounds: [
        dates("feeding", "04-01", "04-30", {
          granular: { productId: granular, target: "lb", nLb: 0.75 },
          liquid: { productId: liquid, target: "lb", nLb: 0.5 },
        }),
        dates("feeding", "09-01", "09-30"),
      ],
    });
    await callRoute(listRoute.POST, p);
    await callRoute(
      propertyRoute.PUT,
      { programId: p.id },
      { method: "PUT", params: { propertyId: haddad } },
    );
    const back = useServices({
      quickWeather: openMeteoProvider({
        baseUrl: "http://127.0.0.1:9",
        timeoutMs: 200,
        retries: 0,
      }),
    });
    try {
      const plan = await callRoute<ProgramPlanDto>(propertyRoute.GET, null, {
        method: "GET",
        params: { propertyId: haddad },
      });
      expect(plan.status).toBe(200);
      expect(plan.body.weatherProblem).toMatch(/could not give the monthly normals/);
      const z = plan.body.zones.find((x) => x.method === "granular")!;
      expect(z.rounds[0]!.nLb).toBe(0.75);
      expect(z.rounds[1]!.reason).toBe("no_weather");
    } finally {
      back();
    }
  });
});
