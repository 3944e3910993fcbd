"use client";

// Client reads of /api/v1/properties through React Query.
import { useQuery } from "@tanstack/react-query";

import type { PropertySummaryDto } from "@/lib/properties/dto";
import { propertyKeys } from "@/lib/properties/query-keys";
import { fetchJson } from "@/lib/query-client";

export function useProperties() {
  return useQuery({
    queryKey: propertyKeys.list(),
    queryFn: async () =>
      (await fetchJson<{ items: PropertySummaryDto[] }>("/api/v1/properties")).items,
  });
}
