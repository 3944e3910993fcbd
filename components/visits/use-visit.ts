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

/** A visit with a saved zone check in it (newer versions only replace older ones). */
export function withCheck(visit: VisitDetailDto, check: ZoneCheckDto): VisitDetailDto {
  const known = visit.checks.find((c) => c.id === check.id || c.zoneId === check.zoneId);
  if (known && known.id === check.id && known.version > check.version) return visit;
  const checks = known
    ? visit.checks.map((c) => (c === known ? check : c))
    : [...visit.checks, check];
  const checkedZones = checks.filter((c) => c.status !== "draft").length;
  return {
    ...visit,
    checks,
    checkedZones,
    status: visit.status === "scheduled" ? "in_progress" : visit.status,
  };
}

/** A visit with an uploaded photo in it. */
export function withPhoto(visit: VisitDetailDto, photo: PhotoDto): VisitDetailDto {
  return visit.photos.some((p) => p.id === photo.id)
    ? visit
    : { ...visit, photos: [...visit.photos, photo] };
}

/** A visit with a recorded application in it. */
export function withApplication(
  visit: VisitDetailDto,
  application: ApplicationDto,
): VisitDetailDto {
  return visit.applications.some((a) => a.id === application.id)
    ? visit
    : {
        ...visit,
        applications: [...visit.applications, application],
        status: visit.status === "scheduled" ? "in_progress" : visit.status,
      };
}

function useMerge<T>(visitId: string, merge: (visit: VisitDetailDto, item: T) => VisitDetailDto) {
  const queryClient = useQueryClient();
  return useCallback(
    (item: T) =>
      queryClient.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (visit) =>
        visit ? merge(visit, item) : visit,
      ),
    [queryClient, visitId, merge],
  );
}

/** Merges a saved zone check into the cached visit (no refetch needed). */
export const useMergeZoneCheck = (visitId: string) => useMerge(visitId, withCheck);
/** Adds an uploaded photo to the cached visit. */
export const useMergePhoto = (visitId: string) => useMerge(visitId, withPhoto);
/** Adds a recorded application to the cached visit. */
export const useMergeApplication = (visitId: string) => useMerge(visitId, withApplication);
