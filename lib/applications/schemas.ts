// Application input, shared by the route and the form (zod/mini: the form's bundle stays small).
import { z } from "zod/mini";

import { correctionReasonField } from "@/lib/audit/correction";

import { OVERRIDE_CATEGORIES, RATE_UNITS } from "./units";

export const applicationSchema = z.strictObject({
  id: z.uuid("An application needs its id."),
  zoneId: z.uuid("Choose the zone."),
  productId: z.uuid("Choose a product."),
  rateAmount: z
    .number("Enter the rate.")
    .check(
      z.positive("The rate must be above 0."),
      z.lte(100_000, "That rate is implausibly high; check the unit."),
    ),
  rateUnit: z.enum(RATE_UNITS),
  appliedAt: z.optional(z.iso.datetime({ offset: true, error: "Use a date and time." })),
  windMph: z.nullable(z.number().check(z.gte(0), z.lte(150))),
  temperatureF: z.nullable(z.number().check(z.gte(-60), z.lte(140))),
  /** First establishment of turf (seeding or sodding). */
  isEstablishing: z.boolean(),
  /** Re-establishment or repair of a turf area (absent: no). */
  isRepairing: z.optional(z.boolean()),
  applicatorName: z.string().check(z.trim(), z.maxLength(200)),
  applicatorLicence: z.string().check(z.trim(), z.maxLength(80)),
  overrideReason: z.nullable(z.string().check(z.trim(), z.maxLength(1000))),
  overrideCategory: z.optional(
    z.nullable(z.enum(OVERRIDE_CATEGORIES, "Choose why the override applies.")),
  ),
  /** Why, when the visit is finished (a correction): required then (lib/audit/correction.ts). */
  correctionReason: correctionReasonField,
});
export type ApplicationInput = z.infer<typeof applicationSchema>;

/** A correction carries the whole record again, under the application's own id (the path's). */
export const applicationCorrectionSchema = z.omit(applicationSchema, { id: true });

export const applicationIdParams = z.object({ applicationId: z.uuid() });
