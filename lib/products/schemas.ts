// Product catalogue input, shared by the route and the manager's form (zod/mini: the form's bundle
// stays small; the server parses the same schema).
import { z } from "zod/mini";

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
  })
  .check(
    z.superRefine((p, ctx) => {
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
    }),
  );
export type ProductInput = z.infer<typeof productSchema>;
