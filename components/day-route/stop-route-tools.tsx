"use client";

// Under each stop on Today: the drive to it, its access notes, "Directions" (the phone's maps
// app), "Call" (when the property has a phone) and the buttons that move it up or down the day.
import { ArrowDown, ArrowUp, KeyRound, Navigation, Phone } from "lucide-react";

import { Button, buttonClass } from "@/components/ui/button";
import { directionsUrl, drivingTimeText, milesText, telHref } from "@/lib/day-route/links";
import { formatUsPhone } from "@/lib/reference/us-phone";
import type { TodayStopDto } from "@/lib/visits/dto";

import { useDayRoute, useSetStopOrder } from "./use-day-route";

/** The id of the stop's name on its card (components/visits/today-list.tsx). */
export const stopNameId = (visitId: string) => `stop-name-${visitId}`;

export function StopRouteTools({
  stop,
  date,
  order,
}: {
  stop: Pick<TodayStopDto, "id" | "propertyName" | "location" | "customerPhone" | "accessNotes">;
  date: string;
  /** The day's stops as listed, first to last. */
  order: string[];
}) {
  // The buttons are named by what they do; the stop they act on is their description, the stop's
  // name on its card (a name with the property's would make "the link named Kowalczyk residence"
  // ambiguous on the page).
  const nameId = stopNameId(stop.id);
  const { data: route } = useDayRoute(date);
  const setOrder = useSetStopOrder(date);
  const index = order.indexOf(stop.id);
  const leg = route?.stops.find((s) => s.visitId === stop.id)?.leg ?? null;
  const move = (by: -1 | 1) => {
    const next = [...order];
    [next[index], next[index + by]] = [next[index + by]!, next[index]!];
    setOrder.mutate(next);
  };

  return (
    <div className="space-y-2 rounded-xl border border-line bg-card p-3">
      {leg ? (
        <p className="text-sm text-muted tabular-nums">
          {milesText(leg.meters)} · {drivingTimeText(leg.seconds)} from{" "}
          {index === 0 ? "the start" : "the stop before"}
        </p>
      ) : null}
      {stop.accessNotes ? (
        <p className="flex items-start gap-1.5 text-ink">
          <KeyRound className="mt-1 size-4 shrink-0 text-sun" aria-hidden="true" />
          <span>
            <span className="font-semibold">Access: </span>
            {stop.accessNotes}
          </span>
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <a
          href={directionsUrl(stop.location)}
          target="_blank"
          rel="noopener noreferrer"
          className={buttonClass("secondary", "no-underline")}
          aria-describedby={nameId}
        >
          <Navigation className="size-5" aria-hidden="true" />
          Directions
        </a>
        {stop.customerPhone ? (
          <a
            href={telHref(stop.customerPhone)}
            className={buttonClass("secondary", "no-underline")}
            aria-describedby={nameId}
          >
            <Phone className="size-5" aria-hidden="true" />
            Call {formatUsPhone(stop.customerPhone)}
          </a>
        ) : null}
        <Button
          type="button"
          variant="quiet"
          disabled={index <= 0 || setOrder.isPending}
          onClick={() => move(-1)}
          aria-describedby={nameId}
        >
          <ArrowUp className="size-5" aria-hidden="true" />
          Move up
        </Button>
        <Button
          type="button"
          variant="quiet"
          disabled={index < 0 || index >= order.length - 1 || setOrder.isPending}
          onClick={() => move(1)}
          aria-describedby={nameId}
        >
          <ArrowDown className="size-5" aria-hidden="true" />
          Move down
        </Button>
      </div>
      {setOrder.error ? (
        <p role="alert" className="text-clay">
          {setOrder.error.message}
        </p>
      ) : null}
    </div>
  );
}
