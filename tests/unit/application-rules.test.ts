// Application checks against the shipped rule sets, each boundary against the statute's words.
// New Jersey, N.J.S.A. 58:10A-62 (L.2010, c.112, s.2), text read as republished:
//   b. "No professional fertilizer applicator shall apply fertilizer containing phosphorus or
//       nitrogen to turf before March 1st or after December 1st in any calendar year, or at any
//       time when the ground is frozen."
//   a.(3) no person shall "apply fertilizer containing phosphorus or nitrogen to turf before
//       March 1st or after November 15th in any calendar year".
//   a.(1) not "when a heavy rainfall ... is occurring or predicted or when soils are saturated".
// P.L.2010, c.112, s.11b (as quoted in a public forum post): phosphorus with a soil test
//   "performed no more than three years before the application", "for the establishment of turf
//   for the first time", or "for the reestablishment or repair of a turf area".
// Minnesota Statutes 18C.60 subd. 2(b) (Revisor of Statutes): a test "performed within the last
//   three years", or "first establishing turf via seed or sod procedures, and only during the
//   first growing season" — repair is not named.
import { describe, expect, it } from "vitest";

import { checkLabel, labelConditions, type LabelLimits } from "@/lib/agronomy/label";
import {
  checkApplication,
  inNoFertilizerWindow,
  isLabelRefused,
  isRefused,
  monthDayWords,
  soilTestCounts,
  type ApplicationFacts,
  type RuleSetLimits,
} from "@/lib/agronomy/rules";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";

const byName = (name: string): RuleSetLimits => SHIPPED_RULE_SETS.find((x) => x.name === name)!;
const NJ = byName("New Jersey turf fertilizer law");
const MN = byName("Minnesota phosphorus law");
const DEFAULT = byName("Company default");

const base: ApplicationFacts = {
  appliedOn: "2026-05-12",
  byProfessional: true,
  nPct: 24,
  nLb: 0.75,
  wsnLb: 0.525,
  p2o5Lb: 0,
  slowReleasePctOfN: 30,
  isEstablishing: false,
  isRepairing: false,
  soilTestOn: null,
  yearToDateNLb: 1,
  annualNRange: { min: 2, max: 4 },
  weather: { tminF: 50, precipIn: 0, isForecast: true },
};
/** Findings other than the standing "conditions" reminder of a rule set that names them. */
const keys = (r: RuleSetLimits, a: Partial<ApplicationFacts>) =>
  checkApplication(r, { ...base, ...a })
    .filter((f) => f.key !== "conditions")
    .map((f) => `${f.key}:${f.severity}`);

describe("New Jersey dates, as N.J.S.A. 58:10A-62 words them", () => {
  it('professionals: "after December 1st" — December 1 allowed, December 2 refused', () => {
    expect(keys(NJ, { appliedOn: "2026-12-01" })).toEqual([]);
    expect(keys(NJ, { appliedOn: "2026-12-02" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2026-12-31" })).toEqual(["blackout:refusal"]);
  });
  it('professionals: "before March 1st" — February 28 and 29 refused, March 1 allowed', () => {
    expect(keys(NJ, { appliedOn: "2027-02-28" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2028-02-29" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2027-01-01" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2027-03-01" })).toEqual([]);
  });
  it('anyone else: "after November 15th" / "before March 1st"', () => {
    const consumer = { byProfessional: false };
    expect(keys(NJ, { ...consumer, appliedOn: "2026-11-15" })).toEqual([]);
    expect(keys(NJ, { ...consumer, appliedOn: "2026-11-16" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { ...consumer, appliedOn: "2027-02-28" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { ...consumer, appliedOn: "2027-03-01" })).toEqual([]);
    // A professional may still apply from November 16 through December 1.
    expect(keys(NJ, { appliedOn: "2026-11-16" })).toEqual([]);
  });
  it("only fertilizer containing nitrogen or phosphorus is barred", () =>
    expect(keys(NJ, { appliedOn: "2026-12-15", nPct: 0, nLb: 0, wsnLb: 0 })).toEqual([]));
  it("the refusal names the section and says the dates in words", () => {
    const f = checkApplication(NJ, { ...base, appliedOn: "2026-12-02" }).find(
      (x) => x.key === "blackout",
    )!;
    expect(f.source).toContain("58:10A-62b");
    expect(f.message).toContain("after December 1 or before March 1");
  });
  it("every day of a year: blocked exactly from December 2 through the last day of February", () => {
    for (let t = Date.UTC(2028, 0, 1); t < Date.UTC(2029, 0, 1); t += 86_400_000) {
      const md = new Date(t).toISOString().slice(5, 10);
      const blocked = md > "12-01" || md < "03-01";
      expect(inNoFertilizerWindow(md, NJ.proBlackout!), md).toBe(blocked);
    }
  });
});

describe("New Jersey limits, each with its section", () => {
  it("an application within every limit passes", () => expect(keys(NJ, {})).toEqual([]));
  it("0.9 lb N is allowed; 0.91 is refused", () => {
    expect(keys(NJ, { nLb: 0.9, wsnLb: 0.63 })).toEqual([]);
    expect(keys(NJ, { nLb: 0.91, wsnLb: 0.63 })).toEqual(["max_n:refusal"]);
  });
  it("water-soluble N above 0.7 lb and under 20 % slow-release are refused", () =>
    expect(keys(NJ, { nLb: 0.8, wsnLb: 0.8, slowReleasePctOfN: 0 })).toEqual([
      "max_wsn:refusal",
      "min_slow_release:refusal",
    ]));
  it("the N limits cite the section that states them, and say what was not read", () => {
    const f = checkApplication(NJ, { ...base, nLb: 1.2 }).find((x) => x.key === "max_n")!;
    expect(f.source).toContain("P.L.2010, c.112, s.11a");
    expect(f.source).toContain("not read");
    expect(f.message).toBe("1.20 lb N per 1,000 ft² is above the 0.90 lb limit per application.");
  });
});

describe("phosphorus: soil-test age and the exemptions each state allows", () => {
  const p = { p2o5Lb: 0.2 };
  it('New Jersey: a test "no more than three years before the application"', () => {
    expect(keys(NJ, { ...p, appliedOn: "2025-05-01", soilTestOn: "2015-04-01" })).toEqual([
      "phosphorus:refusal",
    ]);
    expect(keys(NJ, { ...p, appliedOn: "2025-05-01", soilTestOn: "2022-05-01" })).toEqual([]);
    expect(keys(NJ, { ...p, appliedOn: "2025-05-01", soilTestOn: "2022-04-30" })).toEqual([
      "phosphorus:refusal",
    ]);
  });
  it('Minnesota: "within the last three years"; a test after the application does not count', () => {
    expect(keys(MN, { ...p, soilTestOn: "2024-06-01" })).toEqual([]);
    expect(keys(MN, { ...p, soilTestOn: "2022-06-01" })).toEqual(["phosphorus:refusal"]);
    expect(keys(MN, { ...p, soilTestOn: "2027-01-01" })).toEqual(["phosphorus:refusal"]);
  });
  it("New Jersey exempts first establishment and repair", () => {
    expect(keys(NJ, { ...p })).toEqual(["phosphorus:refusal"]);
    expect(keys(NJ, { ...p, isEstablishing: true })).toEqual([]);
    expect(keys(NJ, { ...p, isRepairing: true })).toEqual([]);
  });
  it("Minnesota exempts first establishment only: repair is refused, and says why", () => {
    expect(keys(MN, { ...p, isEstablishing: true })).toEqual([]);
    const f = checkApplication(MN, { ...base, ...p, isRepairing: true });
    expect(f.map((x) => x.key)).toEqual(["phosphorus"]);
    expect(f[0]!.message).toContain("Repair is not an exemption");
    expect(f[0]!.source).toContain("18C.60 subd. 2(b)");
  });
  it("soilTestCounts reads calendar years", () => {
    expect(soilTestCounts("2024-02-29", "2027-02-28", 3)).toBe(true);
    expect(soilTestCounts("2024-02-29", "2027-03-01", 3)).toBe(false);
    expect(soilTestCounts("2010-01-01", "2026-01-01", null)).toBe(true);
  });
});

describe("frozen or saturated ground and heavy rain: warnings, never silent", () => {
  const conditions = (w: ApplicationFacts["weather"]) =>
    checkApplication(NJ, { ...base, weather: w }).find((f) => f.key === "conditions");
  it("every New Jersey fertilizer application carries the reminder with its section", () => {
    const f = conditions({ tminF: 50, precipIn: 0, isForecast: true })!;
    expect(f.severity).toBe("warning");
    expect(f.source).toContain("58:10A-62a(1)");
  });
  it("a low at or below 32 °F, rain in the forecast, or no weather are said", () => {
    expect(conditions({ tminF: 31, precipIn: 0, isForecast: true })!.message).toContain(
      "the ground may be frozen",
    );
    expect(conditions({ tminF: 40, precipIn: 1.2, isForecast: true })!.message).toContain(
      "1.2 in of rain in the day's forecast",
    );
    expect(conditions(null)!.message).toContain("No weather is kept");
  });
  it("Minnesota's rule set names none of them: no reminder", () =>
    expect(checkApplication(MN, base).map((f) => f.key)).toEqual([]));
});

describe("company default and the species range", () => {
  it("company limits warn instead of refusing", () => {
    const f = checkApplication(DEFAULT, { ...base, nLb: 1.2 });
    expect(f.map((x) => `${x.key}:${x.severity}`)).toEqual(["max_n:warning"]);
    expect(isRefused(f)).toBe(false);
  });
  it("going over the species' annual range is a warning, never a refusal", () => {
    expect(keys(NJ, { yearToDateNLb: 3.5 })).toEqual(["annual_n:warning"]);
  });
  it("a product without nitrogen (an insecticide) never warns about the year's nitrogen", () => {
    const noN = { nPct: 0, nLb: 0, wsnLb: 0, slowReleasePctOfN: 0 };
    expect(keys(DEFAULT, { ...noN, yearToDateNLb: 3.5 })).toEqual([]);
    expect(keys(NJ, { ...noN, yearToDateNLb: 4.5, appliedOn: "2026-12-20" })).toEqual([]);
  });
});

describe("the product label (refusals no one overrides)", () => {
  const label: LabelLimits = {
    productName: "Demo feed",
    registrationNumber: "",
    unitLabel: "lb / 1,000 ft²",
    lbPer1000PerUnit: 1,
    maxRate: 4,
    maxYearly: 10,
    minIntervalDays: 28,
  };
  const at = (appliedOn: string, lb: number) => ({ appliedOn, productLbPer1000: lb });
  const run = (lb: number, others: { appliedOn: string; productLbPer1000: number }[] = []) =>
    checkLabel(label, { appliedOn: "2026-06-01", productLbPer1000: lb, others });
  it("the maximum rate per application: at it passes, above it is refused", () => {
    expect(run(4)).toEqual([]);
    const f = run(4.01);
    expect(f.map((x) => x.key)).toEqual(["label_max_rate"]);
    expect(isLabelRefused(f)).toBe(true);
  });
  it("the yearly maximum counts the 365 days ending on the date", () => {
    expect(run(4, [at("2026-04-01", 3), at("2026-03-01", 3)])).toEqual([]);
    expect(run(4, [at("2026-04-01", 3), at("2025-09-01", 3.5)]).map((x) => x.key)).toEqual([
      "label_yearly",
    ]);
    expect(run(4, [at("2026-04-01", 3), at("2025-06-01", 3.5)])).toEqual([]); // 365 days before
  });
  it("the interval is counted both ways (a backdated entry cannot slip between two)", () => {
    expect(run(2, [at("2026-05-04", 2)])).toEqual([]); // 28 days
    expect(run(2, [at("2026-05-05", 2)]).map((x) => x.value)).toEqual([27]);
    expect(run(2, [at("2026-06-10", 2)]).map((x) => x.key)).toEqual(["label_interval"]);
  });
  it("a product without label limits gets a warning, not a silent pass", () => {
    const f = checkLabel(
      { ...label, maxRate: null, maxYearly: null, minIntervalDays: null },
      { appliedOn: "2026-06-01", productLbPer1000: 40, others: [] },
    );
    expect(f.map((x) => `${x.key}:${x.severity}`)).toEqual(["label_missing:warning"]);
  });
  it("a label that names frozen ground, saturated soil or rain: its own words as a warning, with the weather", () => {
    const caution =
      "Keep out of reach of children. Do not apply to frozen ground or before heavy rain. Wash hands.";
    const [f] = labelConditions("Demo feed", caution, { tminF: 28, precipIn: 0, isForecast: true });
    expect(f).toMatchObject({ key: "label_conditions", severity: "warning", basis: "label" });
    expect(f!.message).toBe(
      "The label says: “Do not apply to frozen ground or before heavy rain.” The day's low is 28 °F: the ground may be frozen.",
    );
    expect(labelConditions("Demo feed", "Wash hands after use.", null)).toEqual([]);
  });
  it("messages speak the label's unit", () => {
    const floz = {
      ...label,
      unitLabel: "fl oz / 1,000 ft²",
      lbPer1000PerUnit: 11.2 / 128,
      maxRate: 60,
    };
    const [f] = checkLabel(floz, {
      appliedOn: "2026-06-01",
      productLbPer1000: (64 * 11.2) / 128,
      others: [],
    });
    expect(f!.message).toBe(
      "64 fl oz / 1,000 ft² is above the label's maximum of 60 fl oz / 1,000 ft² per application.",
    );
  });
});

describe("shipped rule sets", () => {
  // The reference table writes the rule-set shape out (it imports no feature); each set must be
  // exactly what the managers' form would accept, as the seed stores it.
  it("each passes the managers' rule-set schema unchanged", () => {
    expect(SHIPPED_RULE_SETS.length).toBeGreaterThan(0);
    for (const r of SHIPPED_RULE_SETS) expect(ruleSetSchema.parse(r)).toEqual(r);
  });
  it("every limit of a law carries its section", () => {
    for (const r of SHIPPED_RULE_SETS.filter((x) => x.limitsAreLaw)) {
      if (r.maxNLbPer1000 !== null) expect(r.nLimitsSource, r.name).not.toBe("");
      if (r.proBlackout) expect(r.blackoutSource, r.name).not.toBe("");
      if (r.phosphorusRule !== "allowed") expect(r.phosphorusSource, r.name).not.toBe("");
    }
  });
  it("month-days read in words", () => {
    expect(monthDayWords("12-01")).toBe("December 1");
    expect(monthDayWords("03-01")).toBe("March 1");
  });
});
