// Rule-set writes (managers).
import "server-only";

import { sql } from "kysely";

import { db } from "@/db";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";

import type { RuleSetDto } from "./dto";
import { ruleSetColumns as columns, toRuleSetDto } from "./map";
import type { RuleSetInput } from "./schemas";

export async function saveRuleSet(
  actor: Actor,
  ruleSetId: string | null,
  input: RuleSetInput,
): Promise<RuleSetDto> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change rule sets.");
  try {
    const row = ruleSetId
      ? await db()
          .updateTable("rule_sets")
          .set({ ...columns(input), updated_at: sql<Date>`now()` })
          .where("company_id", "=", actor.companyId)
          .where("id", "=", ruleSetId)
          .returningAll()
          .executeTakeFirst()
      : await db()
          .insertInto("rule_sets")
          .values({ company_id: actor.companyId, ...columns(input) })
          .returningAll()
          .executeTakeFirst();
    if (!row) throw notFound("That rule set");
    await recordAudit(db(), actor, {
      entity: "rule_set",
      entityId: row.id,
      action: ruleSetId ? "update_rule_set" : "create_rule_set",
    });
    return toRuleSetDto(row);
  } catch (err) {
    if ((err as { code?: string }).code === "23505")
      throw new AppError("invalid_input", "Some values need attention.", {
        name: ["A rule set with this name already exists."],
      });
    throw err;
  }
}
