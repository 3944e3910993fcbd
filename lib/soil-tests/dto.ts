// What a soil test looks like to the screens: the lab's values and their reading.
import type { BufferMethod, SoilExtractant, SoilTestReading } from "@/lib/agronomy/soil-test";

export interface SoilTestDto {
  id: string;
  propertyId: string;
  zone: { id: string; name: string } | null;
  sampledOn: string;
  lab: string;
  sampleDepthIn: number;
  extractant: SoilExtractant;
  ph: number | null;
  bufferPh: number | null;
  bufferMethod: BufferMethod | null;
  organicMatterPct: number | null;
  ppm: {
    p: number | null;
    k: number | null;
    ca: number | null;
    mg: number | null;
    s: number | null;
  };
  labLimeLbPer1000: number | null;
  labPhosphorusNeeded: boolean | null;
  notes: string;
  recordedBy: string | null;
  reading: SoilTestReading;
}

export interface SoilTestImportDto {
  /** Rows read from the file (after the header). */
  rows: number;
  added: number;
  /** Rows that were recorded already (same lab, date and zone). */
  alreadyRecorded: number;
  preview: boolean;
}
