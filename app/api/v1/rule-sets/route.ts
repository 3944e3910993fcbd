// GET /api/v1/rule-sets — { items: RuleSetDto[] } of the actor's company (staff).
import { route } from "@/lib/auth/guards";
import { listRuleSets } from "@/lib/rule-sets/queries";

export const GET = route({ access: ["manager", "technician"] }, async ({ actor }) => ({ items: await listRuleSets(actor) }));
