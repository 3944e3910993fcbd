"use client";

// A stop called off as a whole — rained out or canceled, with a reason — and, once called off,
// what happened and the day offered to reschedule it. On Today, in the visit runner and on the
// manager's visits of the day. Zone checks already saved are kept with the visit (never deleted)
// and count nowhere, which the form says before anything is sent.
import { CalendarPlus, CloudRain, XCircle } from "lucide-react";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";

import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import type { CancelKind } from "@/db/schema";
import { formatDate, formatDateTime, isIsoDate } from "@/lib/dates";
import { sendJson } from "@/lib/query-client";
import type { VisitDetailDto, VisitSummaryDto } from "@/lib/visits/dto";
import {
  CANCEL_KINDS,
  CANCEL_REASON_MAX,
  cancelVisitSchema,
  rescheduleVisitSchema,
} from "@/lib/visits/stop-outcomes";

const checksKept = (n: number) =>
  n === 0
    ? null
    : `${n === 1 ? "The zone check" : `The ${n} zone checks`} already saved ${n === 1 ? "stays" : "stay"} with this visit, but ${n === 1 ? "it does" : "they do"} not count toward the Sward Index, the book or alerts.`;

/** The form that calls a scheduled or started stop off. */
export function CallOffStop({
  visit,
  onDone,
}: {
  visit: Pick<VisitSummaryDto, "id" | "status" | "propertyName" | "savedChecks">;
  onDone: (visit: VisitDetailDto) => void;
}) {
  const id = useId();
  const [isOpen, setIsOpen] = useState(false);
  const [kind, setKind] = useState<CancelKind>("rained_out");
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);
  if (visit.status !== "scheduled" && visit.status !== "in_progress") return null;

  async function submit(event: React.FormEvent) {
    event.preventDefault();
    const parsed = cancelVisitSchema.safeParse({ outcome: kind, reason });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? "Reason: say why the stop did not happen.");
      return;
    }
    setIsBusy(true);
    setError(null);
    const result = await sendJson<VisitDetailDto>(
      "POST",
      `/api/v1/visits/${visit.id}/cancel`,
      parsed.data,
    );
    setIsBusy(false);
    if (!result.ok) {
      setError(result.error.fieldErrors?.reason?.[0] ?? result.error.message);
      return;
    }
    setIsOpen(false);
    onDone(result.data);
  }

  if (!isOpen)
    return (
      <Button type="button" variant="secondary" className="w-full" onClick={() => setIsOpen(true)}>
        <CloudRain className="size-5" aria-hidden="true" />
        Rained out or canceled
      </Button>
    );

  const kept = checksKept(visit.savedChecks);
  return (
    <form
      onSubmit={submit}
      noValidate
      aria-label={`Call off the stop at ${visit.propertyName}`}
      className="space-y-3 rounded-xl border border-line bg-card p-4"
    >
      <fieldset className="space-y-2">
        <legend className="font-semibold">What happened?</legend>
        <div className="grid grid-cols-2 gap-2">
          {(Object.keys(CANCEL_KINDS) as CancelKind[]).map((k) => (
            <label
              key={k}
              className="flex min-h-tap items-center gap-2 rounded-lg border border-line px-3 has-[:checked]:border-sward has-[:checked]:bg-sward-tint"
            >
              <input
                type="radio"
                name={`${id}-kind`}
                value={k}
                checked={kind === k}
                onChange={() => setKind(k)}
                className="size-5"
              />
              {CANCEL_KINDS[k].label}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="space-y-1">
        <label htmlFor={`${id}-reason`} className="block font-semibold">
          Reason (required)
        </label>
        <textarea
          id={`${id}-reason`}
          value={reason}
          onChange={(e) => {
            setReason(e.target.value);
            setError(null);
          }}
          rows={2}
          maxLength={CANCEL_REASON_MAX}
          aria-invalid={error ? true : undefined}
          aria-describedby={`${id}-count${error ? ` ${id}-error` : ""}`}
          placeholder={
            kind === "rained_out"
              ? "Steady rain since noon, turf saturated"
              : "Customer asked to skip"
          }
          className={inputClass}
        />
        <p id={`${id}-count`} className="text-sm text-muted">
          {reason.length} of {CANCEL_REASON_MAX} characters
        </p>
        {error ? (
          <p id={`${id}-error`} role="alert" className="font-semibold text-clay">
            {error}
          </p>
        ) : null}
      </div>
      {kept ? <p className="rounded-lg bg-sun-tint p-3 text-sm text-ink">{kept}</p> : null}
      <div className="grid grid-cols-2 gap-2">
        <Button type="button" variant="secondary" onClick={() => setIsOpen(false)}>
          Keep the stop
        </Button>
        <Button type="submit" disabled={isBusy}>
          {isBusy ? "Saving…" : kind === "rained_out" ? "Mark rained out" : "Mark canceled"}
        </Button>
      </div>
    </form>
  );
}

/** What happened to a called-off stop, and the day offered to reschedule it. */
export function StopOutcome({
  visit,
  timeZone,
  canReschedule,
  onRescheduled,
}: {
  visit: Pick<VisitSummaryDto, "id" | "outcome">;
  timeZone: string;
  canReschedule: boolean;
  onRescheduled: (next: VisitDetailDto) => void;
}) {
  const id = useId();
  const outcome = visit.outcome;
  const [date, setDate] = useState(outcome?.nextFreeDay ?? "");
  const [error, setError] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);
  if (!outcome) return null;
  const Icon = outcome.kind === "rained_out" ? CloudRain : XCircle;
  const title = outcome.kind ? CANCEL_KINDS[outcome.kind].done : "Canceled";
  const kept = checksKept(outcome.keptChecks);

  async function reschedule(event: React.FormEvent) {
    event.preventDefault();
    const parsed = rescheduleVisitSchema.safeParse({ scheduledFor: date });
    if (!parsed.success) {
      setError(parsed.error.issues[0]?.message ?? "Date: choose the day for the new visit.");
      return;
    }
    setIsBusy(true);
    setError(null);
    const result = await sendJson<VisitDetailDto>(
      "POST",
      `/api/v1/visits/${visit.id}/reschedule`,
      parsed.data,
    );
    setIsBusy(false);
    if (!result.ok) {
      setError(result.error.fieldErrors?.scheduledFor?.[0] ?? result.error.message);
      return;
    }
    onRescheduled(result.data);
  }

  return (
    <div className="space-y-2 rounded-xl border border-line bg-card p-3 text-ink">
      <p className="flex items-center gap-1.5 font-semibold">
        <Icon className="size-5 shrink-0" aria-hidden="true" />
        {title}
        {outcome.reason ? `: ${outcome.reason}` : ""}
      </p>
      {outcome.by || outcome.at ? (
        <p className="text-sm text-muted">
          {[outcome.by, outcome.at ? formatDateTime(outcome.at, timeZone) : null]
            .filter(Boolean)
            .join(", ")}
        </p>
      ) : null}
      {kept ? <p className="text-sm">{kept}</p> : null}
      {outcome.rescheduled ? (
        <p className="flex items-center gap-1.5">
          <CalendarPlus className="size-5 shrink-0" aria-hidden="true" />
          Rescheduled for{" "}
          <Link href={`/visits/${outcome.rescheduled.visitId}`}>
            {formatDate(outcome.rescheduled.scheduledFor)}
          </Link>
        </p>
      ) : canReschedule ? (
        <form onSubmit={reschedule} noValidate className="space-y-2">
          {outcome.nextFreeDay ? (
            <p className="text-sm">Next free day: {formatDate(outcome.nextFreeDay)}</p>
          ) : null}
          <div className="flex flex-wrap items-end gap-2">
            <div className="space-y-1">
              <label htmlFor={`${id}-date`} className="block text-sm font-semibold">
                New visit on
              </label>
              <input
                id={`${id}-date`}
                type="date"
                value={date}
                onChange={(e) => {
                  setDate(e.target.value);
                  setError(null);
                }}
                aria-invalid={error ? true : undefined}
                className={inputClass}
              />
            </div>
            <Button type="submit" disabled={isBusy}>
              <CalendarPlus className="size-5" aria-hidden="true" />
              {isBusy
                ? "Rescheduling…"
                : isIsoDate(date)
                  ? `Reschedule for ${formatDate(date)}`
                  : "Reschedule"}
            </Button>
          </div>
          {error ? (
            <p role="alert" className="font-semibold text-clay">
              {error}
            </p>
          ) : null}
        </form>
      ) : null}
    </div>
  );
}

/** On a server-rendered page (the manager's visits of the day): reloads it once rescheduled. */
export function RefreshingStopOutcome({
  visit,
  timeZone,
}: {
  visit: Pick<VisitSummaryDto, "id" | "outcome">;
  timeZone: string;
}) {
  const router = useRouter();
  return (
    <StopOutcome
      visit={visit}
      timeZone={timeZone}
      canReschedule
      onRescheduled={() => router.refresh()}
    />
  );
}
