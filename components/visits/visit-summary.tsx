"use client";

// A finished visit: what each zone check recorded, in words, with the zone's photos and
// applications and the visit's waterings; for managers, corrections (each asks a reason, in a
// dialog) and the audit trail of who changed what after the visit was finished, in words.
import { useQuery } from "@tanstack/react-query";
import { History, PencilLine, Trash2 } from "lucide-react";

import { PhotoFigure } from "@/components/photos/photo-figure";
import { Button } from "@/components/ui/button";
import { formatTime } from "@/lib/dates";
import { fetchJson } from "@/lib/query-client";
import { mowingReading, mowingSentence } from "@/lib/reference/mowing";
import { findSymptom } from "@/lib/reference/symptoms";
import {
  MOWED_TODAY,
  MOWING_DIRECTION,
  RATING_FIELDS,
  SKIP_REASONS,
  SOIL_MOISTURE,
} from "@/lib/reference/visit-options";
import type { AuditEventDto, VisitDetailDto, ZoneCheckDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";

import { ZoneStatusBadge } from "./status-badge";
import { ApplicationEntry, mayChange, useEntryDialogs, WateringEntries } from "./visit-entries";

const SEVERITY = { 1: "light", 2: "moderate", 3: "severe" } as const;

function Facts({ check }: { check: ZoneCheckDto }) {
  if (check.status === "skipped") {
    return (
      <p>
        Skipped: {check.skipReason ? SKIP_REASONS[check.skipReason] : "no reason"}
        {check.skipNote ? ` — ${check.skipNote}` : ""}
      </p>
    );
  }
  const signs = [
    check.isMatted && "lay-over / matting",
    check.isScalped && "scalping",
    check.hasTornTips && "torn leaf tips",
    check.hasClumpedClippings && "clumped clippings",
  ].filter(Boolean);
  const reading = mowingReading(check);
  return (
    <dl className="grid grid-cols-2 gap-x-4 gap-y-1 text-sm sm:grid-cols-4">
      {(Object.entries(RATING_FIELDS) as [keyof typeof RATING_FIELDS, string][]).map(
        ([field, label]) => (
          <div key={field}>
            <dt className="text-muted">{label}</dt>
            <dd className="text-base font-bold">{check[field] ?? "—"} of 9</dd>
          </div>
        ),
      )}
      <div>
        <dt className="text-muted">Bare / weeds</dt>
        <dd className="font-semibold">
          {check.barePct ?? "—"} % / {check.weedsPct ?? "—"} %
        </dd>
      </div>
      <div>
        <dt className="text-muted">Thatch</dt>
        <dd className="font-semibold">
          {check.thatchIn === null ? "—" : `${check.thatchIn.toFixed(2)} in`}
        </dd>
      </div>
      <div>
        <dt className="text-muted">Soil</dt>
        <dd className="font-semibold">
          {check.soilMoisture ? SOIL_MOISTURE[check.soilMoisture] : "—"}
          {check.soilMoisturePct !== null ? ` (${check.soilMoisturePct} %)` : ""}
        </dd>
      </div>
      <div>
        <dt className="text-muted">Height of cut</dt>
        <dd className="font-semibold">
          {check.heightOfCutIn === null ? "—" : `${check.heightOfCutIn.toFixed(2)} in`}
        </dd>
      </div>
      <div>
        <dt className="text-muted">Mowed at this visit</dt>
        <dd className="font-semibold">
          {check.mowedToday === null
            ? "not recorded"
            : MOWED_TODAY[check.mowedToday ? "yes" : "no"]}
          {check.mowedToday && check.heightBeforeMowingIn !== null
            ? `, from ${check.heightBeforeMowingIn.toFixed(2)} in`
            : ""}
        </dd>
      </div>
      <div className="col-span-2 sm:col-span-4">
        <dt className="text-muted">Mowing</dt>
        <dd>
          {check.mowingDirection
            ? MOWING_DIRECTION[check.mowingDirection]
            : "direction not recorded"}
          {signs.length ? `; ${signs.join(", ")}` : ""}
          {reading ? `. ${mowingSentence(reading)}` : ""}
        </dd>
      </div>
      <div className="col-span-2 sm:col-span-4">
        <dt className="text-muted">Symptoms</dt>
        <dd>
          {check.symptoms.length
            ? check.symptoms
                .map(
                  (s) =>
                    `${findSymptom(s.key)?.name ?? s.key} (${SEVERITY[s.severity]}, ${s.extentPct} %)`,
                )
                .join("; ")
            : "none"}
        </dd>
      </div>
      {check.notes ? (
        <div className="col-span-2 sm:col-span-4">
          <dt className="text-muted">Notes</dt>
          <dd className="whitespace-pre-wrap">{check.notes}</dd>
        </div>
      ) : null}
    </dl>
  );
}

/** The visit's audit events in words (managers): corrections, deletions, a stop called off or moved. */
export function AuditTrail({ visitId }: { visitId: string }) {
  const { data } = useQuery({
    queryKey: visitKeys.audit(visitId),
    queryFn: async () =>
      (await fetchJson<{ items: AuditEventDto[] }>(`/api/v1/visits/${visitId}/audit`)).items,
  });
  if (!data?.length) return null;
  return (
    <section className="mt-8" aria-labelledby="audit-title">
      <h2 id="audit-title" className="mb-2 flex items-center gap-2 text-xl font-bold">
        <History className="size-5" aria-hidden="true" />
        Audit trail
      </h2>
      <ul className="space-y-2" aria-label="Audit trail">
        {data.map((e) => (
          <li key={e.id} className="rounded-lg border border-line bg-card p-3 text-sm">
            <p className="text-muted">
              <time dateTime={e.at}>{e.when}</time>
            </p>
            <p>{e.sentence}</p>
          </li>
        ))}
      </ul>
    </section>
  );
}

export function VisitSummary({
  visit,
  isManager,
  onEditZone,
}: {
  visit: VisitDetailDto;
  isManager: boolean;
  onEditZone?: (zoneId: string) => void;
}) {
  const { open, dialog } = useEntryDialogs(visit);
  return (
    <>
      {dialog}
      <p className="mb-4 rounded-lg bg-sward-tint p-3 text-sward-deep">
        Finished{visit.completedAt ? ` at ${formatTime(visit.completedAt, visit.timeZone)}` : ""}
        {visit.completedBy ? ` by ${visit.completedBy}` : ""}. {visit.checkedZones} of{" "}
        {visit.zones.length} zones recorded.
      </p>
      <h2 className="mb-3 text-xl font-bold">Zone checks</h2>
      <ul className="space-y-3" aria-label="Zone checks">
        {visit.zones.map((zone) => {
          const check = visit.checks.find((c) => c.zoneId === zone.id);
          return (
            <li key={zone.id} className="rounded-xl border border-line bg-card p-4">
              <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
                <h3 className="text-lg font-bold">{zone.name}</h3>
                <span className="flex items-center gap-2">
                  {check?.swardIndex !== null && check?.swardIndex !== undefined ? (
                    <span className="rounded-full bg-sward-tint px-2.5 py-1 font-bold text-sward-deep">
                      Sward Index {Math.round(check.swardIndex)}
                    </span>
                  ) : null}
                  <ZoneStatusBadge status={check?.status ?? null} />
                </span>
              </div>
              {check ? (
                <Facts check={check} />
              ) : (
                <p className="text-muted">Not checked at this visit.</p>
              )}
              {visit.photos.some((p) => p.zoneId === zone.id) ? (
                <ul
                  className="mt-3 grid grid-cols-2 gap-2 sm:grid-cols-4"
                  aria-label={`Photos of ${zone.name}`}
                >
                  {visit.photos
                    .filter((p) => p.zoneId === zone.id)
                    .map((p) => (
                      <li key={p.id}>
                        <PhotoFigure photo={p} />
                        {mayChange(visit, isManager, p.uploadedById) ? (
                          <Button
                            type="button"
                            variant="secondary"
                            className="mt-1 w-full"
                            onClick={() => open({ kind: "delete-photo", photo: p })}
                          >
                            <Trash2 className="size-5" aria-hidden="true" />
                            Delete photo
                          </Button>
                        ) : null}
                      </li>
                    ))}
                </ul>
              ) : null}
              {visit.applications.some((a) => a.zoneId === zone.id) ? (
                <>
                  <h4 className="mt-3 font-semibold">Applications</h4>
                  <ul className="mt-1 space-y-2" aria-label={`Applications on ${zone.name}`}>
                    {visit.applications
                      .filter((a) => a.zoneId === zone.id)
                      .map((a) => (
                        <ApplicationEntry
                          key={a.id}
                          application={a}
                          timeZone={visit.timeZone}
                          canChange={mayChange(visit, isManager, a.createdById)}
                          onCorrect={() => open({ kind: "correct-application", application: a })}
                          onDelete={() => open({ kind: "delete-application", application: a })}
                        />
                      ))}
                  </ul>
                </>
              ) : null}
              {onEditZone && check ? (
                <Button
                  type="button"
                  variant="secondary"
                  className="mt-3"
                  onClick={() => onEditZone(zone.id)}
                >
                  <PencilLine className="size-5" aria-hidden="true" />
                  Correct this check
                </Button>
              ) : null}
            </li>
          );
        })}
      </ul>
      <WateringEntries
        visit={visit}
        isManager={isManager}
        onCorrect={(w) => open({ kind: "correct-watering", watering: w })}
        onDelete={(w) => open({ kind: "delete-watering", watering: w })}
      />
      {isManager ? <AuditTrail visitId={visit.id} /> : null}
    </>
  );
}
