// The company's fertiliser rule sets with their limits.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";

import type { RuleSetDto } from "./dto";
import { toRuleSetDto } from "./map";

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
