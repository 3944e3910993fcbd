// The fields of a zone check and their one-field rules (zod/mini, as every domain schema). The
// rules across fields (what a done or skipped check needs) live in zone-check-rules.ts, free of zod
// for the technician's page; schemas.ts joins both into zoneCheckSchema. Kept apart so the rules
// can name the input's type without importing schemas.ts (which imports them): no import cycle.
import { z } from "zod/mini";

import { symptomKeys } from "@/lib/reference/symptoms";

import { PROBE_READING_MESSAGE, ZONE_CHECK_BOUNDS } from "./zone-check-bounds";

const B = ZONE_CHECK_BOUNDS;

const rating = z.nullable(
  z
    .int("Whole numbers only.")
    .check(z.gte(1, "1 is the lowest rating."), z.lte(9, "9 is the highest rating.")),
);
const percentBy5 = z.nullable(
  z.int().check(
    z.gte(0, "Cannot be below 0 %."),
    z.lte(100, "Cannot be above 100 %."),
    z.refine((v) => v % 5 === 0, "Use steps of 5 %."),
  ),
);
const observedSymptomSchema = z.strictObject({
  key: z.enum(symptomKeys, "Pick a symptom from the list."),
  severity: z.union([z.literal(1), z.literal(2), z.literal(3)], "Severity is 1, 2 or 3."),
  extentPct: z.int().check(
    z.gte(0),
    z.lte(100),
    z.refine((v) => v % 5 === 0, "Use steps of 5 %."),
  ),
});

export const zoneCheckFields = z.strictObject({
  zoneId: z.uuid("A zone check needs its zone."),
  /** The version this edit is based on; 0 for a check not yet saved. */
  baseVersion: z.int().check(z.gte(0)),
  status: z.enum(["draft", "done", "skipped"]),
  quality: rating,
  color: rating,
  density: rating,
  uniformity: rating,
  barePct: percentBy5,
  weedsPct: percentBy5,
  thatchIn: z.nullable(
    z
      .number()
      .check(
        z.gte(0, "Thatch cannot be negative."),
        z.lte(6, "More than 6 in of thatch? Check the reading."),
        z.multipleOf(0.05),
      ),
  ),
  soilMoisture: z.nullable(z.enum(["dry", "moist", "wet"])),
  soilMoisturePct: z.nullable(
    z
      .number("Soil moisture probe reading: enter a number, in %.")
      .check(
        z.gte(B.soilMoisturePct.min, PROBE_READING_MESSAGE),
        z.lte(B.soilMoisturePct.max, PROBE_READING_MESSAGE),
      ),
  ),
  heightOfCutIn: z.nullable(
    z
      .number("Height of cut: enter a number, in inches.")
      .check(
        z.gte(
          B.heightOfCutIn.min,
          `Height of cut: at least ${B.heightOfCutIn.min} in (lawns are cut at 0.5–4 in); check the reading.`,
        ),
        z.lte(
          B.heightOfCutIn.max,
          `Height of cut: at most ${B.heightOfCutIn.max} in (lawns are cut at 0.5–4 in); check the reading.`,
        ),
        z.multipleOf(0.05, "Height of cut: use steps of 0.05 in."),
      ),
  ),
  /**
   * Mowed at this visit (true), not mowed today (false), or not recorded (null). Optional in a
   * request: a form older than the field (a page left open, a draft on a phone) sends none, and the
   * stored value is kept (saveZoneCheck).
   */
  mowedToday: z.optional(z.nullable(z.boolean("Say whether the zone was mowed today."))),
  /** Grass height before mowing, when mowed at this visit: the one-third rule reads it. */
  heightBeforeMowingIn: z.optional(
    z.nullable(
      z
        .number("Enter the height before mowing as a number.")
        .check(
          z.gte(
            B.heightBeforeMowingIn.min,
            `Height before mowing: at least ${B.heightBeforeMowingIn.min} in; check the reading.`,
          ),
          z.lte(
            B.heightBeforeMowingIn.max,
            `Height before mowing: at most ${B.heightBeforeMowingIn.max} in; check the reading.`,
          ),
          z.multipleOf(0.05, "Height before mowing: use steps of 0.05 in."),
        ),
    ),
  ),
  mowingDirection: z.nullable(z.enum(["same", "changed", "unknown"])),
  isMatted: z.boolean(),
  isScalped: z.boolean(),
  hasTornTips: z.boolean(),
  hasClumpedClippings: z.boolean(),
  symptoms: z.array(observedSymptomSchema).check(
    z.maxLength(30),
    z.refine((list) => new Set(list.map((s) => s.key)).size === list.length, "Each symptom once."),
  ),
  notes: z
    .string()
    .check(z.maxLength(B.notesMax, "Zone notes: at most 4,000 characters; shorten them.")),
  skipReason: z.nullable(z.enum(["no_access", "construction", "dog_in_yard", "other"])),
  skipNote: z.string().check(z.maxLength(1000, "Keep the reason under 1,000 characters.")),
});

/** A zone check as a request carries it (the cross-field rules apply on top). */
export type ZoneCheckRequest = z.infer<typeof zoneCheckFields>;

/** A zone check as a form holds it and the server stores it: every field present. */
export type ZoneCheckInput = Omit<ZoneCheckRequest, "mowedToday" | "heightBeforeMowingIn"> & {
  mowedToday: boolean | null;
  heightBeforeMowingIn: number | null;
};
