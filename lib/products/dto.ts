// A catalogue product as screens and the nutrient maths use it.
import type { NitrogenRelease, ProductFormValue, RateUnitValue } from "@/db/schema";
import type { PreEmergenceActive } from "@/lib/agronomy/seeding";

export interface ProductDto {
  id: string;
  name: string;
  form: ProductFormValue;
  nPct: number;
  p2o5Pct: number;
  k2oPct: number;
  slowReleasePctOfN: number;
  densityLbPerGal: number | null;
  isPesticide: boolean;
  registrationNumber: string;
  labelCautions: string;
  reentryGuidance: string;
  nRelease: NitrogenRelease;
  labelMaxRate: number | null;
  labelRateUnit: RateUnitValue | null;
  labelMaxYearly: number | null;
  labelMinIntervalDays: number | null;
  /** A pre-emergence herbicide's active ingredient class; null: not one. */
  preEmergenceActive: PreEmergenceActive | null;
  /** The label's days between this pre-emergence and seeding; null: not entered. */
  seedingIntervalDays: number | null;
  /** The grass species of a seed product; null: not seed. */
  seedSpecies: string | null;
  isArchived: boolean;
}

/** The part of a product the nutrient maths need. */
export function analysisOf(p: ProductDto): import("@/lib/agronomy/nutrients").ProductAnalysis {
  return {
    nPct: p.nPct,
    p2o5Pct: p.p2o5Pct,
    k2oPct: p.k2oPct,
    form: p.form,
    densityLbPerGal: p.densityLbPerGal ?? undefined,
    slowReleaseNPctOfN: p.slowReleasePctOfN,
  };
}
