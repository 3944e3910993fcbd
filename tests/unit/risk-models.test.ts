// Disease weather models against their published forms and examples (REFERENCES.md §3), with
// boundary cases on both sides of each threshold.
// - Dollar spot: Smith, Kerns, Walker et al. (2018), PLoS ONE 13(3): e0194216; worked example
//   RH5 80 %, T5 20 °C → 40.4 %; action threshold 20 %; defined for T5 10–35 °C.
// - Brown patch: Fidanza, Dernoeden & Grybauskas (1996), Phytopathology 86:385–390; example
//   RH 90 %, Tmin 20 °C → E = 6.80; warning at E ≥ 6.
// - Pythium blight: Nutter, Cole & Schein (1983), Plant Disease 67:1126: Tmax > 30 °C, then
//   ≥ 14 h of RH > 90 % with Tmin > 20 °C.
import { describe, expect, it } from "vitest";

import {
  brownPatchIndex,
  DOLLAR_SPOT_THRESHOLD,
  dollarSpotProbability,
  estimateHoursRhAbove90,
  pythiumWeatherRisk,
} from "@/lib/risk/models";

describe("dollar spot (Smith et al. 2018)", () => {
  it("reproduces the worked example: RH5 80 %, T5 20 °C → 40.4 %", () => {
    expect(dollarSpotProbability(80, 20)!).toBeCloseTo(0.404, 3);
  });
  it("is the logistic of the published linear predictor", () => {
    const logit = -11.4041 + 0.0894 * 65 + 0.1932 * 27;
    expect(dollarSpotProbability(65, 27)).toBeCloseTo(Math.exp(logit) / (1 + Math.exp(logit)), 12);
  });
  it("is defined only for a 5-day mean of 10–35 °C", () => {
    expect(dollarSpotProbability(80, 9.9)).toBeNull();
    expect(dollarSpotProbability(80, 10)).not.toBeNull();
    expect(dollarSpotProbability(80, 35)).not.toBeNull();
    expect(dollarSpotProbability(80, 35.1)).toBeNull();
  });
  it("crosses the 20 % threshold where the logit crosses ln(0.25)", () => {
    // At T5 20 °C the threshold RH5 is (ln(0.25) + 11.4041 − 0.1932·20) / 0.0894 ≈ 68.86 %.
    const rhAtThreshold = (Math.log(0.25) + 11.4041 - 0.1932 * 20) / 0.0894;
    expect(dollarSpotProbability(rhAtThreshold - 0.1, 20)!).toBeLessThan(DOLLAR_SPOT_THRESHOLD);
    expect(dollarSpotProbability(rhAtThreshold + 0.1, 20)!).toBeGreaterThan(DOLLAR_SPOT_THRESHOLD);
  });
});

describe("brown patch (Fidanza et al. 1996)", () => {
  it("reproduces the example: RH 90 %, Tmin 20 °C → 6.80", () => {
    expect(brownPatchIndex(90, 20)).toBeCloseTo(6.8, 10);
  });
  it("sits either side of the warning level of 6", () => {
    expect(brownPatchIndex(85, 20)).toBeCloseTo(6.05, 10); // −21.5 + 12.75 + 28 − 13.2
    expect(brownPatchIndex(84, 20)).toBeLessThan(6);
    expect(brownPatchIndex(70, 12)).toBeLessThan(6);
  });
});

describe("Pythium blight (Nutter et al. 1983)", () => {
  it("needs all three: Tmax above 30 °C, Tmin above 20 °C, at least 14 h of RH above 90 %", () => {
    expect(pythiumWeatherRisk({ tmaxC: 31, tminC: 21, hoursRhAbove90: 14 })).toBe(true);
    expect(pythiumWeatherRisk({ tmaxC: 30, tminC: 21, hoursRhAbove90: 16 })).toBe(false); // not above 30
    expect(pythiumWeatherRisk({ tmaxC: 32, tminC: 20, hoursRhAbove90: 16 })).toBe(false); // not above 20
    expect(pythiumWeatherRisk({ tmaxC: 32, tminC: 22, hoursRhAbove90: 13.9 })).toBe(false);
  });
  it("estimates hours above 90 % RH from the day's range (stated assumption)", () => {
    expect(estimateHoursRhAbove90(60, 100)).toBeCloseTo(6, 10); // (100 − 90) / 40 of 24 h
    expect(estimateHoursRhAbove90(92, 100)).toBe(24);
    expect(estimateHoursRhAbove90(40, 90)).toBe(0);
    expect(estimateHoursRhAbove90(null, 99)).toBe(0);
  });
});
