// Application input, shared by the route and the form.
import { z } from "zod";

import { RATE_UNITS } from "./units";

export const applicationSchema = z
  .object({
    id: z.uuid("An application needs its id."),
    zoneId: z.uuid("Choose the zone."),
    productId: z.uuid("Choose a product."),
    rateAmount: z
      .number("Enter the rate.")
      .positive("The rate must be above 0.")
      .max(100_000, "That rate is implausibly high; check the unit."),
    rateUnit: z.enum(RATE_UNITS),
    appliedAt: z.iso.datetime({ offset: true, error: "Use a date and time." }).optional(),
    windMph: z.number().min(0).max(150).nullable(),
    temperatureF: z.number().min(-60).max(140).nullable(),
    isEstablishing: z.boolean(),
    applicatorName: z.string().trim().max(200),
    applicatorLicence: z.string().trim().max(80),
    overrideReason: z.string().trim().max(1000).nullable(),
  })
  .strict();
export type ApplicationInput = z.infer<typeof applicationSchema>;
