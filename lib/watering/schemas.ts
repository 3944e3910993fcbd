// A watering entry: a depth in inches, or a run time with the system's precipitation rate
// (zod/mini: shared by the route and the watering form, whose bundle stays small).
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

export const wateringSchema = z
  .strictObject({
    id: z.uuid(),
    zoneId: z.nullable(z.uuid()),
    wateredOn: z.string().check(z.refine(isIsoDate, "Use a date like 2026-06-15.")),
    depthIn: z.nullable(
      z
        .number("Enter the depth as a number.")
        .check(
          z.positive("Depth must be above 0."),
          z.lte(10, "More than 10 in of water? Check the number."),
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
