// Disease weather models (pure), each as published (REFERENCES.md §3).

/** Smith et al. (2018) dollar spot model: the model's 10–35 °C range of the 5-day mean temperature. */
const DOLLAR_SPOT_T_RANGE_C = { min: 10, max: 35 } as const;
/** The published action threshold of the dollar spot model: 20 % probability. */
export const DOLLAR_SPOT_THRESHOLD = 0.2;

/**
 * Dollar spot probability from the 5-day mean relative humidity (%) and the 5-day mean air
 * temperature (°C): logit = −11.4041 + 0.0894·RH5 + 0.1932·T5 (Smith, Kerns, Walker et al. 2018,
 * PLoS ONE 13(3): e0194216; coefficients as published by the model's authors, via
 * implementations). Null outside the model's 10–35 °C range.
 */
export function dollarSpotProbability(rhMean5dPct: number, tMean5dC: number): number | null {
  if (!Number.isFinite(rhMean5dPct) || !Number.isFinite(tMean5dC)) return null;
  if (tMean5dC < DOLLAR_SPOT_T_RANGE_C.min || tMean5dC > DOLLAR_SPOT_T_RANGE_C.max) return null;
  const logit = -11.4041 + 0.0894 * rhMean5dPct + 0.1932 * tMean5dC;
  return 1 / (1 + Math.exp(-logit));
}

/** Brown patch warning level of the two-variable index: E ≥ 6 (Fidanza et al. 1996). */
export const BROWN_PATCH_THRESHOLD = 6;

/**
 * Brown patch two-variable index E = −21.5 + 0.15·RH + 1.4·T − 0.033·T², RH the daily mean
 * relative humidity (%), T the daily minimum air temperature (°C) (Fidanza, Dernoeden &
 * Grybauskas 1996, Phytopathology 86:385–390).
 */
export function brownPatchIndex(rhMeanPct: number, tminC: number): number {
  return -21.5 + 0.15 * rhMeanPct + 1.4 * tminC - 0.033 * tminC * tminC;
}

/** Thresholds of the Nutter, Cole & Schein (1983) Pythium blight rule. */
export const PYTHIUM = { tmaxAboveC: 30, tminAboveC: 20, hoursRhAbove90AtLeast: 14 } as const;

/**
 * Pythium blight weather (Nutter, Cole & Schein 1983, Plant Disease 67:1126): a maximum air
 * temperature above 30 °C followed by at least 14 hours of relative humidity above 90 % with the
 * minimum temperature above 20 °C.
 */
export function pythiumWeatherRisk(day: {
  tmaxC: number;
  tminC: number;
  hoursRhAbove90: number;
}): boolean {
  return (
    day.tmaxC > PYTHIUM.tmaxAboveC &&
    day.tminC > PYTHIUM.tminAboveC &&
    day.hoursRhAbove90 >= PYTHIUM.hoursRhAbove90AtLeast
  );
}

/**
 * Hours of a day with relative humidity above 90 %, estimated from the day's minimum and maximum
 * RH when hourly values are missing: RH is taken to move linearly between them through the day,
 * so the share of the day above 90 % is (max − 90) / (max − min). A stated assumption (daily
 * weather services give RH extremes, not hours); hourly data, when a provider gives it, is better.
 */
export function estimateHoursRhAbove90(rhMinPct: number | null, rhMaxPct: number | null): number {
  if (rhMinPct === null || rhMaxPct === null || rhMaxPct <= 90) return 0;
  if (rhMinPct >= 90) return 24;
  return (24 * (rhMaxPct - 90)) / (rhMaxPct - rhMinPct);
}
