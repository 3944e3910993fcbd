// The fields of a zone check and their one-field rules (zod). The rules across fields (what a done
// or skipped check needs) live in zone-check-rules.ts, free of zod for the technician's page;
// schemas.ts joins both into zoneCheckSchema. Kept apart so the rules can name the input's type
// without importing schemas.ts (which imports them): no import cycle.
import { z } from "zod";

import { symptomKeys } from "@/lib/reference/symptoms";

const rating = z
  .number()
  .int("Whole numbers only.")
  .min(1, "1 is the lowest rating.")
  .max(9, "9 is the highest rating.")
  .nullable();

const percentBy5 = z
  .number()
  .int()
  .min(0, "Cannot be below 0 %.")
  .max(100, "Cannot be above 100 %.")
  .refine((v) => v % 5 === 0, "Use steps of 5 %.")
  .nullable();

const observedSymptomSchema = z
  .object({
    key: z.enum(symptomKeys, "Pick a symptom from the catalogue."),
    severity: z.union([z.literal(1), z.literal(2), z.literal(3)], "Severity is 1, 2 or 3."),
    extentPct: z
      .number()
      .int()
      .min(0)
      .max(100)
      .refine((v) => v % 5 === 0, "Use steps of 5 %."),
  })
  .strict();

export const zoneCheckFields = z
  .object({
    zoneId: z.uuid("A zone check needs its zone."),
    /** The version this edit is based on; 0 for a check not yet saved. */
    baseVersion: z.number().int().min(0),
    status: z.enum(["draft", "done", "skipped"]),
    quality: rating,
    color: rating,
    density: rating,
    uniformity: rating,
    barePct: percentBy5,
    weedsPct: percentBy5,
    thatchIn: z
      .number()
      .min(0, "Thatch cannot be negative.")
      .max(6, "More than 6 in of thatch? Check the reading.")
      .multipleOf(0.05)
      .nullable(),
    soilMoisture: z.enum(["dry", "moist", "wet"]).nullable(),
    soilMoisturePct: z.number().min(0).max(100).nullable(),
    heightOfCutIn: z
      .number()
      .min(0)
      .max(12, "Height of cut above 12 in? Check the reading.")
      .multipleOf(0.05)
      .nullable(),
    mowingDirection: z.enum(["same", "changed", "unknown"]).nullable(),
    isMatted: z.boolean(),
    isScalped: z.boolean(),
    hasTornTips: z.boolean(),
    hasClumpedClippings: z.boolean(),
    symptoms: z
      .array(observedSymptomSchema)
      .max(30)
      .refine((list) => new Set(list.map((s) => s.key)).size === list.length, "Each symptom once."),
    notes: z.string().max(4000, "Keep notes under 4,000 characters."),
    skipReason: z.enum(["no_access", "construction", "dog_in_yard", "other"]).nullable(),
    skipNote: z.string().max(1000, "Keep the reason under 1,000 characters."),
  })
  .strict();

/** A zone check as a form or a request carries it (the cross-field rules apply on top). */
export type ZoneCheckInput = z.infer<typeof zoneCheckFields>;
