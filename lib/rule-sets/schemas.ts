// Rule-set input (managers), shared by the route and the form (zod/mini: the form's bundle stays
// small; the server parses the same schema).
import { z } from "zod/mini";

import { RECORD_FIELD_KEYS } from "@/lib/reference/record-fields";

const monthDay = z
  .string()
  .check(
    z.regex(
      /^(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/,
      "Type month and day as two digits each, e.g. 12-01 for December 1.",
    ),
  );
// [no fertilizer after, nor before], as the statutes word it: both named days are allowed.
const window = z.nullable(
  z.tuple([monthDay, monthDay]).check(z.refine(([a, b]) => a !== b, "The two days must differ.")),
);
const source = z.string().check(z.trim(), z.maxLength(1000));
const limit = z.nullable(
  z
    .number("Enter a number.")
    .check(
      z.positive("A limit must be above 0."),
      z.lte(10, "Above 10 lb per 1,000 ft²? Check the number."),
    ),
);

export const ruleSetIdParams = z.object({ ruleSetId: z.uuid() });

export const ruleSetSchema = z.strictObject({
  name: z.string().check(z.trim(), z.minLength(1, "Name the rule set."), z.maxLength(120)),
  citation: z.string().check(z.trim(), z.maxLength(1000)),
  limitsAreLaw: z.boolean(),
  maxNLbPer1000: limit,
  maxWsnLbPer1000: limit,
  minSlowReleasePct: z.nullable(z.number().check(z.gte(0), z.lte(100))),
  proBlackout: window,
  homeownerBlackout: window,
  phosphorusRule: z.enum(["allowed", "soil_test_or_establishment"]),
  soilTestMaxAgeYears: z.nullable(z.int().check(z.gte(1), z.lte(20))),
  // Absent (an older client): left as they are, or the defaults for a new rule set.
  phosphorusExemptEstablishment: z.optional(z.boolean()),
  phosphorusExemptRepair: z.optional(z.boolean()),
  nLimitsSource: z.optional(source),
  blackoutSource: z.optional(source),
  phosphorusSource: z.optional(source),
  conditionsSource: z.optional(source),
  recordRetentionYears: z.int().check(z.gte(1, "Keep records at least a year."), z.lte(30)),
  recordRequiredFields: z.array(z.enum(RECORD_FIELD_KEYS)).check(
    z.maxLength(RECORD_FIELD_KEYS.length),
    z.refine((a) => new Set(a).size === a.length, "Each field once."),
  ),
  recordFieldsApplyTo: z.enum(["pesticides", "all"]),
});
export type RuleSetInput = z.infer<typeof ruleSetSchema>;
