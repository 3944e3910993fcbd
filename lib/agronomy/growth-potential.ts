// Turfgrass growth potential (pure): how near the air temperature is to the optimum for growth,
// on a 0–1 scale, and its mean over a round's window.
//
// Gelernter, W. & Stowell, L. J. (2005), "Improved overseeding programs 1. The role of weather",
// Golf Course Management 73(3):108–113:
//
//   GP = exp(−½ · ((t − t_opt) / σ)²)
//
// with t the mean air temperature, t_opt 20 °C (68 °F) for cool-season (C3) grasses and 31 °C
// (88 °F) for warm-season (C4) grasses. The spread σ (the papers call it the "variance") is
// 5.5 °C (10 °F) for cool-season and 7 °C (12 °F) for warm-season grasses — FROM MEMORY of the
// PACE Turf and Asian Turfgrass Center fact sheets that restate the model: the searches made for
// this module found the optimum temperatures (20 °C / 68 °F and 31 °C / 88 °F) and the revision
// below stated, but not a page giving σ. The Fahrenheit pair (10 °F, 12 °F) agrees with the Celsius
// pair within rounding (5.5 × 1.8 = 9.9; 7 × 1.8 = 12.6), which the unit tests check.
//
// Revision (PACE Turf, "Modified warm season growth potential model"): warm-season GP "will no
// longer drop when estimated optimum temperature of 88 F (31 C) has been exceeded"; it stays at 1
// above the optimum. The cool-season curve still falls on both sides (summer heat).
import { addDays, daysBetween, type IsoDate } from "@/lib/dates";
import type { GrassSeason } from "@/lib/reference/grass-species";

const GROWTH_POTENTIAL = {
  cool: { optimumC: 20, sigmaC: 5.5 },
  warm: { optimumC: 31, sigmaC: 7 },
} as const;

/** GP of one mean air temperature (°C) for cool- or warm-season turf, 0–1. */
export function growthPotential(meanC: number, season: GrassSeason): number {
  if (!Number.isFinite(meanC)) throw new RangeError("Mean temperature must be a number (°C).");
  const { optimumC, sigmaC } = GROWTH_POTENTIAL[season];
  if (season === "warm" && meanC >= optimumC) return 1;
  return Math.exp(-0.5 * ((meanC - optimumC) / sigmaC) ** 2);
}

/** Twelve monthly mean air temperatures, °C, January first. */
export type MonthlyMeansC = readonly number[];

/** The mean temperature (°C) the model reads for a day: its daily value if known, else its month's normal. */
function meanTemperatureOn(
  date: IsoDate,
  normals: MonthlyMeansC,
  daily?: ReadonlyMap<IsoDate, number>,
): number {
  const known = daily?.get(date);
  if (known !== undefined) return known;
  const month = Number(date.slice(5, 7));
  const value = normals[month - 1];
  if (value === undefined) throw new RangeError("Monthly normals need twelve months.");
  return value;
}

/**
 * Mean GP over the days start..end (inclusive) for which `counts(day)` holds (every day by
 * default), with each day read by `meanTemperatureOn`. Returns 0 days and GP 0 when no day counts.
 */
export function windowGrowthPotential(
  start: IsoDate,
  end: IsoDate,
  season: GrassSeason,
  normals: MonthlyMeansC,
  options: { daily?: ReadonlyMap<IsoDate, number>; counts?: (day: IsoDate) => boolean } = {},
): { gp: number; days: number } {
  const span = daysBetween(start, end);
  if (span < 0) throw new RangeError("A window ends on or after its first day.");
  let sum = 0;
  let days = 0;
  for (let i = 0; i <= span; i++) {
    const day = addDays(start, i);
    if (options.counts && !options.counts(day)) continue;
    sum += growthPotential(meanTemperatureOn(day, normals, options.daily), season);
    days++;
  }
  return { gp: days ? sum / days : 0, days };
}

/**
 * The first day of `year` on which a trigger is expected from the monthly normals: growing degree
 * days accumulated from January 1 (the plain averaging method of gdd.ts, each day at its month's
 * mean, above `baseC`) reaching `threshold`, or the month's mean air temperature reaching
 * `thresholdC` (for soil temperature the same reading: the monthly mean air temperature stands
 * for the soil temperature at 4 in — common practice as a planning estimate, no published source;
 * the actual trigger is confirmed on site). Null when the normals never reach it.
 */
export function expectedTriggerDay(
  year: number,
  normals: MonthlyMeansC,
  trigger:
    { kind: "gdd"; baseC: number; threshold: number } | { kind: "temperature"; thresholdC: number },
): IsoDate | null {
  const first = `${year}-01-01`;
  let gdd = 0;
  for (let i = 0; i < 366; i++) {
    const day = addDays(first, i);
    if (!day.startsWith(String(year))) break;
    const t = meanTemperatureOn(day, normals);
    if (trigger.kind === "gdd") {
      gdd += Math.max(0, t - trigger.baseC);
      if (gdd >= trigger.threshold) return day;
    } else if (t >= trigger.thresholdC) return day;
  }
  return null;
}
