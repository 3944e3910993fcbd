"use client";

// The technician's stops for a day, in order, with the last visit and what it found.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { ChevronRight, MapPin, TriangleAlert } from "lucide-react";
import Link from "next/link";

import { stopNameId, StopRouteTools } from "@/components/day-route/stop-route-tools";
import { useWaitingOps } from "@/components/offline/use-outbox";
import { WaitingLine } from "@/components/offline/waiting-line";
import { formatDate } from "@/lib/dates";
import { visitStatus } from "@/lib/offline/overlay";
import { fetchJson } from "@/lib/query-client";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import type { TodayStopDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";

import { VisitStatusBadge } from "./status-badge";
import { CallOffStop, StopOutcome } from "./stop-outcome";

export function TodayList({ date, timeZone }: { date: string; timeZone: string }) {
  const queryClient = useQueryClient();
  const refresh = () => queryClient.invalidateQueries({ queryKey: visitKeys.all });
  // What each stop still has waiting on this phone (lib/offline).
  const waiting = useWaitingOps();
  const { data, error, isPending } = useQuery({
    queryKey: visitKeys.today(date),
    queryFn: async () =>
      (await fetchJson<{ items: TodayStopDto[] }>(`/api/v1/today?date=${date}`)).items,
  });
  if (isPending) return <p className="text-muted">Loading your stops…</p>;
  if (error)
    return (
      <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-3 text-clay">
        Your stops could not be loaded: {error.message}
      </p>
    );
  if (data.length === 0)
    return (
      <p className="rounded-lg border border-line bg-card p-4">
        No stops scheduled for {formatDate(date)}.
      </p>
    );

  const done = data.filter((s) => s.status === "completed").length;
  const calledOff = data.filter((s) => s.status === "cancelled").length;
  return (
    <>
      <p className="mb-4 font-semibold">
        {done} of {data.length - calledOff} stops finished
        {calledOff ? ` · ${calledOff} called off` : ""}
      </p>
      <ol className="space-y-3" aria-label="Stops">
        {data.map((stop, index) => (
          <li key={stop.id} className="space-y-2">
            <Link
              href={`/visits/${stop.id}`}
              className="block rounded-xl border border-line bg-card p-4 no-underline shadow-sm hover:border-sward"
            >
              <div className="flex items-start gap-3">
                <span
                  className="grid size-10 shrink-0 place-items-center rounded-full bg-sward text-lg font-bold text-white"
                  aria-label={`Stop ${index + 1}`}
                >
                  {index + 1}
                </span>
                <div className="min-w-0 flex-1">
                  <div className="flex flex-wrap items-center justify-between gap-2">
                    <p id={stopNameId(stop.id)} className="text-lg font-bold text-ink">
                      {stop.propertyName}
                    </p>
                    <VisitStatusBadge
                      status={visitStatus(
                        stop,
                        waiting.filter((op) => op.visitId === stop.id),
                      )}
                      cancelKind={stop.outcome?.kind}
                    />
                  </div>
                  <p className="mt-1 flex items-center gap-1.5 text-muted">
                    <MapPin className="size-4 shrink-0" aria-hidden="true" />
                    {stop.address}
                  </p>
                  <p className="mt-1 text-ink">
                    {PLANNED_SERVICES[stop.plannedService]} · {stop.zoneCount} zones · last visit{" "}
                    {stop.lastVisitOn ? formatDate(stop.lastVisitOn) : "none yet"}
                  </p>
                  {stop.concerns.length ? (
                    <div className="mt-3 rounded-lg bg-sun-tint p-3">
                      <p className="flex items-center gap-1.5 font-semibold text-ink">
                        <TriangleAlert className="size-4 text-sun" aria-hidden="true" />
                        Open concerns from last visit
                      </p>
                      <ul className="mt-1 list-disc space-y-0.5 pl-5 text-sm text-ink">
                        {stop.concerns.slice(0, 5).map((c) => (
                          <li key={c}>{c}</li>
                        ))}
                        {stop.concerns.length > 5 ? (
                          <li>and {stop.concerns.length - 5} more</li>
                        ) : null}
                      </ul>
                    </div>
                  ) : null}
                </div>
                <ChevronRight className="mt-2 size-6 shrink-0 text-muted" aria-hidden="true" />
              </div>
            </Link>
            <WaitingLine ops={waiting.filter((op) => op.visitId === stop.id)} timeZone={timeZone} />
            <StopRouteTools stop={stop} date={date} order={data.map((s) => s.id)} />
            {stop.outcome ? (
              <StopOutcome
                visit={stop}
                timeZone={timeZone}
                canReschedule
                onRescheduled={() => void refresh()}
              />
            ) : (
              <CallOffStop visit={stop} onDone={() => void refresh()} />
            )}
          </li>
        ))}
      </ol>
    </>
  );
}
