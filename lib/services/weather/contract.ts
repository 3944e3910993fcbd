// The daily-weather JSON contract Sward reads (and the local fake serves), validated with zod.
// GET {WEATHER_BASE_URL}/v1/daily?lat=40.3&lon=-74.7&start=2026-06-01&end=2026-06-14
// A hosted service with another shape is adapted in its client, never in the rest of Sward.
import { z } from "zod";

const weatherDaySchema = z.object({
  date: z.string().regex(/^\d{4}-\d{2}-\d{2}$/),
  tmaxC: z.number().min(-70).max(60),
  tminC: z.number().min(-80).max(50),
  rhMaxPct: z.number().min(0).max(100).nullable(),
  rhMinPct: z.number().min(0).max(100).nullable(),
  rhMeanPct: z.number().min(0).max(100).nullable(),
  windMs: z.number().min(0).max(80).nullable(),
  windHeightM: z.number().min(0.5).max(50).nullable(),
  sunshineH: z.number().min(0).max(24).nullable(),
  solarMJ: z.number().min(0).max(50).nullable(),
  precipMm: z.number().min(0).max(1000),
  isForecast: z.boolean(),
});
export type WeatherDayInput = z.infer<typeof weatherDaySchema>;

export const weatherResponseSchema = z.object({
  location: z.object({ lat: z.number(), lon: z.number() }),
  days: z.array(weatherDaySchema).max(800),
});
