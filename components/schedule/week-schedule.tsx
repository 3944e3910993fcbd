"use client";

// The manager's week: each technician's days with their stops and a capacity bar; stops chosen and
// moved to another day or technician; a rained-out day's stops moved to the next working day.
// Every move is previewed first (where each stop lands, and the warnings), then confirmed.
import clsx from "clsx";
import { CalendarClock, CloudRain, MoveRight } from "lucide-react";
import { useLocale } from "next-intl";
import Link from "next/link";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";

import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { formatDate, formatWeekDay } from "@/lib/dates";
import { sendJson } from "@/lib/query-client";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import type {
  MovePreviewDto,
  ScheduleStopDto,
  ScheduleTechnicianDto,
  WeekScheduleDto,
} from "@/lib/schedule/dto";
import { isWorkingDay } from "@/lib/schedule/plan";
import { CAPACITY_BOUNDS } from "@/lib/schedule/schemas";
import { CANCEL_KINDS } from "@/lib/visits/stop-outcomes";

type Pending =
  | { kind: "move"; visitIds: string[]; toDate: string; technicianId?: string }
  | { kind: "rain"; date: string; technicianId?: string };

const STATUS_WORDS = { in_progress: "In progress", completed: "Finished" } as const;

export function WeekSchedule({ week }: { week: WeekScheduleDto }) {
  const locale = useLocale();
  const router = useRouter();
  const [selected, setSelected] = useState<Set<string>>(new Set());
  const [pending, setPending] = useState<Pending | null>(null);
  const [preview, setPreview] = useState<MovePreviewDto[] | null>(null);
  const [error, setError] = useState<string | null>(null);
  const [done, setDone] = useState<string | null>(null);
  const [isBusy, setIsBusy] = useState(false);

  const rows: (ScheduleTechnicianDto | null)[] = [...week.technicians];
  if (week.stops.some((s) => !s.technicianId)) rows.push(null);
  const movable = (s: ScheduleStopDto) => s.status === "scheduled" && s.scheduledFor >= week.today;

  function toggle(id: string) {
    setSelected((prev) => {
      const next = new Set(prev);
      if (next.has(id)) next.delete(id);
      else next.add(id);
      return next;
    });
  }

  async function ask(what: Pending, confirm: boolean, previewOnly: boolean) {
    setIsBusy(true);
    setError(null);
    setDone(null);
    const { kind, ...body } = what;
    const result = await sendJson<{ items: MovePreviewDto[] }>(
      "POST",
      kind === "move" ? "/api/v1/schedule/moves" : "/api/v1/schedule/rain-delays",
      { ...body, confirm, preview: previewOnly },
    );
    setIsBusy(false);
    if (!result.ok) {
      const details = Object.values(result.error.fieldErrors ?? {}).flat();
      setError([result.error.message, ...details].join(" "));
      return;
    }
    if (previewOnly) {
      setPending(what);
      setPreview(result.data.items);
      return;
    }
    const moved = result.data.items.reduce((n, p) => n + p.moves.length, 0);
    const to = result.data.items[0]?.toDate;
    setDone(
      `Moved ${moved} ${moved === 1 ? "stop" : "stops"}${to ? ` to ${formatDate(to, locale)}` : ""}.`,
    );
    setPending(null);
    setPreview(null);
    setSelected(new Set());
    router.refresh();
  }

  return (
    <div className="space-y-6">
      <RainDelayForEveryone
        week={week}
        onPreview={(date) => ask({ kind: "rain", date }, false, true)}
      />
      {done ? (
        <p role="status" className="rounded-lg bg-sward-tint p-3 text-sward-deep">
          {done}
        </p>
      ) : null}
      {error && !preview ? (
        <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-3 text-clay">
          {error}
        </p>
      ) : null}
      {preview && pending ? (
        <MoveConfirmation
          previews={preview}
          pending={pending}
          error={error}
          isBusy={isBusy}
          onConfirm={() =>
            ask(
              pending,
              preview.some((p) => p.warnings.length > 0),
              false,
            )
          }
          onCancel={() => {
            setPreview(null);
            setPending(null);
            setError(null);
          }}
        />
      ) : null}

      {rows.map((tech) => {
        const stopsOf = (day: string) =>
          week.stops.filter(
            (s) => s.scheduledFor === day && (s.technicianId ?? null) === (tech?.id ?? null),
          );
        return (
          <section
            key={tech?.id ?? "none"}
            aria-labelledby={`tech-${tech?.id ?? "none"}`}
            className="space-y-3"
          >
            <div className="flex flex-wrap items-end justify-between gap-3">
              <h2 id={`tech-${tech?.id ?? "none"}`} className="text-xl font-bold">
                {tech?.name ?? "No technician"}
              </h2>
              {tech ? <CapacityForm technician={tech} /> : null}
            </div>
            <ol className="grid gap-3 lg:grid-cols-7">
              {week.days.map((day) => {
                const stops = stopsOf(day);
                const counted = stops.filter((s) => s.status !== "cancelled").length;
                const capacity = tech?.capacity ?? null;
                const canRainDelay = tech && day >= week.today && stops.some(movable);
                return (
                  <li
                    key={day}
                    aria-label={`${tech?.name ?? "No technician"}, ${formatDate(day, locale)}`}
                    className={clsx(
                      "min-w-0 rounded-xl border p-2",
                      day === week.today ? "border-sward" : "border-line",
                      isWorkingDay(day) ? "bg-card" : "bg-paper",
                    )}
                  >
                    <p className={clsx("font-semibold", stops.length === 0 && "max-lg:inline")}>
                      {formatWeekDay(day, locale)}
                      {day === week.today ? (
                        <span className="ml-1 text-sm text-sward-deep">(today)</span>
                      ) : null}
                    </p>
                    {capacity && stops.length > 0 ? (
                      <CapacityBar count={counted} capacity={capacity} />
                    ) : null}
                    {stops.length === 0 ? (
                      <p className="mt-1 text-sm text-muted max-lg:ml-2 max-lg:inline">
                        {isWorkingDay(day) ? "No stops" : "Not a working day"}
                      </p>
                    ) : (
                      <ol className="mt-2 space-y-1" aria-label="Stops">
                        {stops.map((s) => (
                          <li key={s.id} className="flex items-start gap-2 text-sm">
                            {movable(s) ? (
                              <input
                                type="checkbox"
                                className="mt-1 size-5 shrink-0"
                                checked={selected.has(s.id)}
                                onChange={() => toggle(s.id)}
                                aria-label={`Choose ${s.propertyName} on ${formatDate(day, locale)}`}
                              />
                            ) : (
                              <span className="size-5 shrink-0" aria-hidden="true" />
                            )}
                            <Link
                              href={`/visits/${s.id}`}
                              className={clsx(
                                "min-w-0 break-words",
                                s.status === "cancelled" && "line-through",
                              )}
                            >
                              {s.stopOrder}. {s.propertyName}
                              <span className="block text-muted no-underline">
                                {PLANNED_SERVICES[s.plannedService]}
                                {s.status === "cancelled"
                                  ? ` · ${s.cancelKind ? CANCEL_KINDS[s.cancelKind].done : "Canceled"}`
                                  : s.status === "scheduled"
                                    ? ""
                                    : ` · ${STATUS_WORDS[s.status]}`}
                              </span>
                            </Link>
                          </li>
                        ))}
                      </ol>
                    )}
                    {canRainDelay ? (
                      <Button
                        type="button"
                        variant="secondary"
                        className="mt-2 w-full px-2 text-sm"
                        disabled={isBusy}
                        onClick={() =>
                          ask({ kind: "rain", date: day, technicianId: tech.id }, false, true)
                        }
                      >
                        <CloudRain className="size-4" aria-hidden="true" />
                        Rain delay
                      </Button>
                    ) : null}
                  </li>
                );
              })}
            </ol>
          </section>
        );
      })}

      {selected.size > 0 ? (
        <MoveBar
          count={selected.size}
          week={week}
          isBusy={isBusy}
          onPreview={(toDate, technicianId) =>
            ask({ kind: "move", visitIds: [...selected], toDate, technicianId }, false, true)
          }
          onClear={() => setSelected(new Set())}
        />
      ) : null}
    </div>
  );
}

function CapacityBar({ count, capacity }: { count: number; capacity: number }) {
  const over = count > capacity;
  return (
    <div className="mt-1">
      <div
        className="h-2 overflow-hidden rounded-full bg-paper ring-1 ring-line"
        role="img"
        aria-label={`${count} of ${capacity} stops`}
      >
        <div
          className={clsx("h-full", over ? "bg-clay" : "bg-sward")}
          style={{ width: `${Math.min(100, (count / capacity) * 100)}%` }}
        />
      </div>
      <p className={clsx("text-xs", over ? "font-semibold text-clay" : "text-muted")}>
        {count} of {capacity} stops{over ? " — over capacity" : ""}
      </p>
    </div>
  );
}

function CapacityForm({ technician }: { technician: ScheduleTechnicianDto }) {
  const id = useId();
  const router = useRouter();
  const [value, setValue] = useState(String(technician.capacity));
  const [message, setMessage] = useState<{ ok: boolean; text: string } | null>(null);
  async function save(event: React.FormEvent) {
    event.preventDefault();
    const capacity = Number(value);
    const result = await sendJson<{ capacity: number }>(
      "PUT",
      `/api/v1/schedule/technicians/${technician.id}/capacity`,
      { capacity: value.trim() === "" || !Number.isFinite(capacity) ? value : capacity },
    );
    if (!result.ok) {
      const details = Object.values(result.error.fieldErrors ?? {}).flat();
      setMessage({ ok: false, text: details[0] ?? result.error.message });
      return;
    }
    setMessage({ ok: true, text: `Saved: ${result.data.capacity} stops a day.` });
    router.refresh();
  }
  return (
    <form
      onSubmit={save}
      className="flex flex-wrap items-end gap-2"
      aria-label={`Stops a day for ${technician.name}`}
    >
      <label htmlFor={id} className="text-sm font-semibold">
        Stops a day
        <input
          id={id}
          inputMode="numeric"
          value={value}
          onChange={(e) => setValue(e.target.value)}
          min={CAPACITY_BOUNDS.min}
          max={CAPACITY_BOUNDS.max}
          className={inputClass.replace("w-full", "w-24")}
          aria-invalid={message?.ok === false}
        />
      </label>
      <Button type="submit" variant="secondary">
        Save
      </Button>
      {message ? (
        <p
          role={message.ok ? "status" : "alert"}
          className={clsx("w-full text-sm", message.ok ? "text-sward-deep" : "text-clay")}
        >
          {message.text}
        </p>
      ) : null}
    </form>
  );
}

function RainDelayForEveryone({
  week,
  onPreview,
}: {
  week: WeekScheduleDto;
  onPreview: (date: string) => void;
}) {
  const locale = useLocale();
  const id = useId();
  const days = week.days.filter(
    (d) =>
      d >= week.today && week.stops.some((s) => s.scheduledFor === d && s.status === "scheduled"),
  );
  const [day, setDay] = useState(days[0] ?? "");
  if (days.length === 0) return null;
  return (
    <form
      aria-label="Rain delay for every technician"
      className="flex flex-wrap items-end gap-2 rounded-xl border border-line bg-card p-3"
      onSubmit={(e) => {
        e.preventDefault();
        onPreview(day);
      }}
    >
      <label htmlFor={id} className="font-semibold">
        Rained out for everyone
        <select id={id} value={day} onChange={(e) => setDay(e.target.value)} className={inputClass}>
          {days.map((d) => (
            <option key={d} value={d}>
              {formatDate(d, locale)}
            </option>
          ))}
        </select>
      </label>
      <Button type="submit" variant="secondary">
        <CloudRain className="size-5" aria-hidden="true" />
        Preview the rain delay
      </Button>
      <p className="w-full text-sm text-muted">
        Every stop not yet started that day goes to the next working day (Monday to Saturday), each
        with its technician, in the same order.
      </p>
    </form>
  );
}

function MoveBar({
  count,
  week,
  isBusy,
  onPreview,
  onClear,
}: {
  count: number;
  week: WeekScheduleDto;
  isBusy: boolean;
  onPreview: (toDate: string, technicianId?: string) => void;
  onClear: () => void;
}) {
  const dateId = useId();
  const techId = useId();
  const [toDate, setToDate] = useState("");
  const [technicianId, setTechnicianId] = useState("");
  const [error, setError] = useState<string | null>(null);
  return (
    <form
      aria-label="Move the chosen stops"
      className="sticky bottom-[5.25rem] z-10 flex flex-wrap items-end gap-2 rounded-xl border border-line bg-card p-3 shadow-lg md:bottom-2"
      onSubmit={(e) => {
        e.preventDefault();
        if (!toDate) return setError("Move to: choose a date.");
        setError(null);
        onPreview(toDate, technicianId || undefined);
      }}
    >
      <p className="w-full font-semibold">
        {count} {count === 1 ? "stop" : "stops"} chosen
      </p>
      <label htmlFor={dateId} className="font-semibold">
        Move to
        <input
          id={dateId}
          type="date"
          min={week.today}
          value={toDate}
          onChange={(e) => setToDate(e.target.value)}
          className={inputClass}
          aria-invalid={Boolean(error)}
        />
      </label>
      <label htmlFor={techId} className="font-semibold">
        Technician
        <select
          id={techId}
          value={technicianId}
          onChange={(e) => setTechnicianId(e.target.value)}
          className={inputClass}
        >
          <option value="">Each keeps their technician</option>
          {week.technicians.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
      </label>
      <Button type="submit" disabled={isBusy}>
        <MoveRight className="size-5" aria-hidden="true" />
        Preview the move
      </Button>
      <Button type="button" variant="quiet" onClick={onClear}>
        Clear
      </Button>
      {error ? (
        <p role="alert" className="w-full font-semibold text-clay">
          {error}
        </p>
      ) : null}
    </form>
  );
}

function MoveConfirmation({
  previews,
  pending,
  error,
  isBusy,
  onConfirm,
  onCancel,
}: {
  previews: MovePreviewDto[];
  pending: Pending;
  error: string | null;
  isBusy: boolean;
  onConfirm: () => void;
  onCancel: () => void;
}) {
  const locale = useLocale();
  const total = previews.reduce((n, p) => n + p.moves.length, 0);
  const to = previews[0]?.toDate ?? "";
  const warnings = previews.flatMap((p) => p.warnings);
  return (
    <section
      aria-labelledby="move-preview-title"
      className="space-y-3 rounded-xl border-2 border-sward bg-card p-4"
    >
      <h2 id="move-preview-title" className="flex items-center gap-2 text-xl font-bold">
        <CalendarClock className="size-5" aria-hidden="true" />
        {pending.kind === "rain" ? "Rain delay" : "Move"}: {total} {total === 1 ? "stop" : "stops"}{" "}
        to {formatDate(to, locale)}
      </h2>
      {previews.map((p) => (
        <div key={p.technicianId ?? "none"}>
          <h3 className="font-semibold">{p.technicianName ?? "No technician"}</h3>
          <ol
            className="list-inside list-decimal text-sm"
            aria-label={`Where ${p.technicianName ?? "unassigned"} stops land`}
          >
            {p.moves.map((m) => (
              <li key={m.stopId}>
                {m.propertyName}: stop {m.stopOrder} on {formatDate(p.toDate, locale)} (was{" "}
                {formatDate(m.from, locale)})
              </li>
            ))}
          </ol>
        </div>
      ))}
      {warnings.length ? (
        <div role="alert" className="rounded-lg bg-sun-tint p-3">
          <p className="font-semibold">Check before moving:</p>
          <ul className="list-inside list-disc">
            {warnings.map((w) => (
              <li key={w}>{w}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="text-clay">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={onConfirm} disabled={isBusy}>
          Move {total} {total === 1 ? "stop" : "stops"}
          {warnings.length ? " anyway" : ""}
        </Button>
        <Button type="button" variant="secondary" onClick={onCancel}>
          Keep the schedule as it is
        </Button>
      </div>
    </section>
  );
}
