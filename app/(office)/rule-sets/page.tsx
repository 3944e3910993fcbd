import type { Metadata } from "next";

import { RuleSetList } from "@/components/rule-sets/rule-set-list";
import { requireActor } from "@/lib/auth/require";
import { listRuleSets } from "@/lib/rule-sets/queries";

export const metadata: Metadata = { title: "Rule sets" };

export default async function RuleSetsPage() {
  const actor = await requireActor(["manager"]);
  return (
    <>
      <h1 className="text-3xl font-bold">Rule sets</h1>
      <p className="mt-1 mb-6 text-muted">
        Fertilizer rules each property is checked against. Sward&apos;s checks help; local
        ordinances, applicator licensing and the product label take precedence.
      </p>
      <RuleSetList ruleSets={await listRuleSets(actor)} />
    </>
  );
}
