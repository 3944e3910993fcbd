"use client";

// The day's route above Today's stops: total distance and driving time of the stops in their
// order, where the day starts and ends, whether the figures are estimates, and "Put in driving
// order" when a shorter order exists.
import { Route, TriangleAlert } from "lucide-react";

import { Button } from "@/components/ui/button";
import { drivingTimeText, milesText } from "@/lib/day-route/links";

import { useDayRoute, usePutInDrivingOrder } from "./use-day-route";

export function DayRouteSummary({ date }: { date: string }) {
  const { data: route, error } = useDayRoute(date);
  const putInOrder = usePutInDrivingOrder(date);
  if (error)
    return (
      <p role="alert" className="mb-4 rounded-lg border border-clay bg-clay-tint p-3 text-clay">
        The day&apos;s route could not be worked out: {error.message}
      </p>
    );
  if (!route || route.stops.length === 0) return null;

  const saving = route.total.seconds - route.proposed.total.seconds;
  return (
    <section
      aria-labelledby="day-route-heading"
      className="mb-4 rounded-xl border border-line bg-card p-4 shadow-sm"
    >
      <h2 id="day-route-heading" className="flex items-center gap-2 text-lg font-bold">
        <Route className="size-5 text-sward" aria-hidden="true" />
        Route
      </h2>
      <p className="mt-1 text-lg font-semibold tabular-nums" data-testid="route-total">
        {milesText(route.total.meters)} · {drivingTimeText(route.total.seconds)} driving
      </p>
      <p className="text-muted">
        {route.start
          ? route.start.kind === "start_point"
            ? `From your start point (${route.start.label}) and back.`
            : `From the yard (${route.start.label}) and back.`
          : "Open route: no yard or start point is set, so it runs from the first stop to the last. A manager sets the yard in Settings."}
      </p>
      {route.estimated ? (
        <p className="mt-2 flex items-start gap-1.5 text-sm text-ink">
          <TriangleAlert className="mt-0.5 size-4 shrink-0 text-sun" aria-hidden="true" />
          <span>
            Estimated: straight-line distance × 1.2 at 30 mph, because{" "}
            {route.estimateReason ?? "the routing service did not answer"}.
          </span>
        </p>
      ) : null}
      {route.inDrivingOrder ? (
        <p className="mt-2 font-semibold text-sward" data-testid="route-in-order">
          The stops are in driving order.
        </p>
      ) : (
        <div className="mt-3 space-y-2">
          <p>
            In driving order: {milesText(route.proposed.total.meters)} ·{" "}
            {drivingTimeText(route.proposed.total.seconds)}
            {saving >= 60 ? `, ${drivingTimeText(saving)} less driving` : ""}.
          </p>
          <Button type="button" onClick={() => putInOrder.mutate()} disabled={putInOrder.isPending}>
            {putInOrder.isPending ? "Ordering…" : "Put in driving order"}
          </Button>
        </div>
      )}
      {putInOrder.error ? (
        <p role="alert" className="mt-2 text-clay">
          {putInOrder.error.message}
        </p>
      ) : null}
    </section>
  );
}
