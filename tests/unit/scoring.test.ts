// The Sward Index and its statistics: Anscombe's quartet for regression and correlation
// (Anscombe 1973, "Graphs in Statistical Analysis", The American Statistician 27(1) — the data
// typed from memory, pinned by the paper's printed summary: mean x 9, mean y 7.50,
// y = 3.00 + 0.500x, r = 0.816); fast-check bounds and monotonicity; golden cases.
import fc from "fast-check";
import jStat from "jstat";
import { mean } from "simple-statistics";
import { describe, expect, it } from "vitest";

import { GOLDEN_CASES } from "@/fixtures/scoring/golden";
import { addDays as addDaysUtc } from "@/lib/dates";
import { availableNitrogen } from "@/lib/scoring/available-nitrogen";
import { propertyIndex, swardIndex, type IndexInput } from "@/lib/scoring/sward-index";
import { correlate, indexTrend, linearFit, trendWord } from "@/lib/scoring/trend";

const X = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
const ANSCOMBE: [number[], number[]][] = [
  [X, [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68]],
  [X, [9.14, 8.14, 8.74, 8.77, 9.26, 8.1, 6.13, 3.1, 9.13, 7.26, 4.74]],
  [X, [7.46, 6.77, 12.74, 7.11, 7.81, 8.84, 6.08, 5.39, 8.15, 6.42, 5.73]],
  [
    [8, 8, 8, 8, 8, 8, 8, 19, 8, 8, 8],
    [6.58, 5.76, 7.71, 8.84, 8.47, 7.04, 5.25, 12.5, 5.56, 7.91, 6.89],
  ],
];

describe("Anscombe's quartet", () => {
  it.each(ANSCOMBE.map((set, i) => [i + 1, set] as const))(
    "set %i: mean x 9, mean y 7.50, y = 3.00 + 0.500x, r = 0.816",
    (_i, [xs, ys]) => {
      expect(mean(xs)).toBe(9);
      expect(mean(ys)).toBeCloseTo(7.5, 2);
      const fit = linearFit(xs, ys);
      expect(fit.intercept).toBeCloseTo(3.0, 2);
      expect(fit.slope).toBeCloseTo(0.5, 3);
      const r = correlate(xs, ys)!;
      expect(Math.abs(r.pearson - 0.816)).toBeLessThan(0.0015);
      expect(r.n).toBe(11);
    },
  );
});

const rating = fc.integer({ min: 1, max: 9 });
const input = fc.record({
  qualityRating: rating,
  colorRating: rating,
  densityRating: rating,
  uniformityRating: fc.option(rating, { nil: undefined }),
  bareSoilPct: fc.option(fc.integer({ min: 0, max: 100 }), { nil: undefined }),
  weedPct: fc.option(fc.integer({ min: 0, max: 100 }), { nil: undefined }),
  symptoms: fc.array(fc.record({ severity: fc.constantFrom(1 as const, 2 as const, 3 as const) }), {
    maxLength: 4,
  }),
  photo: fc.option(
    fc.record({
      greenCoverPct: fc.double({ min: 0, max: 100, noNaN: true }),
      dgci: fc.option(fc.double({ min: 0, max: 1, noNaN: true }), { nil: null }),
    }),
    { nil: undefined },
  ),
}) as fc.Arbitrary<IndexInput>;

describe("swardIndex properties", () => {
  it("is bounded 0–100", () => {
    fc.assert(
      fc.property(input, (c) => {
        const { index } = swardIndex(c);
        expect(index).toBeGreaterThanOrEqual(0);
        expect(index).toBeLessThanOrEqual(100);
      }),
    );
  });

  it("never drops when a rating rises", () => {
    fc.assert(
      fc.property(
        input,
        fc.constantFrom(
          "qualityRating",
          "colorRating",
          "densityRating",
          "uniformityRating",
        ) as fc.Arbitrary<"qualityRating" | "colorRating" | "densityRating" | "uniformityRating">,
        (c, key) => {
          const current = c[key];
          if (current === undefined || current >= 9) return;
          expect(swardIndex({ ...c, [key]: current + 1 }).index).toBeGreaterThanOrEqual(
            swardIndex(c).index,
          );
        },
      ),
    );
  });

  it("never rises when bare ground or a symptom is added", () => {
    fc.assert(
      fc.property(
        input,
        fc.integer({ min: 1, max: 50 }),
        fc.constantFrom(1 as const, 2 as const, 3 as const),
        (c, more, severity) => {
          const before = swardIndex(c).index;
          expect(
            swardIndex({ ...c, bareSoilPct: Math.min(100, (c.bareSoilPct ?? 0) + more) }).index,
          ).toBeLessThanOrEqual(before);
          expect(
            swardIndex({ ...c, symptoms: [...(c.symptoms ?? []), { severity }] }).index,
          ).toBeLessThanOrEqual(before);
        },
      ),
    );
  });

  it("a property's index lies between its zones' lowest and highest", () => {
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            index: fc.double({ min: 0, max: 100, noNaN: true }),
            areaFt2: fc.double({ min: 1, max: 20000, noNaN: true }),
          }),
          { minLength: 1, maxLength: 6 },
        ),
        (zones) => {
          const p = propertyIndex(zones)!;
          expect(p).toBeGreaterThanOrEqual(Math.min(...zones.map((z) => z.index)) - 0.05);
          expect(p).toBeLessThanOrEqual(Math.max(...zones.map((z) => z.index)) + 0.05);
        },
      ),
    );
  });
});

describe("golden cases", () => {
  it.each(GOLDEN_CASES.map((g) => [g.name, g] as const))("%s", (_name, g) => {
    expect(swardIndex(g.check).index).toBeCloseTo(g.expected, 1);
    expect(g.why.length).toBeGreaterThan(20);
  });

  it("has at least 12 cases, and a thin, yellowing, diseased zone scores below a dense dark one", () => {
    expect(GOLDEN_CASES.length).toBeGreaterThanOrEqual(12);
    const by = (n: string) => GOLDEN_CASES.find((g) => g.name === n)!.expected;
    expect(by("thin yellowing lawn with dollar spot")).toBeLessThan(
      by("healthy dense dark lawn with photo"),
    );
    expect(by("acceptable")).toBeGreaterThan(50);
    expect(by("good ratings but severe grubs")).toBeLessThan(by("acceptable"));
  });
});

describe("trends", () => {
  const series = (indexes: number[], everyDays = 20) =>
    indexes.map((index, i) => ({ date: addDaysUtc("2026-04-01", i * everyDays), index }));

  it("slope per 30 days by least squares; null below 2 points; the interval from 3", () => {
    expect(indexTrend([{ date: "2026-05-01", index: 60 }])).toBeNull();
    const two = indexTrend(series([60, 66], 30))!;
    expect(two.slopePer30Days).toBeCloseTo(6, 9);
    expect(two.ciLowPer30Days).toBeNull();
    const t = indexTrend(series([60, 66, 72], 30))!;
    expect(t.slopePer30Days).toBeCloseTo(6, 9);
    expect(t.r2).toBeCloseTo(1, 9);
    expect(t.ciLowPer30Days).toBeCloseTo(6, 9); // a perfect line: no residual, no width
  });

  it("the slope interval of Anscombe's set I: b = 0.5001, SE 0.1179, t(0.95; 9) = 1.833", () => {
    // Anscombe (1973), The American Statistician 27(1): set I. Slope and its standard error as any
    // regression package prints them (R's lm: 0.5001, Std. Error 0.1179; from memory), with x read
    // as days so the slope per 30 days is 30 × b.
    const x = [10, 8, 13, 9, 11, 14, 6, 4, 12, 7, 5];
    const y = [8.04, 6.95, 7.58, 8.81, 8.33, 9.96, 7.24, 4.26, 10.84, 4.82, 5.68];
    const t = indexTrend(x.map((d, i) => ({ date: addDaysUtc("2026-01-01", d), index: y[i]! })))!;
    expect(t.slopePer30Days / 30).toBeCloseTo(0.5001, 4);
    const half = (t.ciHighPer30Days! - t.ciLowPer30Days!) / 2 / 30;
    expect(half / 1.833).toBeCloseTo(0.1179, 4);
    expect(t.r2).toBeCloseTo(0.6665, 4);
  });

  it("words need 5 checks and an interval clear of zero; steady needs it within ±2", () => {
    const w = (b: number, lo: number, hi: number, n = 6) =>
      trendWord({ slopePer30Days: b, ciLowPer30Days: lo, ciHighPer30Days: hi, n });
    expect(w(-3, -4, -2)).toBe("declining");
    expect(w(-3, -6, 0.5)).toBeNull(); // interval includes zero: no clear trend
    expect(w(-1.5, -1.9, -1.1)).toBe("steady"); // significant but inside ±2: equivalence holds
    expect(w(-1.5, -2.5, -0.5)).toBeNull(); // a small change, not shown steady either
    expect(w(3, 1, 5)).toBe("improving");
    expect(w(3, 1, 5, 4)).toBeNull(); // 4 checks
    expect(w(0.2, -1.5, 1.9)).toBe("steady");
    expect(w(0.2, -2.5, 2.9)).toBeNull();
    expect(trendWord(null)).toBeNull();
  });

  it("where the old reading (n ≥ 3, slope beyond ±2) and the new one disagree", () => {
    // 3 noisy checks, 20 days apart: −2.6 points per 30 days. Old: "declining" (and an alert).
    const three = indexTrend(series([78, 70, 74.5]))!;
    expect(three.slopePer30Days).toBeLessThan(-2);
    expect(trendWord(three)).toBeNull();
    // 5 noisy checks: −3.9 points per 30 days, but the 90 % interval reaches above zero.
    const noisy = indexTrend(series([80, 68, 79, 66, 74]))!;
    expect(noisy.n).toBe(5);
    expect(noisy.slopePer30Days).toBeLessThan(-2);
    expect(noisy.ciHighPer30Days!).toBeGreaterThan(0);
    expect(trendWord(noisy)).toBeNull();
    // The same fall with little scatter: declining under both readings.
    const clean = indexTrend(series([80, 77.5, 75, 73, 69.5]))!;
    expect(clean.ciHighPer30Days!).toBeLessThan(0);
    expect(trendWord(clean)).toBe("declining");
    // Flat but noisy, slope +1: old "steady", new no word (the interval reaches beyond ±2).
    const flat = indexTrend(series([70, 78, 66, 79, 71, 74]))!;
    expect(Math.abs(flat.slopePer30Days)).toBeLessThan(2);
    expect(trendWord(flat)).toBeNull();
    // Flat and quiet: steady.
    expect(trendWord(indexTrend(series([70, 70.5, 70, 70.5, 70, 70.5]))!)).toBe("steady");
  });

  it("correlation needs at least 6 pairs and carries the significance of Pearson's r", () => {
    expect(correlate([1, 2, 3, 4, 5], [2, 4, 6, 8, 10])).toBeNull();
    const c = correlate([1, 2, 3, 4, 5, 6], [1, 3, 2, 5, 4, 6])!;
    expect(c).toMatchObject({ n: 6 });
    expect(c.pearson).toBeCloseTo(31 / 35, 12); // Sxy 15.5 / Sxx 17.5 by hand
    const t = ((31 / 35) * 2) / Math.sqrt(1 - (31 / 35) ** 2);
    expect(c.pPearson).toBeCloseTo(2 * (1 - jStat.studentt.cdf(t, 4)), 7);
    expect(c.isSignificant).toBe(true); // r 0.886 is above the printed critical r .811 at n 6
  });
});

describe("available nitrogen", () => {
  it("counts water-soluble N in the window and releases slow-release N over 8 weeks", () => {
    const apps = [{ date: "2026-05-01", wsnLb: 0.5, slowLb: 0.28 }];
    expect(availableNitrogen(apps, "2026-05-01")).toBeCloseTo(0.5, 9); // day of application: release not started
    expect(availableNitrogen(apps, "2026-05-29")).toBeCloseTo(0.5 + 0.28 * (28 / 56), 9);
    expect(availableNitrogen(apps, "2026-07-30")).toBeCloseTo(0.28 * (11 / 56), 9); // WSN out of the window (from 15 Jun); release ends 26 Jun: 11 days inside
    expect(availableNitrogen(apps, "2026-04-30")).toBe(0);
  });
});
