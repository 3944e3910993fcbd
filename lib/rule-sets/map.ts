// Rule-set rows ↔ DTOs: input → table columns (shared by the manager's edits and the seed), row → DTO.
import type { RuleSet } from "@/db/schema";

import type { RuleSetDto } from "./dto";
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

export function toRuleSetDto(r: RuleSet): RuleSetDto {
  const num = (v: number | null) => (v === null ? null : Number(v));
  return {
    id: r.id,
    name: r.name,
    citation: r.citation,
    limitsAreLaw: r.limits_are_law,
    maxNLbPer1000: num(r.max_n_lb_per_1000),
    maxWsnLbPer1000: num(r.max_wsn_lb_per_1000),
    minSlowReleasePct: num(r.min_slow_release_pct),
    proBlackout:
      r.pro_blackout_start && r.pro_blackout_end
        ? [r.pro_blackout_start, r.pro_blackout_end]
        : null,
    homeownerBlackout:
      r.homeowner_blackout_start && r.homeowner_blackout_end
        ? [r.homeowner_blackout_start, r.homeowner_blackout_end]
        : null,
    phosphorusRule: r.phosphorus_rule,
    soilTestMaxAgeYears: r.soil_test_max_age_years,
    recordRetentionYears: r.record_retention_years,
    recordRequiredFields: r.record_required_fields as RuleSetDto["recordRequiredFields"],
    recordFieldsApplyTo: r.record_fields_apply_to,
  };
}
