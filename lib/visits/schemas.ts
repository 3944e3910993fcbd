// Input schemas for visits and zone checks, shared by the route handlers and the forms.
import { z } from "zod";

import { isIsoDate } from "@/lib/dates";

import { zoneCheckFields } from "./zone-check-fields";
import { zoneCheckCompleteness } from "./zone-check-rules";

export { zoneCheckFields } from "./zone-check-fields";
export { emptyZoneCheck } from "./zone-check-rules";

const isoDate = z.string().refine(isIsoDate, "Use a date like 2026-06-15.");

const plannedServiceSchema = z.enum([
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

export const zoneCheckSchema = zoneCheckFields.superRefine((check, ctx) => {
  for (const [field, message] of Object.entries(zoneCheckCompleteness(check)))
    ctx.addIssue({ code: "custom", path: [field], message });
});
export type ZoneCheckInput = z.infer<typeof zoneCheckSchema>;

/** Finishing takes no input: notes belong to the zone checks, the office note to the visit. */
export const finishVisitSchema = z.object({}).strict();
