// PUT /api/v1/rule-sets/:ruleSetId — replace a rule set's limits and citation (manager).
import { route } from "@/lib/auth/guards";
import { saveRuleSet } from "@/lib/rule-sets/mutations";
import { ruleSetIdParams, ruleSetSchema } from "@/lib/rule-sets/schemas";

export const PUT = route(
  { access: ["manager"], params: ruleSetIdParams, body: ruleSetSchema, resource: "That rule set" },
  async ({ actor, params, body }) => saveRuleSet(actor, params.ruleSetId, body),
);
