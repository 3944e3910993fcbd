// Disease weather models against their published forms and examples (REFERENCES.md §3), with
// boundary cases on both sides of each threshold.
// - Dollar spot: Smith, Kerns, Walker et al. (2018), PLoS ONE 13(3): e0194216; worked example
//   RH5 80 %, T5 20 °C → 40.4 %; action threshold 20 %; defined for T5 10–35 °C.
// - Brown patch: Fidanza, Dernoeden & Grybauskas (1996), Phytopathology 86:385–390; example
//   RH 90 %, Tmin 20 °C → E = 6.80; warning at E ≥ 6.
// - Pythium blight: Nutter, Cole & Schein (1983), Plant Disease 67:1126 (abstract, REFERENCES.md
//   §3): "maximum air temperature > 30 °C followed by at least 14 h of relative humidity > 90 %
//   with the minimum temperature > 20 °C" — counted on hourly humidity over the night after the
//   hot day (noon to noon; our reading of "followed by").
import { describe, expect, it } from "vitest";

import {
  brownPatchIndex,
  DOLLAR_SPOT_THRESHOLD,
  dollarSpotProbability,
  pythiumNight,
  type WeatherHour,
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

/** 48 local hours from 00:00 of `date`: temperature and RH by hour of the two days. */
function twoDays(
  date: string,
  temp: (h: number) => number,
  rh: (h: number) => number,
): WeatherHour[] {
  const next = new Date(Date.parse(`${date}T00:00:00Z`) + 86_400_000).toISOString().slice(0, 10);
  return Array.from({ length: 48 }, (_, i) => ({
    at: `${i < 24 ? date : next}T${String(i % 24).padStart(2, "0")}:00`,
    tempC: temp(i),
    rhPct: rh(i),
  }));
}
/** A hot afternoon (33 °C at 15:00) and a night that stays at 23–24 °C. */
const muggy = (i: number) => (i < 15 ? 24 + i * 0.6 : i < 21 ? 33 - (i - 15) * 1.5 : 23.5);

describe("Pythium blight (Nutter et al. 1983), on hourly humidity", () => {
  const D = "2026-07-20";
  it("raises for a hot day, then ≥ 14 h above 90 % with the night's low above 20 °C", () => {
    // Humid from 20:00 to 10:00 the next day: 14 hours above 90 % inside noon-to-noon.
    const hours = twoDays(D, muggy, (i) => (i >= 20 && i < 34 ? 95 : 60));
    expect(pythiumNight({ date: D, tmaxC: 33 }, hours)).toEqual({
      hoursRhAbove90: 14,
      nightMinC: 23.5,
      risk: true,
    });
  });
  it("stays quiet at 13 h, at a high of exactly 30 °C, or a night's low of exactly 20 °C", () => {
    const thirteen = twoDays(D, muggy, (i) => (i >= 21 && i < 34 ? 95 : 60));
    expect(pythiumNight({ date: D, tmaxC: 33 }, thirteen)!.risk).toBe(false);
    const fourteen = twoDays(D, muggy, (i) => (i >= 20 && i < 34 ? 95 : 60));
    expect(pythiumNight({ date: D, tmaxC: 30 }, fourteen)!.risk).toBe(false); // not above 30
    const coolNight = twoDays(
      D,
      (i) => (i === 28 ? 20 : muggy(i)),
      (i) => (i >= 20 && i < 34 ? 95 : 60),
    );
    expect(pythiumNight({ date: D, tmaxC: 33 }, coolNight)!.risk).toBe(false); // not above 20
    expect(
      pythiumNight(
        { date: D, tmaxC: 33 },
        twoDays(D, muggy, () => 90),
      )!.hoursRhAbove90,
    ).toBe(0); // "above 90 %"
  });
  it("counts the night after the hot day, not the night before it", () => {
    // Humid from 00:00 to 11:00 of the hot day and dry after: the night that counts is dry.
    const before = twoDays(D, muggy, (i) => (i < 12 ? 97 : 55));
    expect(pythiumNight({ date: D, tmaxC: 33 }, before)).toMatchObject({
      hoursRhAbove90: 0,
      risk: false,
    });
  });
  it("counts hours whether or not they run together", () => {
    const broken = twoDays(D, muggy, (i) => (i >= 18 && i < 36 && i % 4 !== 0 ? 95 : 70)); // 18 h minus 4 breaks
    expect(pythiumNight({ date: D, tmaxC: 33 }, broken)).toMatchObject({
      hoursRhAbove90: 14,
      risk: true,
    });
  });
  it("is not judged without every hour of the night", () => {
    const hours = twoDays(D, muggy, (i) => (i >= 20 && i < 34 ? 95 : 60)).slice(0, 30);
    expect(pythiumNight({ date: D, tmaxC: 33 }, hours)).toBeNull();
  });
  it("disagrees with a linear interpolation between the day's RH extremes, which the model does not use", () => {
    // A real-looking muggy night: RH 55 % at 15:00, above 90 % from 19:00 to 09:00 (14 h).
    const hours = twoDays(D, muggy, (i) =>
      i >= 19 && i < 33 ? 96 : i < 12 ? 88 : i < 19 ? 55 + (i - 15 >= 0 ? (i - 15) * 8 : 0) : 70,
    );
    const night = pythiumNight({ date: D, tmaxC: 33 }, hours)!;
    expect(night).toMatchObject({ hoursRhAbove90: 14, risk: true });
    // The former estimate: 24 · (RHmax − 90) / (RHmax − RHmin) with RHmin 55 %, RHmax 96 %
    // gives 3.5 h, far under 14: the hot humid night would have gone unflagged.
    const interpolated = (24 * (96 - 90)) / (96 - 55);
    expect(interpolated).toBeCloseTo(3.51, 2);
    expect(interpolated).toBeLessThan(14);
    // And a day whose RH extremes are high but whose night is dry: interpolation says 24 h of
    // RH above 90 % (RHmin 91 %), the hours say the night after the hot day had none.
    const wetMorningDryNight = twoDays(D, muggy, (i) => (i < 12 ? 99 : i < 24 ? 91.5 : 70));
    expect(pythiumNight({ date: D, tmaxC: 33 }, wetMorningDryNight)).toMatchObject({
      hoursRhAbove90: 12, // 12:00–23:00 of the hot day only
      risk: false,
    });
  });
  it("takes the 25 hours of a night when clocks fall back", () => {
    const hours = twoDays("2026-11-01", muggy, (i) => (i >= 20 && i < 34 ? 95 : 60));
    // A repeated 01:00 (25-hour day): one more humid hour inside the window.
    hours.splice(26, 0, { at: "2026-11-02T01:00", tempC: 23.5, rhPct: 95 });
    expect(pythiumNight({ date: "2026-11-01", tmaxC: 33 }, hours)).toMatchObject({
      hoursRhAbove90: 15,
      risk: true,
    });
  });
});
