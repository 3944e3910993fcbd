// Product rows ↔ DTOs: input → table columns (shared by the catalogue edits and the seed), row → DTO.
import type { Product } from "@/db/schema";

import type { ProductDto } from "./dto";
import type { ProductInput } from "./schemas";

/** Table columns of a product input; label fields the input leaves out stay as they are. */
export const productColumns = (p: ProductInput) => ({
  ...(p.nRelease !== undefined ? { n_release: p.nRelease } : {}),
  ...(p.labelMaxRate !== undefined ? { label_max_rate: p.labelMaxRate } : {}),
  ...(p.labelRateUnit !== undefined ? { label_rate_unit: p.labelRateUnit } : {}),
  ...(p.labelMaxYearly !== undefined ? { label_max_yearly: p.labelMaxYearly } : {}),
  ...(p.labelMinIntervalDays !== undefined
    ? { label_min_interval_days: p.labelMinIntervalDays }
    : {}),
  ...(p.preEmergenceActive !== undefined ? { pre_emergence_active: p.preEmergenceActive } : {}),
  ...(p.seedingIntervalDays !== undefined ? { seeding_interval_days: p.seedingIntervalDays } : {}),
  ...(p.seedSpecies !== undefined ? { seed_species: p.seedSpecies } : {}),
  name: p.name,
  form: p.form,
  n_pct: p.nPct,
  p2o5_pct: p.p2o5Pct,
  k2o_pct: p.k2oPct,
  slow_release_pct_of_n: p.slowReleasePctOfN,
  density_lb_per_gal: p.densityLbPerGal,
  is_pesticide: p.isPesticide,
  registration_number: p.registrationNumber,
  label_cautions: p.labelCautions,
  reentry_guidance: p.reentryGuidance,
});

export function toProductDto(p: Product): ProductDto {
  return {
    id: p.id,
    name: p.name,
    form: p.form,
    nPct: Number(p.n_pct),
    p2o5Pct: Number(p.p2o5_pct),
    k2oPct: Number(p.k2o_pct),
    slowReleasePctOfN: Number(p.slow_release_pct_of_n),
    densityLbPerGal: p.density_lb_per_gal === null ? null : Number(p.density_lb_per_gal),
    isPesticide: p.is_pesticide,
    registrationNumber: p.registration_number,
    labelCautions: p.label_cautions,
    reentryGuidance: p.reentry_guidance,
    nRelease: p.n_release,
    labelMaxRate: p.label_max_rate === null ? null : Number(p.label_max_rate),
    labelRateUnit: p.label_rate_unit,
    labelMaxYearly: p.label_max_yearly === null ? null : Number(p.label_max_yearly),
    labelMinIntervalDays: p.label_min_interval_days,
    preEmergenceActive: p.pre_emergence_active,
    seedingIntervalDays: p.seeding_interval_days,
    seedSpecies: p.seed_species,
    isArchived: p.archived_at !== null,
  };
}
