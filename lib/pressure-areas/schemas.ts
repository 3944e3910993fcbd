// The company's pressure-area settings (managers), shared by the route and the form.
import { z } from "zod/mini";

import { PRESSURE_BOUNDS } from "@/lib/risk/pressure-areas";

const B = PRESSURE_BOUNDS;

export const pressureSettingsSchema = z.strictObject({
  distanceMi: z.number("Distance: a number of miles, e.g. 1 mi.").check(
    z.gte(B.distanceMi.min, `Distance: at least ${B.distanceMi.min} mi.`),
    z.lte(B.distanceMi.max, `Distance: at most ${B.distanceMi.max} mi.`),
    z.refine(
      (v) => Math.abs(v * 100 - Math.round(v * 100)) < 1e-9,
      "Distance: in hundredths of a mile at most, e.g. 0.75 mi.",
    ),
  ),
  days: z
    .number("Days: a whole number of days, e.g. 7.")
    .check(
      z.int("Days: a whole number of days."),
      z.gte(B.days.min, `Days: at least ${B.days.min} day.`),
      z.lte(B.days.max, `Days: at most ${B.days.max} days.`),
    ),
  minProperties: z
    .number("Properties: a whole number, e.g. 3.")
    .check(
      z.int("Properties: a whole number."),
      z.gte(B.minProperties.min, `Properties: at least ${B.minProperties.min}.`),
      z.lte(B.minProperties.max, `Properties: at most ${B.minProperties.max}.`),
    ),
});

export type PressureSettingsInput = z.output<typeof pressureSettingsSchema>;
