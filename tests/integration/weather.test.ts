// Weather through the provider and the cache: the fake service on 127.0.0.1 speaking
// Open-Meteo's forecast and archive API, validation, the cache keeping each day's hours and the
// service's ETo, the cache answering when the service is down, and a visit that starts without
// weather and gets it filled on the next sync.
import type { Server } from "node:http";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { addDays, todayIn } from "@/lib/dates";
import { openMeteoProvider, WeatherUnavailable } from "@/lib/services/weather/provider";
import { deriveDays } from "@/lib/weather/derived";
import { refreshWeather } from "@/lib/weather/mutations";

import { startFakeWeather } from "../harness/weather-fake";
import { createTestCompany, testDb } from "../helpers/factories";

let server: Server;
let base = "";
beforeAll(async () => {
  server = await startFakeWeather(0);
  const address = server.address();
  base = `http://127.0.0.1:${typeof address === "object" && address ? address.port : 0}`;
});
afterAll(() => new Promise<void>((r) => server.close(() => r())));

const today = todayIn("America/New_York");

describe("weather", () => {
  it("the fake serves plausible, deterministic days that pass the contract, from the archive and the forecast endpoint", async () => {
    const provider = openMeteoProvider({ baseUrl: base });
    const a = await provider.daily(40.33, -74.74, "2026-07-01", "2026-07-14");
    expect(a.every((d) => d.hourly?.rhPct.length === 24 && d.serviceEt0Mm! > 0)).toBe(true);
    expect(a.every((d) => !d.isForecast)).toBe(true);
    // Recent days and the week ahead come from the forecast endpoint; the days ahead are forecasts.
    const recent = await provider.daily(40.33, -74.74, addDays(today, -3), addDays(today, 3));
    expect(recent).toHaveLength(7);
    expect(recent.filter((d) => d.isForecast).map((d) => d.date)).toEqual(
      [1, 2, 3].map((i) => addDays(today, i)),
    );
    const b = await provider.daily(40.33, -74.74, "2026-07-01", "2026-07-14");
    expect(a).toEqual(b);
    expect(a).toHaveLength(14);
    const meanHigh = a.reduce((s, d) => s + d.tmaxC, 0) / a.length;
    expect(meanHigh).toBeGreaterThan(22); // July in central New Jersey
    expect(meanHigh).toBeLessThan(36);
    const winter = await provider.daily(40.33, -74.74, "2026-01-10", "2026-01-16");
    expect(winter.reduce((s, d) => s + d.tmaxC, 0) / 7).toBeLessThan(10);
    const derived = deriveDays(a, { latitudeDeg: 40.33, kc: 0.8, wateringInByDate: {} });
    expect(
      derived.every((d) => d.et0Method === "penman-monteith" && d.et0In > 0 && d.et0In < 0.4),
    ).toBe(true);
  });

  it("monthly normals: each month's mean of (max + min) / 2 over the last three full years of the archive", async () => {
    const provider = openMeteoProvider({ baseUrl: base });
    const { monthlyMeanC, years } = await provider.normals(40.33, -74.74);
    const last = new Date().getUTCFullYear() - 1;
    expect(years).toEqual([last - 2, last]);
    expect(monthlyMeanC).toHaveLength(12);
    // The same days read through daily(): July of the three years, averaged by hand.
    const julys = (
      await Promise.all(
        [last - 2, last - 1, last].map((y) =>
          provider.daily(40.33, -74.74, `${y}-07-01`, `${y}-07-31`),
        ),
      )
    ).flat();
    expect(julys).toHaveLength(93);
    const julyMean = julys.reduce((s, d) => s + (d.tmaxC + d.tminC) / 2, 0) / julys.length;
    expect(monthlyMeanC[6]).toBeCloseTo(julyMean, 1);
    // Central New Jersey (NOAA 1991–2020 normals, from memory: January about 0 °C, July about
    // 25 °C): the fake's climate is in that neighbourhood.
    expect(monthlyMeanC[0]).toBeGreaterThan(-6);
    expect(monthlyMeanC[0]).toBeLessThan(6);
    expect(monthlyMeanC[6]).toBeGreaterThan(20);
    expect(monthlyMeanC[6]).toBeLessThan(30);
    // A refused location is a WeatherUnavailable naming the service's reason.
    await expect(provider.normals(95, -74)).rejects.toThrow(/Latitude must be in range/);
  });

  it("a service that is down gives WeatherUnavailable after retries; the cache still answers", async () => {
    const down = openMeteoProvider({
      baseUrl: "http://127.0.0.1:9",
      timeoutMs: 300,
      retries: 1,
      backoffMs: 10,
    });
    await expect(down.daily(40, -74, "2026-07-01", "2026-07-02")).rejects.toBeInstanceOf(
      WeatherUnavailable,
    );
    const up = openMeteoProvider({ baseUrl: base });
    const filled = await refreshWeather(up, 40.31, -74.71, "2026-06-01", "2026-06-10", today);
    expect(filled.status).toBe("ok");
    const fromCache = await refreshWeather(down, 40.31, -74.71, "2026-06-01", "2026-06-10", today);
    expect(fromCache.status).toBe("ok"); // past, complete and cached: no fetch needed
    expect(fromCache.days).toHaveLength(10);
    // The cache keeps each day's hours and the service's ETo.
    expect(fromCache.days.every((d) => d.hourly?.time[0] === "00:00" && d.serviceEt0Mm! > 0)).toBe(
      true,
    );
    const partly = await refreshWeather(down, 40.31, -74.71, "2026-06-01", "2026-06-20", today);
    expect(partly.status).toBe("cached");
    expect(partly.message).toMatch(/Weather unavailable: the weather service could not be reached/);
  });

  it("a refused request gives the service's own reason", async () => {
    // Further ahead than the forecast endpoint's 16 days is not asked for; a bad coordinate is.
    const provider = openMeteoProvider({ baseUrl: base, retries: 0 });
    await expect(provider.daily(95, -74, today, today)).rejects.toThrow(
      /answered 400 \(Latitude must be in range of -90 to 90°\.\)/,
    );
    const ahead = await provider.daily(40.33, -74.74, addDays(today, 10), addDays(today, 30));
    expect(ahead.at(-1)!.date <= addDays(today, 15)).toBe(true);
  });

  it("a visit starts with the weather service down; the snapshot says unavailable; the next sync fills it", async () => {
    const c = await createTestCompany();
    const tech1 = await c.actor("tech1");
    const visit = await testDb()
      .selectFrom("visits")
      .select("id")
      .where("company_id", "=", c.companyId)
      .where("scheduled_for", "=", today)
      .where("technician_id", "=", tech1.userId)
      .executeTakeFirstOrThrow();
    const { startVisit } = await import("@/lib/visits/mutations");
    const started = await startVisit(tech1, visit.id, { latitude: null, longitude: null }); // no WEATHER_BASE_URL in this suite: service unavailable
    expect(started.status).toBe("in_progress");
    expect(started.weather).toMatchObject({ status: "unavailable" });

    // The service comes back: fill the snapshot the way the next sync does.
    const property = await testDb()
      .selectFrom("visits")
      .innerJoin("properties", "properties.id", "visits.property_id")
      .select(["latitude", "longitude"])
      .where("visits.id", "=", visit.id)
      .executeTakeFirstOrThrow();
    await refreshWeather(
      openMeteoProvider({ baseUrl: base }),
      property.latitude,
      property.longitude,
      addDays(today, -1),
      today,
      today,
    );
    const { fillVisitWeather } = await import("@/lib/weather/mutations");
    await fillVisitWeather(tech1, visit.id);
    const { getVisit } = await import("@/lib/visits/queries");
    expect((await getVisit(tech1, visit.id)).weather).toMatchObject({ status: "ok" });
  });
});
