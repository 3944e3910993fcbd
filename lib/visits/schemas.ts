// Input schemas for visits and zone checks, shared by the route handlers and the forms (zod/mini:
// the forms' bundles stay small; the server parses the same schemas).
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

import { zoneCheckFields } from "./zone-check-fields";
import { mowingConsistency, zoneCheckCompleteness } from "./zone-check-rules";

export { zoneCheckFields } from "./zone-check-fields";
export { emptyZoneCheck } from "./zone-check-rules";

const isoDate = z.string().check(z.refine(isIsoDate, "Use a date like 2026-06-15."));

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

export const listVisitsQuery = z.strictObject({
  date: z.optional(isoDate),
  from: z.optional(isoDate),
  to: z.optional(isoDate),
  technicianId: z.optional(z.uuid()),
  propertyId: z.optional(z.uuid()),
  status: z.optional(z.enum(["scheduled", "in_progress", "completed", "cancelled"])),
});

export const scheduleVisitSchema = z.strictObject({
  id: z.optional(z.uuid("A visit id must be a UUID.")),
  propertyId: z.uuid("Choose a property."),
  scheduledFor: isoDate,
  technicianId: z.nullable(z.uuid("Choose a technician.")),
  plannedService: plannedServiceSchema,
  stopOrder: z._default(z.int().check(z.gte(0), z.lte(1000)), 0),
  notes: z._default(
    z.string().check(z.trim(), z.maxLength(4000, "Keep notes under 4,000 characters.")),
    "",
  ),
});
export type ScheduleVisitInput = z.infer<typeof scheduleVisitSchema>;

export const startVisitSchema = z
  .strictObject({
    latitude: z._default(z.nullable(z.number().check(z.gte(-90), z.lte(90))), null),
    longitude: z._default(z.nullable(z.number().check(z.gte(-180), z.lte(180))), null),
  })
  .check(
    z.refine((v) => (v.latitude === null) === (v.longitude === null), {
      message: "Send both latitude and longitude, or neither.",
      path: ["latitude"],
    }),
  );

export const zoneCheckSchema = zoneCheckFields.check(
  z.superRefine((check, ctx) => {
    for (const [field, message] of Object.entries({
      ...zoneCheckCompleteness(check),
      ...mowingConsistency(check),
    }))
      ctx.addIssue({ code: "custom", path: [field], message });
  }),
);
export type { ZoneCheckInput, ZoneCheckRequest } from "./zone-check-fields";

/** Finishing takes no input: notes belong to the zone checks, the office note to the visit. */
export const finishVisitSchema = z.strictObject({});
