// The company's fertiliser rule sets with their limits.
import "server-only";

import { db } from "@/db";
import type { RuleSet } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";

import type { RuleSetDto } from "./dto";

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

export async function listRuleSets(actor: Actor): Promise<RuleSetDto[]> {
  if (actor.role === "homeowner") return [];
  const rows = await db()
    .selectFrom("rule_sets")
    .selectAll()
    .where("company_id", "=", actor.companyId)
    .orderBy("name")
    .execute();
  return rows.map(toRuleSetDto);
}
