// Weather as the reads return it: days from the cache (with how fresh they are) and the property panel.
import type { CrabgrassTiming } from "@/lib/agronomy/crabgrass";
import type { WeatherDayInput } from "@/lib/services/weather/contract";

import type { DerivedDay } from "./derived";

/** Days as the cache holds them; fresh = every day present and none out of date. */
export interface CachedWeather {
  days: WeatherDayInput[];
  isFresh: boolean;
}

export type WeatherStatus = "ok" | "cached" | "unavailable";

export interface WeatherResult {
  days: WeatherDayInput[];
  status: WeatherStatus;
  message: string | null;
}

export interface PropertyWeather {
  status: WeatherStatus;
  message: string | null;
  today: string;
  kc: number;
  days: DerivedDay[]; // the last 14 days and the forecast
  gddSinceJan1F: number | null;
  /** Crabgrass pre-emergence timing from this year's daily highs and lows (null: no day yet). */
  crabgrass: CrabgrassTiming | null;
  /** The soil near the surface estimated from the last 5 days' air (°F; null: too few days). */
  soilTempEstimateF: number | null;
}
