// Application checks against the shipped rule sets: New Jersey P.L.2010, c.112 (0.9 lb N,
// 0.7 lb WSN, 20 % slow-release, blackout 1 Dec – 1 Mar for professionals, 15 Nov – 1 Mar for
// consumers, phosphorus only with a soil test or when establishing) and Minnesota Statutes
// 18C.60 (phosphorus only with a soil test within 3 years, or establishment).
import { describe, expect, it } from "vitest";

import {
  checkApplication,
  isInWindow,
  isRefused,
  type ApplicationFacts,
  type RuleSetLimits,
} from "@/lib/agronomy/rules";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";

const byName = (name: string): RuleSetLimits => {
  const r = SHIPPED_RULE_SETS.find((x) => x.name === name)!;
  return {
    ...r,
    proBlackout: r.proBlackout ? [...r.proBlackout] : null,
    homeownerBlackout: r.homeownerBlackout ? [...r.homeownerBlackout] : null,
  };
};
const NJ = byName("New Jersey turf fertiliser law");
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
  soilTestOn: null,
  yearToDateNLb: 1,
  annualNRange: { min: 2, max: 4 },
};
const keys = (r: RuleSetLimits, a: Partial<ApplicationFacts>) =>
  checkApplication(r, { ...base, ...a }).map((f) => `${f.key}:${f.severity}`);

describe("New Jersey", () => {
  it("an application within every limit passes", () => expect(keys(NJ, {})).toEqual([]));
  it("0.9 lb N is allowed; 0.91 is refused", () => {
    expect(keys(NJ, { nLb: 0.9, wsnLb: 0.63 })).toEqual([]);
    expect(keys(NJ, { nLb: 0.91, wsnLb: 0.63 })).toEqual(["max_n:refusal"]);
  });
  it("water-soluble N above 0.7 lb is refused", () =>
    expect(keys(NJ, { nLb: 0.8, wsnLb: 0.8, slowReleasePctOfN: 0 })).toEqual([
      "max_wsn:refusal",
      "min_slow_release:refusal",
    ]));
  it("less than 20 % slow-release N is refused (only for products with N)", () => {
    expect(keys(NJ, { slowReleasePctOfN: 10 })).toEqual(["min_slow_release:refusal"]);
    expect(keys(NJ, { nPct: 0, nLb: 0, wsnLb: 0, slowReleasePctOfN: 0 })).toEqual([]);
  });
  it("blackout 1 Dec – 1 Mar for professionals, 15 Nov – 1 Mar for homeowners, both ends inclusive", () => {
    expect(keys(NJ, { appliedOn: "2026-12-01" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2027-03-01" })).toEqual(["blackout:refusal"]);
    expect(keys(NJ, { appliedOn: "2026-11-20" })).toEqual([]);
    expect(keys(NJ, { appliedOn: "2026-11-20", byProfessional: false })).toEqual([
      "blackout:refusal",
    ]);
    expect(keys(NJ, { appliedOn: "2027-03-02" })).toEqual([]);
  });
  it("phosphorus only with a soil test or when establishing", () => {
    expect(keys(NJ, { p2o5Lb: 0.2 })).toEqual(["phosphorus:refusal"]);
    expect(keys(NJ, { p2o5Lb: 0.2, isEstablishing: true })).toEqual([]);
    expect(keys(NJ, { p2o5Lb: 0.2, soilTestOn: "2020-04-01" })).toEqual([]); // NJ sets no age limit
  });
  it("findings carry the citation", () => {
    const [f] = checkApplication(NJ, { ...base, nLb: 1.2 });
    expect(f!.source).toContain("P.L.2010, c.112");
    expect(f!.message).toBe("1.20 lb N per 1,000 ft² is above the 0.90 lb limit per application.");
  });
});

describe("Minnesota", () => {
  it("phosphorus needs a soil test within 3 years", () => {
    expect(keys(MN, { p2o5Lb: 0.3, soilTestOn: "2024-06-01" })).toEqual([]);
    expect(keys(MN, { p2o5Lb: 0.3, soilTestOn: "2022-06-01" })).toEqual(["phosphorus:refusal"]);
    expect(keys(MN, { p2o5Lb: 0.3, soilTestOn: "2027-01-01" })).toEqual(["phosphorus:refusal"]); // a test after the date does not count
  });
  it("has no nitrogen limits or blackout", () =>
    expect(keys(MN, { nLb: 1.5, wsnLb: 1.5, appliedOn: "2026-12-15" })).toEqual([]));
});

describe("company default and the species range", () => {
  it("company limits warn instead of refusing", () => {
    const f = checkApplication(DEFAULT, { ...base, nLb: 1.2 });
    expect(f.map((x) => `${x.key}:${x.severity}`)).toEqual(["max_n:warning"]);
    expect(isRefused(f)).toBe(false);
  });
  it("going over the species' annual range is a warning, never a refusal", () => {
    const f = checkApplication(NJ, { ...base, yearToDateNLb: 3.5 });
    expect(f.map((x) => `${x.key}:${x.severity}`)).toEqual(["annual_n:warning"]);
  });
});

describe("isInWindow", () => {
  it("handles windows within a year and across the new year", () => {
    expect(isInWindow("06-15", ["06-01", "06-30"])).toBe(true);
    expect(isInWindow("07-01", ["06-01", "06-30"])).toBe(false);
    expect(isInWindow("01-15", ["12-01", "03-01"])).toBe(true);
    expect(isInWindow("11-30", ["12-01", "03-01"])).toBe(false);
  });
});

describe("shipped rule sets", () => {
  // The reference table writes the rule-set shape out (it imports no feature); each set must be
  // exactly what the managers' form would accept, as the seed stores it.
  it("each passes the managers' rule-set schema unchanged", () => {
    expect(SHIPPED_RULE_SETS.length).toBeGreaterThan(0);
    for (const r of SHIPPED_RULE_SETS) expect(ruleSetSchema.parse(r)).toEqual(r);
  });
});
