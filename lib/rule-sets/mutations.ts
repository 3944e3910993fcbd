// Rule-set writes (managers).
import "server-only";
import { sql } from "kysely";
import { db } from "@/db";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";
import type { RuleSetDto } from "./dto";
import { toRuleSetDto } from "./queries";
import type { RuleSetInput } from "./schemas";

const columns = (r: RuleSetInput) => ({
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

export async function saveRuleSet(actor: Actor, ruleSetId: string | null, input: RuleSetInput): Promise<RuleSetDto> {
  if (actor.role !== "manager") throw new AppError("forbidden", "Only a manager can change rule sets.");
  try {
    const row = ruleSetId
      ? await db().updateTable("rule_sets").set({ ...columns(input), updated_at: sql<Date>`now()` }).where("company_id", "=", actor.companyId).where("id", "=", ruleSetId).returningAll().executeTakeFirst()
      : await db().insertInto("rule_sets").values({ company_id: actor.companyId, ...columns(input) }).returningAll().executeTakeFirst();
    if (!row) throw notFound("That rule set");
    await recordAudit(db(), actor, { entity: "rule_set", entityId: row.id, action: ruleSetId ? "update_rule_set" : "create_rule_set" });
    return toRuleSetDto(row);
  } catch (err) {
    if ((err as { code?: string }).code === "23505") throw new AppError("invalid_input", "Some values need attention.", { name: ["A rule set with this name already exists."] });
    throw err;
  }
}
