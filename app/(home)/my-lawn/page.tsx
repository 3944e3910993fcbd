import type { Metadata } from "next";
import Link from "next/link";
import { Suspense } from "react";

import { PropertyHeader } from "@/components/properties/property-header";
import { ZoneList } from "@/components/properties/zone-list";
import { LawnIndex } from "@/components/sward-index/lawn-index";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { NextVisitNote } from "@/components/visit-reports/next-visit-note";
import { WateringLog } from "@/components/watering/watering-log";
import type { Actor } from "@/lib/auth/actor";
import { requireActor } from "@/lib/auth/require";
import { formatDate, todayIn } from "@/lib/dates";
import { visitReportPath } from "@/lib/paths";
import { getProperty, listProperties } from "@/lib/properties/queries";
import { findNextVisit, listReports } from "@/lib/reports/queries";
import { getPropertyScoreHistory } from "@/lib/scoring/queries";
import { listWaterings } from "@/lib/watering/queries";

export const metadata: Metadata = { title: "My lawn" };

export default async function MyLawnPage() {
  const actor = await requireActor(["homeowner"], "/my-lawn");
  // The title at once, the lawns (histories, reports, waterings) streamed in behind a skeleton.
  return (
    <>
      <h1 className="text-3xl font-bold">My lawn</h1>
      <p className="mt-1 mb-6 text-muted">
        Cared for by {actor.companyName}. Visit reports and care notes appear here after each visit.
      </p>
      <Suspense fallback={<PageSkeleton cards={2} />}>
        <MyLawns actor={actor} />
      </Suspense>
    </>
  );
}

async function MyLawns({ actor }: { actor: Actor }) {
  const summaries = await listProperties(actor);
  const properties = await Promise.all(
    summaries.map(async (p) => ({
      ...(await getProperty(actor, p.id)),
      scores: await getPropertyScoreHistory(actor, p.id, { weather: false }),
      reports: await listReports(actor, p.id),
      waterings: await listWaterings(actor, p.id, { limit: 30 }),
      nextVisit: await findNextVisit(actor, p.id, todayIn(p.timeZone), undefined, {
        inclusive: true,
      }),
    })),
  );

  return (
    <>
      {properties.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No property is linked to your sign-in yet. Ask {actor.companyName} to link your lawn.
        </p>
      ) : (
        properties.map((property) => (
          <section key={property.id} className="mb-10" aria-label={property.name}>
            <PropertyHeader property={property} as="h2" />
            <NextVisitNote visit={property.nextVisit} locale={actor.companyLocale} />
            <LawnIndex history={property.scores} locale={actor.companyLocale} />
            <h3 className="mb-2 text-xl font-bold">Visit reports</h3>
            {property.reports.length ? (
              <ul className="mb-6 space-y-2" aria-label="Visit reports">
                {property.reports.map((r, i) => (
                  <li key={r.visitId}>
                    <Link
                      href={visitReportPath(r.visitId)}
                      className="flex min-h-tap items-center justify-between rounded-xl border border-line bg-card p-3 font-semibold text-sward no-underline hover:border-sward"
                    >
                      <span>Visit of {formatDate(r.date)}</span>
                      {i === 0 ? (
                        <span className="rounded-full bg-sward-tint px-2.5 py-1 text-sm text-sward-deep">
                          Latest
                        </span>
                      ) : null}
                    </Link>
                  </li>
                ))}
              </ul>
            ) : (
              <p className="mb-6 rounded-lg border border-line bg-card p-4">
                Your first report appears here after the first visit.
              </p>
            )}
            <h3 className="mb-1 text-xl font-bold">Your watering</h3>
            <p className="mb-3 text-muted">
              Tell us when you water: it goes into the water balance we watch for drought and
              disease.
            </p>
            <div className="mb-8">
              <WateringLog
                propertyId={property.id}
                zones={property.zones}
                today={todayIn(property.timeZone)}
                waterings={property.waterings}
                canAdd
              />
            </div>
            <h3 className="mb-3 text-xl font-bold">Your lawn&apos;s zones</h3>
            <ZoneList zones={property.zones} />
          </section>
        ))
      )}
    </>
  );
}
