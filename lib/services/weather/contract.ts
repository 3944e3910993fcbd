// The weather service's API as Sward speaks it: Open-Meteo's forecast endpoint
// (GET {WEATHER_BASE_URL}/v1/forecast) and historical-weather endpoint
// (GET {WEATHER_ARCHIVE_URL}/v1/archive), both answering the same JSON shape
// (https://open-meteo.com/en/docs, https://open-meteo.com/en/docs/historical-weather-api):
//   ?latitude=40.33&longitude=-74.74&start_date=2026-06-01&end_date=2026-06-14
//   &hourly=temperature_2m,relative_humidity_2m,…&daily=temperature_2m_max,…
//   &timezone=auto&wind_speed_unit=ms
// Units: we ask for SI (°C, mm, m/s, W m⁻², MJ m⁻²) — FAO-56 and the disease models are defined
// in SI — and convert to °F and inches where a person reads them. `timezone=auto` makes hourly
// times and daily boundaries the location's local time, which the Pythium model's "night after
// the hot day" needs. The local fake serves the same shape. Pure: zod and arithmetic only.
import { z } from "zod";

/** The hourly variables Sward asks for (Open-Meteo names). */
export const OPEN_METEO_HOURLY = [
  "temperature_2m",
  "relative_humidity_2m",
  "dew_point_2m",
  "precipitation",
  "wind_speed_10m",
  "shortwave_radiation",
] as const;

/** The daily variables Sward asks for; `et0_fao_evapotranspiration` is the service's own FAO-56 ETo. */
export const OPEN_METEO_DAILY = [
  "temperature_2m_max",
  "temperature_2m_min",
  "precipitation_sum",
  "shortwave_radiation_sum",
  "et0_fao_evapotranspiration",
] as const;

const series = z.array(z.number().nullable());
const localHour = z.string().regex(/^\d{4}-\d{2}-\d{2}T\d{2}:\d{2}$/);
const localDate = z.string().regex(/^\d{4}-\d{2}-\d{2}$/);

/** One Open-Meteo answer (forecast or archive), the fields Sward reads; others are ignored. */
export const openMeteoResponseSchema = z.object({
  latitude: z.number(),
  longitude: z.number(),
  elevation: z.number().optional(),
  utc_offset_seconds: z.number().int(),
  timezone: z.string(),
  hourly: z.object({
    time: z.array(localHour).max(800 * 25),
    temperature_2m: series,
    relative_humidity_2m: series,
    dew_point_2m: series,
    precipitation: series,
    wind_speed_10m: series,
    shortwave_radiation: series,
  }),
  daily: z.object({
    time: z.array(localDate).max(800),
    temperature_2m_max: series,
    temperature_2m_min: series,
    precipitation_sum: series,
    shortwave_radiation_sum: series,
    et0_fao_evapotranspiration: series,
  }),
});
export type OpenMeteoResponse = z.infer<typeof openMeteoResponseSchema>;

/** A day's hours as the service gave them (local time; 23 or 25 on daylight-saving days). */
interface WeatherHours {
  /** "HH:MM", local time. */
  time: string[];
  tempC: number[];
  rhPct: number[];
}

/** One day of weather as the rest of Sward reads it (and the cache keeps it). */
export interface WeatherDayInput {
  date: string;
  tmaxC: number;
  tminC: number;
  rhMaxPct: number | null;
  rhMinPct: number | null;
  rhMeanPct: number | null;
  /** Mean wind speed, m/s, measured at windHeightM. */
  windMs: number | null;
  windHeightM: number | null;
  sunshineH: number | null;
  /** Incoming shortwave radiation, MJ m⁻² day⁻¹. */
  solarMJ: number | null;
  precipMm: number;
  isForecast: boolean;
  /** The day's hourly temperature and humidity, when the service gave every hour. */
  hourly: WeatherHours | null;
  /** The service's own daily FAO-56 reference ET (mm): an outside check of ours, never used in its place. */
  serviceEt0Mm: number | null;
}

const mean = (xs: number[]) => xs.reduce((a, b) => a + b, 0) / xs.length;
const round = (x: number, d: number) => Math.round(x * 10 ** d) / 10 ** d;

/** The location's local date at `nowMs`, from the answer's UTC offset. */
export const localToday = (utcOffsetSeconds: number, nowMs: number) =>
  new Date(nowMs + utcOffsetSeconds * 1000).toISOString().slice(0, 10);

/**
 * An Open-Meteo answer as Sward's days. Daily maximum/minimum temperature, rain, radiation and
 * the service's ETo come from `daily`; the day's RH extremes and mean and its mean wind speed
 * come from its hours (Open-Meteo's daily block has no mean wind). A day without its daily
 * temperatures (the archive lags a few days) is left out; a day with a missing hour keeps its
 * daily values but no `hourly`. Days after `today` (the location's date) are forecasts.
 */
export function daysFromOpenMeteo(
  response: OpenMeteoResponse,
  today: string,
  options: { archive: boolean },
): WeatherDayInput[] {
  const h = response.hourly;
  const byDate = new Map<string, number[]>();
  h.time.forEach((t, i) => {
    const date = t.slice(0, 10);
    const list = byDate.get(date) ?? [];
    list.push(i);
    byDate.set(date, list);
  });
  const d = response.daily;
  const days: WeatherDayInput[] = [];
  d.time.forEach((date, i) => {
    const tmax = d.temperature_2m_max[i];
    const tmin = d.temperature_2m_min[i];
    if (tmax === null || tmax === undefined || tmin === null || tmin === undefined) return;
    const hours = byDate.get(date) ?? [];
    const pick = (xs: (number | null)[]) =>
      hours.map((j) => xs[j]).filter((x): x is number => x !== null && x !== undefined);
    const rh = pick(h.relative_humidity_2m);
    const temp = pick(h.temperature_2m);
    const wind = pick(h.wind_speed_10m);
    const complete =
      hours.length >= 23 && rh.length === hours.length && temp.length === hours.length;
    days.push({
      date,
      tmaxC: tmax,
      tminC: Math.min(tmin, tmax),
      rhMaxPct: rh.length ? Math.max(...rh) : null,
      rhMinPct: rh.length ? Math.min(...rh) : null,
      rhMeanPct: rh.length >= 20 ? round(mean(rh), 1) : null,
      windMs: wind.length >= 20 ? round(mean(wind), 2) : null,
      windHeightM: wind.length >= 20 ? 10 : null,
      sunshineH: null,
      solarMJ: d.shortwave_radiation_sum[i] ?? null,
      precipMm: d.precipitation_sum[i] ?? 0,
      isForecast: !options.archive && date > today,
      hourly: complete
        ? { time: hours.map((j) => h.time[j]!.slice(11, 16)), tempC: temp, rhPct: rh }
        : null,
      serviceEt0Mm: d.et0_fao_evapotranspiration[i] ?? null,
    });
  });
  return days;
}

/** The daily variables of the monthly normals: the day's mean is (max + min) / 2. */
export const OPEN_METEO_NORMALS_DAILY = ["temperature_2m_max", "temperature_2m_min"] as const;

/** An archive answer asked for daily temperatures only (no hourly block). */
export const openMeteoTemperaturesSchema = z.object({
  utc_offset_seconds: z.number().int(),
  daily: z.object({
    time: z.array(localDate).max(800),
    temperature_2m_max: series,
    temperature_2m_min: series,
  }),
});

/**
 * Twelve monthly mean air temperatures (°C, January first) from daily history: each day's mean is
 * (max + min) / 2 (the averaging of gdd.ts), each month the mean of its days over all years given.
 * Null when a month has no day.
 */
export function monthlyMeansFromDays(
  days: { date: string; tmaxC: number; tminC: number }[],
): number[] | null {
  const sum = new Array<number>(12).fill(0);
  const count = new Array<number>(12).fill(0);
  for (const d of days) {
    const m = Number(d.date.slice(5, 7)) - 1;
    sum[m]! += (d.tmaxC + d.tminC) / 2;
    count[m]! += 1;
  }
  if (count.some((c) => c === 0)) return null;
  return sum.map((s, i) => round(s / count[i]!, 2));
}

/** Open-Meteo's error answer: `{ "error": true, "reason": "…" }`. */
export const openMeteoErrorSchema = z.object({ error: z.literal(true), reason: z.string() });
