// The weather cache per location cell (PostgreSQL) in front of the provider: a slow or failing
// service never blocks anything — the cache answers, marked as such. Takes the database handle
// from its caller (the web app's pool, or the background worker's).
import type { Kysely } from "kysely";

import type { Database, WeatherDay } from "@/db/schema";
import { addDays } from "@/lib/dates";
import { log } from "@/lib/log";
import type { WeatherDayInput } from "@/lib/services/weather/contract";
import { WeatherUnavailable, type WeatherProvider } from "@/lib/services/weather/provider";

export const cellOf = (lat: number, lon: number) => `${lat.toFixed(1)}:${lon.toFixed(1)}`;

const toInput = (r: WeatherDay): WeatherDayInput => ({
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
});

export interface WeatherResult {
  days: WeatherDayInput[];
  status: "ok" | "cached" | "unavailable";
  message: string | null;
}

/** Days [from, to] for a location: from the cache, fetching what is missing or out of date. */
export async function weatherFromCache(
  executor: Kysely<Database>,
  provider: WeatherProvider | null,
  lat: number,
  lon: number,
  from: string,
  to: string,
  today: string,
): Promise<WeatherResult> {
  const cell = cellOf(lat, lon);
  const cached = await executor
    .selectFrom("weather_days")
    .selectAll()
    .where("cell", "=", cell)
    .where("day", ">=", from)
    .where("day", "<=", to)
    .orderBy("day")
    .execute();
  const staleAfter = Date.now() - 6 * 3600_000;
  const wanted = Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1;
  // Past days are final two days after the fact; recent days and forecasts are refreshed every 6 h.
  const needsFetch =
    cached.length < wanted ||
    cached.some(
      (r) =>
        (r.is_forecast || r.day >= addDays(today, -2)) &&
        new Date(r.fetched_at).getTime() < staleAfter,
    );
  if (!needsFetch) return { days: cached.map(toInput), status: "ok", message: null };
  if (!provider)
    return {
      days: cached.map(toInput),
      status: cached.length ? "cached" : "unavailable",
      message: "No weather service is configured.",
    };
  try {
    const days = await provider.daily(lat, lon, from, to);
    if (days.length) {
      await executor
        .insertInto("weather_days")
        .values(days.map((d) => weatherDayRow(cell, d)))
        .onConflict((oc) =>
          oc.columns(["cell", "day"]).doUpdateSet((eb) => ({
            tmax_c: eb.ref("excluded.tmax_c"),
            tmin_c: eb.ref("excluded.tmin_c"),
            rh_max_pct: eb.ref("excluded.rh_max_pct"),
            rh_min_pct: eb.ref("excluded.rh_min_pct"),
            rh_mean_pct: eb.ref("excluded.rh_mean_pct"),
            wind_ms: eb.ref("excluded.wind_ms"),
            wind_height_m: eb.ref("excluded.wind_height_m"),
            sunshine_h: eb.ref("excluded.sunshine_h"),
            solar_mj: eb.ref("excluded.solar_mj"),
            precip_mm: eb.ref("excluded.precip_mm"),
            is_forecast: eb.ref("excluded.is_forecast"),
            fetched_at: eb.fn("now"),
          })),
        )
        .execute();
    }
    return { days, status: "ok", message: null };
  } catch (err) {
    const message =
      err instanceof WeatherUnavailable
        ? `Weather unavailable: ${err.message}.`
        : "Weather unavailable.";
    log.warn({ err, cell }, "weather fetch failed");
    return { days: cached.map(toInput), status: cached.length ? "cached" : "unavailable", message };
  }
}
