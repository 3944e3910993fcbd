// Disease weather and heat feeding through the evaluation every write and the daily sweep run
// (evaluateProperty → afterWrite), on weather cached with its hours as the service gives them.
// Two lawns share one weather cell: the Haddad lawn (tall fescue, perennial ryegrass: cool-season)
// and the Okafor lawn, turned into bermudagrass and zoysiagrass (warm-season).
// - Pythium blight: Nutter, Cole & Schein (1983): high > 30 °C, then ≥ 14 h of RH > 90 % with
//   the low > 20 °C — counted on hourly humidity over the night after the hot day.
// - Brown patch: Fidanza et al. (1996), built on perennial ryegrass: cool-season zones only.
// - Heat feeding: common practice for cool-season turf; warm-season grasses are fed in summer.
import { beforeAll, describe, expect, it } from "vitest";

import { demoCompany } from "@/fixtures/demo/scenario";
import { evaluateProperty } from "@/lib/after-write/sweep";
import { recordApplication } from "@/lib/applications/mutations";
import { addDays } from "@/lib/dates";
import { listProducts } from "@/lib/products/queries";
import type { WeatherDayInput } from "@/lib/services/weather/contract";
import { cellOf, weatherDayRow } from "@/lib/weather/map";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { newId } from "../helpers/zone-checks";

const AT = "2026-07-21";
const HOT = "2026-07-20";
const LAT = 39.6123;
const LON = -74.9123; // a weather cell no other test file uses

let c: TestCompany;

/** A July day; `rh(h)` and `temp(h)` give its 24 hours. */
function july(
  date: string,
  o: Partial<WeatherDayInput>,
  temp: (h: number) => number,
  rh: (h: number) => number,
): WeatherDayInput {
  const tempC = Array.from({ length: 24 }, (_, h) => temp(h));
  const rhPct = Array.from({ length: 24 }, (_, h) => rh(h));
  return {
    date,
    tmaxC: Math.max(...tempC),
    tminC: Math.min(...tempC),
    rhMaxPct: Math.max(...rhPct),
    rhMinPct: Math.min(...rhPct),
    rhMeanPct: Math.round(rhPct.reduce((a, b) => a + b, 0) / 24),
    windMs: 2,
    windHeightM: 10,
    sunshineH: null,
    solarMJ: 22,
    precipMm: 0,
    isForecast: false,
    hourly: {
      time: Array.from({ length: 24 }, (_, h) => `${String(h).padStart(2, "0")}:00`),
      tempC,
      rhPct,
    },
    serviceEt0Mm: 5,
    ...o,
  };
}

/** 24 °C at dawn to 33 °C at 15:00, then 23.5 °C all night. */
const hotTemp = (h: number) =>
  h < 6 ? 23.5 : h <= 15 ? 23.5 + (h - 6) : h < 20 ? 32.5 - (h - 15) * 2 : 23.5;
const mildTemp = (h: number) => 18 + 6 * Math.sin((Math.PI * (h - 9)) / 12);

async function writeWeather(days: WeatherDayInput[]) {
  const cell = cellOf(LAT, LON);
  await testDb().deleteFrom("weather_days").where("cell", "=", cell).execute();
  await testDb()
    .insertInto("weather_days")
    .values(days.map((d) => weatherDayRow(cell, d)))
    .execute();
}

/** The 20 days before AT mild and dry; then the hot day and its night, as `night(h)` for hours 0–47 from HOT. */
async function season(night: (i: number) => number) {
  const days: WeatherDayInput[] = [];
  for (let d = addDays(AT, -20); d < HOT; d = addDays(d, 1))
    days.push(july(d, {}, mildTemp, (h) => 55 + 20 * Math.cos((Math.PI * h) / 12) ** 2));
  days.push(july(HOT, {}, hotTemp, (h) => night(h)));
  days.push(july(AT, {}, hotTemp, (h) => night(24 + h)));
  for (let d = addDays(AT, 1); d <= addDays(AT, 3); d = addDays(d, 1))
    days.push(july(d, { isForecast: true }, mildTemp, () => 60));
  await writeWeather(days);
}

const evaluate = async (key: string) =>
  evaluateProperty(testDb(), c.companyId, c.propertyIds[key]!, { provider: null, at: AT });

const alertsOf = (key: string) =>
  testDb()
    .selectFrom("risk_alerts")
    .leftJoin("zones", "zones.id", "risk_alerts.zone_id")
    .select([
      "risk_alerts.kind",
      "risk_alerts.status",
      "risk_alerts.clear_since",
      "risk_alerts.evidence",
      "risk_alerts.source",
      "risk_alerts.summary",
      "zones.name as zone",
    ])
    .where("risk_alerts.company_id", "=", c.companyId)
    .where("risk_alerts.property_id", "=", c.propertyIds[key]!)
    .where("risk_alerts.raised_on", "=", AT)
    .execute()
    .then((rows) =>
      rows.map((r) => ({ ...r, evidence: r.evidence as { values: Record<string, unknown> } })),
    );

beforeAll(async () => {
  const scenario = {
    ...demoCompany,
    properties: demoCompany.properties.map((p) =>
      p.key === "haddad" || p.key === "okafor" ? { ...p, latitude: LAT, longitude: LON } : p,
    ),
  };
  c = await createTestCompany(scenario);
  const okaforZones = await testDb()
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", c.propertyIds["okafor"]!)
    .orderBy("name")
    .execute();
  for (const [i, z] of okaforZones.entries())
    await testDb()
      .updateTable("zones")
      .set({ grass_species: i % 2 ? "zoysiagrass" : "bermudagrass" })
      .where("id", "=", z.id)
      .execute();
});

describe("Pythium blight weather on hourly humidity", () => {
  it("is raised after a hot day whose night stays above 90 % for 14 h, though its daily RH range (55–97 %) reads dry", async () => {
    // 97 % from 19:00 on the hot day to 08:59 the next morning; 55 % in the afternoons.
    await season((i) => (i >= 19 && i < 33 ? 97 : 55));
    await evaluate("haddad");
    const pythium = (await alertsOf("haddad")).find((a) => a.kind === "pythium_weather");
    expect(pythium).toMatchObject({ status: "open" });
    expect(pythium!.evidence.values).toMatchObject({
      on: HOT,
      hoursRhAbove90: 14,
      nightMinC: 23.5,
      builtOn: expect.stringMatching(/Pennsylvania/),
    });
    expect(pythium!.source).toMatch(/Nutter, Cole & Schein \(1983\).*hourly/);
  });

  it("stays quiet when the humid hours came the night before the hot day", async () => {
    await season((i) => (i < 10 ? 97 : 55));
    await evaluate("okafor");
    expect((await alertsOf("okafor")).find((a) => a.kind === "pythium_weather")).toBeUndefined();
  });
});

describe("warm- and cool-season grasses", () => {
  it("brown patch weather is raised for the cool-season lawn, naming its zones and the model's ryegrass, and not for bermuda and zoysia", async () => {
    // A humid warm night: on the day after, mean RH 87.6 % and a low of 23.5 °C, index 6.3
    // (−21.5 + 0.15 · 87.6 + 1.4 · 23.5 − 0.033 · 23.5²).
    await season((i) => (i >= 19 && i < 33 ? 97 : 82));
    await evaluate("haddad");
    await evaluate("okafor");
    const haddad = (await alertsOf("haddad")).find((a) => a.kind === "brown_patch_weather");
    expect(haddad!.evidence.values).toMatchObject({
      coolSeasonZones: "Front slope, Back yard",
      highestIndex: 6.38, // the day's mean RH as cached, 88 %
      builtOn: expect.stringMatching(/perennial ryegrass/),
    });
    expect((await alertsOf("okafor")).map((a) => a.kind)).not.toContain("brown_patch_weather");
  });

  it("feeding in 94 °F heat raises the heat alert on perennial ryegrass, not on bermudagrass", async () => {
    await season(() => 50);
    // The hot day peaks at 34.4 °C (94 °F).
    await testDb()
      .updateTable("weather_days")
      .set({ tmax_c: 34.4 })
      .where("cell", "=", cellOf(LAT, LON))
      .where("day", "in", [HOT, AT])
      .execute();
    const manager = await c.actor("manager");
    const steadyfeed = (await listProducts(manager)).find((p) =>
      p.name.startsWith("Larkmoor Steadyfeed"),
    )!.id;
    for (const key of ["haddad", "okafor"]) {
      const visit = await testDb()
        .selectFrom("visits")
        .select("id")
        .where("property_id", "=", c.propertyIds[key]!)
        .where("status", "!=", "cancelled")
        .orderBy("scheduled_for", "desc")
        .limit(1)
        .executeTakeFirstOrThrow();
      const zone = await testDb()
        .selectFrom("zones")
        .select(["id", "grass_species"])
        .where("property_id", "=", c.propertyIds[key]!)
        .orderBy("name")
        .executeTakeFirstOrThrow();
      expect(zone.grass_species).toBe(key === "haddad" ? "perennial_ryegrass" : "bermudagrass");
      // An application is dated within its visit (issue 18 item 1): the visit is the hot day's.
      await testDb()
        .updateTable("visits")
        .set({
          status: "completed",
          started_at: new Date(`${HOT}T09:00:00-04:00`),
          completed_at: new Date(`${HOT}T12:00:00-04:00`),
        })
        .where("id", "=", visit.id)
        .execute();
      // The label's yearly maximum and interval count the scenario's own feedings of this zone;
      // this test is about the heat, so the zone starts the season unfed.
      await testDb().deleteFrom("applications").where("zone_id", "=", zone.id).execute();
      await recordApplication(manager, visit.id, {
        id: newId(),
        zoneId: zone.id,
        productId: steadyfeed,
        rateAmount: 3.1, // 0.74 lb N per 1,000 ft²
        rateUnit: "lb/1000ft2",
        appliedAt: `${HOT}T10:00:00-04:00`,
        windMph: 4,
        temperatureF: 86,
        isEstablishing: false,
        applicatorName: "",
        applicatorLicence: "",
        overrideReason: null,
        correctionReason: "Recorded on paper on the hot day; entered afterwards.",
      });
      await evaluate(key);
    }
    const heat = (key: string) =>
      alertsOf(key).then((as) => as.filter((a) => a.kind === "heat_feeding"));
    expect(await heat("haddad")).toMatchObject([
      { zone: "Back yard", evidence: { values: { highestF: 94, season: "cool" } } },
    ]);
    expect(await heat("okafor")).toEqual([]);
  });
});
