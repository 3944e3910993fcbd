// Row → DTO mapping for properties and zones (zones are shared by property and visit reads).
import type { Property, Zone } from "@/db/schema";
import { findGrassSpecies } from "@/lib/reference/grass-species";

import type { PropertySummaryDto, ZoneDto } from "./dto";

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

/** A property with its technician, rule set and live zones' count and area (lib/properties/queries.ts). */
export type PropertySummaryRow = Pick<
  Property,
  | "id"
  | "name"
  | "street"
  | "city"
  | "region"
  | "postal_code"
  | "latitude"
  | "longitude"
  | "time_zone"
  | "technician_id"
  | "rule_set_id"
  | "archived_at"
> & {
  technician_name: string | null;
  rule_set_name: string | null;
  zone_count: number | string | null;
  lawn_area_ft2: number | string | null;
};

export function toPropertySummaryDto(row: PropertySummaryRow): PropertySummaryDto {
  return {
    id: row.id,
    name: row.name,
    address: {
      street: row.street,
      city: row.city,
      region: row.region,
      postalCode: row.postal_code,
    },
    location: { latitude: row.latitude, longitude: row.longitude },
    timeZone: row.time_zone,
    technician: row.technician_id
      ? { id: row.technician_id, name: row.technician_name ?? "" }
      : null,
    ruleSet: row.rule_set_id ? { id: row.rule_set_id, name: row.rule_set_name ?? "" } : null,
    zoneCount: Number(row.zone_count ?? 0),
    lawnAreaFt2: Number(row.lawn_area_ft2 ?? 0),
    isArchived: row.archived_at !== null,
  };
}
