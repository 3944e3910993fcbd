// A watering entry: a depth in inches, or a run time with the system's precipitation rate.
import { z } from "zod";

import { isIsoDate } from "@/lib/dates";

export const wateringSchema = z
  .object({
    id: z.uuid(),
    zoneId: z.uuid().nullable(),
    wateredOn: z.string().refine(isIsoDate, "Use a date like 2026-06-15."),
    depthIn: z
      .number()
      .positive("Depth must be above 0.")
      .max(10, "More than 10 in of water? Check the number.")
      .nullable(),
    runMinutes: z.number().positive("Run time must be above 0.").max(1440).nullable(),
    precipitationRateInPerHour: z.number().positive("The rate must be above 0.").max(10).nullable(),
    notes: z.string().trim().max(1000),
  })
  .strict()
  .superRefine((w, ctx) => {
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
  });
export type WateringInput = z.infer<typeof wateringSchema>;
