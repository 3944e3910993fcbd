// Product catalogue input, shared by the route and the manager's form.
import { z } from "zod";

const pct = (label: string) =>
  z
    .number(`${label} is a number.`)
    .min(0, `${label} cannot be below 0 %.`)
    .max(100, `${label} cannot be above 100 %.`);

export const productIdParams = z.object({ productId: z.uuid() });

export const productSchema = z
  .object({
    name: z.string().trim().min(1, "Name the product.").max(160),
    form: z.enum(["granular", "liquid", "soluble"], "Choose the form."),
    nPct: pct("N"),
    p2o5Pct: pct("P₂O₅"),
    k2oPct: pct("K₂O"),
    slowReleasePctOfN: pct("Slow-release share"),
    densityLbPerGal: z
      .number()
      .positive("Density must be above 0.")
      .max(30, "Density above 30 lb/gal? Check the label.")
      .nullable(),
    isPesticide: z.boolean(),
    registrationNumber: z.string().trim().max(60),
    labelCautions: z.string().trim().max(4000),
    reentryGuidance: z.string().trim().max(1000),
  })
  .strict()
  .superRefine((p, ctx) => {
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
  });
export type ProductInput = z.infer<typeof productSchema>;
