"use client";

// Client reads and cache updates of one visit.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { useCallback } from "react";

import type { ApplicationDto } from "@/lib/applications/dto";
import type { PhotoDto } from "@/lib/photos/dto";
import { fetchJson } from "@/lib/query-client";
import type { VisitDetailDto, ZoneCheckDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";

export function useVisit(visitId: string) {
  return useQuery({
    queryKey: visitKeys.detail(visitId),
    queryFn: () => fetchJson<VisitDetailDto>(`/api/v1/visits/${visitId}`),
  });
}

/** Merges a saved zone check into the cached visit (no refetch needed). */
export function useMergeZoneCheck(visitId: string) {
  const queryClient = useQueryClient();
  return useCallback(
    (check: ZoneCheckDto) => {
      queryClient.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (visit) => {
        if (!visit) return visit;
        const checks = visit.checks.some((c) => c.id === check.id || c.zoneId === check.zoneId)
          ? visit.checks.map((c) => (c.id === check.id || c.zoneId === check.zoneId ? check : c))
          : [...visit.checks, check];
        const checkedZones = checks.filter((c) => c.status !== "draft").length;
        return {
          ...visit,
          checks,
          checkedZones,
          status: visit.status === "scheduled" ? "in_progress" : visit.status,
        };
      });
    },
    [queryClient, visitId],
  );
}

/** Adds an uploaded photo to the cached visit. */
export function useMergePhoto(visitId: string) {
  const queryClient = useQueryClient();
  return useCallback(
    (photo: PhotoDto) => {
      queryClient.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (visit) =>
        visit && !visit.photos.some((p) => p.id === photo.id)
          ? { ...visit, photos: [...visit.photos, photo] }
          : visit,
      );
    },
    [queryClient, visitId],
  );
}

/** Adds a recorded application to the cached visit. */
export function useMergeApplication(visitId: string) {
  const queryClient = useQueryClient();
  return useCallback(
    (application: ApplicationDto) => {
      queryClient.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (visit) =>
        visit && !visit.applications.some((a) => a.id === application.id)
          ? {
              ...visit,
              applications: [...visit.applications, application],
              status: visit.status === "scheduled" ? "in_progress" : visit.status,
            }
          : visit,
      );
    },
    [queryClient, visitId],
  );
}
