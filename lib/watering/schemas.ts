// A watering entry: a depth in inches, or a run time with the system's precipitation rate
// (zod/mini: shared by the route and the watering form, whose bundle stays small).
import { z } from "zod/mini";

import { correctionReasonField } from "@/lib/audit/correction";
import { addDays, isIsoDate, todayIn } from "@/lib/dates";

/** How far back a watering may be logged: a year (the water balance reads two weeks). */
export const WATERING_BACK_DAYS = 365;

export const wateringSchema = z
  .strictObject({
    id: z.uuid(),
    zoneId: z.nullable(z.uuid()),
    // Seen from this device's clock (a day of slack for time zones); the server checks the
    // property's own day (lib/watering/mutations.ts).
    wateredOn: z.string().check(
      z.refine(isIsoDate, "Use a date like 2026-06-15."),
      z.refine(
        (d) => !isIsoDate(d) || d <= addDays(todayIn("UTC"), 1),
        "Date watered: not in the future.",
      ),
      z.refine(
        (d) => !isIsoDate(d) || d >= addDays(todayIn("UTC"), -WATERING_BACK_DAYS - 1),
        "Date watered: within the last year.",
      ),
    ),
    depthIn: z.nullable(
      z
        .number("Enter the depth as a number.")
        .check(
          z.positive("Depth: above 0 in."),
          z.lte(10, "Depth: at most 10 in of water at once; check the number."),
        ),
    ),
    runMinutes: z.nullable(
      z
        .number("Enter the run time as a number.")
        .check(z.positive("Run time must be above 0."), z.lte(1440)),
    ),
    precipitationRateInPerHour: z.nullable(
      z
        .number("Enter the rate as a number.")
        .check(z.positive("The rate must be above 0."), z.lte(10)),
    ),
    notes: z.string().check(z.trim(), z.maxLength(1000)),
    /** The visit it is recorded on (staff), if any. */
    visitId: z.optional(z.nullable(z.uuid("A visit id must be a UUID."))),
    /** Why, when it changes a finished visit (a correction): required then. */
    correctionReason: correctionReasonField,
  })
  .check(
    z.superRefine((w, ctx) => {
      const byRun = w.runMinutes !== null || w.precipitationRateInPerHour !== null;
      if (w.depthIn === null && !byRun)
        ctx.addIssue({
          code: "custom",
          path: ["depthIn"],
          message: "Give the depth, or the run time and the precipitation rate.",
        });
      if (
        w.depthIn === null &&
        byRun &&
        (w.runMinutes === null || w.precipitationRateInPerHour === null)
      )
        ctx.addIssue({
          code: "custom",
          path: [w.runMinutes === null ? "runMinutes" : "precipitationRateInPerHour"],
          message: "Give both the run time and the precipitation rate.",
        });
    }),
  );
export type WateringInput = z.infer<typeof wateringSchema>;

export const wateringIdParams = z.object({ wateringId: z.uuid() });
