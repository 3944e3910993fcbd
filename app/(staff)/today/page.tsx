import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import { ChevronLeft, ChevronRight } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";

import { DayRouteSummary } from "@/components/day-route/day-route-summary";
import { LicenseNotice } from "@/components/people/license-notice";
import { OfflineReady } from "@/components/pwa/offline-ready";
import { buttonClass } from "@/components/ui/button";
import { TodayList } from "@/components/visits/today-list";
import type { Actor } from "@/lib/auth/actor";
import { requireActor } from "@/lib/auth/require";
import { addDays, formatDate, isIsoDate, todayIn } from "@/lib/dates";
import { makeQueryClient } from "@/lib/query-client";
import { listTodayStops } from "@/lib/visits/queries";
import { visitKeys } from "@/lib/visits/query-keys";

export const metadata: Metadata = { title: "Today" };

export default async function TodayPage({
  searchParams,
}: {
  searchParams: Promise<{ date?: string }>;
}) {
  const actor = await requireActor(["technician"]);
  const { date: asked } = await searchParams;
  const today = todayIn(actor.companyTimeZone);
  const date = asked && isIsoDate(asked) ? asked : today;
  const dayHref = (d: string) => (d === today ? "/today" : `/today?date=${d}`);
  return (
    <>
      <h1 className="text-3xl font-bold">{date === today ? "Today" : formatDate(date)}</h1>
      <p className="mt-1 text-muted">
        {date === today ? formatDate(date) : date < today ? "A past day" : "A coming day"}
      </p>
      <LicenseNotice actor={actor} />
      <nav aria-label="Other days" className="mt-3 mb-4 flex flex-wrap gap-2">
        <Link
          href={dayHref(addDays(date, -1))}
          className={buttonClass("secondary", "no-underline")}
        >
          <ChevronLeft className="size-5" aria-hidden="true" />
          Previous day
        </Link>
        {date !== today ? (
          <Link href="/today" className={buttonClass("quiet", "no-underline")}>
            Back to today
          </Link>
        ) : null}
        <Link href={dayHref(addDays(date, 1))} className={buttonClass("secondary", "no-underline")}>
          Next day
          <ChevronRight className="size-5" aria-hidden="true" />
        </Link>
      </nav>
      <OfflineReady
        date={date}
        today={today}
        userId={actor.userId}
        timeZone={actor.companyTimeZone}
      />
      {/* Rendered with the page, not streamed: the field app's first screen must show its stops
          without waiting on a client-side reveal (a streamed boundary stayed hidden under the
          seasons suite's shifted clocks). */}
      <DayRouteSummary date={date} />
      <Stops actor={actor} date={date} />
    </>
  );
}

async function Stops({ actor, date }: { actor: Actor; date: string }) {
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({
    queryKey: visitKeys.today(date),
    queryFn: () => listTodayStops(actor, date),
  });
  return (
    <HydrationBoundary state={dehydrate(queryClient)}>
      <TodayList date={date} timeZone={actor.companyTimeZone} />
    </HydrationBoundary>
  );
}
