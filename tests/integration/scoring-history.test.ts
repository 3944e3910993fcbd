// Index histories read from the database: the demo season (seven past visits with feeding and
// irrigation) gives every zone a trend and correlations; the property index is area-weighted per
// visit; scope holds (homeowners their own lawn only, other companies nothing); the book figures.
import { beforeAll, describe, expect, it } from "vitest";

import { pastRounds } from "@/fixtures/demo/rounds";
import { demoCompany, otherCompany } from "@/fixtures/demo/scenario";
import { fakeWeatherDay } from "@/fixtures/demo/weather-days";
import { addDays, todayIn } from "@/lib/dates";
import { getBookScoring, getPropertyScoreHistory } from "@/lib/scoring/queries";
import { cellOf, weatherDayRow } from "@/lib/weather/map";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let c: TestCompany;
let other: TestCompany;
const today = todayIn("America/New_York");

beforeAll(async () => {
  // The Haddad lawn moved to a weather cell of its own, so this file's cache rows never meet
  // the weather tests' (which expect an empty cache for the demo's cells).
  const scenario = {
    ...demoCompany,
    properties: demoCompany.properties.map((p) =>
      p.key === "haddad" ? { ...p, latitude: 41.0123, longitude: -75.0123 } : p,
    ),
  };
  [c, other] = await Promise.all([createTestCompany(scenario), createTestCompany(otherCompany)]);
  // The weather cache for the Haddad lawn's cell (no weather service in these tests).
  const haddad = c.scenario.properties.find((p) => p.key === "haddad")!;
  const cell = cellOf(haddad.latitude, haddad.longitude);
  const rows = Array.from({ length: 200 }, (_, i) =>
    weatherDayRow(cell, {
      ...fakeWeatherDay(haddad.latitude, haddad.longitude, addDays(today, -i), today),
      isForecast: false,
    }),
  );
  await testDb()
    .insertInto("weather_days")
    .values(rows)
    .onConflict((oc) => oc.columns(["cell", "day"]).doNothing())
    .execute();
});

describe("getPropertyScoreHistory", () => {
  it("gives each visit an area-weighted property index and each zone its season", async () => {
    const manager = await c.actor("manager");
    const h = await getPropertyScoreHistory(manager, c.propertyIds["haddad"]!);
    expect(h.visits).toHaveLength(7);
    expect(h.zones.map((z) => z.name)).toEqual(["Front slope", "Back yard"]);
    // Area-weighted: Front slope 1,800 ft², Back yard 5,200 ft².
    for (const v of h.visits) {
      const [slope, back] = h.zones.map(
        (z) => z.points.find((p) => p.visitId === v.visitId)!.index,
      );
      expect(v.index).toBeCloseTo((slope! * 1800 + back! * 5200) / 7000, 1);
    }
    const back = h.zones.find((z) => z.name === "Back yard")!;
    expect(back.trend?.word).toBe("declining"); // dollar spot in the demo story
    expect(back.correlations.n).toBe(7);
    expect(back.correlations.respondsToNitrogen).toBe(false);
    const slope = h.zones.find((z) => z.name === "Front slope")!;
    // A trend over every check; its word only when the 90 % interval of the slope excludes zero.
    expect(slope.trend!.n).toBeGreaterThanOrEqual(5);
    if (slope.trend!.ciLowPer30Days! < 0 && slope.trend!.ciHighPer30Days! > 0)
      expect(slope.trend?.word).toBeNull();
    // The applications of the demo's rounds before today (fixtures/demo/rounds.ts), the products
    // with nitrogen among them; none before the first check.
    const haddad = c.scenario.properties.find((p) => p.key === "haddad")!;
    const rounds = pastRounds(c.scenario.schedule!, haddad, today).filter((v) => v.application);
    expect(slope.applications).toHaveLength(rounds.length);
    expect(slope.correlations.pairs[0]!.availableNLb).toBe(0);
    // Weather from the cache: a 14-day balance for every check, so the water correlation exists.
    expect(h.weather.days.length).toBeGreaterThan(140);
    expect(slope.correlations.water?.n).toBe(7);
    // The back yard is irrigated in the demo; the front slope is not.
    expect(back.waterings.length).toBeGreaterThan(20);
    expect(slope.waterings).toEqual([]);
    // The charts start a week before the first check.
    expect(h.from).toBe(addDays(h.visits[0]!.date, -7));
  });

  it("is scoped: the homeowner of the lawn reads it, another homeowner and another company do not", async () => {
    const h = await getPropertyScoreHistory(await c.actor("owner2"), c.propertyIds["haddad"]!, {
      weather: false,
    });
    expect(h.visits).toHaveLength(7);
    expect(h.weather.days).toEqual([]);
    await expect(
      getPropertyScoreHistory(await c.actor("owner1"), c.propertyIds["haddad"]!),
    ).rejects.toMatchObject({ code: "not_found" });
    await expect(
      getPropertyScoreHistory(await other.actor("manager"), c.propertyIds["haddad"]!),
    ).rejects.toMatchObject({ code: "not_found" });
  });

  it("a property without checks has an empty history, not an error", async () => {
    const h = await getPropertyScoreHistory(
      await other.actor("manager"),
      other.propertyIds["aaland"]!,
      { weather: false },
    );
    expect(h.visits).toEqual([]);
    expect(h.trend).toBeNull();
    expect(h.zones.every((z) => z.correlations.n === 0 && z.correlations.nitrogen === null)).toBe(
      true,
    );
  });
});

describe("getBookScoring", () => {
  it("spreads the latest property indexes and counts the zones that follow nitrogen", async () => {
    const book = await getBookScoring(await c.actor("manager"));
    expect(book.total).toBe(6);
    expect(book.scored).toBe(6);
    expect(book.distribution.reduce((s, b) => s + b.count, 0)).toBe(6);
    expect(book.zonesTotal).toBe(17);
    expect(book.zonesWithEnoughChecks).toBe(17);
    // The book's count is the zones whose own history follows the N available before each check.
    let responding = 0;
    for (const id of Object.values(c.propertyIds)) {
      const h = await getPropertyScoreHistory(await c.actor("manager"), id, { weather: false });
      responding += h.zones.filter((z) => z.correlations.respondsToNitrogen).length;
    }
    expect(book.zonesRespondingToN).toBe(responding);
    expect(book.declining.map((p) => p.name)).toEqual(["Haddad residence"]);
    const theirs = await getBookScoring(await other.actor("manager"));
    expect(theirs.total).toBe(1);
    expect(theirs.zonesWithEnoughChecks).toBe(0);
  });
});
