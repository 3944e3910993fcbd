// Nutrients delivered by an application, per 1,000 ft² (the trade's unit), from the product's
// guaranteed analysis (N-P₂O₅-K₂O, % by weight) and the rate. Extension arithmetic: lb of a
// nutrient = lb of product × % / 100; liquids by volume need their density (lb/gal).
import {
  FL_OZ_PER_GAL,
  G_M2_PER_LB_1000FT2,
  KG_HA_PER_LB_1000FT2,
  LB_ACRE_PER_LB_1000FT2,
  OZ_PER_LB,
  THOUSAND_FT2_PER_HA,
  US_GAL_IN_L,
} from "./units";

type ProductForm = "granular" | "liquid" | "soluble";
/** Every rate unit Sward speaks (product by weight or by volume, per area). */
export const RATE_UNITS = [
  "lb/1000ft2",
  "oz/1000ft2",
  "floz/1000ft2",
  "gal/1000ft2",
  "kg/ha",
  "g/m2",
  "lb/acre",
  "L/ha",
] as const;
export type RateUnit = (typeof RATE_UNITS)[number];

export interface ProductAnalysis {
  nPct: number;
  p2o5Pct: number;
  k2oPct: number;
  form: ProductForm;
  densityLbPerGal?: number;
  slowReleaseNPctOfN?: number;
}

export interface Rate {
  amount: number;
  unit: RateUnit;
}

const VOLUME_UNITS: readonly RateUnit[] = ["floz/1000ft2", "gal/1000ft2", "L/ha"];
const isVolumeUnit = (unit: RateUnit) => VOLUME_UNITS.includes(unit);

export class NutrientInputError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "NutrientInputError";
  }
}

function checkProduct(p: ProductAnalysis): void {
  for (const [name, v] of [
    ["N", p.nPct],
    ["P₂O₅", p.p2o5Pct],
    ["K₂O", p.k2oPct],
  ] as const) {
    if (!Number.isFinite(v) || v < 0 || v > 100)
      throw new NutrientInputError(`${name} must be between 0 and 100 %.`);
  }
  if (p.nPct + p.p2o5Pct + p.k2oPct > 100)
    throw new NutrientInputError("The analysis adds up to more than 100 %; check N-P₂O₅-K₂O.");
  if (
    p.slowReleaseNPctOfN !== undefined &&
    (p.slowReleaseNPctOfN < 0 || p.slowReleaseNPctOfN > 100)
  )
    throw new NutrientInputError("The slow-release share is a percentage of N, 0–100 %.");
}

/** Pounds of product per 1,000 ft² for a rate in any supported unit. */
export function productLbPer1000(
  product: Pick<ProductAnalysis, "form" | "densityLbPerGal">,
  rate: Rate,
): number {
  if (!Number.isFinite(rate.amount) || rate.amount < 0)
    throw new NutrientInputError("The rate cannot be negative.");
  const needsDensity = isVolumeUnit(rate.unit);
  // A liquid is measured by volume: a weight oz taken for a fl oz reads 1/16 lb instead of
  // density/128 lb (29 % less N at 11.2 lb/gal).
  if (product.form === "liquid" && !needsDensity)
    throw new NutrientInputError("A liquid is measured by volume: use fl oz, gal or L.");
  const density = product.densityLbPerGal;
  if (needsDensity && (density === undefined || !(density > 0)))
    throw new NutrientInputError("A rate by volume needs the product's density (lb/gal).");
  switch (rate.unit) {
    case "lb/1000ft2":
      return rate.amount;
    case "oz/1000ft2":
      return rate.amount / OZ_PER_LB;
    case "kg/ha":
      return rate.amount / KG_HA_PER_LB_1000FT2;
    case "g/m2":
      return rate.amount / G_M2_PER_LB_1000FT2;
    case "lb/acre":
      return rate.amount / LB_ACRE_PER_LB_1000FT2;
    case "floz/1000ft2":
      return (rate.amount / FL_OZ_PER_GAL) * density!;
    case "gal/1000ft2":
      return rate.amount * density!;
    case "L/ha":
      return (rate.amount / US_GAL_IN_L / THOUSAND_FT2_PER_HA) * density!;
  }
}

/** lb N, P₂O₅, K₂O and water-soluble N per 1,000 ft². */
export function nutrientsPer1000(
  product: ProductAnalysis,
  rate: Rate,
): { nLb: number; p2o5Lb: number; k2oLb: number; wsnLb: number } {
  checkProduct(product);
  const lb = productLbPer1000(product, rate);
  const nLb = (lb * product.nPct) / 100;
  return {
    nLb,
    p2o5Lb: (lb * product.p2o5Pct) / 100,
    k2oLb: (lb * product.k2oPct) / 100,
    wsnLb: nLb * (1 - (product.slowReleaseNPctOfN ?? 0) / 100),
  };
}

/** The rate that delivers a target lb N per 1,000 ft²: lb for dry products, fl oz for liquids. */
export function rateForNitrogen(product: ProductAnalysis, targetNLb: number): Rate {
  checkProduct(product);
  if (product.nPct <= 0) throw new NutrientInputError("This product contains no nitrogen.");
  if (!(targetNLb >= 0)) throw new NutrientInputError("The nitrogen target cannot be negative.");
  const lb = targetNLb / (product.nPct / 100);
  if (product.form === "liquid") {
    if (!(product.densityLbPerGal && product.densityLbPerGal > 0))
      throw new NutrientInputError("A liquid needs its density (lb/gal).");
    return { amount: (lb / product.densityLbPerGal) * FL_OZ_PER_GAL, unit: "floz/1000ft2" };
  }
  return { amount: lb, unit: "lb/1000ft2" };
}

/**
 * The rate proposed for a target lb N, never above the label's maximum per application
 * (lb of product per 1,000 ft²; null when the catalog has none): capped, it says so.
 */
export function proposeRateForNitrogen(
  product: ProductAnalysis,
  targetNLb: number,
  labelMaxLbPer1000: number | null,
): { rate: Rate; cappedByLabel: boolean } {
  const rate = rateForNitrogen(product, targetNLb);
  const lb = productLbPer1000(product, rate);
  if (labelMaxLbPer1000 === null || lb <= labelMaxLbPer1000) return { rate, cappedByLabel: false };
  return {
    rate: { amount: (rate.amount * labelMaxLbPer1000) / lb, unit: rate.unit },
    cappedByLabel: true,
  };
}

/** What to load for a zone: total product (lb, and gallons for liquids). */
export function productForArea(
  product: ProductAnalysis,
  rate: Rate,
  areaFt2: number,
): { lb: number; gal: number | null } {
  const lb = (productLbPer1000(product, rate) * areaFt2) / 1000;
  return {
    lb,
    gal: product.densityLbPerGal && product.form === "liquid" ? lb / product.densityLbPerGal : null,
  };
}
