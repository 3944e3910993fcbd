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
  OPEN_METEO_DAILY,
  OPEN_METEO_HOURLY,
  openMeteoErrorSchema,
  openMeteoResponseSchema,
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
}

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

  async function getDays(
    base: string,
    lat: number,
    lon: number,
    start: string,
    end: string,
    archive: boolean,
  ): Promise<WeatherDayInput[]> {
    const url = `${base}?${openMeteoQuery(lat, lon, start, end, apiKey)}`;
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
        const parsed = openMeteoResponseSchema.safeParse(body);
        if (!parsed.success)
          throw new WeatherUnavailable("the weather service sent data Sward could not read");
        return daysFromOpenMeteo(parsed.data, localToday(parsed.data.utc_offset_seconds, now()), {
          archive,
        }).filter((d) => d.date >= start && d.date <= end);
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
  };
}
