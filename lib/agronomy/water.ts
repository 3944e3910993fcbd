// Turf water use and water balance. Crop coefficients for turf against FAO-56 reference ET:
// about 0.8 for cool-season and 0.6 for warm-season turf (University of California guidance
// following Meyer, Gibeault & Youngner 1985 — from memory, the primary text was not read).
import { findGrassSpecies, type GrassSeason } from "@/lib/reference/grass-species";

import { IN_IN_MM } from "./units";

export const TURF_KC: Record<GrassSeason, number> = { cool: 0.8, warm: 0.6 };

/** Kc of a grass species (cool-season when the species is unknown). */
export const turfKcOf = (speciesKey: string) =>
  TURF_KC[findGrassSpecies(speciesKey)?.season ?? "cool"];

/** The area-weighted Kc of a lawn's zones (cool-season for a lawn without area). */
export function lawnKc(zones: { grass_species: string; area_ft2: number | string }[]): number {
  const area = zones.reduce((s, z) => s + Number(z.area_ft2), 0);
  return area
    ? zones.reduce((s, z) => s + turfKcOf(z.grass_species) * Number(z.area_ft2), 0) / area
    : TURF_KC.cool;
}

/** One zone's watering by date (inches): its own entries and those logged for the whole lawn. */
export function zoneWateringByDate(
  waterings: { zone_id: string | null; watered_on: string; depth_in: number | string }[],
  zoneId: string,
): Record<string, number> {
  const byDate: Record<string, number> = {};
  for (const w of waterings)
    if (w.zone_id === null || w.zone_id === zoneId)
      byDate[w.watered_on] = (byDate[w.watered_on] ?? 0) + Number(w.depth_in);
  return byDate;
}

export const mmToIn = (mm: number) => mm / IN_IN_MM;

/** Turf water use, same unit as ETo: Kc × ETo. */
export const turfWaterUse = (et0: number, kc: number) => kc * et0;

/** Depth of an irrigation from its run time and the system's precipitation rate (in/h). */
export const wateringDepthIn = (runMinutes: number, precipitationRateInPerHour: number) =>
  (runMinutes / 60) * precipitationRateInPerHour;

/** Water balance over a window: rain + watering − turf use (same unit; negative = deficit). */
export function waterBalance(days: { rain: number; watering: number; use: number }[]): number {
  return days.reduce((sum, d) => sum + d.rain + d.watering - d.use, 0);
}

/** Trailing moving mean over `window` values (the first window − 1 entries use what exists). */
export function movingMean(values: number[], window: number): number[] {
  return values.map((_, i) => {
    const slice = values.slice(Math.max(0, i - window + 1), i + 1);
    return slice.reduce((a, b) => a + b, 0) / slice.length;
  });
}
