import type { Metadata } from "next";
import Link from "next/link";

import { WeekSchedule } from "@/components/schedule/week-schedule";
import { buttonClass } from "@/components/ui/button";
import { requireActor } from "@/lib/auth/require";
import { addDays, formatShortDate, isIsoDate } from "@/lib/dates";
import { getWeekSchedule } from "@/lib/schedule/queries";

export const metadata: Metadata = { title: "Week schedule" };

export default async function SchedulePage({
  searchParams,
}: {
  searchParams: Promise<{ week?: string }>;
}) {
  const actor = await requireActor(["manager"]);
  const { week: asked } = await searchParams;
  const week = await getWeekSchedule(actor, asked && isIsoDate(asked) ? asked : undefined);
  const locale = actor.companyLocale;
  const last = week.days.at(-1)!;
  return (
    <>
      <h1 className="text-3xl font-bold">Week schedule</h1>
      <nav aria-label="Week" className="my-4 flex flex-wrap items-center gap-2">
        <Link
          href={`/schedule?week=${addDays(week.weekStart, -7)}`}
          className={buttonClass("secondary", "no-underline")}
        >
          ← Previous week
        </Link>
        <p className="px-2 text-lg font-bold">
          {formatShortDate(week.weekStart, locale)} – {formatShortDate(last, locale)}
        </p>
        <Link
          href={`/schedule?week=${addDays(week.weekStart, 7)}`}
          className={buttonClass("secondary", "no-underline")}
        >
          Next week →
        </Link>
        <Link href="/schedule" className={buttonClass("quiet", "no-underline")}>
          This week
        </Link>
        <Link href={`/visits?date=${week.today}`} className={buttonClass("quiet", "no-underline")}>
          Day view
        </Link>
      </nav>
      {week.technicians.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No technicians yet: invite one, then their stops show here by day.
        </p>
      ) : (
        <WeekSchedule week={week} />
      )}
    </>
  );
}
