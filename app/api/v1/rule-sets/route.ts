// GET  /api/v1/rule-sets — { items: RuleSetDto[] } with their limits (staff).
// POST /api/v1/rule-sets — add a rule set (manager).
import { route } from "@/lib/auth/guards";
import { saveRuleSet } from "@/lib/rule-sets/mutations";
import { listRuleSets } from "@/lib/rule-sets/queries";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";

export const GET = route({ access: ["manager", "technician"] }, async ({ actor }) => ({
  items: await listRuleSets(actor),
}));

export const POST = route({ access: ["manager"], body: ruleSetSchema }, async ({ actor, body }) =>
  saveRuleSet(actor, null, body),
);
