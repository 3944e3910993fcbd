// Daily weather per location cell, cached in PostgreSQL and refreshed from the provider (a slow
// or failing service never blocks anything: the cache answers, marked as such); the property
// weather panel; the weather snapshot of a visit.
import "server-only";
import { db } from "@/db";
import type { WeatherDay } from "@/db/schema";
import { findGrassSpecies } from "@/fixtures/grass-species";
import { TURF_KC } from "@/lib/agronomy/water";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { notFound } from "@/lib/http/app-error";
import { propertyInScope } from "@/lib/properties/scope";
import { weatherProvider } from "@/lib/services/weather/instance";
import { type DerivedDay, deriveDays } from "./derived";
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
export async function weatherForLocation(provider: WeatherProvider | null, lat: number, lon: number, from: string, to: string, today: string): Promise<WeatherResult> {
  const cell = cellOf(lat, lon);
  const cached = await db().selectFrom("weather_days").selectAll().where("cell", "=", cell).where("day", ">=", from).where("day", "<=", to).orderBy("day").execute();
  const staleAfter = Date.now() - 6 * 3600_000;
  const wanted = Math.round((Date.parse(to) - Date.parse(from)) / 86_400_000) + 1;
  // Past days are final two days after the fact; recent days and forecasts are refreshed every 6 h.
  const needsFetch =
    cached.length < wanted || cached.some((r) => (r.is_forecast || r.day >= addDays(today, -2)) && new Date(r.fetched_at).getTime() < staleAfter);
  if (!needsFetch) return { days: cached.map(toInput), status: "ok", message: null };
  if (!provider) return { days: cached.map(toInput), status: cached.length ? "cached" : "unavailable", message: "No weather service is configured." };
  try {
    const days = await provider.daily(lat, lon, from, to);
    if (days.length) {
      await db()
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
    const message = err instanceof WeatherUnavailable ? `Weather unavailable: ${err.message}.` : "Weather unavailable.";
    log.warn({ err, cell }, "weather fetch failed");
    return { days: cached.map(toInput), status: cached.length ? "cached" : "unavailable", message };
  }
}

/** Where a property is (and its time zone), within the actor's scope; not found otherwise. */
export async function propertyLocation(actor: Actor, propertyId: string) {
  const property = await db()
    .selectFrom("properties")
    .select(["properties.id", "properties.latitude", "properties.longitude", "properties.time_zone"])
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  return property;
}

export interface PropertyWeather {
  status: "ok" | "cached" | "unavailable";
  message: string | null;
  today: string;
  kc: number;
  days: DerivedDay[]; // the last 14 days and the forecast
  gddSinceJan1F: number | null;
}

export async function propertyWeather(actor: Actor, propertyId: string): Promise<PropertyWeather> {
  const property = await propertyLocation(actor, propertyId);
  const today = todayIn(property.time_zone);
  const jan1 = `${today.slice(0, 4)}-01-01`;
  const result = await weatherForLocation(weatherProvider(), property.latitude, property.longitude, jan1, addDays(today, 7), today);

  const zones = await db().selectFrom("zones").select(["grass_species", "area_ft2"]).where("company_id", "=", actor.companyId).where("property_id", "=", propertyId).where("archived_at", "is", null).execute();
  const totalArea = zones.reduce((s, z) => s + Number(z.area_ft2), 0) || 1;
  const kc = zones.reduce((s, z) => s + TURF_KC[findGrassSpecies(z.grass_species)?.season ?? "cool"] * Number(z.area_ft2), 0) / totalArea || TURF_KC.cool;

  const waterings = await db()
    .selectFrom("waterings")
    .select(["waterings.watered_on", "waterings.depth_in", "waterings.zone_id"])
    .leftJoin("zones", "zones.id", "waterings.zone_id")
    .select("zones.area_ft2")
    .where("waterings.company_id", "=", actor.companyId)
    .where("waterings.property_id", "=", propertyId)
    .where("watered_on", ">=", jan1)
    .execute();
  // Area-weighted: a zone's watering counts for its share of the lawn.
  const wateringInByDate: Record<string, number> = {};
  for (const w of waterings) wateringInByDate[w.watered_on] = (wateringInByDate[w.watered_on] ?? 0) + Number(w.depth_in) * (w.zone_id ? Number(w.area_ft2) / totalArea : 1);

  const derived = deriveDays(result.days, { latitudeDeg: property.latitude, kc, wateringInByDate });
  const past = derived.filter((d) => d.date <= today);
  return {
    status: result.status,
    message: result.message,
    today,
    kc,
    days: derived.filter((d) => d.date > addDays(today, -14)),
    gddSinceJan1F: past.length && past[0]!.date === jan1 ? past[past.length - 1]!.gddSinceStartF : null,
  };
}

/** The weather of a day at a place, for a visit snapshot: never throws, never waits long. */
export async function weatherSnapshot(lat: number, lon: number, date: string, today: string): Promise<Record<string, unknown>> {
  try {
    const result = await weatherForLocation(weatherProvider("quick"), lat, lon, date, date, today);
    const d = result.days.find((x) => x.date === date);
    if (!d) return { status: "unavailable", message: result.message ?? "Weather unavailable.", at: new Date().toISOString() };
    return {
      status: "ok",
      date,
      tmaxF: Math.round(((d.tmaxC * 9) / 5 + 32) * 10) / 10,
      tminF: Math.round(((d.tminC * 9) / 5 + 32) * 10) / 10,
      rhMinPct: d.rhMinPct,
      rhMaxPct: d.rhMaxPct,
      windMph: d.windMs === null ? null : Math.round(d.windMs * 2.236936 * 10) / 10,
      precipIn: Math.round((d.precipMm / 25.4) * 100) / 100,
      isForecast: d.isForecast,
      at: new Date().toISOString(),
    };
  } catch {
    return { status: "unavailable", message: "Weather unavailable.", at: new Date().toISOString() };
  }
}

