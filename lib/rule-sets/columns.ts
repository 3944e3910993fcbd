// Rule-set input → table columns (shared by the manager's edits and the seed).
import type { RuleSetInput } from "./schemas";

export const ruleSetColumns = (r: RuleSetInput) => ({
  name: r.name,
  citation: r.citation,
  limits_are_law: r.limitsAreLaw,
  max_n_lb_per_1000: r.maxNLbPer1000,
  max_wsn_lb_per_1000: r.maxWsnLbPer1000,
  min_slow_release_pct: r.minSlowReleasePct,
  pro_blackout_start: r.proBlackout?.[0] ?? null,
  pro_blackout_end: r.proBlackout?.[1] ?? null,
  homeowner_blackout_start: r.homeownerBlackout?.[0] ?? null,
  homeowner_blackout_end: r.homeownerBlackout?.[1] ?? null,
  phosphorus_rule: r.phosphorusRule,
  soil_test_max_age_years: r.soilTestMaxAgeYears,
  record_retention_years: r.recordRetentionYears,
  record_required_fields: r.recordRequiredFields,
  record_fields_apply_to: r.recordFieldsApplyTo,
});
