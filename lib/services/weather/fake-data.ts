// Deterministic, plausible daily weather for the local fake service (demo and tests): a seasonal
// temperature curve by latitude, rain spells, heat spells, humidity that follows the rain, wind
// and sunshine. Invented numbers; nothing here is a forecast of anything.
import { daylightHours, dayOfYear } from "@/lib/agronomy/et0";

import type { WeatherDayInput } from "./contract";

function hash(text: string): number {
  let h = 2166136261;
  for (const ch of text) h = Math.imul(h ^ ch.charCodeAt(0), 16777619);
  // Final avalanche (MurmurHash3 fmix32) so that nearby dates give unrelated values.
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return (h >>> 0) / 2 ** 32;
}

export function fakeWeatherDay(
  lat: number,
  lon: number,
  date: string,
  today: string,
): WeatherDayInput {
  const doy = dayOfYear(date);
  const cell = `${lat.toFixed(1)}:${lon.toFixed(1)}`;
  const absLat = Math.abs(lat);
  const annualMean = 28 - 0.42 * absLat; // °C: ~11 at 40°, ~9 at 45°
  const amplitude = 4 + 0.22 * absLat; // ~12.8 at 40°
  const season = Math.sin((2 * Math.PI * (doy - 110)) / 365) * (lat >= 0 ? 1 : -1);
  const week = Math.floor(doy / 7);
  const isHeatSpell = season > 0.6 && hash(`${cell}:heat:${date.slice(0, 4)}:${week}`) < 0.25;
  const isRainSpell = hash(`${cell}:spell:${date.slice(0, 4)}:${Math.floor(doy / 4)}`) < 0.28;
  const isRain = isRainSpell ? hash(`${cell}:r:${date}`) < 0.75 : hash(`${cell}:r:${date}`) < 0.12;
  const noise = (hash(`${cell}:t:${date}`) - 0.5) * 5;
  const mean = annualMean + amplitude * season + noise + (isHeatSpell ? 5 : 0) - (isRain ? 1.5 : 0);
  const range = (isRain ? 5 : 10) + hash(`${cell}:range:${date}`) * 4;
  const tmax = mean + range / 2;
  const tmin = mean - range / 2;
  const rhMin = Math.min(
    95,
    (isRain ? 70 : 38) + hash(`${cell}:rh:${date}`) * 22 + (isHeatSpell ? 8 : 0),
  );
  const rhMax = Math.min(100, rhMin + 25 + hash(`${cell}:rhx:${date}`) * 12);
  const N = daylightHours(lat, doy);
  const sunshine =
    N * (isRain ? 0.1 + 0.25 * hash(`${cell}:s:${date}`) : 0.45 + 0.45 * hash(`${cell}:s:${date}`));
  const round = (x: number, d = 1) => Math.round(x * 10 ** d) / 10 ** d;
  return {
    date,
    tmaxC: round(tmax),
    tminC: round(tmin),
    rhMaxPct: round(rhMax, 0),
    rhMinPct: round(rhMin, 0),
    rhMeanPct: round((rhMax + rhMin) / 2, 0),
    windMs: round(1.5 + 3 * hash(`${cell}:w:${date}`)),
    windHeightM: 10,
    sunshineH: round(sunshine),
    solarMJ: null,
    precipMm: isRain ? round(1 + 22 * hash(`${cell}:p:${date}`) ** 2) : 0,
    isForecast: date > today,
  };
}
