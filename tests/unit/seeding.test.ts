// Seed rates, seed to load, the seeding window and the pre-emergence conflict, against their
// named sources (lib/agronomy/seeding.ts).
import { describe, expect, it } from "vitest";

import {
  readSeedRate,
  seedingConflicts,
  seedingFindings,
  seedingInterval,
  seedingWindow,
  seedRate,
  seedToLoadLb,
  soilTempEstimateF,
  type ZoneTreatment,
} from "@/lib/agronomy/seeding";
import { grassSpecies } from "@/lib/reference/grass-species";
import { seedingConflict } from "@/lib/risk/rules";

describe("seed rates (Cornell Safe Sports Fields seeding-rate table; Nebraska Extension 2021)", () => {
  it("new seeding: Kentucky bluegrass 1–3, perennial ryegrass 4–6, tall fescue 6–8 lb/1,000 ft² (Cornell table)", () => {
    expect(seedRate("kentucky_bluegrass", "new")).toEqual({ min: 1, max: 3 });
    expect(seedRate("perennial_ryegrass", "new")).toEqual({ min: 4, max: 6 });
    expect(seedRate("tall_fescue", "new")).toEqual({ min: 6, max: 8 });
  });

  it("overseeding is half: tall fescue 3–4, Kentucky bluegrass 1–1.5 (Nebraska Extension: 'cut in half' of 6–8 and 2–3)", () => {
    expect(seedRate("tall_fescue", "overseed")).toEqual({ min: 3, max: 4 });
    // Nebraska gives Kentucky bluegrass 2–3 for a full seeding; half of Cornell's 1–3 is 0.5–1.5,
    // whose top agrees with half of Nebraska's top.
    expect(seedRate("kentucky_bluegrass", "overseed")!.max).toBe(3 / 2);
  });

  it("St. Augustinegrass is not grown from seed (sod, sprigs or plugs: common practice): no rate", () => {
    expect(seedRate("st_augustinegrass", "new")).toBeNull();
  });

  it("every species of the reference table but St. Augustinegrass has a rate, and every rate range is ordered", () => {
    for (const s of grassSpecies) {
      const r = seedRate(s.key, "new");
      if (s.key === "st_augustinegrass") continue;
      expect(r, s.key).not.toBeNull();
      expect(r!.min).toBeLessThanOrEqual(r!.max);
    }
  });

  it("seed to load = rate × area / 1,000: 4 lb/1,000 ft² on 2,500 ft² is 10 lb (arithmetic)", () => {
    expect(seedToLoadLb(4, 2500)).toBe(10);
    expect(seedToLoadLb(3.5, 1800)).toBeCloseTo(6.3, 10);
    expect(() => seedToLoadLb(-1, 100)).toThrow(RangeError);
    expect(() => seedToLoadLb(Number.NaN, 100)).toThrow(RangeError);
  });

  it("a recorded rate is read against the range, both ends inside", () => {
    const r = { min: 3, max: 4 };
    expect(readSeedRate(2.9, r)).toBe("below");
    expect(readSeedRate(3, r)).toBe("within");
    expect(readSeedRate(4, r)).toBe("within");
    expect(readSeedRate(4.1, r)).toBe("above");
  });
});

describe("seeding window by soil temperature (cool-season 50–65 °F, warm-season 65–70 °F: extension figures)", () => {
  it("cool-season: 49 °F too cold, 50 and 65 °F good, 66 °F warm", () => {
    expect(seedingWindow(49, "cool")).toBe("too_cold");
    expect(seedingWindow(50, "cool")).toBe("good");
    expect(seedingWindow(65, "cool")).toBe("good");
    expect(seedingWindow(66, "cool")).toBe("warm");
  });

  it("warm-season: 64 °F too cold, 65 °F and 85 °F good", () => {
    expect(seedingWindow(64, "warm")).toBe("too_cold");
    expect(seedingWindow(65, "warm")).toBe("good");
    expect(seedingWindow(85, "warm")).toBe("good");
  });

  it("the soil estimate is the mean of the last five daily means (hand-worked), none with four days", () => {
    const d = (tmaxF: number, tminF: number) => ({ tmaxF, tminF });
    // daily means 60, 55, 50, 65, 70 → 300 / 5 = 60; the first day (mean 100) is not among the last five
    const days = [d(110, 90), d(70, 50), d(65, 45), d(60, 40), d(75, 55), d(80, 60)];
    expect(soilTempEstimateF(days)).toBe(60);
    expect(soilTempEstimateF(days.slice(0, 4))).toBeNull();
  });
});

describe("pre-emergence and seeding (Weed Technology 19(1) 2005 intervals; siduron and mesotrione per the label)", () => {
  it("typical intervals before slit seeding: prodiamine 16 wk, pendimethalin 10 wk, dithiopyr 11 wk", () => {
    expect(seedingInterval({ active: "prodiamine", labelIntervalDays: null })).toMatchObject({
      days: 16 * 7,
      fromLabel: false,
    });
    expect(seedingInterval({ active: "pendimethalin", labelIntervalDays: null })!.days).toBe(70);
    expect(seedingInterval({ active: "dithiopyr", labelIntervalDays: null })!.days).toBe(77);
  });

  it("the label's interval, when entered, comes first; an unknown active without one has none", () => {
    expect(seedingInterval({ active: "prodiamine", labelIntervalDays: 90 })).toEqual({
      days: 90,
      fromLabel: true,
      source: "Product label",
    });
    expect(seedingInterval({ active: "other", labelIntervalDays: null })).toBeNull();
  });

  const seed = (date: string): ZoneTreatment => ({
    date,
    productName: "Seed",
    preEmergence: null,
    seedSpecies: "tall_fescue",
  });
  const pre = (
    date: string,
    active: "prodiamine" | "siduron" | "mesotrione" | "other" = "prodiamine",
    labelIntervalDays: number | null = null,
  ): ZoneTreatment => ({
    date,
    productName: `Pre ${active}`,
    preEmergence: { active, labelIntervalDays },
    seedSpecies: null,
  });

  it("prodiamine 111 days before seeding conflicts, 112 days does not (16 weeks)", () => {
    expect(seedingConflicts([pre("2026-04-01"), seed("2026-07-21")])).toHaveLength(1); // 111 days
    expect(seedingConflicts([pre("2026-04-01"), seed("2026-07-22")])).toHaveLength(0); // 112 days
  });

  it("a pre-emergence after seeding conflicts too, with the days apart negative", () => {
    const [c] = seedingConflicts([seed("2026-09-05"), pre("2026-09-25")]);
    expect(c).toMatchObject({ daysApart: -20, intervalDays: 112, intervalFromLabel: false });
    expect(c!.seeding.date).toBe("2026-09-05");
    expect(c!.preEmergence.date).toBe("2026-09-25");
  });

  it("siduron and mesotrione at seeding do not conflict (labelled at seeding)", () => {
    expect(seedingConflicts([pre("2026-05-01", "siduron"), seed("2026-05-01")])).toHaveLength(0);
    expect(seedingConflicts([pre("2026-05-01", "mesotrione"), seed("2026-05-01")])).toHaveLength(0);
  });

  it("an active with no interval known conflicts within a year; the label's interval replaces it", () => {
    expect(seedingConflicts([pre("2026-01-10", "other"), seed("2026-12-01")])).toHaveLength(1);
    expect(seedingConflicts([pre("2026-01-10", "other", 60), seed("2026-04-01")])).toHaveLength(0);
  });

  it("the closest pair comes first", () => {
    const cs = seedingConflicts([pre("2026-04-01"), pre("2026-06-01"), seed("2026-06-20")]);
    expect(cs.map((c) => c.preEmergence.date)).toEqual(["2026-06-01", "2026-04-01"]);
  });
});

describe("the seeding findings on a record and the risk rule (intervals as above; the label decides)", () => {
  const seedT = (date: string): ZoneTreatment => ({
    date,
    productName: "Demo fescue seed",
    preEmergence: null,
    seedSpecies: "tall_fescue",
  });
  const preT = (date: string, labelIntervalDays: number | null = 112): ZoneTreatment => ({
    date,
    productName: "Demo prodiamine",
    preEmergence: { active: "prodiamine", labelIntervalDays },
    seedSpecies: null,
  });
  const base = {
    zone: { speciesKey: "tall_fescue", areaFt2: 2000 },
    isEstablishing: false,
    formatDate: (d: string) => `[${d}]`,
  };

  it("a pre-emergence recorded 20 days after a seeding warns with the seeding's date and product", () => {
    const [f] = seedingFindings({
      ...base,
      application: { ...preT("2026-09-25"), productLbPer1000: 2 },
      others: [seedT("2026-09-05")],
    });
    expect(f).toMatchObject({ key: "seeding_conflict", severity: "warning", limit: 112 });
    expect(f!.message).toContain("Demo fescue seed on [2026-09-05], 20 days before this");
    expect(f!.message).toContain("the label asks for 112 days");
  });

  it("a seeding at 3.5 lb/1,000 ft² is within tall fescue's 3–4 lb overseeding range; 6 lb is above it", () => {
    const at = (lb: number) =>
      seedingFindings({
        ...base,
        application: { ...seedT("2026-09-05"), productLbPer1000: lb },
        others: [],
      });
    expect(at(3.5)).toEqual([]);
    const [f] = at(6);
    expect(f).toMatchObject({ key: "seed_rate", limit: "3–4" });
    expect(f!.message).toContain("6–8 lb for the zone's 2,000 ft²");
  });

  it("products that are neither seed nor pre-emergence are not checked", () => {
    const fert: ZoneTreatment = {
      date: "2026-09-05",
      productName: "Feed",
      preEmergence: null,
      seedSpecies: null,
    };
    expect(
      seedingFindings({
        ...base,
        application: { ...fert, productLbPer1000: 3 },
        others: [preT("2026-09-01")],
      }),
    ).toEqual([]);
  });

  it("the alert is raised while the later of the two is within the interval, quiet after", () => {
    const ts = [preT("2026-04-01"), seedT("2026-06-01")]; // 61 days apart, interval 112
    const r = seedingConflict(ts, "2026-06-02");
    expect(r).toMatchObject({ kind: "seeding_conflict", raised: true, severity: "moderate" });
    expect(r.evidence.values).toMatchObject({
      seededOn: "2026-06-01",
      preEmergenceOn: "2026-04-01",
      daysApart: 61,
      intervalDays: 112,
      intervalFrom: "the product label",
    });
    expect(seedingConflict(ts, "2026-09-20").raised).toBe(true); // 111 days after the seeding
    expect(seedingConflict(ts, "2026-09-21").raised).toBe(false); // 112 days
    expect(seedingConflict(ts, "2026-05-31").raised).toBe(false); // the seeding is not yet
  });
});
