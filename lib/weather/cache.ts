// The weather cache per location cell (PostgreSQL) in front of the provider: a slow or failing
// service never blocks anything — the cache answers, marked as such. Takes the database handle
// from its caller (the web app's pool, or the background worker's). `readWeatherDays` only
// reads; `weatherFromCache` is the refresh (it fetches what is missing or out of date and writes
// it), called by mutations and the risk evaluation, never by a query.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { addDays } from "@/lib/dates";
import { log } from "@/lib/log";
import { WeatherUnavailable, type WeatherProvider } from "@/lib/services/weather/provider";

import type { CachedWeather, WeatherResult } from "./dto";
import { cellOf, toWeatherDay, weatherDayRow } from "./map";

/** Recent days and forecasts are fetched again after this long. */
const STALE_AFTER_MS = 6 * 3600_000;
/** How far back a day's hours are needed: the alerts' weather window (lib/after-write/alerts.ts). */
const HOURS_NEEDED_DAYS = 20;

/** Days [from, to] for a location as the cache holds them, and whether they are complete and fresh. */
export async function readWeatherDays(
  executor: Kysely<Database>,
  lat: number,
  lon: number,
  from: string,
  to: string,
  today: string,
): Promise<CachedWeather> {
  const cached = await executor
    .selectFrom("weather_days")
    .selectAll()
    .where("cell", "=", cellOf(lat, lon))
    .where("day", ">=", from)
    .where("day", "<=", to)
    .orderBy("day")
    .execute();
  const staleAfter = Date.now() - STALE_AFTER_MS;
  const wanted = Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1;
  // Past days are final two days after the fact; recent days and forecasts are refreshed every 6 h.
  // A day of the alerts' window without its hours (cached before the hours were kept, or an hour
  // missing at the service) is asked for again: the Pythium model needs them.
  const isFresh =
    cached.length >= wanted &&
    !cached.some(
      (r) =>
        ((r.is_forecast || r.day >= addDays(today, -2)) &&
          new Date(r.fetched_at).getTime() < staleAfter) ||
        (r.hourly === null && r.day >= addDays(today, -HOURS_NEEDED_DAYS)),
    );
  return { days: cached.map(toWeatherDay), isFresh };
}

/** What a read of the cache says to its reader: fresh is "ok"; otherwise the last values Sward has. */
export function cachedWeatherResult(cached: CachedWeather, hasProvider: boolean): WeatherResult {
  if (cached.isFresh) return { days: cached.days, status: "ok", message: null };
  return {
    days: cached.days,
    status: cached.days.length ? "cached" : "unavailable",
    message: hasProvider
      ? "Weather unavailable: the weather service did not answer."
      : "No weather service is configured.",
  };
}

/**
 * Refreshes days [from, to] for a location — fetches what is missing or out of date and writes
 * it to the cache — and answers them (from the cache when the service fails).
 */
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
  const cached = await readWeatherDays(executor, lat, lon, from, to, today);
  if (cached.isFresh || !provider) return cachedWeatherResult(cached, provider !== null);
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
            hourly: eb.ref("excluded.hourly"),
            service_et0_mm: eb.ref("excluded.service_et0_mm"),
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
    return {
      days: cached.days,
      status: cached.days.length ? "cached" : "unavailable",
      message,
    };
  }
}
