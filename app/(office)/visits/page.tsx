import type { Metadata } from "next";
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";
import { ScheduleVisitForm } from "@/components/visits/schedule-visit-form";
import { VisitStatusBadge } from "@/components/visits/status-badge";
import { RefreshingStopOutcome } from "@/components/visits/stop-outcome";
import { TeamActivity } from "@/components/visits/team-activity";
import { requireActor } from "@/lib/auth/require";
import { getTeamActivity } from "@/lib/book/queries";
import { addDays, formatDate, isIsoDate, todayIn } from "@/lib/dates";
import { listPeople } from "@/lib/people/queries";
import { listProperties } from "@/lib/properties/queries";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import { listVisits } from "@/lib/visits/queries";

export const metadata: Metadata = { title: "Visits" };

export default async function VisitsPage({
  searchParams,
}: {
  searchParams: Promise<{ date?: string }>;
}) {
  const actor = await requireActor(["manager"]);
  const { date: asked } = await searchParams;
  const date = asked && isIsoDate(asked) ? asked : todayIn(actor.companyTimeZone);
  const [visits, properties, technicians, team] = await Promise.all([
    listVisits(actor, { date }),
    listProperties(actor),
    listPeople(actor, "technician"),
    getTeamActivity(actor),
  ]);
  const byTech = new Map<string, typeof visits>();
  for (const v of visits) {
    const key = v.technician?.name ?? "No technician";
    byTech.set(key, [...(byTech.get(key) ?? []), v]);
  }

  return (
    <>
      <h1 className="text-3xl font-bold">Visits</h1>
      <nav aria-label="Day" className="my-4 flex flex-wrap items-center gap-2">
        <Link
          href={`/visits?date=${addDays(date, -1)}`}
          className={buttonClass("secondary", "no-underline")}
        >
          ← Previous day
        </Link>
        <p className="px-2 text-lg font-bold">{formatDate(date)}</p>
        <Link
          href={`/visits?date=${addDays(date, 1)}`}
          className={buttonClass("secondary", "no-underline")}
        >
          Next day →
        </Link>
        <Link href={`/schedule?week=${date}`} className={buttonClass("quiet", "no-underline")}>
          Week view
        </Link>
      </nav>
      <div className="grid gap-8 lg:grid-cols-[1fr_24rem]">
        <section aria-label="Visits of the day">
          {visits.length === 0 ? (
            <p className="rounded-lg border border-line bg-card p-4">
              No visits on {formatDate(date)}.
            </p>
          ) : null}
          {[...byTech.entries()].map(([tech, list]) => (
            <div key={tech} className="mb-6">
              <h2 className="mb-2 text-xl font-bold">{tech}</h2>
              <ol className="space-y-2">
                {list
                  .sort((a, b) => a.stopOrder - b.stopOrder)
                  .map((v) => (
                    <li key={v.id}>
                      <Link
                        href={`/visits/${v.id}`}
                        className="flex flex-wrap items-center justify-between gap-2 rounded-xl border border-line bg-card p-3 no-underline hover:border-sward"
                      >
                        <span className="text-ink">
                          <span className="font-bold">{v.propertyName}</span> ·{" "}
                          {PLANNED_SERVICES[v.plannedService]} · {v.checkedZones} of {v.zoneCount}{" "}
                          zones
                        </span>
                        <VisitStatusBadge status={v.status} cancelKind={v.outcome?.kind} />
                      </Link>
                      {v.outcome ? (
                        <div className="mt-1">
                          <RefreshingStopOutcome visit={v} timeZone={actor.companyTimeZone} />
                        </div>
                      ) : null}
                    </li>
                  ))}
              </ol>
            </div>
          ))}
        </section>
        <ScheduleVisitForm
          properties={properties}
          technicians={technicians.filter((t) => !t.isDisabled)}
          defaultDate={date}
        />
      </div>
      <section aria-labelledby="team-title" className="mt-10">
        <h2 id="team-title" className="mb-1 text-2xl font-bold">
          Technicians, last eight weeks
        </h2>
        <p className="mb-3 text-muted">
          Visits finished each week (weeks start on Monday), zone checks per visit and photos per
          check.
        </p>
        <TeamActivity technicians={team.technicians} />
      </section>
    </>
  );
}
