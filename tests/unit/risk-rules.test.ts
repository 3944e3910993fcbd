// Each rule with cases that raise and cases that stay quiet, named with their source.
import { describe, expect, it } from "vitest";

import { addDays } from "@/lib/dates";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import {
  blackoutApplication,
  brownPatchWeather,
  decliningIndex,
  dollarSpotWeather,
  droughtStress,
  heatFeeding,
  lateSeasonFeeding,
  mattedCanopy,
  mowingTooShort,
  overApplication,
  pythiumWeather,
  tornTips,
  type CheckFacts,
  type RiskDay,
} from "@/lib/risk/rules";
import { recentTrend } from "@/lib/scoring/history";
import { trendWord } from "@/lib/scoring/trend";

const c2f = (c: number) => (c * 9) / 5 + 32;
const day = (date: string, o: Partial<RiskDay> = {}): RiskDay => ({
  date,
  isForecast: false,
  tmaxF: 80,
  tminF: 62,
  rhMeanPct: 70,
  rhMinPct: 50,
  rhMaxPct: 90,
  rainIn: 0,
  tmean5dF: 71,
  rhMean5dPct: 72,
  hourly: null,
  ...o,
});
const check = (date: string, o: Partial<CheckFacts> = {}): CheckFacts => ({
  date,
  mowingDirection: "changed",
  isMatted: false,
  isScalped: false,
  hasTornTips: false,
  heightOfCutIn: 3,
  mowedToday: null,
  heightBeforeMowingIn: null,
  symptomKeys: [],
  ...o,
});
const AT = "2026-07-20";
const warmHumid = [day(AT, { tmean5dF: c2f(24), rhMean5dPct: 80 })];
const cool = [day(AT, { tmean5dF: c2f(9), rhMean5dPct: 85 })]; // under the dollar spot model's 10 °C

describe("matted canopy (common practice; weather from Smith et al. 2018 and Fidanza et al. 1996)", () => {
  const same3 = [
    check("2026-06-08", { mowingDirection: "same" }),
    check("2026-06-29", { mowingDirection: "same" }),
    check(AT, { mowingDirection: "same" }),
  ];
  it("raises on three checks mowed the same way while dollar spot weather is at its 20 % threshold: low, marked common practice", () => {
    const r = mattedCanopy(same3, warmHumid, AT, "cool");
    expect(r.raised).toBe(true);
    expect(r.evidence.values).toMatchObject({
      sameDirectionChecks: 3,
      tMean5dC: 24,
      rhMean5dPct: 80,
      probabilityPct: 59.5, // logit −11.4041 + 0.0894·80 + 0.1932·24 = 0.385
      practice: "common practice (no published threshold)",
    });
    expect(r.severity).toBe("low");
    expect(r.source).toMatch(/^Common practice/);
    expect(r.source).toMatch(/Smith et al\. \(2018\)/);
    expect(
      mattedCanopy(
        [
          ...same3.slice(0, 2),
          check(AT, { mowingDirection: "same", symptomKeys: ["dollar_spot"] }),
        ],
        warmHumid,
        AT,
        "cool",
      ).severity,
    ).toBe("moderate"); // disease showing: seen, not inferred
    expect(r.summary).toMatch(/dollar spot weather at 60 %.*Vary the mowing direction/);
  });
  it("raises on matting seen once; the weather part follows the dollar spot model's own threshold", () => {
    // At T5 20 °C the model's 20 % threshold is RH5 68.86 % (ln 0.25 = −11.4041 + 0.0894·RH + 0.1932·20).
    const at = (rh5: number) => [day(AT, { tmean5dF: c2f(20), rhMean5dPct: rh5 })];
    expect(mattedCanopy([check(AT, { isMatted: true })], at(69.5), AT, "warm")).toMatchObject({
      raised: true,
      severity: "low",
    });
    expect(mattedCanopy([check(AT, { isMatted: true })], at(68), AT, "warm").raised).toBe(false);
  });
  it("counts brown patch weather on cool-season turf only (Fidanza et al. 1996 was built on perennial ryegrass)", () => {
    // Dollar spot under threshold (T5 9 °C is outside its range); brown patch index 6.80 the day before.
    const days = [
      day("2026-07-19", { rhMeanPct: 90, tminF: c2f(20), tmean5dF: c2f(9) }),
      day(AT, { tmean5dF: c2f(9), rhMean5dPct: 85 }),
    ];
    expect(mattedCanopy(same3, days, AT, "cool")).toMatchObject({
      raised: true,
      evidence: { values: { highestIndex: 6.8 } },
    });
    expect(mattedCanopy(same3, days, AT, "warm").raised).toBe(false);
  });
  it("stays quiet with two same-way checks, a change of direction, weather under the models' thresholds, or none", () => {
    expect(mattedCanopy(same3.slice(1), warmHumid, AT, "cool").raised).toBe(false);
    expect(
      mattedCanopy(
        [...same3.slice(0, 2), check(AT, { mowingDirection: "changed" })],
        warmHumid,
        AT,
        "cool",
      ).raised,
    ).toBe(false);
    expect(mattedCanopy(same3, cool, AT, "cool").raised).toBe(false);
    // At T5 24 °C the threshold is RH5 60.2 %.
    expect(
      mattedCanopy(same3, [day(AT, { tmean5dF: c2f(24), rhMean5dPct: 59 })], AT, "cool").raised,
    ).toBe(false);
    expect(mattedCanopy(same3, [], AT, "cool").raised).toBe(false); // no weather: no claim
  });
});

/** Two local days of hours as the weather service gives them: `rh(i)` and `temp(i)` by hour 0–47. */
function withHours(
  first: RiskDay,
  second: RiskDay,
  temp: (i: number) => number,
  rh: (i: number) => number,
): RiskDay[] {
  const hours = (offset: number) => ({
    time: Array.from({ length: 24 }, (_, h) => `${String(h).padStart(2, "0")}:00`),
    tempC: Array.from({ length: 24 }, (_, h) => temp(h + offset)),
    rhPct: Array.from({ length: 24 }, (_, h) => rh(h + offset)),
  });
  return [
    { ...first, hourly: hours(0) },
    { ...second, hourly: hours(24) },
  ];
}

describe("disease weather rules", () => {
  it("dollar spot (Smith et al. 2018): raised at ≥ 20 %, naming the model and the golf-course bentgrass it was built on", () => {
    const r = dollarSpotWeather([day(AT, { tmean5dF: c2f(20), rhMean5dPct: 80 })], AT);
    expect(r).toMatchObject({
      raised: true,
      severity: "moderate",
      evidence: { values: { probabilityPct: 40.4 } },
    });
    expect(r.evidence.values.builtOn).toMatch(/golf-course creeping bentgrass/);
    expect(r.source).toMatch(/Built on golf-course creeping bentgrass/);
    expect(r.summary).toMatch(/built on golf-course bentgrass/);
    expect(dollarSpotWeather([day(AT, { tmean5dF: c2f(20), rhMean5dPct: 65 })], AT).raised).toBe(
      false,
    );
    expect(dollarSpotWeather([day(AT, { tmean5dF: c2f(8), rhMean5dPct: 95 })], AT).raised).toBe(
      false,
    ); // outside 10–35 °C
  });
  it("brown patch (Fidanza et al. 1996): raised at index ≥ 6 in the last 3 days, for cool-season zones", () => {
    const humid = [
      day("2026-07-18", { rhMeanPct: 90, tminF: c2f(20) }),
      day("2026-07-19"),
      day(AT),
    ];
    const r = brownPatchWeather(humid, AT, ["Front lawn"]);
    expect(r).toMatchObject({
      raised: true,
      evidence: { values: { on: "2026-07-18", highestIndex: 6.8, coolSeasonZones: "Front lawn" } },
    });
    expect(r.evidence.values.builtOn).toMatch(/perennial ryegrass/);
    expect(r.summary).toMatch(/cool-season zones \(Front lawn\)/);
    // The same weather on a lawn of zoysia and St. Augustine only: the model does not apply.
    expect(brownPatchWeather(humid, AT, [])).toMatchObject({
      raised: false,
      evidence: { values: { highestIndex: null, coolSeasonZones: null } },
    });
    expect(
      brownPatchWeather(
        [
          day("2026-07-16", { rhMeanPct: 90, tminF: c2f(20) }),
          day("2026-07-18"),
          day("2026-07-19"),
          day(AT),
        ],
        AT,
        ["Front lawn"],
      ).raised,
    ).toBe(false); // 4 days ago
    expect(
      brownPatchWeather([day(AT, { rhMeanPct: 84, tminF: c2f(20) })], AT, ["Front lawn"]).raised,
    ).toBe(false);
  });
  describe("Pythium (Nutter et al. 1983) on the service's hourly humidity", () => {
    const hot = day("2026-07-19", { tmaxF: c2f(33), tminF: c2f(22), rhMinPct: 55, rhMaxPct: 97 });
    const next = day(AT, { tmaxF: c2f(31), tminF: c2f(23), rhMinPct: 60, rhMaxPct: 97 });
    const temp = (i: number) => (i < 15 ? 24 + i * 0.6 : i < 21 ? 33 - (i - 15) * 1.5 : 23.5);
    it("raises for a hot day and 14 humid hours of the night after, though the day's RH range reads as a dry day", () => {
      // 96 % from 19:00 to 08:59 the next morning; 55–79 % in the afternoon.
      const days = withHours(hot, next, temp, (i) => (i >= 19 && i < 33 ? 96 : 55 + (i % 3)));
      const r = pythiumWeather(days, AT);
      expect(r).toMatchObject({
        raised: true,
        severity: "high",
        evidence: {
          values: { on: "2026-07-19", hoursRhAbove90: 14, nightMinC: 23.5, nightsJudged: 1 },
        },
      });
      expect(r.evidence.values.builtOn).toMatch(/Pennsylvania/);
      expect(r.summary).toMatch(/a high of 91 °F, then 14 hours above 90 % humidity/);
    });
    it("stays quiet when the humid hours were the night before the hot day", () => {
      const days = withHours(hot, next, temp, (i) => (i < 10 ? 97 : 60));
      expect(pythiumWeather(days, AT)).toMatchObject({
        raised: false,
        evidence: { values: { hoursRhAbove90: 0 } },
      });
    });
    it("does not judge a night without hourly humidity, and says so", () => {
      expect(pythiumWeather([hot, next], AT)).toMatchObject({
        raised: false,
        evidence: { values: { nightsJudged: 0, nightsWithoutHours: 1 } },
      });
    });
    it("stays quiet for a cool night (low of 19 °C) and for a high of 30 °C", () => {
      const humid = (i: number) => (i >= 19 && i < 33 ? 96 : 60);
      expect(
        pythiumWeather(
          withHours(hot, next, (i) => (i === 28 ? 19 : temp(i)), humid),
          AT,
        ).raised,
      ).toBe(false);
      expect(
        pythiumWeather(withHours({ ...hot, tmaxF: c2f(30) }, next, temp, humid), AT).raised,
      ).toBe(false);
    });
  });
});

describe("drought stress (common practice: about 1 in of water a week)", () => {
  it("raises at a 14-day balance of −1 in or less with no rain forecast; high at −2", () => {
    expect(
      droughtStress(
        -1.2,
        [day(AT), day("2026-07-21", { isForecast: true, rainIn: 0.1 })],
        AT,
        undefined,
      ),
    ).toMatchObject({ raised: true, severity: "moderate" });
    expect(droughtStress(-2.4, [], AT, undefined)).toMatchObject({
      raised: true,
      severity: "high",
    });
  });
  it("stays quiet when rain is coming or the deficit is small", () => {
    expect(
      droughtStress(-1.5, [day("2026-07-21", { isForecast: true, rainIn: 0.6 })], AT, undefined)
        .raised,
    ).toBe(false);
    expect(droughtStress(-0.8, [], AT, undefined).raised).toBe(false);
    expect(droughtStress(null, [], AT, undefined).raised).toBe(false);
  });
  it("raises when wilt is seen", () => {
    expect(droughtStress(0.3, [], AT, check(AT, { symptomKeys: ["wilt"] }))).toMatchObject({
      raised: true,
      severity: "moderate",
    });
  });
});

describe("feeding under heat stress (common practice; cool-season turf only)", () => {
  const app = { date: "2026-07-18", nLb: 0.7, productName: "Steadyfeed", findings: [] };
  const hotDays = [
    day("2026-07-18", { tmaxF: 88 }),
    day("2026-07-19", { tmaxF: 92 }),
    day(AT, { tmaxF: 91 }),
  ];
  it("raises on cool-season turf when the high reaches 90 °F within 2 days of the application with no rain", () => {
    expect(heatFeeding([app], hotDays, AT, "cool")).toMatchObject({
      raised: true,
      evidence: { values: { highestF: 92, season: "cool" } },
    });
  });
  it("stays quiet for warm-season turf fed in summer heat: 0.75 lb N on bermudagrass at 94 °F", () => {
    const bermuda = { ...app, nLb: 0.75, productName: "Quickgreen 24-0-6" };
    const r = heatFeeding([bermuda], [day("2026-07-18", { tmaxF: 94 })], AT, "warm");
    expect(r.raised).toBe(false);
    expect(r.evidence.threshold).toMatch(/warm-season grasses are fed in summer heat/);
    expect(heatFeeding([bermuda], [day("2026-07-18", { tmaxF: 94 })], AT, "cool").raised).toBe(
      true,
    );
  });
  it("stays quiet with rain, cooler days, or an old application", () => {
    expect(
      heatFeeding([app], [day("2026-07-18", { tmaxF: 93, rainIn: 0.4 })], AT, "cool").raised,
    ).toBe(false);
    expect(heatFeeding([app], [day("2026-07-18", { tmaxF: 89 })], AT, "cool").raised).toBe(false);
    expect(
      heatFeeding([{ ...app, date: "2026-07-01" }], [day("2026-07-01", { tmaxF: 95 })], AT, "cool")
        .raised,
    ).toBe(false);
  });
});

describe("over-application and blackout (the rule set; species range: University of Illinois 1995)", () => {
  const refusal = {
    key: "max_n",
    severity: "refusal",
    message: "1.2 lb N per 1,000 ft² is above the 0.9 lb limit per application.",
  };
  it("raises on a breached limit (high when the limit is law) or the year's N above the species' range", () => {
    expect(
      overApplication(
        [{ date: "2026-05-01", nLb: 1.2, productName: "x", findings: [refusal] }],
        4,
        "2026",
        "NJ",
      ),
    ).toMatchObject({ raised: true, severity: "high" });
    expect(
      overApplication(
        [0, 1, 2, 3, 4].map((i) => ({
          date: `2026-0${i + 4}-01`,
          nLb: 0.9,
          productName: "x",
          findings: [],
        })),
        4,
        "2026",
        null,
      ),
    ).toMatchObject({
      raised: true,
      severity: "moderate",
      evidence: { values: { yearToDateNLb: 4.5 } },
    });
  });
  it("stays quiet within limits, and last year's applications do not count", () => {
    expect(
      overApplication(
        [{ date: "2026-05-01", nLb: 0.9, productName: "x", findings: [] }],
        4,
        "2026",
        null,
      ).raised,
    ).toBe(false);
    expect(
      overApplication(
        [{ date: "2025-05-01", nLb: 1.2, productName: "x", findings: [refusal] }],
        4,
        "2026",
        null,
      ).raised,
    ).toBe(false);
  });
  it("a blackout application (recorded with an override) is high", () => {
    const blackout = { key: "blackout", severity: "refusal", message: "…" };
    expect(
      blackoutApplication(
        [{ date: "2026-12-02", nLb: 0.5, productName: "x", findings: [blackout] }],
        "2026",
        "NJ",
      ),
    ).toMatchObject({ raised: true, severity: "high" });
    expect(
      blackoutApplication(
        [{ date: "2026-11-02", nLb: 0.5, productName: "x", findings: [] }],
        "2026",
        "NJ",
      ).raised,
    ).toBe(false);
  });
});

describe("mowing: home-lawn heights (extension tables) and the one-third rule (common practice)", () => {
  // Ranges as lib/reference/grass-species.ts holds them (checked against their extension tables in
  // tests/unit/reference-tables.test.ts): tall fescue 2.0–3.5 in (University of Kentucky AGR-209).
  const tallFescue = findGrassSpecies("tall_fescue")!.heightOfCutIn;
  const mowed = (before: number, cut: number) =>
    check(AT, { mowedToday: true, heightBeforeMowingIn: before, heightOfCutIn: cut });

  it("raises below the species' home-lawn range, on more than a third off at this mowing, or scalping", () => {
    expect(mowingTooShort([check(AT, { heightOfCutIn: 1.75 })], tallFescue)).toMatchObject({
      raised: true,
      severity: "moderate",
    });
    // 5 in before mowing, cut to 3: 40 % of the blade (Cornell: at 3 in, mow by about 4.5 in).
    const r = mowingTooShort([mowed(5, 3)], tallFescue);
    expect(r).toMatchObject({
      raised: true,
      severity: "low",
      evidence: { values: { heightBeforeMowingIn: 5, removedPct: 40, mowedToday: true } },
    });
    expect(r.summary).toMatch(/mowed from 5 in to 3 in, taking off 40 %/);
    expect(r.summary).toMatch(/mow before the grass passes 4\.5 in/);
    // Half or more taken off: moderate.
    expect(mowingTooShort([mowed(6, 3)], tallFescue).severity).toBe("moderate");
    expect(mowingTooShort([check(AT, { isScalped: true })], tallFescue).raised).toBe(true);
  });

  it("stays quiet at a third exactly, within the range, or when not mowed today", () => {
    expect(mowingTooShort([mowed(4.5, 3)], tallFescue).raised).toBe(false); // exactly a third
    expect(mowingTooShort([mowed(3.75, 2.5)], tallFescue).raised).toBe(false); // exactly a third
    expect(mowingTooShort([check(AT, { heightOfCutIn: 3 })], tallFescue).raised).toBe(false);
    expect(
      mowingTooShort([check(AT, { mowedToday: false, heightOfCutIn: 3 })], tallFescue).raised,
    ).toBe(false);
  });

  it("where the old reading (cuts of two checks; all-use minimums) and the new one disagree", () => {
    // Old: 3.5 in at one check and 2.25 in weeks later read as "more than a third at once" (low).
    // Those are different mowings; nothing says a third came off at either.
    expect(
      mowingTooShort(
        [check("2026-07-01", { heightOfCutIn: 3.5 }), check(AT, { heightOfCutIn: 2.25 })],
        tallFescue,
      ).raised,
    ).toBe(false);
    // Old: same cut at both checks, quiet. New: the grass stood 5 in before today's mowing.
    expect(
      mowingTooShort([check("2026-07-01", { heightOfCutIn: 3 }), mowed(5, 3)], tallFescue).raised,
    ).toBe(true);
    // Old: tall fescue's all-use minimum of 1 in let a 1.5 in cut pass; the home-lawn range starts at 2.
    expect(mowingTooShort([check(AT, { heightOfCutIn: 1.5 })], { min: 1, max: 3 }).raised).toBe(
      false,
    );
    expect(mowingTooShort([check(AT, { heightOfCutIn: 1.5 })], tallFescue).raised).toBe(true);
  });
  it("torn tips (common practice: a dull blade) raise a low alert", () => {
    expect(tornTips([check(AT, { hasTornTips: true })])).toMatchObject({
      raised: true,
      severity: "low",
    });
    expect(tornTips([check(AT)]).raised).toBe(false);
  });
});

const t4 = (slopePer30Days: number, lo: number, hi: number, n: number) => ({
  slopePer30Days,
  r2: 0.5,
  n,
  ciLowPer30Days: lo,
  ciHighPer30Days: hi,
  word: trendWord({ slopePer30Days, n, ciLowPer30Days: lo, ciHighPer30Days: hi }),
});

describe("declining Index and late-season feeding", () => {
  it("declining raises with the trend word; high at −6 per 30 days", () => {
    const t = (slopePer30Days: number, lo: number, hi: number, n: number) => ({
      slopePer30Days,
      r2: 0.8,
      n,
      ciLowPer30Days: lo,
      ciHighPer30Days: hi,
      word: trendWord({ slopePer30Days, n, ciLowPer30Days: lo, ciHighPer30Days: hi }),
    });
    expect(decliningIndex(t(-3, -4.5, -1.5, 6))).toMatchObject({
      raised: true,
      severity: "moderate",
      evidence: { values: { n: 6, ciHighPer30Days: -1.5 } },
    });
    expect(decliningIndex(t(-7, -9, -5, 6))).toMatchObject({ raised: true, severity: "high" });
    expect(decliningIndex(t(-1, -1.5, -0.5, 6)).raised).toBe(false);
    expect(decliningIndex(null).raised).toBe(false);
  });
  it("where the old rule raised and the new one does not: few or noisy checks", () => {
    // Old rule: slope ≤ −2 with n ≥ 3 raised. Now n ≥ 5 and a 90 % interval below zero.
    expect(decliningIndex(t4(-3, -9, 3, 3)).raised).toBe(false); // 3 checks
    expect(decliningIndex(t4(-7, -15, 1, 5)).raised).toBe(false); // 5 noisy checks
    const points = [80, 68, 79, 66, 74].map((index, i) => ({
      date: addDays("2026-06-01", 20 * i),
      index,
    }));
    const noisy = recentTrend(points)!;
    expect(noisy.slopePer30Days).toBeLessThan(-2);
    expect(decliningIndex(noisy).raised).toBe(false);
    const clean = recentTrend(
      [80, 77.5, 75, 73, 69.5].map((index, i) => ({ date: addDays("2026-06-01", 20 * i), index })),
    )!;
    expect(decliningIndex(clean)).toMatchObject({ raised: true });
  });
  it("late-season feeding is a low reminder for cool-season turf in the fall window without N", () => {
    expect(lateSeasonFeeding("cool", [], "2026-10-15", "12-01")).toMatchObject({
      raised: true,
      severity: "low",
    });
    expect(
      lateSeasonFeeding(
        "cool",
        [{ date: "2026-09-20", nLb: 0.9, productName: "x", findings: [] }],
        "2026-10-15",
        "12-01",
      ).raised,
    ).toBe(false);
    expect(lateSeasonFeeding("warm", [], "2026-10-15", "12-01").raised).toBe(false);
    expect(lateSeasonFeeding("cool", [], "2026-08-15", "12-01").raised).toBe(false);
    expect(lateSeasonFeeding("cool", [], "2026-12-01", "12-01").raised).toBe(false); // blackout started
  });
});
