// Product rows ↔ DTOs: input → table columns (shared by the catalogue edits and the seed), row → DTO.
import type { Product } from "@/db/schema";

import type { ProductDto } from "./dto";
import type { ProductInput } from "./schemas";

export const productColumns = (p: ProductInput) => ({
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
    isArchived: p.archived_at !== null,
  };
}
