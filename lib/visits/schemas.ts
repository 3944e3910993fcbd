// Input schemas for visits and zone checks, shared by the route handlers and the forms.
import { z } from "zod";

import { isIsoDate } from "@/lib/dates";
import { symptomKeys } from "@/lib/reference/symptoms";

import { zoneCheckCompleteness } from "./zone-check-rules";

export { emptyZoneCheck } from "./zone-check-rules";

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
const isoDate = z.string().refine(isIsoDate, "Use a date like 2026-06-15.");

export const plannedServiceSchema = z.enum([
  "feeding_round",
  "weed_control",
  "insect_control",
  "aeration_overseeding",
  "fall_feeding",
  "inspection",
  "callback",
]);

export const visitIdParams = z.object({ visitId: z.uuid() });
export const zoneCheckParams = z.object({ visitId: z.uuid(), zoneCheckId: z.uuid() });
export const zoneIdParams = z.object({ zoneId: z.uuid() });

export const listVisitsQuery = z
  .object({
    date: isoDate.optional(),
    from: isoDate.optional(),
    to: isoDate.optional(),
    technicianId: z.uuid().optional(),
    propertyId: z.uuid().optional(),
    status: z.enum(["scheduled", "in_progress", "completed", "cancelled"]).optional(),
  })
  .strict();

export const scheduleVisitSchema = z
  .object({
    id: z.uuid("A visit id must be a UUID.").optional(),
    propertyId: z.uuid("Choose a property."),
    scheduledFor: isoDate,
    technicianId: z.uuid("Choose a technician.").nullable(),
    plannedService: plannedServiceSchema,
    stopOrder: z.number().int().min(0).max(1000).default(0),
    notes: z.string().trim().max(4000, "Keep notes under 4,000 characters.").default(""),
  })
  .strict();
export type ScheduleVisitInput = z.infer<typeof scheduleVisitSchema>;

export const startVisitSchema = z
  .object({
    latitude: z.number().min(-90).max(90).nullable().default(null),
    longitude: z.number().min(-180).max(180).nullable().default(null),
  })
  .strict()
  .refine((v) => (v.latitude === null) === (v.longitude === null), {
    message: "Send both latitude and longitude, or neither.",
    path: ["latitude"],
  });

export const observedSymptomSchema = z
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

export const zoneCheckSchema = zoneCheckFields.superRefine((check, ctx) => {
  for (const [field, message] of Object.entries(zoneCheckCompleteness(check)))
    ctx.addIssue({ code: "custom", path: [field], message });
});
export type ZoneCheckInput = z.infer<typeof zoneCheckSchema>;

export const finishVisitSchema = z.object({ notes: z.string().max(4000).optional() }).strict();
