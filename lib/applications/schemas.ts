// Application input, shared by the route and the form.
import { z } from "zod";

export const RATE_UNITS = ["lb/1000ft2", "oz/1000ft2", "floz/1000ft2", "gal/1000ft2", "kg/ha", "g/m2", "lb/acre", "L/ha"] as const;

export const RATE_UNIT_LABEL: Record<(typeof RATE_UNITS)[number], string> = {
  "lb/1000ft2": "lb / 1,000 ft²",
  "oz/1000ft2": "oz / 1,000 ft²",
  "floz/1000ft2": "fl oz / 1,000 ft²",
  "gal/1000ft2": "gal / 1,000 ft²",
  "kg/ha": "kg / ha",
  "g/m2": "g / m²",
  "lb/acre": "lb / acre",
  "L/ha": "L / ha",
};

export const applicationSchema = z
  .object({
    id: z.uuid("An application needs its id."),
    zoneId: z.uuid("Choose the zone."),
    productId: z.uuid("Choose a product."),
    rateAmount: z.number("Enter the rate.").positive("The rate must be above 0.").max(100_000, "That rate is implausibly high; check the unit."),
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
