import { dehydrate, HydrationBoundary } from "@tanstack/react-query";
import type { Metadata } from "next";

import { TodayList } from "@/components/visits/today-list";
import { requireActor } from "@/lib/auth/require";
import { formatDate, isIsoDate, todayIn } from "@/lib/dates";
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
  const date = asked && isIsoDate(asked) ? asked : todayIn(actor.companyTimeZone);
  const queryClient = makeQueryClient();
  await queryClient.prefetchQuery({
    queryKey: visitKeys.today(date),
    queryFn: () => listTodayStops(actor, date),
  });

  return (
    <>
      <h1 className="text-3xl font-bold">Today</h1>
      <p className="mt-1 mb-4 text-muted">{formatDate(date)}</p>
      <HydrationBoundary state={dehydrate(queryClient)}>
        <TodayList date={date} />
      </HydrationBoundary>
    </>
  );
}
