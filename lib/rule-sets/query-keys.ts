// React Query keys for the company's rule sets, shared by server prefetch and client hooks.
export const ruleSetKeys = {
  all: ["rule-sets"] as const,
  list: () => [...ruleSetKeys.all, "list"] as const,
};
