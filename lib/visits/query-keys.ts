// React Query keys for visit reads, shared by server prefetch and client hooks.
export const visitKeys = {
  all: ["visits"] as const,
  detail: (visitId: string) => [...visitKeys.all, "detail", visitId] as const,
  today: (date: string) => [...visitKeys.all, "today", date] as const,
  list: (filters: Record<string, string | undefined>) =>
    [...visitKeys.all, "list", filters] as const,
  audit: (visitId: string) => [...visitKeys.all, "audit", visitId] as const,
  zoneHistory: (zoneId: string) => ["zones", zoneId, "history"] as const,
};
