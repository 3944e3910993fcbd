import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";

import { RuleSetList } from "@/components/rule-sets/rule-set-list";
import { requireActor } from "@/lib/auth/require";
import { makeQueryClient } from "@/lib/query-client";
import { listRuleSets } from "@/lib/rule-sets/queries";
import { ruleSetKeys } from "@/lib/rule-sets/query-keys";

export const metadata: Metadata = { title: "Rule sets" };

export default async function RuleSetsPage() {
  const actor = await requireActor(["manager"]);
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({
    queryKey: ruleSetKeys.list(),
    queryFn: () => listRuleSets(actor),
  });
  return (
    <>
      <h1 className="text-3xl font-bold">Rule sets</h1>
      <p className="mt-1 mb-6 text-muted">
        Fertilizer rules each property is checked against. Sward&apos;s checks help; local
        ordinances, applicator licensing and the product label take precedence.
      </p>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <RuleSetList />
      </HydrationBoundary>
    </>
  );
}
