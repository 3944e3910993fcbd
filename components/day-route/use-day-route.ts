"use client";

// The day's route on Today: read it, put it in driving order, move a stop up or down. Each write
// refreshes the day's stops and the route.
import { useMutation, useQuery, useQueryClient } from "@tanstack/react-query";

import type { DayRouteDto } from "@/lib/day-route/dto";
import { dayRouteKeys } from "@/lib/day-route/query-keys";
import { fetchJson, sendJson } from "@/lib/query-client";
import { visitKeys } from "@/lib/visits/query-keys";

export function useDayRoute(date: string) {
  return useQuery({
    queryKey: dayRouteKeys.day(date),
    queryFn: () => fetchJson<DayRouteDto>(`/api/v1/today/route?date=${date}`),
  });
}

function useRefresh() {
  const queryClient = useQueryClient();
  return () =>
    Promise.all([
      queryClient.invalidateQueries({ queryKey: visitKeys.all }),
      queryClient.invalidateQueries({ queryKey: dayRouteKeys.all }),
    ]);
}

async function orThrow(result: Awaited<ReturnType<typeof sendJson>>) {
  if (!result.ok) throw new Error(result.error.message);
}

export function usePutInDrivingOrder(date: string) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async () => orThrow(await sendJson("POST", "/api/v1/today/route", { date })),
    onSettled: refresh,
  });
}

export function useSetStopOrder(date: string) {
  const refresh = useRefresh();
  return useMutation({
    mutationFn: async (visitIds: string[]) =>
      orThrow(await sendJson("PUT", "/api/v1/today/order", { date, visitIds })),
    onSettled: refresh,
  });
}
