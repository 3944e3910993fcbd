"use client";

// Running a visit on a phone: start it, go zone by zone, finish. The zone in progress is kept in
// the URL (?zone=…) so a reload lands on the same zone with its draft.
import { useQueryClient } from "@tanstack/react-query";
import { ArrowLeft, ArrowRight, CheckCheck, List, MapPin, Play } from "lucide-react";
import { useLocale, useTranslations } from "next-intl";
import { usePathname, useRouter, useSearchParams } from "next/navigation";
import { useState, type ReactNode } from "react";

import { HeldOps } from "@/components/offline/held-ops";
import { useWaitingOps } from "@/components/offline/use-outbox";
import { WaitingLine } from "@/components/offline/waiting-line";
import { Button } from "@/components/ui/button";
import { formatAreaFt2 } from "@/components/ui/format";
import { formatDate, formatTime } from "@/lib/dates";
import { outbox, requestBackgroundSync } from "@/lib/offline/client";
import { visitStatus, zonesLeft, zoneStatuses } from "@/lib/offline/overlay";
import { sendJson } from "@/lib/query-client";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import type { VisitDetailDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";

import { clearVisitDrafts } from "./draft-store";
import { VisitStatusBadge, ZoneStatusBadge } from "./status-badge";
import { CallOffStop, StopOutcome } from "./stop-outcome";
import { useMergeApplication, useMergePhoto, useMergeZoneCheck, useVisit } from "./use-visit";
import { mayChange, useEntryDialogs } from "./visit-entries";
import { AuditTrail, VisitSummary } from "./visit-summary";
import { ZoneCheckForm } from "./zone-check-form";

function currentPosition(): Promise<{ latitude: number | null; longitude: number | null }> {
  return new Promise((resolve) => {
    if (!("geolocation" in navigator)) return resolve({ latitude: null, longitude: null });
    navigator.geolocation.getCurrentPosition(
      (p) =>
        resolve({
          latitude: Number(p.coords.latitude.toFixed(5)),
          longitude: Number(p.coords.longitude.toFixed(5)),
        }),
      () => resolve({ latitude: null, longitude: null }),
      { timeout: 8000, maximumAge: 60_000 },
    );
  });
}

export function VisitRunner({
  visitId,
  isManager,
  alerts,
}: {
  visitId: string;
  isManager: boolean;
  alerts?: ReactNode;
}) {
  const { data: visit } = useVisit(visitId);
  const mergeCheck = useMergeZoneCheck(visitId);
  const mergePhoto = useMergePhoto(visitId);
  const mergeApplication = useMergeApplication(visitId);
  const queryClient = useQueryClient();
  const router = useRouter();
  const pathname = usePathname();
  const searchParams = useSearchParams();
  const [message, setMessage] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);
  // A finished visit's correction reason: typed, then committed when the field is left (or on
  // Enter), so a half-typed reason is never the one saved in the audit trail.
  const [reasonDraft, setReasonDraft] = useState("");
  const [correctionReason, setCorrectionReason] = useState("");
  const waiting = useWaitingOps(visitId);
  const t = useTranslations("offline");
  const locale = useLocale();
  if (!visit) return null;

  const zoneId = searchParams.get("zone");
  const zone = visit.zones.find((z) => z.id === zoneId);
  const checkOf = (id: string) => visit.checks.find((c) => c.zoneId === id);
  const openZone = (id: string | null) =>
    router.replace(id ? `${pathname}?zone=${id}` : pathname, { scroll: true });
  // What the phone has queued, laid over the server's copy (lib/offline/overlay.ts).
  const zoneStatus = zoneStatuses(visit, waiting);
  const remaining = zonesLeft(visit, waiting);
  const status = visitStatus(visit, waiting);
  const queuedStart = waiting.find((op) => op.kind === "start");
  const queuedFinish = waiting.find((op) => op.kind === "finish");
  const waitingOf = (zoneId: string) => waiting.filter((op) => op.zoneId === zoneId).length;
  const setVisit = (next: VisitDetailDto) =>
    queryClient.setQueryData(visitKeys.detail(visitId), next);
  const zoneName = (id: string | null) => visit.zones.find((z) => z.id === id)?.name ?? "—";
  const waitingBar = (
    <>
      <HeldOps
        // The open zone's own conflict is settled in its form, side by side.
        ops={waiting.filter((op) => !(op.kind === "zone-check" && op.zoneId === zoneId))}
        zoneName={zoneName}
        onOpenZone={(id) => openZone(id)}
      />
      <WaitingLine
        ops={waiting}
        timeZone={visit.timeZone}
        onSendNow={() => void outbox().replay({ now: true })}
        className="mb-4"
      />
    </>
  );

  /** Queues an operation the server could not take now (no signal); the outbox sends it later. */
  async function queue(kind: "start" | "finish", payload: Record<string, unknown>) {
    await outbox().enqueue({ kind, visitId, zoneId: null, clientId: visitId, payload });
    requestBackgroundSync();
  }

  async function start() {
    setIsBusy(true);
    setMessage(null);
    const body = { ...(await currentPosition()), startedAt: new Date().toISOString() };
    const result = navigator.onLine
      ? await sendJson<VisitDetailDto>("POST", `/api/v1/visits/${visitId}/start`, body)
      : null;
    setIsBusy(false);
    if (result?.ok) {
      setVisit(result.data);
      if (result.data.zones[0]) openZone(result.data.zones[0].id);
    } else if (!result || result.status === 0) {
      await queue("start", body);
      if (visit?.zones[0]) openZone(visit.zones[0].id);
    } else setMessage(result.error.message);
  }

  async function finish() {
    setIsBusy(true);
    setMessage(null);
    // Behind anything still queued for this visit: the server sees the zones first.
    if (!navigator.onLine || waiting.length) {
      await queue("finish", {});
      void outbox().replay({ now: true });
      setIsBusy(false);
      return;
    }
    const result = await sendJson<VisitDetailDto>("POST", `/api/v1/visits/${visitId}/finish`, {});
    setIsBusy(false);
    if (!result.ok && result.status === 0) await queue("finish", {});
    else if (result.ok) {
      clearVisitDrafts(visitId);
      setVisit(result.data);
      void queryClient.invalidateQueries({ queryKey: visitKeys.all });
      openZone(null);
      router.refresh(); // the alerts raised by this visit come from the server
    } else setMessage(result.error.message);
  }

  const header = (
    <header className="mb-4 space-y-1">
      <div className="flex flex-wrap items-center gap-2">
        <h1 className="text-2xl font-bold sm:text-3xl">{visit.propertyName}</h1>
        <VisitStatusBadge status={status} cancelKind={visit.outcome?.kind} />
      </div>
      <p className="flex items-center gap-1.5 text-muted">
        <MapPin className="size-4 shrink-0" aria-hidden="true" />
        {visit.address}
      </p>
      <p>
        {PLANNED_SERVICES[visit.plannedService]} · {formatDate(visit.scheduledFor)} ·{" "}
        {visit.technician?.name ?? "no technician"}
      </p>
      {visit.weather?.status === "ok" ? (
        <p className="text-sm text-ink">
          Weather: {Math.round(visit.weather.tmaxF)}/{Math.round(visit.weather.tminF)} °F · humidity{" "}
          {visit.weather.rhMinPct ?? "—"}–{visit.weather.rhMaxPct ?? "—"} % · wind{" "}
          {visit.weather.windMph ?? "—"} mph · rain {visit.weather.precipIn.toFixed(2)} in
        </p>
      ) : visit.weather?.status === "unavailable" ? (
        <p className="text-sm text-muted">
          Weather unavailable for now; it is added when the service answers.
        </p>
      ) : null}
    </header>
  );

  if (visit.status === "completed" && !zone) {
    return (
      <>
        {header}
        {alerts}
        <VisitSummary
          visit={visit}
          isManager={isManager}
          onEditZone={isManager ? openZone : undefined}
        />
      </>
    );
  }

  if (zone) {
    const index = visit.zones.indexOf(zone);
    const next = visit.zones[index + 1];
    const species = findGrassSpecies(zone.grassSpecies.key);
    return (
      <>
        <button
          type="button"
          onClick={() => openZone(null)}
          className="mb-3 inline-flex min-h-tap items-center gap-1 font-semibold text-sward"
        >
          <ArrowLeft className="size-5" aria-hidden="true" />
          {visit.propertyName}: all zones
        </button>
        <header className="mb-4">
          <p className="text-sm font-semibold text-muted">
            Zone {index + 1} of {visit.zones.length}
          </p>
          <div className="flex flex-wrap items-center gap-2">
            <h1 className="text-2xl font-bold">{zone.name}</h1>
            <ZoneStatusBadge status={zoneStatus.get(zone.id) ?? null} />
          </div>
          <p className="text-muted">
            {formatAreaFt2(zone.areaFt2)} · {species?.name ?? zone.grassSpecies.name}
          </p>
        </header>
        {waitingBar}
        {visit.status === "completed" ? (
          <div className="mb-4 space-y-2 rounded-lg bg-sun-tint p-3">
            <p>
              This visit is finished. Your changes are recorded in its audit trail with the reason
              you give here; nothing is saved without one.
            </p>
            <label className="block">
              <span className="mb-1 block font-semibold">Reason for the correction (required)</span>
              <input
                type="text"
                value={reasonDraft}
                onChange={(e) => setReasonDraft(e.target.value)}
                onBlur={() => setCorrectionReason(reasonDraft)}
                onKeyDown={(e) => {
                  if (e.key === "Enter") setCorrectionReason(reasonDraft);
                }}
                maxLength={500}
                placeholder="What was wrong, e.g. misread in shade"
                className="min-h-tap w-full rounded-lg border border-line bg-paper px-3"
              />
            </label>
          </div>
        ) : null}
        <ZoneEntries visit={visit} isManager={isManager}>
          {(entries) => (
            <ZoneCheckForm
              key={zone.id}
              visitId={visit.id}
              zone={zone}
              serverCheck={checkOf(zone.id)}
              canEdit={visit.canEdit}
              timeZone={visit.timeZone}
              onSaved={(check) => {
                mergeCheck(check);
                if (visit.status === "completed")
                  void queryClient.invalidateQueries({ queryKey: visitKeys.audit(visitId) });
              }}
              correctionReason={
                visit.status === "completed" ? correctionReason.trim() || null : null
              }
              entries={entries}
              photos={visit.photos.filter((p) => p.zoneId === zone.id)}
              onPhotoUploaded={mergePhoto}
              applications={visit.applications}
              onApplicationRecorded={mergeApplication}
              ruleSetId={visit.ruleSetId}
              isManager={isManager}
              weather={visit.weather?.status === "ok" ? visit.weather : null}
              lastCheck={visit.lastChecks.find((c) => c.zoneId === zone.id)}
              waiting={waiting}
              footer={
                <>
                  <Button
                    type="button"
                    variant="secondary"
                    // On a phone the link above the zone's name leads back; the bar keeps Next wide.
                    className="hidden shrink-0 sm:inline-flex"
                    onClick={() => openZone(null)}
                  >
                    <List className="size-5" aria-hidden="true" />
                    All zones
                  </Button>
                  <Button
                    type="button"
                    className="min-w-0 flex-1 px-3"
                    onClick={() => openZone(next ? next.id : null)}
                  >
                    <span className="truncate">
                      {next ? `Next: ${next.name}` : "Review and finish"}
                    </span>
                    <ArrowRight className="size-5 shrink-0" aria-hidden="true" />
                  </Button>
                </>
              }
            />
          )}
        </ZoneEntries>
      </>
    );
  }

  return (
    <>
      {header}
      {waitingBar}
      {queuedStart && visit.status === "scheduled" ? (
        <p className="mb-4 rounded-lg border border-line bg-card p-3" role="status">
          {t("startWaiting", {
            time: formatTime(String(queuedStart.payload["startedAt"]), visit.timeZone, locale),
          })}
        </p>
      ) : null}
      {queuedFinish ? (
        <p
          className="mb-4 rounded-lg border border-rain bg-rain-tint p-3 font-semibold"
          role="status"
        >
          {t("finishWaiting")}
        </p>
      ) : null}
      {visit.notes ? (
        <p className="mb-4 rounded-lg border border-line bg-card p-3">Office note: {visit.notes}</p>
      ) : null}
      <h2 className="mb-2 text-xl font-bold">Zones</h2>
      <ul className="space-y-2" aria-label="Zones of this visit">
        {visit.zones.map((z) => (
          <li key={z.id}>
            <button
              type="button"
              disabled={status === "scheduled" || status === "cancelled" || !visit.canEdit}
              onClick={() => openZone(z.id)}
              className="flex min-h-tap w-full items-center justify-between gap-3 rounded-xl border border-line bg-card p-4 text-left shadow-sm hover:border-sward disabled:opacity-60"
            >
              <span>
                <span className="block text-lg font-bold">{z.name}</span>
                <span className="block text-sm text-muted">
                  {formatAreaFt2(z.areaFt2)} · {z.grassSpecies.name}
                </span>
              </span>
              <span className="flex shrink-0 flex-col items-end gap-1">
                <ZoneStatusBadge status={zoneStatus.get(z.id) ?? null} />
                {waitingOf(z.id) ? (
                  <span className="text-sm font-semibold text-rain">
                    {t("zoneWaiting", { count: waitingOf(z.id) })}
                  </span>
                ) : null}
              </span>
            </button>
          </li>
        ))}
      </ul>
      {message ? (
        <p role="alert" className="mt-4 rounded-lg border border-clay bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <div className="mt-6">
        {visit.outcome ? (
          <StopOutcome
            visit={visit}
            timeZone={visit.timeZone}
            canReschedule
            onRescheduled={(next) => {
              void queryClient.invalidateQueries({ queryKey: visitKeys.all });
              router.push(`/visits/${next.id}`);
            }}
          />
        ) : visit.canEdit ? (
          <CallOffStop
            visit={visit}
            onDone={(next) => {
              setVisit(next);
              void queryClient.invalidateQueries({ queryKey: visitKeys.all });
              router.refresh(); // the alerts follow the canceled visit
            }}
          />
        ) : null}
      </div>
      {/* Edits and deletions on the open visit, the stop called off or moved: in words. */}
      {isManager ? <AuditTrail visitId={visit.id} /> : null}
      {visit.canEdit && (status === "scheduled" || status === "in_progress") ? (
        <div className="sticky bottom-[5.25rem] z-10 mt-6 rounded-xl border border-line bg-card p-2 shadow-lg md:bottom-2">
          {status === "scheduled" ? (
            <Button type="button" className="w-full text-lg" onClick={start} disabled={isBusy}>
              <Play className="size-5" aria-hidden="true" />
              {isBusy ? "Starting…" : "Start visit"}
            </Button>
          ) : (
            <Button
              type="button"
              className="w-full text-lg"
              onClick={finish}
              disabled={isBusy || remaining.length > 0 || !!queuedFinish}
            >
              <CheckCheck className="size-5" aria-hidden="true" />
              {remaining.length > 0
                ? `Finish visit (${visit.zones.length - remaining.length} of ${visit.zones.length} zones done)`
                : isBusy
                  ? "Finishing…"
                  : "Finish visit"}
            </Button>
          )}
        </div>
      ) : null}
    </>
  );
}

/** The Correct/Delete dialogs of a visit, handed to the zone form as callbacks. */
function ZoneEntries({
  visit,
  isManager,
  children,
}: {
  visit: VisitDetailDto;
  isManager: boolean;
  children: (entries: {
    canChange: (authorId: string | null) => boolean;
    deletePhoto: (photo: VisitDetailDto["photos"][number]) => void;
    correctApplication: (a: VisitDetailDto["applications"][number]) => void;
    deleteApplication: (a: VisitDetailDto["applications"][number]) => void;
  }) => ReactNode;
}) {
  const { open, dialog } = useEntryDialogs(visit);
  return (
    <>
      {dialog}
      {children({
        canChange: (authorId) => mayChange(visit, isManager, authorId),
        deletePhoto: (photo) => open({ kind: "delete-photo", photo }),
        correctApplication: (application) => open({ kind: "correct-application", application }),
        deleteApplication: (application) => open({ kind: "delete-application", application }),
      })}
    </>
  );
}
