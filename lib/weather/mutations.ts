// Weather writes: refreshing the cache from the provider (pages that show weather call
// `refreshPropertyWeather` before they read), and keeping a visit's weather snapshot filled
// (the "next sync" after an unavailable service).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { addDays, todayIn } from "@/lib/dates";
import { services } from "@/lib/services";
import type { WeatherProvider } from "@/lib/services/weather/provider";

import { weatherFromCache } from "./cache";
import type { WeatherResult, WeatherStatus } from "./dto";
import { getPropertyLocation } from "./queries";

/**
 * How far back a property's weather is kept fresh: the Index histories reach 365 days back and
 * their water balance 15 days before the first check (lib/scoring/queries.ts); the weather panel
 * reads from 1 January.
 */
const PAST_DAYS = 365 + 15;

/** Refreshes days [from, to] for a location from the provider into the cache, and answers them. */
export const refreshWeather = (
  provider: WeatherProvider | null,
  lat: number,
  lon: number,
  from: string,
  to: string,
  today: string,
): Promise<WeatherResult> => weatherFromCache(db(), provider, lat, lon, from, to, today);

/**
 * Brings the property's cached weather up to date (the past year and the week ahead), so the
 * reads that follow (weather panel, Index histories) find it; a failing service leaves the cache
 * as it was and the reads say so.
 */
export async function refreshPropertyWeather(
  actor: Actor,
  propertyId: string,
): Promise<{ status: WeatherStatus; message: string | null }> {
  const property = await getPropertyLocation(actor, propertyId);
  const today = todayIn(property.time_zone);
  const jan1 = `${today.slice(0, 4)}-01-01`;
  const past = addDays(today, -PAST_DAYS);
  const { status, message } = await refreshWeather(
    services().weather,
    property.latitude,
    property.longitude,
    jan1 < past ? jan1 : past,
    addDays(today, 7),
    today,
  );
  return { status, message };
}

/** The weather of a day at a place, for a visit snapshot: never throws, never waits long. */
async function weatherSnapshot(
  lat: number,
  lon: number,
  date: string,
  today: string,
): Promise<Record<string, unknown>> {
  try {
    const result = await refreshWeather(services().quickWeather, lat, lon, date, date, today);
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

/** Fills a visit's snapshot when it is missing or was unavailable (the "next sync"). */
export async function fillVisitWeather(actor: Actor, visitId: string): Promise<void> {
  const visit = await db()
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .select([
      "visits.id",
      "visits.weather",
      "visits.scheduled_for",
      "visits.status",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
    ])
    .where("visits.company_id", "=", actor.companyId)
    .where("visits.id", "=", visitId)
    .executeTakeFirst();
  if (
    !visit ||
    visit.status === "scheduled" ||
    (visit.weather as { status?: string } | null)?.status === "ok"
  )
    return;
  const snapshot = await weatherSnapshot(
    visit.latitude,
    visit.longitude,
    visit.scheduled_for,
    todayIn(visit.time_zone),
  );
  if (snapshot.status === "ok" || !visit.weather)
    await db()
      .updateTable("visits")
      .set({ weather: JSON.stringify(snapshot) })
      .where("id", "=", visitId)
      .execute();
}
