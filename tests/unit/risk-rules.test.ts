// Each rule with cases that raise and cases that stay quiet, named with their source.
import { describe, expect, it } from "vitest";

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
  ...o,
});
const check = (date: string, o: Partial<CheckFacts> = {}): CheckFacts => ({
  date,
  mowingDirection: "changed",
  isMatted: false,
  isScalped: false,
  hasTornTips: false,
  heightOfCutIn: 3,
  symptomKeys: [],
  ...o,
});
const AT = "2026-07-20";
const warmHumid = [day(AT, { tmean5dF: c2f(24), rhMean5dPct: 80 })];
const cool = [day(AT, { tmean5dF: c2f(15), rhMean5dPct: 85 })];

describe("matted canopy (common practice; Kansas State University extension)", () => {
  const same3 = [
    check("2026-06-08", { mowingDirection: "same" }),
    check("2026-06-29", { mowingDirection: "same" }),
    check(AT, { mowingDirection: "same" }),
  ];
  it("raises on three checks mowed the same way in warm humid weather", () => {
    const r = mattedCanopy(same3, warmHumid, AT);
    expect(r.raised).toBe(true);
    expect(r.evidence.values).toMatchObject({
      sameDirectionChecks: 3,
      tMean5dC: 24,
      rhMean5dPct: 80,
    });
    expect(r.severity).toBe("moderate");
    expect(
      mattedCanopy(
        [
          ...same3.slice(0, 2),
          check(AT, { mowingDirection: "same", symptomKeys: ["dollar_spot"] }),
        ],
        warmHumid,
        AT,
      ).severity,
    ).toBe("high"); // disease showing
    expect(r.summary).toMatch(/Vary the mowing direction/);
  });
  it("raises on matting seen once, in warm humid weather", () => {
    expect(
      mattedCanopy(
        [check(AT, { isMatted: true })],
        [day(AT, { tmean5dF: c2f(21), rhMean5dPct: 71 })],
        AT,
      ),
    ).toMatchObject({ raised: true, severity: "moderate" });
  });
  it("stays quiet with two same-way checks, a change of direction, or cool weather", () => {
    expect(mattedCanopy(same3.slice(1), warmHumid, AT).raised).toBe(false);
    expect(
      mattedCanopy([...same3.slice(0, 2), check(AT, { mowingDirection: "changed" })], warmHumid, AT)
        .raised,
    ).toBe(false);
    expect(mattedCanopy(same3, cool, AT).raised).toBe(false);
    expect(mattedCanopy(same3, [day(AT, { tmean5dF: c2f(24), rhMean5dPct: 69 })], AT).raised).toBe(
      false,
    ); // RH just under 70 %
    expect(mattedCanopy(same3, [], AT).raised).toBe(false); // no weather: no claim
  });
});

describe("disease weather rules", () => {
  it("dollar spot (Smith et al. 2018): raised at ≥ 20 %", () => {
    expect(dollarSpotWeather([day(AT, { tmean5dF: c2f(20), rhMean5dPct: 80 })], AT)).toMatchObject({
      raised: true,
      severity: "moderate",
      evidence: { values: { probabilityPct: 40.4 } },
    });
    expect(dollarSpotWeather([day(AT, { tmean5dF: c2f(20), rhMean5dPct: 65 })], AT).raised).toBe(
      false,
    );
    expect(dollarSpotWeather([day(AT, { tmean5dF: c2f(8), rhMean5dPct: 95 })], AT).raised).toBe(
      false,
    ); // outside 10–35 °C
  });
  it("brown patch (Fidanza et al. 1996): raised at index ≥ 6 in the last 3 days", () => {
    expect(
      brownPatchWeather(
        [day("2026-07-18", { rhMeanPct: 90, tminF: c2f(20) }), day("2026-07-19"), day(AT)],
        AT,
      ),
    ).toMatchObject({ raised: true, evidence: { values: { on: "2026-07-18" } } });
    expect(
      brownPatchWeather(
        [
          day("2026-07-16", { rhMeanPct: 90, tminF: c2f(20) }),
          day("2026-07-18"),
          day("2026-07-19"),
          day(AT),
        ],
        AT,
      ).raised,
    ).toBe(false); // 4 days ago
    expect(brownPatchWeather([day(AT, { rhMeanPct: 84, tminF: c2f(20) })], AT).raised).toBe(false);
  });
  it("Pythium (Nutter et al. 1983): a hot day, a warm night and ≥ 14 h above 90 % RH", () => {
    const hot = day(AT, { tmaxF: c2f(32), tminF: c2f(22), rhMinPct: 92, rhMaxPct: 100 });
    expect(pythiumWeather([hot], AT)).toMatchObject({ raised: true, severity: "high" });
    expect(pythiumWeather([{ ...hot, rhMinPct: 60 }], AT).raised).toBe(false); // (100 − 90)/40 × 24 = 6 h
    expect(pythiumWeather([{ ...hot, tmaxF: c2f(30) }], AT).raised).toBe(false);
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

describe("feeding under heat stress (common practice)", () => {
  const app = { date: "2026-07-18", nLb: 0.7, productName: "Steadyfeed", findings: [] };
  it("raises when the high reaches 90 °F within 2 days of the application with no rain", () => {
    const days = [
      day("2026-07-18", { tmaxF: 88 }),
      day("2026-07-19", { tmaxF: 92 }),
      day(AT, { tmaxF: 91 }),
    ];
    expect(heatFeeding([app], days, AT)).toMatchObject({
      raised: true,
      evidence: { values: { highestF: 92 } },
    });
  });
  it("stays quiet with rain, cooler days, or an old application", () => {
    expect(heatFeeding([app], [day("2026-07-18", { tmaxF: 93, rainIn: 0.4 })], AT).raised).toBe(
      false,
    );
    expect(heatFeeding([app], [day("2026-07-18", { tmaxF: 89 })], AT).raised).toBe(false);
    expect(
      heatFeeding([{ ...app, date: "2026-07-01" }], [day("2026-07-01", { tmaxF: 95 })], AT).raised,
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

describe("mowing (University of Tennessee heights; the one-third rule, common practice)", () => {
  const tallFescue = { min: 1, max: 3 };
  it("raises below the species' range, on more than a third off at once, or scalping", () => {
    expect(mowingTooShort([check(AT, { heightOfCutIn: 0.75 })], tallFescue)).toMatchObject({
      raised: true,
      severity: "moderate",
    });
    expect(
      mowingTooShort(
        [check("2026-07-01", { heightOfCutIn: 3.5 }), check(AT, { heightOfCutIn: 2.25 })],
        tallFescue,
      ),
    ).toMatchObject({ raised: true, severity: "low" });
    expect(mowingTooShort([check(AT, { isScalped: true })], tallFescue).raised).toBe(true);
  });
  it("stays quiet at a third exactly, or within the range", () => {
    expect(
      mowingTooShort(
        [check("2026-07-01", { heightOfCutIn: 3 }), check(AT, { heightOfCutIn: 2 })],
        tallFescue,
      ).raised,
    ).toBe(false);
    expect(mowingTooShort([check(AT, { heightOfCutIn: 3 })], tallFescue).raised).toBe(false);
  });
  it("torn tips (common practice: a dull blade) raise a low alert", () => {
    expect(tornTips([check(AT, { hasTornTips: true })])).toMatchObject({
      raised: true,
      severity: "low",
    });
    expect(tornTips([check(AT)]).raised).toBe(false);
  });
});

describe("declining Index and late-season feeding", () => {
  it("declining raises with the trend word; high at −6 per 30 days", () => {
    expect(decliningIndex({ slopePer30Days: -3, r2: 0.8, n: 4, word: "declining" })).toMatchObject({
      raised: true,
      severity: "moderate",
    });
    expect(decliningIndex({ slopePer30Days: -7, r2: 0.8, n: 4, word: "declining" })).toMatchObject({
      raised: true,
      severity: "high",
    });
    expect(decliningIndex({ slopePer30Days: -1, r2: 0.8, n: 4, word: "steady" }).raised).toBe(
      false,
    );
    expect(decliningIndex(null).raised).toBe(false);
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
