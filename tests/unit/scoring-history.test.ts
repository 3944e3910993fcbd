// Index histories: trends over a window, change in the season, the property index per visit,
// correlations with the nitrogen and water before each check, the book's distribution.
// Outside checks: Spearman's ρ against the worked example of Wikipedia's "Spearman's rank
// correlation coefficient" article (IQ vs hours of television, 10 people, ρ = −29/165 ≈ −0.1758;
// data from memory, pinned by that printed result); correlation strength words after Cohen,
// Statistical Power Analysis for the Behavioral Sciences (1988): r .1 small, .3 medium, .5 large.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { technicianActivity, weekStart } from "@/lib/book/team";
import { addDays } from "@/lib/dates";
import {
  indexDistribution,
  propertyIndexByVisit,
  propertyNitrogenEvents,
  recentTrend,
  seasonChange,
  zoneCorrelations,
} from "@/lib/scoring/history";
import { correlate } from "@/lib/scoring/trend";
import {
  correlationSentence,
  correlationStrength,
  patternPhrase,
  seasonSentence,
  trendSentence,
} from "@/lib/scoring/words";
import type { DerivedDay } from "@/lib/weather/derived";

describe("Spearman's ρ (Wikipedia worked example)", () => {
  it("IQ vs hours of TV per week: ρ = −29/165", () => {
    const iq = [106, 100, 86, 101, 99, 103, 97, 113, 112, 110];
    const tv = [7, 27, 2, 50, 28, 29, 20, 12, 6, 17];
    const c = correlate(iq, tv)!;
    expect(c.spearman).toBeCloseTo(-29 / 165, 6);
    expect(c.n).toBe(10);
  });
});

describe("recentTrend and seasonChange", () => {
  it("uses only the 120 days before the latest check", () => {
    const points = [
      { date: "2026-01-10", index: 10 }, // outside the window: would flip the slope
      { date: "2026-04-02", index: 83 },
      { date: "2026-05-02", index: 80 },
      { date: "2026-06-01", index: 77 },
      { date: "2026-07-01", index: 74 },
      { date: "2026-07-31", index: 71 },
    ];
    const t = recentTrend(points)!;
    expect(t.n).toBe(5);
    expect(t.slopePer30Days).toBeCloseTo(-3, 9);
    expect(t.word).toBe("declining");
    expect(trendSentence(t)).toBe(
      "Declining: −3.0 points per 30 days over the last 120 days (n 5; 90 % interval −3.0 to −3.0).",
    );
  });
  it("sentences: n beside every word; no slope below 5 checks; the interval otherwise", () => {
    const three = recentTrend([
      { date: "2026-06-01", index: 80 },
      { date: "2026-07-01", index: 70 },
      { date: "2026-07-31", index: 76 },
    ])!;
    expect(three.word).toBeNull();
    expect(trendSentence(three)).toBe(
      "Not enough rated checks for a trend yet (n 3 in the last 120 days; a trend needs at least 5).",
    );
    expect(trendSentence(null)).toMatch(/\(n 0 in the last 120 days/);
    const noisy = recentTrend(
      [80, 68, 79, 66, 74].map((index, i) => ({ date: addDays("2026-06-01", 20 * i), index })),
    )!;
    expect(trendSentence(noisy)).toMatch(
      /^No clear trend: −\d\.\d points per 30 days over the last 120 days \(n 5; 90 % interval −\d+\.\d to \+\d+\.\d\)\./,
    );
  });
  it("season change counts from the first check of the latest check's calendar year", () => {
    const s = seasonChange([
      { date: "2025-10-01", index: 40 },
      { date: "2026-04-20", index: 62 },
      { date: "2026-09-01", index: 75 },
    ])!;
    expect(s.from.date).toBe("2026-04-20");
    expect(s.change).toBe(13);
    expect(seasonChange([{ date: "2026-04-20", index: 62 }])).toBeNull();
    expect(seasonSentence(null)).toBe("One check so far this season.");
  });
});

describe("propertyIndexByVisit", () => {
  it("weights zones by area at each visit, leaving out zones not checked", () => {
    const v = propertyIndexByVisit([
      { visitId: "a", date: "2026-06-01", index: 80, areaFt2: 3000 },
      { visitId: "a", date: "2026-06-01", index: 40, areaFt2: 1000 },
      { visitId: "b", date: "2026-06-21", index: 50, areaFt2: 1000 },
    ]);
    expect(v).toEqual([
      { visitId: "a", date: "2026-06-01", index: 70, zonesChecked: 2, areaCheckedFt2: 4000 },
      { visitId: "b", date: "2026-06-21", index: 50, zonesChecked: 1, areaCheckedFt2: 1000 },
    ]);
  });
  it("each visit's index lies between its zones' lowest and highest (fast-check)", () => {
    // Stored Indexes are rounded to 0.1, and so is the property index.
    fc.assert(
      fc.property(
        fc.array(
          fc.record({
            visit: fc.constantFrom("a", "b", "c"),
            index: fc.integer({ min: 0, max: 1000 }).map((x) => x / 10),
            areaFt2: fc.double({ min: 1, max: 50_000, noNaN: true }),
          }),
          { minLength: 1, maxLength: 20 },
        ),
        (rows) => {
          for (const v of propertyIndexByVisit(
            rows.map((r) => ({
              visitId: r.visit,
              date: "2026-06-01",
              index: r.index,
              areaFt2: r.areaFt2,
            })),
          )) {
            const own = rows.filter((r) => r.visit === v.visitId).map((r) => r.index);
            expect(v.index).toBeGreaterThanOrEqual(Math.min(...own) - 1e-9);
            expect(v.index).toBeLessThanOrEqual(Math.max(...own) + 1e-9);
          }
        },
      ),
    );
  });
  it("property N per feeding date is averaged over the whole lawn", () => {
    const e = propertyNitrogenEvents(
      [
        { date: "2026-05-01", nLb: 0.8, wsnLb: 0.4, productName: "A", areaFt2: 3000 },
        { date: "2026-05-01", nLb: 0.4, wsnLb: 0.4, productName: "B", areaFt2: 1000 },
      ],
      5000, // 1,000 ft² untreated
    );
    expect(e).toHaveLength(1);
    expect(e[0]!.nLb).toBeCloseTo((0.8 * 3000 + 0.4 * 1000) / 5000, 9);
    expect(e[0]!.productName).toBe("A, B");
  });
});

const day = (date: string, balance14In: number) => ({ date, balance14In }) as DerivedDay;

describe("zoneCorrelations", () => {
  // 50 days apart, so a feeding 20 days before one check is outside the 45-day window of the next.
  const dates = [0, 1, 2, 3, 4, 5].map((k) => addDays("2026-01-05", 50 * k));
  it("below 6 checks: nothing (not enough visits yet)", () => {
    const c = zoneCorrelations(
      dates.slice(0, 5).map((date, i) => ({ date, index: 60 + i })),
      [],
      [],
    );
    expect(c.n).toBe(5);
    expect(c.nitrogen).toBeNull();
    expect(c.respondsToNitrogen).toBeNull();
  });
  it("N is what was available before the check: a feeding at the same visit is not counted", () => {
    const c = zoneCorrelations(
      [{ date: "2026-06-01", index: 70 }],
      [{ date: "2026-06-01", nLb: 0.8, wsnLb: 0.5, productName: "x" }],
      [],
    );
    expect(c.pairs[0]!.availableNLb).toBe(0);
    // 28 days later: all 0.5 WSN (inside 45 days) + 0.3 slow-release × 27/56 released by the day before.
    const later = zoneCorrelations(
      [{ date: "2026-06-29", index: 70 }],
      [{ date: "2026-06-01", nLb: 0.8, wsnLb: 0.5, productName: "x" }],
      [],
    );
    expect(later.pairs[0]!.availableNLb).toBeCloseTo(0.5 + (0.3 * 27) / 56, 9);
  });
  it("a zone whose Index rises with its feeding responds; water balance is read the day before", () => {
    // A feeding of 0.6 lb WSN 20 days before every other check.
    const apps = [dates[1]!, dates[3]!, dates[5]!].map((d) => ({
      date: addDays(d, -20),
      nLb: 0.6,
      wsnLb: 0.6,
      productName: "x",
    }));
    const checks = dates.map((date, i) => ({ date, index: i % 2 ? 82 : 70 }));
    const days = dates.map((d, i) => day(addDays(d, -1), i * 0.1));
    const c = zoneCorrelations(checks, apps, days);
    expect(c.n).toBe(6);
    expect(c.nitrogen!.pearson).toBeGreaterThan(0.9);
    expect(c.respondsToNitrogen).toBe(true);
    expect(c.water!.n).toBe(6);
    expect(c.pairs.map((p) => p.balance14In)).toEqual([0, 0.1, 0.2, 0.30000000000000004, 0.4, 0.5]);
  });
  it("without weather days the water correlation is absent, not invented", () => {
    const c = zoneCorrelations(
      dates.map((date, i) => ({ date, index: 60 + i })),
      [],
      [],
    );
    expect(c.water).toBeNull();
    expect(c.pairs.every((p) => p.balance14In === null)).toBe(true);
  });
});

describe("book figures and words", () => {
  it("bins property indexes by 10 points, 100 in the top bin", () => {
    const bins = indexDistribution([0, 9.9, 10, 55, 99.5, 100]);
    expect(bins).toHaveLength(10);
    expect(bins[0]).toEqual({ from: 0, to: 9, count: 2 });
    expect(bins[1]!.count).toBe(1);
    expect(bins[5]!.count).toBe(1);
    expect(bins[9]).toEqual({ from: 90, to: 100, count: 2 });
  });
  it("names correlation strength after Cohen (1988)", () => {
    expect(correlationStrength(0.05)).toBe("no");
    expect(correlationStrength(-0.1)).toBe("a weak");
    expect(correlationStrength(0.3)).toBe("a moderate");
    expect(correlationStrength(-0.5)).toBe("a strong");
    expect(patternPhrase({ pearson: -0.62, isSignificant: true })).toBe(
      "a strong negative pattern",
    );
    expect(patternPhrase({ pearson: 0.02, isSignificant: true })).toBe("no clear pattern");
  });
  it("pattern words follow significance: r 0.5 over 6 checks is no clear pattern, over 30 a strong one", () => {
    // Old words read r alone: 0.5 was "a strong positive pattern" at any n.
    const six = correlate([1, 2, 3, 4, 5, 6], [2, 1, 3, 6, 2, 5])!;
    expect(six.pearson).toBeGreaterThanOrEqual(0.5);
    expect(six.isSignificant).toBe(false);
    expect(patternPhrase(six)).toBe("no clear pattern");
    expect(correlationSentence("x", six)).toMatch(
      /^No clear pattern with x: Pearson r 0\.\d\d \(p 0\.\d\d, not significant at 5 %\), Spearman ρ [−\d.]+ \(n 6\)\.$/,
    );
    // The same shape repeated five times: r unchanged, n 30, p < 0.01.
    const xs = Array.from({ length: 5 }, () => [1, 2, 3, 4, 5, 6]).flat();
    const ys = Array.from({ length: 5 }, () => [2, 1, 3, 6, 2, 5]).flat();
    const thirty = correlate(xs, ys)!;
    expect(thirty.pearson).toBeCloseTo(six.pearson, 12);
    expect(thirty.isSignificant).toBe(true);
    expect(patternPhrase(thirty)).toBe("a strong positive pattern");
  });
});

describe("technician activity", () => {
  it("weeks start on Monday; visits per week, checks per visit and photos per check", () => {
    expect(weekStart("2026-12-01")).toBe("2026-11-30"); // a Tuesday → Monday
    expect(weekStart("2026-11-29")).toBe("2026-11-23"); // a Sunday → the Monday before
    const [a, b] = technicianActivity(
      [
        { id: "t1", name: "A" },
        { id: "t2", name: "B" },
      ],
      [
        { technicianId: "t1", completedOn: "2026-11-30", checks: 3, photos: 6 },
        { technicianId: "t1", completedOn: "2026-12-01", checks: 2, photos: 0 },
        { technicianId: "t1", completedOn: "2026-11-24", checks: 4, photos: 4 },
        { technicianId: "t1", completedOn: "2026-08-01", checks: 9, photos: 9 }, // before the 8 weeks
      ],
      "2026-12-01",
    );
    expect(a!.weeks).toHaveLength(8);
    expect(a!.weeks.at(-1)).toEqual({ weekStart: "2026-11-30", visits: 2 });
    expect(a!.weeks.at(-2)).toEqual({ weekStart: "2026-11-23", visits: 1 });
    expect(a!.visits).toBe(3);
    expect(a!.checksPerVisit).toBeCloseTo(3, 9);
    expect(a!.photosPerCheck).toBeCloseTo(10 / 9, 9);
    expect(b).toMatchObject({ visits: 0, checksPerVisit: null, photosPerCheck: null });
  });
});
