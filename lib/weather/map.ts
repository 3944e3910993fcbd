// Weather rows ↔ days: the cache's cell of a location, a cached row as a provider's day, and back.
import type { WeatherDay } from "@/db/schema";
import type { WeatherDayInput } from "@/lib/services/weather/contract";

/** The cache keeps one row per day and 0.1° cell (about 11 km north–south). */
export const cellOf = (lat: number, lon: number) => `${lat.toFixed(1)}:${lon.toFixed(1)}`;

/** A cached row as the provider's day. */
export const toWeatherDay = (r: WeatherDay): WeatherDayInput => ({
  date: r.day,
  tmaxC: r.tmax_c,
  tminC: r.tmin_c,
  rhMaxPct: r.rh_max_pct,
  rhMinPct: r.rh_min_pct,
  rhMeanPct: r.rh_mean_pct,
  windMs: r.wind_ms,
  windHeightM: r.wind_height_m,
  sunshineH: r.sunshine_h,
  solarMJ: r.solar_mj,
  precipMm: r.precip_mm,
  isForecast: r.is_forecast,
  hourly: r.hourly,
  serviceEt0Mm: r.service_et0_mm,
});

/** A provider's day as a row of the cache. */
export const weatherDayRow = (cell: string, d: WeatherDayInput) => ({
  cell,
  day: d.date,
  tmax_c: d.tmaxC,
  tmin_c: Math.min(d.tminC, d.tmaxC),
  rh_max_pct: d.rhMaxPct,
  rh_min_pct: d.rhMinPct,
  rh_mean_pct: d.rhMeanPct,
  wind_ms: d.windMs,
  wind_height_m: d.windHeightM,
  sunshine_h: d.sunshineH,
  solar_mj: d.solarMJ,
  precip_mm: d.precipMm,
  is_forecast: d.isForecast,
  hourly: d.hourly ? JSON.stringify(d.hourly) : null,
  service_et0_mm: d.serviceEt0Mm,
});
