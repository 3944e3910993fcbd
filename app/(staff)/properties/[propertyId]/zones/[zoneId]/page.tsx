import { ArrowLeft } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";
import { notFound } from "next/navigation";
import { Suspense } from "react";

import { BeforeAfter } from "@/components/photos/before-after";
import { ZoneIndexSection } from "@/components/sward-index/zone-index-section";
import { PageSkeleton } from "@/components/ui/page-skeleton";
import { ZoneStatusBadge } from "@/components/visits/status-badge";
import type { Actor } from "@/lib/auth/actor";
import { requireActor } from "@/lib/auth/require";
import { formatDate } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";
import { listZonePhotos } from "@/lib/photos/queries";
import { zoneIdParams } from "@/lib/properties/schemas";
import { findSymptom } from "@/lib/reference/symptoms";
import { RATING_SCALE, SKIP_REASONS } from "@/lib/reference/visit-options";
import { getPropertyScoreHistory } from "@/lib/scoring/queries";
import { getZoneHistory } from "@/lib/visits/queries";
import { refreshPropertyWeather } from "@/lib/weather/mutations";

export const metadata: Metadata = { title: "Zone history" };

const Rating = ({ value }: { value: number | null }) =>
  value === null ? (
    <span className="text-muted">—</span>
  ) : (
    <span className={value < RATING_SCALE.acceptable ? "font-bold text-clay" : "font-bold"}>
      {value}
      {value < RATING_SCALE.acceptable ? " ▼" : ""}
    </span>
  );

export default async function ZoneHistoryPage({
  params,
}: {
  params: Promise<{ propertyId: string; zoneId: string }>;
}) {
  const actor = await requireActor(["manager", "technician"]);
  const raw = await params;
  const parsed = zoneIdParams.safeParse({ zoneId: raw.zoneId });
  if (!parsed.success) notFound();
  const history = await getZoneHistory(actor, parsed.data.zoneId).catch((err: unknown) => {
    if (err instanceof AppError && err.code === "not_found") notFound();
    throw err;
  });
  if (history.propertyId !== raw.propertyId) notFound();
  // Checked first, streamed after: a zone out of scope answers 404 before anything is sent.
  return (
    <Suspense fallback={<PageSkeleton cards={3} />}>
      <ZoneHistoryBody actor={actor} zoneId={parsed.data.zoneId} history={history} />
    </Suspense>
  );
}

async function ZoneHistoryBody({
  actor,
  zoneId,
  history,
}: {
  actor: Actor;
  zoneId: string;
  history: Awaited<ReturnType<typeof getZoneHistory>>;
}) {
  const [photos, scores] = await Promise.all([
    listZonePhotos(actor, zoneId),
    // The Index history reads weather from the cache: bring it up to date first.
    refreshPropertyWeather(actor, history.propertyId).then(() =>
      getPropertyScoreHistory(actor, history.propertyId),
    ),
  ]);
  const zoneScores = scores.zones.find((z) => z.zoneId === zoneId);

  return (
    <>
      <Link
        href={`/properties/${history.propertyId}`}
        className="mb-4 inline-flex min-h-tap items-center gap-1 font-semibold text-sward"
      >
        <ArrowLeft className="size-5" aria-hidden="true" />
        Back to the property
      </Link>
      <h1 className="text-3xl font-bold">{history.zoneName}: history</h1>
      {zoneScores ? (
        <div className="mt-6">
          <ZoneIndexSection zone={zoneScores} from={scores.from} to={scores.today} />
        </div>
      ) : (
        <p className="mt-3 rounded-lg border border-line bg-card p-3">
          This zone is archived: its checks are below; it no longer has a chart.
        </p>
      )}
      <h2 className="mt-6 mb-3 text-2xl font-bold">Before and after</h2>
      <BeforeAfter photos={photos} zoneName={history.zoneName} />
      <h2 className="mt-8 mb-1 text-2xl font-bold">Checks</h2>
      <p className="mt-1 mb-6 text-muted">
        Every check of this zone, newest first. Ratings 1–9 (9 ideal, 6 lowest acceptable; ▼ below
        acceptable).
      </p>
      {history.entries.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          This zone has not been checked yet.
        </p>
      ) : (
        <div
          className="overflow-x-auto rounded-xl border border-line bg-card"
          role="region"
          aria-label={`Checks of ${history.zoneName} (scrolls sideways)`}
          tabIndex={0}
        >
          <table className="w-full min-w-[46rem] text-left">
            <caption className="sr-only">Checks of {history.zoneName}</caption>
            <thead className="border-b border-line bg-paper text-sm">
              <tr>
                <th scope="col" className="p-3">
                  Date
                </th>
                <th scope="col" className="p-3">
                  Sward Index
                </th>
                <th scope="col" className="p-3">
                  Quality
                </th>
                <th scope="col" className="p-3">
                  Color
                </th>
                <th scope="col" className="p-3">
                  Density
                </th>
                <th scope="col" className="p-3">
                  Uniformity
                </th>
                <th scope="col" className="p-3">
                  Bare / weeds
                </th>
                <th scope="col" className="p-3">
                  Cut
                </th>
                <th scope="col" className="p-3">
                  Symptoms
                </th>
              </tr>
            </thead>
            <tbody>
              {history.entries.map((e) => (
                <tr key={e.zoneCheckId} className="border-b border-line last:border-0">
                  <td className="p-3">
                    <Link href={`/visits/${e.visitId}`} className="font-semibold text-sward">
                      {formatDate(e.visitedOn)}
                    </Link>
                    <div className="mt-1">
                      <ZoneStatusBadge status={e.status} />
                    </div>
                  </td>
                  {e.status === "skipped" ? (
                    <td className="p-3" colSpan={8}>
                      Skipped: {e.skipReason ? SKIP_REASONS[e.skipReason] : "—"}
                    </td>
                  ) : (
                    <>
                      <td className="p-3 text-lg font-bold">
                        {e.swardIndex === null ? "—" : Math.round(e.swardIndex)}
                      </td>
                      <td className="p-3">
                        <Rating value={e.quality} />
                      </td>
                      <td className="p-3">
                        <Rating value={e.color} />
                      </td>
                      <td className="p-3">
                        <Rating value={e.density} />
                      </td>
                      <td className="p-3">
                        <Rating value={e.uniformity} />
                      </td>
                      <td className="p-3">
                        {e.barePct ?? "—"} % / {e.weedsPct ?? "—"} %
                      </td>
                      <td className="p-3">
                        {e.heightOfCutIn === null ? "—" : `${e.heightOfCutIn.toFixed(2)} in`}
                        {e.mowedToday === false ? (
                          <span className="block text-sm text-muted">not mowed today</span>
                        ) : e.mowedToday && e.heightBeforeMowingIn !== null ? (
                          <span className="block text-sm text-muted">
                            mowed from {e.heightBeforeMowingIn.toFixed(2)} in
                          </span>
                        ) : null}
                      </td>
                      <td className="p-3 text-sm">
                        {e.symptoms.length
                          ? e.symptoms.map((s) => findSymptom(s.key)?.name ?? s.key).join(", ")
                          : "none"}
                      </td>
                    </>
                  )}
                </tr>
              ))}
            </tbody>
          </table>
        </div>
      )}
    </>
  );
}
