// The company's fertiliser rule sets (names and citations; their limits arrive with the agronomy engine).
import "server-only";
import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import type { RuleSetDto } from "./dto";


export async function listRuleSets(actor: Actor): Promise<RuleSetDto[]> {
  return db()
    .selectFrom("rule_sets")
    .select(["id", "name", "citation"])
    .where("company_id", "=", actor.companyId)
    .orderBy("name")
    .execute();
}
