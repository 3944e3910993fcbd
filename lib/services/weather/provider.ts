// The weather client: Open-Meteo's forecast and historical-weather endpoints over plain fetch,
// with a timeout, retries with back-off, and zod validation (contract.ts). Anything unexpected
// becomes a WeatherUnavailable error, never a crash.
//
// Which endpoint: the forecast endpoint keeps the recent past (up to 92 days back) and the next
// 16 days; the archive starts in 1940 and lags about five days. Days older than
// FORECAST_PAST_DAYS go to the archive, the rest to the forecast endpoint, and the answer is one
// list of days.
import { addDays } from "@/lib/dates";

import {
  daysFromOpenMeteo,
  localToday,
  monthlyMeansFromDays,
  OPEN_METEO_DAILY,
  OPEN_METEO_HOURLY,
  OPEN_METEO_NORMALS_DAILY,
  openMeteoErrorSchema,
  openMeteoResponseSchema,
  openMeteoTemperaturesSchema,
  type WeatherDayInput,
} from "./contract";

export class WeatherUnavailable extends Error {
  constructor(message: string) {
    super(message);
    this.name = "WeatherUnavailable";
  }
}

export interface WeatherProvider {
  daily(lat: number, lon: number, start: string, end: string): Promise<WeatherDayInput[]>;
  /**
   * Monthly normals: the mean air temperature (°C) of each month, January first, averaged over
   * the last `NORMALS_YEARS` full calendar years of the same service's daily history (the archive
   * endpoint, daily maximum and minimum only). What growth potential reads for the months ahead.
   */
  normals(lat: number, lon: number): Promise<{ monthlyMeanC: number[]; years: [number, number] }>;
}

/** How many past full years the monthly normals average. */
const NORMALS_YEARS = 3;

/** Days further back than this come from the archive (the forecast endpoint keeps 92). */
const FORECAST_PAST_DAYS = 60;
/** The forecast endpoint's horizon is 16 days (today + 15); later days are not asked for. */
const FORECAST_AHEAD_DAYS = 15;

/** The query of one Open-Meteo request for days [start, end]. */
export function openMeteoQuery(
  lat: number,
  lon: number,
  start: string,
  end: string,
  apiKey?: string,
): string {
  const params = new URLSearchParams({
    latitude: lat.toFixed(4),
    longitude: lon.toFixed(4),
    start_date: start,
    end_date: end,
    hourly: OPEN_METEO_HOURLY.join(","),
    daily: OPEN_METEO_DAILY.join(","),
    timezone: "auto",
    wind_speed_unit: "ms",
  });
  if (apiKey) params.set("apikey", apiKey);
  return params.toString();
}

export function openMeteoProvider(options: {
  /** The forecast endpoint's origin, e.g. https://api.open-meteo.com */
  baseUrl: string;
  /** The historical-weather endpoint's origin, e.g. https://archive-api.open-meteo.com; default baseUrl. */
  archiveUrl?: string;
  apiKey?: string;
  timeoutMs?: number;
  retries?: number;
  backoffMs?: number;
  now?: () => number;
}): WeatherProvider {
  const { apiKey, timeoutMs = 4000, retries = 2, backoffMs = 300, now = Date.now } = options;
  const origin = (url: string) => url.replace(/\/$/, "");
  const forecastBase = `${origin(options.baseUrl)}/v1/forecast`;
  const archiveBase = `${origin(options.archiveUrl ?? options.baseUrl)}/v1/archive`;

  async function getJson(url: string): Promise<unknown> {
    let lastError = "no attempt";
    for (let attempt = 0; attempt <= retries; attempt++) {
      if (attempt > 0) await new Promise((r) => setTimeout(r, backoffMs * 3 ** (attempt - 1)));
      try {
        const response = await fetch(url, {
          headers: { Accept: "application/json" },
          signal: AbortSignal.timeout(timeoutMs),
        });
        if (response.status >= 500 || response.status === 429) {
          lastError = `the weather service answered ${response.status}`;
          continue;
        }
        const body: unknown = await response.json().catch(() => null);
        if (!response.ok) {
          const reason = openMeteoErrorSchema.safeParse(body);
          throw new WeatherUnavailable(
            `the weather service answered ${response.status}${reason.success ? ` (${reason.data.reason})` : ""}`,
          );
        }
        return body;
      } catch (err) {
        if (err instanceof WeatherUnavailable) throw err;
        lastError =
          err instanceof Error && err.name === "TimeoutError"
            ? "the weather service did not answer in time"
            : "the weather service could not be reached";
      }
    }
    throw new WeatherUnavailable(lastError);
  }

  // Past years do not change: one answer per place (to about 1 km) and years for the process.
  const normalsMemo = new Map<
    string,
    Promise<{ monthlyMeanC: number[]; years: [number, number] }>
  >();

  async function fetchNormals(lat: number, lon: number, first: number, last: number) {
    const days: { date: string; tmaxC: number; tminC: number }[] = [];
    for (let year = first; year <= last; year++) {
      const params = new URLSearchParams({
        latitude: lat.toFixed(4),
        longitude: lon.toFixed(4),
        start_date: `${year}-01-01`,
        end_date: `${year}-12-31`,
        daily: OPEN_METEO_NORMALS_DAILY.join(","),
        timezone: "auto",
        wind_speed_unit: "ms",
      });
      if (apiKey) params.set("apikey", apiKey);
      const parsed = openMeteoTemperaturesSchema.safeParse(
        await getJson(`${archiveBase}?${params.toString()}`),
      );
      if (!parsed.success)
        throw new WeatherUnavailable("the weather service sent data Sward could not read");
      const d = parsed.data.daily;
      d.time.forEach((date, i) => {
        const tmax = d.temperature_2m_max[i];
        const tmin = d.temperature_2m_min[i];
        if (typeof tmax === "number" && typeof tmin === "number")
          days.push({ date, tmaxC: tmax, tminC: tmin });
      });
    }
    const monthlyMeanC = monthlyMeansFromDays(days);
    if (!monthlyMeanC)
      throw new WeatherUnavailable("the weather service's history left a month without days");
    return { monthlyMeanC, years: [first, last] as [number, number] };
  }

  async function getDays(
    base: string,
    lat: number,
    lon: number,
    start: string,
    end: string,
    archive: boolean,
  ): Promise<WeatherDayInput[]> {
    const url = `${base}?${openMeteoQuery(lat, lon, start, end, apiKey)}`;
    const parsed = openMeteoResponseSchema.safeParse(await getJson(url));
    if (!parsed.success)
      throw new WeatherUnavailable("the weather service sent data Sward could not read");
    return daysFromOpenMeteo(parsed.data, localToday(parsed.data.utc_offset_seconds, now()), {
      archive,
    }).filter((d) => d.date >= start && d.date <= end);
  }

  return {
    async daily(lat, lon, start, end) {
      // UTC's date is within a day of any location's; the margins below absorb that.
      const todayUtc = new Date(now()).toISOString().slice(0, 10);
      const firstForecastDay = addDays(todayUtc, -FORECAST_PAST_DAYS);
      const lastForecastDay = addDays(todayUtc, FORECAST_AHEAD_DAYS - 1);
      const days: WeatherDayInput[] = [];
      if (start < firstForecastDay) {
        const archiveEnd = end < firstForecastDay ? end : addDays(firstForecastDay, -1);
        days.push(...(await getDays(archiveBase, lat, lon, start, archiveEnd, true)));
      }
      const from = start > firstForecastDay ? start : firstForecastDay;
      const to = end < lastForecastDay ? end : lastForecastDay;
      if (from <= to) days.push(...(await getDays(forecastBase, lat, lon, from, to, false)));
      return days;
    },
    normals(lat, lon) {
      const last = new Date(now()).getUTCFullYear() - 1;
      const first = last - NORMALS_YEARS + 1;
      const key = `${lat.toFixed(2)},${lon.toFixed(2)},${first}-${last}`;
      let answer = normalsMemo.get(key);
      if (!answer) {
        answer = fetchNormals(lat, lon, first, last);
        normalsMemo.set(key, answer);
        answer.catch(() => normalsMemo.delete(key));
      }
      return answer;
    },
  };
}
