// Weather reads: days from the cache per location cell (never fetched here — the refresh is a
// mutation, lib/weather/mutations.ts, which pages that show weather call first), the property
// weather panel, where a property is.
import "server-only";

import { db } from "@/db";
import { crabgrassTiming } from "@/lib/agronomy/crabgrass";
import { soilTempEstimateF } from "@/lib/agronomy/seeding";
import { lawnKc } from "@/lib/agronomy/water";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { notFound } from "@/lib/http/app-error";
import { services } from "@/lib/services";

import { cachedWeatherResult, readWeatherDays } from "./cache";
import { deriveDays } from "./derived";
import type { PropertyWeather, WeatherResult } from "./dto";

/** Days [from, to] for a location as the cache holds them: "ok" when complete and fresh. */
export async function getCachedWeather(
  lat: number,
  lon: number,
  from: string,
  to: string,
  today: string,
): Promise<WeatherResult> {
  const cached = await readWeatherDays(db(), lat, lon, from, to, today);
  return cachedWeatherResult(cached, services().weather !== null);
}

/** Where a property is (and its time zone), within the actor's scope; not found otherwise. */
export async function getPropertyLocation(actor: Actor, propertyId: string) {
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

/** The property's weather panel: the last 14 days and the forecast, from the cache. */
export async function getPropertyWeather(
  actor: Actor,
  propertyId: string,
): Promise<PropertyWeather> {
  const property = await getPropertyLocation(actor, propertyId);
  const today = todayIn(property.time_zone);
  const jan1 = `${today.slice(0, 4)}-01-01`;
  const result = await getCachedWeather(
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
  const toF = (c: number) => (c * 9) / 5 + 32;
  const pastF = result.days
    .filter((d) => d.date <= today)
    .map((d) => ({ date: d.date, tmaxF: toF(d.tmaxC), tminF: toF(d.tminC) }));
  return {
    status: result.status,
    message: result.message,
    today,
    kc,
    days: derived.filter((d) => d.date > addDays(today, -14)),
    gddSinceJan1F:
      past.length && past[0]!.date === jan1 ? past[past.length - 1]!.gddSinceStartF : null,
    crabgrass: crabgrassTiming(pastF, today),
    soilTempEstimateF: soilTempEstimateF(pastF.filter((d) => d.date > addDays(today, -5))),
  };
}
