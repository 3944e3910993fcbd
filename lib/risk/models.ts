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
export const PYTHIUM = {
  tmaxAboveC: 30,
  tminAboveC: 20,
  hoursRhAbove90AtLeast: 14,
  /** The night after the hot day: local noon of the hot day to noon the next day (24 hours). */
  nightFromHour: 12,
} as const;

/** One local hour of weather. */
export interface WeatherHour {
  /** "YYYY-MM-DDTHH:MM", local time. */
  at: string;
  tempC: number;
  rhPct: number;
}

/**
 * Pythium blight weather (Nutter, Cole & Schein 1983, Plant Disease 67:1126–1128), as the
 * abstract states it: "a maximum air temperature > 30 °C followed by at least 14 h of relative
 * humidity > 90 % with the minimum temperature > 20 °C" (REFERENCES.md §3; the extension form
 * is the same in °F: high above 86 °F, low above 68 °F). The model counts hours of measured
 * humidity, so it takes the hours that follow the hot day: from local noon of the hot day to
 * noon the next day (the afternoon, the night and the morning after; our reading of "followed
 * by" — the paper's exact window is from memory, not re-read), counting every hour above 90 %
 * whether or not they run together, with the lowest temperature of those 24 hours as the
 * minimum. Null when that night's hours are not all known.
 */
export function pythiumNight(
  hotDay: { date: string; tmaxC: number },
  hours: WeatherHour[],
): { hoursRhAbove90: number; nightMinC: number; risk: boolean } | null {
  const from = `${hotDay.date}T${String(PYTHIUM.nightFromHour).padStart(2, "0")}:00`;
  const nextNoon = new Date(Date.parse(`${hotDay.date}T00:00:00Z`) + 86_400_000)
    .toISOString()
    .slice(0, 10);
  const to = `${nextNoon}T${String(PYTHIUM.nightFromHour).padStart(2, "0")}:00`;
  const night = hours.filter((h) => h.at >= from && h.at < to);
  // 23 or 25 hours on a daylight-saving night.
  if (night.length < 23) return null;
  const hoursRhAbove90 = night.filter((h) => h.rhPct > 90).length;
  const nightMinC = Math.min(...night.map((h) => h.tempC));
  return {
    hoursRhAbove90,
    nightMinC,
    risk:
      hotDay.tmaxC > PYTHIUM.tmaxAboveC &&
      nightMinC > PYTHIUM.tminAboveC &&
      hoursRhAbove90 >= PYTHIUM.hoursRhAbove90AtLeast,
  };
}

/** What each disease model was built on, shown with its alerts (the model applies best there). */
export const MODEL_TURF = {
  dollarSpot:
    "golf-course creeping bentgrass (fairways and putting greens in several US states and Canada)",
  brownPatch: "perennial ryegrass (Maryland field plots)",
  pythium: "Pennsylvania turfgrass plots (cool-season turf; the species from memory, not re-read)",
} as const;
