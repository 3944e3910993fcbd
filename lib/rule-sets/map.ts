// Rule-set rows ↔ DTOs: input → table columns (shared by the manager's edits and the seed), row → DTO.
import type { RuleSet } from "@/db/schema";

import type { RuleSetDto } from "./dto";
import type { RuleSetInput } from "./schemas";

/** The entries whose value is given (an absent field leaves its column as it is). */
function defined<T extends Record<string, unknown>>(o: T): Partial<T> {
  return Object.fromEntries(Object.entries(o).filter(([, v]) => v !== undefined)) as Partial<T>;
}

export const ruleSetColumns = (r: RuleSetInput) => ({
  name: r.name,
  citation: r.citation,
  limits_are_law: r.limitsAreLaw,
  max_n_lb_per_1000: r.maxNLbPer1000,
  max_wsn_lb_per_1000: r.maxWsnLbPer1000,
  min_slow_release_pct: r.minSlowReleasePct,
  pro_no_fertilizer_after: r.proBlackout?.[0] ?? null,
  pro_no_fertilizer_before: r.proBlackout?.[1] ?? null,
  homeowner_no_fertilizer_after: r.homeownerBlackout?.[0] ?? null,
  homeowner_no_fertilizer_before: r.homeownerBlackout?.[1] ?? null,
  phosphorus_rule: r.phosphorusRule,
  soil_test_max_age_years: r.soilTestMaxAgeYears,
  ...defined({
    phosphorus_exempt_establishment: r.phosphorusExemptEstablishment,
    phosphorus_exempt_repair: r.phosphorusExemptRepair,
    n_limits_source: r.nLimitsSource,
    blackout_source: r.blackoutSource,
    phosphorus_source: r.phosphorusSource,
    conditions_source: r.conditionsSource,
  }),
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
      r.pro_no_fertilizer_after && r.pro_no_fertilizer_before
        ? [r.pro_no_fertilizer_after, r.pro_no_fertilizer_before]
        : null,
    homeownerBlackout:
      r.homeowner_no_fertilizer_after && r.homeowner_no_fertilizer_before
        ? [r.homeowner_no_fertilizer_after, r.homeowner_no_fertilizer_before]
        : null,
    phosphorusRule: r.phosphorus_rule,
    soilTestMaxAgeYears: r.soil_test_max_age_years,
    phosphorusExemptEstablishment: r.phosphorus_exempt_establishment,
    phosphorusExemptRepair: r.phosphorus_exempt_repair,
    nLimitsSource: r.n_limits_source,
    blackoutSource: r.blackout_source,
    phosphorusSource: r.phosphorus_source,
    conditionsSource: r.conditions_source,
    recordRetentionYears: r.record_retention_years,
    recordRequiredFields: r.record_required_fields as RuleSetDto["recordRequiredFields"],
    recordFieldsApplyTo: r.record_fields_apply_to,
  };
}
