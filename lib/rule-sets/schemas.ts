// Rule-set input (managers), shared by the route and the form.
import { z } from "zod";

import { RECORD_FIELD_KEYS } from "@/lib/reference/record-fields";

const monthDay = z
  .string()
  .regex(/^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/, "Use month-day, e.g. 12-01.");
const window = z.tuple([monthDay, monthDay]).nullable();
const limit = z
  .number()
  .positive("A limit must be above 0.")
  .max(10, "Above 10 lb per 1,000 ft²? Check the number.")
  .nullable();

export const ruleSetIdParams = z.object({ ruleSetId: z.uuid() });

export const ruleSetSchema = z
  .object({
    name: z.string().trim().min(1, "Name the rule set.").max(120),
    citation: z.string().trim().max(1000),
    limitsAreLaw: z.boolean(),
    maxNLbPer1000: limit,
    maxWsnLbPer1000: limit,
    minSlowReleasePct: z.number().min(0).max(100).nullable(),
    proBlackout: window,
    homeownerBlackout: window,
    phosphorusRule: z.enum(["allowed", "soil_test_or_establishment"]),
    soilTestMaxAgeYears: z.number().int().min(1).max(20).nullable(),
    recordRetentionYears: z.number().int().min(1, "Keep records at least a year.").max(30),
    recordRequiredFields: z
      .array(z.enum(RECORD_FIELD_KEYS))
      .max(RECORD_FIELD_KEYS.length)
      .refine((a) => new Set(a).size === a.length, "Each field once."),
    recordFieldsApplyTo: z.enum(["pesticides", "all"]),
  })
  .strict();
export type RuleSetInput = z.infer<typeof ruleSetSchema>;
