// A soil test as typed on the property page or read from a lab's CSV file (zod/mini: shared by the
// route, the CSV import and the form). Bounds are a lab report's plausible ranges; a value outside
// them is refused in words, never clamped. Numbers are kept to one decimal place.
import { z } from "zod/mini";

import { BUFFER_METHODS, SOIL_EXTRACTANTS } from "@/lib/agronomy/soil-test";
import { addDays, isIsoDate, todayIn } from "@/lib/dates";

/** How far back a soil test may be dated: ten years (older ones count for nothing). */
export const SOIL_TEST_BACK_DAYS = 3653;
/** The most rows one CSV import reads. */
export const SOIL_TEST_IMPORT_MAX_ROWS = 500;
/** The longest CSV text one import takes (characters), well above 500 rows of a lab file. */
export const SOIL_TEST_IMPORT_MAX_CHARS = 256 * 1024;

const bounded = (label: string, unit: string, min: number, max: number) =>
  z.nullable(
    z
      .number(`${label}: enter a number${unit ? ` in ${unit}` : ""}.`)
      .check(
        z.gte(min, `${label}: at least ${min.toLocaleString("en-US")}${unit ? ` ${unit}` : ""}.`),
        z.lte(max, `${label}: at most ${max.toLocaleString("en-US")}${unit ? ` ${unit}` : ""}.`),
      ),
  );
const ppm = (element: string) => bounded(element, "ppm", 0, 20_000);

const PPM_FIELDS = ["pPpm", "kPpm", "caPpm", "mgPpm", "sPpm"] as const;

export const soilTestSchema = z
  .strictObject({
    id: z.uuid("A soil test id must be a UUID."),
    zoneId: z.nullable(z.uuid("Choose a zone of this property, or the whole property.")),
    // Seen from this device's clock (a day of slack for time zones); the server checks the
    // property's own day (lib/soil-tests/mutations.ts).
    sampledOn: z.string().check(
      z.refine(isIsoDate, "Date sampled: a date like 2026-04-15."),
      z.refine(
        (d) => !isIsoDate(d) || d <= addDays(todayIn("UTC"), 1),
        "Date sampled: not in the future.",
      ),
      z.refine(
        (d) => !isIsoDate(d) || d >= addDays(todayIn("UTC"), -SOIL_TEST_BACK_DAYS - 1),
        "Date sampled: within the last ten years.",
      ),
    ),
    lab: z
      .string()
      .check(
        z.trim(),
        z.minLength(1, "Lab: the laboratory's name is required."),
        z.maxLength(120, "Lab: at most 120 characters."),
      ),
    sampleDepthIn: z
      .number("Sample depth: enter a number in inches.")
      .check(z.gte(1, "Sample depth: at least 1 in."), z.lte(12, "Sample depth: at most 12 in.")),
    extractant: z.enum(SOIL_EXTRACTANTS, "Extractant: choose the lab's extraction method."),
    ph: bounded("Soil pH", "", 3, 10),
    bufferPh: bounded("Buffer pH", "", 4, 8),
    bufferMethod: z.nullable(z.enum(BUFFER_METHODS, "Buffer: choose the lab's buffer method.")),
    organicMatterPct: bounded("Organic matter", "%", 0, 100),
    pPpm: ppm("Phosphorus (P)"),
    kPpm: ppm("Potassium (K)"),
    caPpm: ppm("Calcium (Ca)"),
    mgPpm: ppm("Magnesium (Mg)"),
    sPpm: ppm("Sulfur (S)"),
    labLimeLbPer1000: bounded("Lab's lime recommendation", "lb per 1,000 ft²", 0, 500),
    labPhosphorusNeeded: z.nullable(z.boolean("Lab's word on phosphorus: choose yes or no.")),
    notes: z.string().check(z.trim(), z.maxLength(1000, "Notes: at most 1,000 characters.")),
  })
  .check(
    z.superRefine((t, ctx) => {
      if (t.bufferPh !== null && t.bufferMethod === null)
        ctx.addIssue({
          code: "custom",
          path: ["bufferMethod"],
          message: "Buffer: say which buffer the lab used for the buffer pH.",
        });
      if (t.ph === null && PPM_FIELDS.every((f) => t[f] === null))
        ctx.addIssue({
          code: "custom",
          path: ["ph"],
          message: "Enter the soil pH or at least one nutrient from the lab report.",
        });
    }),
  );
export type SoilTestInput = z.infer<typeof soilTestSchema>;

export const soilTestImportSchema = z.strictObject({
  csv: z
    .string()
    .check(
      z.minLength(1, "The file is empty."),
      z.maxLength(SOIL_TEST_IMPORT_MAX_CHARS, "The file is too long for one import: split it."),
    ),
  /** Check every row and report what would be added, without saving. */
  preview: z.optional(z.boolean()),
});

export const soilTestIdParams = z.object({ soilTestId: z.uuid() });
