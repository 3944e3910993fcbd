// Product input → table columns (shared by the catalogue edits and the seed).
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
