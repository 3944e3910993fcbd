// The growth potential model and the nitrogen spread, against their published sources
// (lib/agronomy/growth-potential.ts, lib/agronomy/n-spread.ts).
import { describe, expect, it } from "vitest";

import {
  expectedTriggerDay,
  growthPotential,
  windowGrowthPotential,
} from "@/lib/agronomy/growth-potential";
import { spreadNitrogen, yearlyNTarget, type SpreadRound } from "@/lib/agronomy/n-spread";
import { findGrassSpecies } from "@/lib/reference/grass-species";

const f2c = (f: number) => ((f - 32) * 5) / 9;
/** The Fahrenheit form of the model as the fact sheets restate it (68 °F / 10 °F, 88 °F / 12 °F; from memory). */
const gpF = (f: number, optimumF: number, sigmaF: number) =>
  Math.exp(-0.5 * ((f - optimumF) / sigmaF) ** 2);

describe("growth potential (Gelernter & Stowell 2005)", () => {
  it("is 1 at the published optimum: 20 °C cool-season, 31 °C warm-season", () => {
    expect(growthPotential(20, "cool")).toBe(1);
    expect(growthPotential(31, "warm")).toBe(1);
  });

  it("is exp(−½) one σ from the optimum (5.5 °C cool, 7 °C warm) and exp(−2) two σ away", () => {
    expect(growthPotential(14.5, "cool")).toBeCloseTo(Math.exp(-0.5), 12);
    expect(growthPotential(25.5, "cool")).toBeCloseTo(Math.exp(-0.5), 12);
    expect(growthPotential(9, "cool")).toBeCloseTo(Math.exp(-2), 12);
    expect(growthPotential(24, "warm")).toBeCloseTo(Math.exp(-0.5), 12);
    expect(growthPotential(17, "warm")).toBeCloseTo(Math.exp(-2), 12);
  });

  it("agrees with the Fahrenheit form of the fact sheets within 0.01 (cool) and 0.05 (warm: 88 °F is 31.1 °C, 12 °F is 6.7 °C) from 32 °F to 100 °F", () => {
    for (let f = 32; f <= 100; f += 2) {
      expect(Math.abs(growthPotential(f2c(f), "cool") - gpF(f, 68, 10))).toBeLessThan(0.01);
      const warmF = f >= 88 ? 1 : gpF(f, 88, 12);
      expect(Math.abs(growthPotential(f2c(f), "warm") - warmF)).toBeLessThan(0.05);
    }
  });

  it("holds warm-season GP at 1 above the optimum (PACE Turf's revision); cool-season falls in heat", () => {
    expect(growthPotential(35, "warm")).toBe(1);
    expect(growthPotential(40, "warm")).toBe(1);
    expect(growthPotential(30, "cool")).toBeCloseTo(Math.exp(-0.5 * (10 / 5.5) ** 2), 12);
    expect(growthPotential(30, "cool")).toBeLessThan(0.2);
  });

  it("a 68 °F day is the cool-season optimum and an 88 °F day about the warm-season one (the fact sheets' figures)", () => {
    expect(growthPotential(f2c(68), "cool")).toBeCloseTo(1, 12);
    expect(growthPotential(f2c(88), "warm")).toBe(1);
    // 60–75 °F "grows best" for cool-season turf: GP above one half there.
    for (const f of [60, 65, 70, 75]) expect(growthPotential(f2c(f), "cool")).toBeGreaterThan(0.5);
  });

  it("refuses a temperature that is not a number", () => {
    expect(() => growthPotential(Number.NaN, "cool")).toThrow(/Mean temperature/);
  });
});

// A hand-worked season. Monthly means chosen (not a place's normals) so each window's GP is a
// round number of σ from the optimum: April 14.5 °C and July 25.5 °C (one σ: e^−½ = 0.606531),
// May and September 20 °C (1), November 9 °C (two σ: e^−2 = 0.135335), December 3.5 °C (three σ:
// e^−4.5 = 0.011109).
const NORMALS = [0, 2, 8, 14.5, 20, 23, 25.5, 25, 20, 13, 9, 3.5];
const ONE_SIGMA = 0.6065306597;
const TWO_SIGMA = 0.1353352832;
const THREE_SIGMA = 0.0111089965;
const NJ_PRO_WINDOW = ["12-01", "03-01"] as const; // N.J.S.A. 58:10A-62b: not after Dec 1 nor before Mar 1

const season: SpreadRound[] = [
  { key: "spring", start: "2027-04-01", end: "2027-04-30", target: { kind: "growth_potential" } },
  { key: "weeds", start: "2027-05-01", end: "2027-05-31", target: { kind: "growth_potential" } },
  { key: "grubs", start: "2027-06-10", end: "2027-06-30", target: { kind: "none" } },
  { key: "summer", start: "2027-07-01", end: "2027-07-31", target: { kind: "growth_potential" } },
  { key: "fall", start: "2027-09-01", end: "2027-09-30", target: { kind: "growth_potential" } },
  { key: "late", start: "2027-11-15", end: "2027-12-15", target: { kind: "growth_potential" } },
];

describe("the nitrogen spread over a hand-worked season", () => {
  it("a round's GP is the mean over its allowed days: Nov 15–Dec 1 under New Jersey's window", () => {
    const all = windowGrowthPotential("2027-11-15", "2027-12-15", "cool", NORMALS);
    expect(all.days).toBe(31);
    expect(all.gp).toBeCloseTo((16 * TWO_SIGMA + 15 * THREE_SIGMA) / 31, 9);
    const allowed = windowGrowthPotential("2027-11-15", "2027-12-15", "cool", NORMALS, {
      counts: (d) => d <= "2027-12-01",
    });
    expect(allowed.days).toBe(17);
    expect(allowed.gp).toBeCloseTo((16 * TWO_SIGMA + THREE_SIGMA) / 17, 9);
  });

  it("Kentucky bluegrass, irrigated, full sun: 4 lb a year, 1 lb cap: May and September capped, the rest by GP", () => {
    const kbg = findGrassSpecies("kentucky_bluegrass")!;
    const target = yearlyNTarget({
      annualNitrogenLb: kbg.annualNitrogenLb,
      sun: "full_sun",
      irrigated: true,
      yearlyLimitLb: null,
    });
    expect(target.lb).toBe(4); // University of Illinois range 1–4, the top for an irrigated zone
    const plan = spreadNitrogen({
      season: "cool",
      normals: NORMALS,
      yearlyTargetLb: target.lb,
      perApplicationMaxLb: 1,
      noFertilizerWindow: NJ_PRO_WINDOW,
      rounds: season,
    });
    const by = Object.fromEntries(plan.rounds.map((r) => [r.key, r]));
    // By hand: GP sum 0.606531 + 1 + 0.606531 + 1 + 0.128028 = 3.341090; May's share
    // 4 × 1 / 3.341090 = 1.197 > 1, so May and September take 1 lb; 2 lb remain over
    // 0.606531 + 0.606531 + 0.128028 = 1.341090.
    const lateGp = (16 * TWO_SIGMA + THREE_SIGMA) / 17;
    const rest = 2 * ONE_SIGMA + lateGp;
    expect(by.weeds!.nLb).toBe(1);
    expect(by.fall!.nLb).toBe(1);
    expect(by.weeds!.reason).toBe("capped");
    expect(by.spring!.nLb).toBeCloseTo((2 * ONE_SIGMA) / rest, 9); // 0.9045
    expect(by.spring!.nLb).toBeCloseTo(0.9045, 4);
    expect(by.summer!.nLb).toBeCloseTo(by.spring!.nLb, 12); // summer shrinks from May's 1 lb
    expect(by.late!.nLb).toBeCloseTo((2 * lateGp) / rest, 9); // 0.1909
    expect(by.late!.allowed).toEqual({ from: "2027-11-15", to: "2027-12-01" });
    expect(by.grubs!.nLb).toBe(0);
    expect(by.grubs!.reason).toBe("no_nitrogen");
    expect(plan.totalLb).toBeCloseTo(4, 9);
    expect(plan.unplacedLb).toBeCloseTo(0, 9);
  });

  it("without a cap the spread is exactly proportional to GP, and summer gets less than spring's peak", () => {
    const plan = spreadNitrogen({
      season: "cool",
      normals: NORMALS,
      yearlyTargetLb: 3,
      perApplicationMaxLb: null,
      noFertilizerWindow: null,
      rounds: season.slice(0, 4),
    });
    const gpSum = ONE_SIGMA + 1 + ONE_SIGMA;
    expect(plan.rounds.map((r) => Number(r.nLb.toFixed(4)))).toEqual([
      Number(((3 * ONE_SIGMA) / gpSum).toFixed(4)),
      Number((3 / gpSum).toFixed(4)),
      0,
      Number(((3 * ONE_SIGMA) / gpSum).toFixed(4)),
    ]);
  });

  it("a round wholly inside the no-fertilizer window gets no nitrogen and its share goes elsewhere", () => {
    const plan = spreadNitrogen({
      season: "cool",
      normals: NORMALS,
      yearlyTargetLb: 2,
      perApplicationMaxLb: null,
      noFertilizerWindow: NJ_PRO_WINDOW,
      rounds: [
        {
          key: "winter",
          start: "2027-12-05",
          end: "2027-12-20",
          target: { kind: "growth_potential" },
        },
        { key: "fixed", start: "2027-01-10", end: "2027-01-20", target: { kind: "lb", lb: 0.5 } },
        {
          key: "may",
          start: "2027-05-01",
          end: "2027-05-31",
          target: { kind: "growth_potential" },
        },
      ],
    });
    expect(plan.rounds.map((r) => [r.key, r.nLb, r.reason])).toEqual([
      ["winter", 0, "no_fertilizer_window"],
      ["fixed", 0, "no_fertilizer_window"],
      ["may", 2, "growth_potential"],
    ]);
  });

  it("fixed targets come first and are capped; what no round can take is reported as unplaced", () => {
    const plan = spreadNitrogen({
      season: "cool",
      normals: NORMALS,
      yearlyTargetLb: 4,
      perApplicationMaxLb: 0.7,
      noFertilizerWindow: null,
      rounds: [
        { key: "a", start: "2027-04-01", end: "2027-04-30", target: { kind: "lb", lb: 1.2 } },
        { key: "b", start: "2027-05-01", end: "2027-05-31", target: { kind: "growth_potential" } },
        { key: "c", start: "2027-09-01", end: "2027-09-30", target: { kind: "growth_potential" } },
      ],
    });
    expect(plan.rounds.map((r) => [r.nLb, r.reason])).toEqual([
      [0.7, "capped"],
      [0.7, "capped"],
      [0.7, "capped"],
    ]);
    expect(plan.totalLb).toBeCloseTo(2.1, 9);
    expect(plan.unplacedLb).toBeCloseTo(1.9, 9);
  });

  it("warm-season turf in the same summer gets its largest share in July (GP held at 1 in heat)", () => {
    const warm = [14, 16, 19, 22, 26, 29, 32, 33, 30, 25, 19, 15];
    const plan = spreadNitrogen({
      season: "warm",
      normals: warm,
      yearlyTargetLb: 4,
      perApplicationMaxLb: null,
      noFertilizerWindow: null,
      rounds: [
        {
          key: "apr",
          start: "2027-04-01",
          end: "2027-04-30",
          target: { kind: "growth_potential" },
        },
        {
          key: "jul",
          start: "2027-07-01",
          end: "2027-07-31",
          target: { kind: "growth_potential" },
        },
        {
          key: "oct",
          start: "2027-10-01",
          end: "2027-10-31",
          target: { kind: "growth_potential" },
        },
      ],
    });
    const [apr, jul, oct] = plan.rounds;
    expect(jul!.gp).toBe(1);
    expect(jul!.nLb).toBeGreaterThan(oct!.nLb);
    expect(oct!.nLb).toBeGreaterThan(apr!.nLb);
    expect(plan.totalLb).toBeCloseTo(4, 9);
  });
});

describe("yearly target from species, sun and irrigation", () => {
  const tf = findGrassSpecies("tall_fescue")!.annualNitrogenLb; // 2–4 (University of Illinois)
  it("middle of the range without irrigation, scaled by shade, capped by the yearly limit", () => {
    expect(
      yearlyNTarget({
        annualNitrogenLb: tf,
        sun: "full_sun",
        irrigated: false,
        yearlyLimitLb: null,
      }).lb,
    ).toBe(3);
    expect(
      yearlyNTarget({
        annualNitrogenLb: tf,
        sun: "part_shade",
        irrigated: false,
        yearlyLimitLb: null,
      }).lb,
    ).toBe(2.25);
    expect(
      yearlyNTarget({ annualNitrogenLb: tf, sun: "shade", irrigated: true, yearlyLimitLb: null })
        .lb,
    ).toBe(2);
    expect(
      yearlyNTarget({ annualNitrogenLb: tf, sun: "full_sun", irrigated: true, yearlyLimitLb: 3.2 }),
    ).toEqual({
      lb: 3.2,
      cappedByLimit: true,
    });
  });
});

describe("expected trigger days from the normals", () => {
  it("GDD above 10 °C from January 1, each day at its month's mean", () => {
    // Jan 0, Feb 2, Mar 8 add nothing; April adds 4.5 a day: 100 GDD on day 23 (22.2 → 23rd).
    expect(expectedTriggerDay(2027, NORMALS, { kind: "gdd", baseC: 10, threshold: 100 })).toBe(
      "2027-04-23",
    );
  });
  it("a temperature reached first in a month's mean: the month's first day; never reached: null", () => {
    expect(expectedTriggerDay(2027, NORMALS, { kind: "temperature", thresholdC: 13 })).toBe(
      "2027-04-01",
    );
    expect(expectedTriggerDay(2027, NORMALS, { kind: "temperature", thresholdC: 30 })).toBeNull();
  });
});
