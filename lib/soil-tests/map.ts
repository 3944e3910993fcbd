// Row → DTO for soil tests; the reading comes from the pure module (lib/agronomy/soil-test.ts).
import type { Selectable } from "kysely";

import type { Database } from "@/db/schema";
import { readSoilTest, type SoilTestValues } from "@/lib/agronomy/soil-test";

import type { SoilTestDto } from "./dto";

type Row = Selectable<Database["soil_tests"]> & {
  zone_name: string | null;
  recorded_by_name: string | null;
};

export function valuesOf(row: Selectable<Database["soil_tests"]>): SoilTestValues {
  return {
    extractant: row.extractant,
    depthIn: Number(row.depth_in),
    ph: row.ph,
    bufferPh: row.buffer_ph,
    bufferMethod: row.buffer_method,
    labLimeLbPer1000: row.lab_lime_lb_per_1000,
    labPhosphorusNeeded: row.lab_p_needed,
    ppm: { p: row.p_ppm, k: row.k_ppm, ca: row.ca_ppm, mg: row.mg_ppm, s: row.s_ppm },
  };
}

export function toSoilTestDto(row: Row): SoilTestDto {
  const values = valuesOf(row);
  return {
    id: row.id,
    propertyId: row.property_id,
    zone: row.zone_id ? { id: row.zone_id, name: row.zone_name ?? "" } : null,
    sampledOn: row.sampled_on,
    lab: row.lab,
    sampleDepthIn: values.depthIn,
    extractant: row.extractant,
    ph: row.ph,
    bufferPh: row.buffer_ph,
    bufferMethod: row.buffer_method,
    organicMatterPct: row.organic_matter_pct,
    ppm: values.ppm,
    labLimeLbPer1000: row.lab_lime_lb_per_1000,
    labPhosphorusNeeded: row.lab_p_needed,
    notes: row.notes,
    recordedBy: row.recorded_by_name,
    reading: readSoilTest(values),
  };
}
