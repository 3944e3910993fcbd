"use client";

// The company's rule sets through React Query: the list (prefetched by the page), and saving one,
// which refreshes the list in the cache when the server accepted it.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";

import { fetchJson, sendJson, type SendResult } from "@/lib/query-client";
import type { RuleSetDto } from "@/lib/rule-sets/dto";
import { ruleSetKeys } from "@/lib/rule-sets/query-keys";
import type { RuleSetInput } from "@/lib/rule-sets/schemas";

export function useRuleSets() {
  return useQuery({
    queryKey: ruleSetKeys.list(),
    queryFn: async () => (await fetchJson<{ items: RuleSetDto[] }>("/api/v1/rule-sets")).items,
  });
}

/** Answers the server's result (field errors included); the list is fresh once it resolves. */
export function useSaveRuleSet() {
  const queryClient = useQueryClient();
  return useMutation({
    mutationFn: ({ id, values }: { id?: string; values: RuleSetInput }) =>
      id
        ? sendJson<RuleSetDto>("PUT", `/api/v1/rule-sets/${id}`, values)
        : sendJson<RuleSetDto>("POST", "/api/v1/rule-sets", values),
    onSuccess: (result: SendResult<RuleSetDto>) =>
      result.ok ? queryClient.invalidateQueries({ queryKey: ruleSetKeys.all }) : undefined,
  });
}
