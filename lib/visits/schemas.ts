// Input schemas for visits and zone checks, shared by the route handlers and the forms (zod/mini:
// the forms' bundles stay small; the server parses the same schemas).
import { z } from "zod/mini";

import { correctionReasonField } from "@/lib/audit/correction";
import { addDays, isIsoDate, todayIn } from "@/lib/dates";

import { ZONE_CHECK_BOUNDS } from "./zone-check-bounds";
import { zoneCheckFields, type ZoneCheckRequest } from "./zone-check-fields";
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
  "soil_sampling",
  "liming",
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

/** How far ahead a visit may be scheduled: about 18 months (548 days). */
export const SCHEDULE_AHEAD_DAYS = 548;
/** The most stops one technician's day may number. */
export const MAX_STOP_NUMBER = 200;
/** Visit notes: the column's limit (characters); zone-check notes have the same. */
export const VISIT_NOTES_MAX = ZONE_CHECK_BOUNDS.notesMax;

/**
 * The window a visit date may fall in, seen from this device's clock: from yesterday (a time zone
 * west of here may still be on it) to 18 months ahead. The server checks the exact day in the
 * company's time zone (lib/visits/mutations.ts).
 */
const scheduleDate = isoDate.check(
  z.refine(
    (d) => !isIsoDate(d) || d >= addDays(todayIn("UTC"), -1),
    "Date: a visit is scheduled for today or a later day, not in the past.",
  ),
  z.refine(
    (d) => !isIsoDate(d) || d <= addDays(todayIn("UTC"), SCHEDULE_AHEAD_DAYS + 1),
    "Date: at most 18 months ahead.",
  ),
);

export const scheduleVisitSchema = z.strictObject({
  id: z.optional(z.uuid("A visit id must be a UUID.")),
  propertyId: z.uuid("Choose a property."),
  scheduledFor: scheduleDate,
  technicianId: z.nullable(z.uuid("Choose a technician.")),
  plannedService: plannedServiceSchema,
  /** Omitted: not numbered (0), listed after the numbered stops. */
  stopOrder: z._default(
    z
      .int("Stop number: a whole number, 1 or more.")
      .check(
        z.gte(1, "Stop number: 1 or more (the day's first stop is 1)."),
        z.lte(MAX_STOP_NUMBER, `Stop number: at most ${MAX_STOP_NUMBER} stops in a day.`),
      ),
    0,
  ),
  notes: z._default(
    z
      .string()
      .check(z.trim(), z.maxLength(VISIT_NOTES_MAX, "Note: at most 4,000 characters; shorten it.")),
    "",
  ),
  /** The manager saw the warning that the property already has a visit that day, and goes ahead. */
  confirmSameDay: z._default(z.boolean(), false),
  /** The manager saw the no-fertilizer window warning for a round with N or P, and goes ahead. */
  confirmBlackout: z._default(z.boolean(), false),
});
type ScheduleVisitParsed = z.infer<typeof scheduleVisitSchema>;
/** What scheduleVisit takes: the parsed body; the confirmations default to false. */
export type ScheduleVisitInput = Omit<ScheduleVisitParsed, "confirmSameDay" | "confirmBlackout"> &
  Partial<Pick<ScheduleVisitParsed, "confirmSameDay" | "confirmBlackout">>;

export const startVisitSchema = z
  .strictObject({
    latitude: z._default(z.nullable(z.number().check(z.gte(-90), z.lte(90))), null),
    longitude: z._default(z.nullable(z.number().check(z.gte(-180), z.lte(180))), null),
    /** When the technician tapped Start on the device (a start queued offline arrives later). */
    startedAt: z.optional(z.iso.datetime({ offset: true, error: "Use a date and time." })),
  })
  .check(
    z.refine((v) => (v.latitude === null) === (v.longitude === null), {
      message: "Send both latitude and longitude, or neither.",
      path: ["latitude"],
    }),
  );

const wholeCheck = z.superRefine((check: ZoneCheckRequest, ctx) => {
  for (const [field, message] of Object.entries({
    ...zoneCheckCompleteness(check),
    ...mowingConsistency(check),
  }))
    ctx.addIssue({ code: "custom", path: [field], message });
});

export const zoneCheckSchema = zoneCheckFields.check(wholeCheck);

/** The PUT's body: the check, and on a finished visit the reason for the correction. */
export const zoneCheckBodySchema = z
  .extend(zoneCheckFields, { correctionReason: correctionReasonField })
  .check(wholeCheck);
export type { ZoneCheckInput, ZoneCheckRequest } from "./zone-check-fields";

/** Finishing takes no input: notes belong to the zone checks, the office note to the visit. */
export const finishVisitSchema = z.strictObject({});
