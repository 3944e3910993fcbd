// Product catalogue input, shared by the route and the manager's form (zod/mini: the form's bundle
// stays small; the server parses the same schema).
import { z } from "zod/mini";

import { RATE_UNITS } from "@/lib/agronomy/nutrients";
import { PRE_EMERGENCE_ACTIVES, SEED_SPECIES_KEYS } from "@/lib/agronomy/seeding";

const pct = (label: string) =>
  z
    .number(`Enter ${label} as a number.`)
    .check(
      z.gte(0, `${label} cannot be below 0 %.`),
      z.lte(100, `${label} cannot be above 100 %.`),
    );

export const productIdParams = z.object({ productId: z.uuid() });

export const productSchema = z
  .strictObject({
    name: z.string().check(z.trim(), z.minLength(1, "Name the product."), z.maxLength(160)),
    form: z.enum(["granular", "liquid", "soluble"], "Choose the form."),
    nPct: pct("N"),
    p2o5Pct: pct("P₂O₅"),
    k2oPct: pct("K₂O"),
    slowReleasePctOfN: pct("Slow-release share"),
    densityLbPerGal: z.nullable(
      z
        .number("Enter the density as a number.")
        .check(
          z.positive("Density must be above 0."),
          z.lte(30, "Density above 30 lb/gal? Check the label."),
        ),
    ),
    isPesticide: z.boolean(),
    registrationNumber: z.string().check(z.trim(), z.maxLength(60)),
    labelCautions: z.string().check(z.trim(), z.maxLength(4000)),
    reentryGuidance: z.string().check(z.trim(), z.maxLength(1000)),
    // How the N is released, and so which share the label gives: slow-release N, or for an
    // organic product its water-insoluble N. Optional in the API (absent: unchanged, or "quick").
    nRelease: z.optional(
      z.enum(["quick", "slow_release", "organic"], "Choose how the N is released."),
    ),
    // The label's limits (absent or null: not entered). Rates are in labelRateUnit.
    labelMaxRate: z.optional(
      z.nullable(
        z
          .number("Enter the label's maximum rate as a number.")
          .check(z.positive("The label's maximum must be above 0."), z.lte(100_000)),
      ),
    ),
    labelRateUnit: z.optional(z.nullable(z.enum(RATE_UNITS, "Choose the label's unit."))),
    labelMaxYearly: z.optional(
      z.nullable(
        z
          .number("Enter the label's yearly maximum as a number.")
          .check(z.positive("The yearly maximum must be above 0."), z.lte(1_000_000)),
      ),
    ),
    labelMinIntervalDays: z.optional(
      z.nullable(
        z
          .int("Enter whole days.")
          .check(z.gte(1, "At least 1 day."), z.lte(366, "At most 366 days.")),
      ),
    ),
    // Pre-emergence herbicide and seed (absent: unchanged, or neither).
    preEmergenceActive: z.optional(
      z.nullable(z.enum(PRE_EMERGENCE_ACTIVES, "Choose the pre-emergence active ingredient.")),
    ),
    seedingIntervalDays: z.optional(
      z.nullable(
        z
          .int("Days between this product and seeding: enter whole days.")
          .check(
            z.gte(0, "Days between this product and seeding: 0 or more."),
            z.lte(366, "Days between this product and seeding: at most 366."),
          ),
      ),
    ),
    seedSpecies: z.optional(
      z.nullable(
        z.enum(SEED_SPECIES_KEYS, "Seed species: choose a grass species grown from seed."),
      ),
    ),
  })
  .check(
    z.superRefine((p, ctx) => {
      if ((p.preEmergenceActive ?? null) !== null && (p.seedSpecies ?? null) !== null)
        ctx.addIssue({
          code: "custom",
          path: ["seedSpecies"],
          message: "A product is either seed or a pre-emergence herbicide, not both.",
        });
      if ((p.seedingIntervalDays ?? null) !== null && (p.preEmergenceActive ?? null) === null)
        ctx.addIssue({
          code: "custom",
          path: ["seedingIntervalDays"],
          message: "Days between this product and seeding: only for a pre-emergence herbicide.",
        });
      if (p.preEmergenceActive === "other" && (p.seedingIntervalDays ?? null) === null)
        ctx.addIssue({
          code: "custom",
          path: ["seedingIntervalDays"],
          message:
            "Days between this product and seeding: enter the label's interval (no typical value is known for this active).",
        });
      if ((p.preEmergenceActive ?? null) !== null && !p.isPesticide)
        ctx.addIssue({
          code: "custom",
          path: ["isPesticide"],
          message: "A pre-emergence herbicide is a pesticide: tick “This is a pesticide”.",
        });
      if (p.nPct + p.p2o5Pct + p.k2oPct > 100)
        ctx.addIssue({
          code: "custom",
          path: ["nPct"],
          message: "N + P₂O₅ + K₂O adds up to more than 100 %.",
        });
      if (p.form === "liquid" && p.densityLbPerGal === null)
        ctx.addIssue({
          code: "custom",
          path: ["densityLbPerGal"],
          message: "A liquid needs its density (lb/gal) from the label.",
        });
      if (p.isPesticide && !p.registrationNumber)
        ctx.addIssue({
          code: "custom",
          path: ["registrationNumber"],
          message: "A pesticide needs its registration number.",
        });
      if (p.nRelease && p.nRelease !== "quick" && p.nPct > 0 && p.slowReleasePctOfN === 0)
        ctx.addIssue({
          code: "custom",
          path: ["slowReleasePctOfN"],
          message:
            p.nRelease === "organic"
              ? "Enter the water-insoluble share of N from the label: most of an organic product's N is water-insoluble."
              : "Enter the slow-release share of N from the label.",
        });
      const hasRate = (p.labelMaxRate ?? null) !== null || (p.labelMaxYearly ?? null) !== null;
      const unit = p.labelRateUnit ?? null;
      if (hasRate && unit === null)
        ctx.addIssue({
          code: "custom",
          path: ["labelRateUnit"],
          message: "Choose the unit the label gives its rates in.",
        });
      if (unit !== null) {
        const byVolume = unit === "floz/1000ft2" || unit === "gal/1000ft2" || unit === "L/ha";
        if (p.form === "liquid" && !byVolume)
          ctx.addIssue({
            code: "custom",
            path: ["labelRateUnit"],
            message: "A liquid's label rate is by volume (fl oz, gal or L).",
          });
        if (p.form !== "liquid" && byVolume && p.densityLbPerGal === null)
          ctx.addIssue({
            code: "custom",
            path: ["labelRateUnit"],
            message: "A rate by volume needs the product's density (lb/gal).",
          });
      }
      if (p.labelMaxRate != null && p.labelMaxYearly != null && p.labelMaxYearly < p.labelMaxRate)
        ctx.addIssue({
          code: "custom",
          path: ["labelMaxYearly"],
          message: "The yearly maximum cannot be below the maximum per application.",
        });
      if (p.isPesticide && !p.reentryGuidance)
        ctx.addIssue({
          code: "custom",
          path: ["reentryGuidance"],
          message: "A pesticide label says when people and pets may go back on the turf: enter it.",
        });
      if (p.isPesticide && (p.labelMaxRate ?? null) === null)
        ctx.addIssue({
          code: "custom",
          path: ["labelMaxRate"],
          message: "A pesticide label states its maximum rate per application: enter it.",
        });
    }),
  );
export type ProductInput = z.infer<typeof productSchema>;
