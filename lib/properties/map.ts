// Row → DTO mapping for zones, shared by property and visit reads.
import type { Zone } from "@/db/schema";
import { findGrassSpecies } from "@/lib/reference/grass-species";

import type { ZoneDto } from "./dto";

export type ZoneRow = Pick<
  Zone,
  "id" | "name" | "area_ft2" | "grass_species" | "sun_exposure" | "is_irrigated" | "slope"
>;

export const ZONE_COLUMNS = [
  "id",
  "name",
  "area_ft2",
  "grass_species",
  "sun_exposure",
  "is_irrigated",
  "slope",
] as const;

export function toZoneDto(z: ZoneRow): ZoneDto {
  const species = findGrassSpecies(z.grass_species);
  return {
    id: z.id,
    name: z.name,
    areaFt2: Number(z.area_ft2),
    grassSpecies: {
      key: z.grass_species,
      name: species?.name ?? z.grass_species,
      season: species?.season ?? null,
    },
    sunExposure: z.sun_exposure,
    isIrrigated: z.is_irrigated,
    slope: z.slope,
  };
}
