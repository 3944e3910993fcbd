// The property form's address checks and the rule set proposed from the state: the USPS state
// codes, the ZIP Code's format and its first digits against the state, and the proposal's words.
import { describe, expect, it } from "vitest";

import { propertySchema } from "@/lib/properties/schemas";
import {
  findUsState,
  statesOfZip,
  US_STATE_CODES,
  zipMatchesState,
  zipStateWarning,
} from "@/lib/reference/us-states";
import { proposeRuleSet, stateOfRuleSet } from "@/lib/rule-sets/propose";

const valid = {
  name: "Test residence",
  street: "77 Bramblecote Road",
  city: "Larkfield",
  region: "NJ",
  postalCode: "08561",
  latitude: 40.3378,
  longitude: -74.7326,
  timeZone: "America/New_York",
  ruleSetId: null,
  technicianId: null,
};

const errorsOf = (o: Record<string, unknown>) => {
  const r = propertySchema.safeParse({ ...valid, ...o });
  if (r.success) return {};
  return Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message]));
};

describe("state codes (USPS Publication 28, Appendix B)", () => {
  it("lists the 50 states, DC and the 5 inhabited territories: 56 codes, each once", () => {
    expect(US_STATE_CODES).toHaveLength(56);
    expect(new Set(US_STATE_CODES).size).toBe(56);
    // Codes as Publication 28 prints them (checked against the appendix's well-known entries).
    for (const [code, name] of [
      ["NJ", "New Jersey"],
      ["MN", "Minnesota"],
      ["PA", "Pennsylvania"],
      ["DC", "District of Columbia"],
      ["PR", "Puerto Rico"],
      ["GU", "Guam"],
      ["MP", "Northern Mariana Islands"],
      ["ME", "Maine"],
      ["MO", "Missouri"],
    ] as const)
      expect(findUsState(code)?.name).toBe(name);
    // Armed Forces and freely associated states are not places for a lawn in the book.
    for (const code of ["AA", "AE", "AP", "FM", "MH", "PW", "XX"])
      expect(findUsState(code)).toBeUndefined();
  });

  it("the form's state is refused unless it is a code; lower case is kept as upper case", () => {
    expect(errorsOf({ region: "New Jersey" })).toEqual({
      region: "State: use the two-letter USPS code of a US state or territory, e.g. NJ.",
    });
    expect(errorsOf({ region: "ZZ" }).region).toMatch(/^State:/);
    expect(errorsOf({ region: "" })).toEqual({ region: "State is required." });
    const r = propertySchema.safeParse({ ...valid, region: " nj " });
    expect(r.success && r.data.region).toBe("NJ");
  });
});

describe("ZIP codes", () => {
  it("five digits or ZIP+4 are accepted; '@08540' and other shapes are refused with the field's name", () => {
    expect(errorsOf({ postalCode: "08540" })).toEqual({});
    expect(errorsOf({ postalCode: "08540-1234" })).toEqual({});
    const message = "ZIP code: five digits, e.g. 08540, or ZIP+4, e.g. 08540-1234.";
    for (const bad of ["@08540", "8540", "085401", "08540-12", "08540 1234", "O8540", "085401234"])
      expect(errorsOf({ postalCode: bad }), bad).toEqual({ postalCode: message });
    expect(errorsOf({ postalCode: " " })).toEqual({ postalCode: "ZIP code is required." });
  });

  // USPS three-digit prefixes (DMM L002, from memory): New Jersey 070–089, New York 005 and
  // 100–149, Minnesota 550–567, Pennsylvania 150–196, Puerto Rico 006–007 and 009.
  it("the first three digits are read against the state's USPS prefixes", () => {
    expect(zipMatchesState("08540", "NJ")).toBe(true); // Princeton, NJ
    expect(zipMatchesState("07001", "NJ")).toBe(true); // the first NJ prefix, 070
    expect(zipMatchesState("08999", "NJ")).toBe(true); // the last, 089
    expect(zipMatchesState("10001", "NJ")).toBe(false); // Manhattan
    expect(zipMatchesState("55391", "MN")).toBe(true); // Wayzata, MN
    expect(zipMatchesState("19087", "PA")).toBe(true); // Wayne, PA
    expect(zipMatchesState("00501", "NY")).toBe(true); // Holtsville, NY (the IRS's unique ZIP)
    expect(zipMatchesState("00901", "PR")).toBe(true); // San Juan, PR
    expect(zipMatchesState("@08540", "NJ")).toBeUndefined();
    expect(statesOfZip("10001").map((s) => s.code)).toEqual(["NY"]);
  });

  it("a mismatch is a warning that names both fields and both states", () => {
    expect(zipStateWarning("10001", "NJ")).toBe(
      "ZIP code 10001 is a New York ZIP code, but State is NJ (New Jersey). Check both; save as it is if the address really is so.",
    );
    expect(zipStateWarning("08561", "NJ")).toBeNull();
    expect(zipStateWarning("00000", "NJ")).toMatch(/not a ZIP code USPS uses in any state/);
    // The schema itself accepts it: a few delivery areas cross a state line.
    expect(errorsOf({ postalCode: "10001" })).toEqual({});
  });
});

describe("the rule set proposed from the state", () => {
  const sets = [
    { id: "a", name: "Company default" },
    { id: "b", name: "New Jersey turf fertilizer law" },
    { id: "c", name: "Minnesota phosphorus law" },
    { id: "d", name: "West Virginia nutrient rules" },
  ];

  it("a rule set is a state's when its name names the state; the longest name wins", () => {
    expect(stateOfRuleSet("New Jersey turf fertilizer law")?.code).toBe("NJ");
    expect(stateOfRuleSet("West Virginia nutrient rules")?.code).toBe("WV");
    expect(stateOfRuleSet("Company default")).toBeUndefined();
    // Whole words only: "Maine" is not in "Mainely lawns".
    expect(stateOfRuleSet("Mainely lawns")).toBeUndefined();
  });

  it("New Jersey gets the New Jersey rule set with the reason; a state without one says so", () => {
    expect(proposeRuleSet(sets, "NJ")).toMatchObject({
      kind: "state",
      ruleSetId: "b",
      reason:
        "Proposed because the property is in New Jersey and “New Jersey turf fertilizer law” is the company's rule set for New Jersey. You can choose another.",
    });
    expect(proposeRuleSet(sets, "mn")).toMatchObject({ kind: "state", ruleSetId: "c" });
    expect(proposeRuleSet(sets, "VA")).toMatchObject({ kind: "none" });
    expect(proposeRuleSet(sets, "OH")?.reason).toMatch(/^No rule set here is for Ohio/);
    expect(proposeRuleSet(sets, "")).toBeNull();
  });
});
