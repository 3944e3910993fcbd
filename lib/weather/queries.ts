// Daily weather per location cell, cached in PostgreSQL and refreshed from the provider (a slow
// or failing service never blocks anything: the cache answers, marked as such); the property
// weather panel; the weather snapshot of a visit.
import "server-only";

import { db } from "@/db";
import { lawnKc } from "@/lib/agronomy/water";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { notFound } from "@/lib/http/app-error";
import { propertyInScope } from "@/lib/properties/scope";
import { weatherProvider } from "@/lib/services/weather/instance";
import type { WeatherProvider } from "@/lib/services/weather/provider";

import { weatherFromCache, type WeatherResult } from "./cache";
import { deriveDays, type DerivedDay } from "./derived";

export { cellOf, weatherDayRow, type WeatherResult } from "./cache";

/** Days [from, to] for a location: from the cache, fetching what is missing or out of date. */
export const weatherForLocation = (
  provider: WeatherProvider | null,
  lat: number,
  lon: number,
  from: string,
  to: string,
  today: string,
): Promise<WeatherResult> => weatherFromCache(db(), provider, lat, lon, from, to, today);

/** Where a property is (and its time zone), within the actor's scope; not found otherwise. */
export async function propertyLocation(actor: Actor, propertyId: string) {
  const property = await db()
    .selectFrom("properties")
    .select([
      "properties.id",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
    ])
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
  const result = await weatherForLocation(
    weatherProvider(),
    property.latitude,
    property.longitude,
    jan1,
    addDays(today, 7),
    today,
  );

  const zones = await db()
    .selectFrom("zones")
    .select(["grass_species", "area_ft2"])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", propertyId)
    .where("archived_at", "is", null)
    .execute();
  const totalArea = zones.reduce((s, z) => s + Number(z.area_ft2), 0) || 1;
  const kc = lawnKc(zones);

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
  for (const w of waterings)
    wateringInByDate[w.watered_on] =
      (wateringInByDate[w.watered_on] ?? 0) +
      Number(w.depth_in) * (w.zone_id ? Number(w.area_ft2) / totalArea : 1);

  const derived = deriveDays(result.days, { latitudeDeg: property.latitude, kc, wateringInByDate });
  const past = derived.filter((d) => d.date <= today);
  return {
    status: result.status,
    message: result.message,
    today,
    kc,
    days: derived.filter((d) => d.date > addDays(today, -14)),
    gddSinceJan1F:
      past.length && past[0]!.date === jan1 ? past[past.length - 1]!.gddSinceStartF : null,
  };
}

/** The weather of a day at a place, for a visit snapshot: never throws, never waits long. */
export async function weatherSnapshot(
  lat: number,
  lon: number,
  date: string,
  today: string,
): Promise<Record<string, unknown>> {
  try {
    const result = await weatherForLocation(weatherProvider("quick"), lat, lon, date, date, today);
    const d = result.days.find((x) => x.date === date);
    if (!d)
      return {
        status: "unavailable",
        message: result.message ?? "Weather unavailable.",
        at: new Date().toISOString(),
      };
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
