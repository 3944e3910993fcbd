"use client";

// A number with big − and + buttons (steps of `step`), for readings taken with one thumb.
import { Minus, Plus } from "lucide-react";

export function Stepper({
  label,
  value,
  onChange,
  step,
  min,
  max,
  unit,
  startAt,
  format = (v) => String(v),
}: {
  label: string;
  value: number | null;
  onChange: (value: number | null) => void;
  step: number;
  min: number;
  max: number;
  unit: string;
  /** Where the first tap lands when there is no value yet. */
  startAt: number;
  format?: (value: number) => string;
}) {
  const round = (v: number) => Math.round(v / step) * step;
  const change = (delta: number) => {
    const next = value === null ? startAt : round(Math.min(max, Math.max(min, value + delta)));
    onChange(Number(next.toFixed(4)));
  };
  return (
    <div className="flex items-center gap-2" role="group" aria-label={label}>
      <button
        type="button"
        aria-label={`${label}: less`}
        onClick={() => change(-step)}
        disabled={value !== null && value <= min}
        className="grid size-12 place-items-center rounded-lg border-2 border-line bg-card disabled:opacity-40"
      >
        <Minus className="size-6" aria-hidden="true" />
      </button>
      <output className="min-w-24 flex-1 text-center text-xl font-bold" aria-live="polite">
        {value === null ? <span className="text-muted">—</span> : `${format(value)} ${unit}`}
      </output>
      <button
        type="button"
        aria-label={`${label}: more`}
        onClick={() => change(step)}
        disabled={value !== null && value >= max}
        className="grid size-12 place-items-center rounded-lg border-2 border-line bg-card disabled:opacity-40"
      >
        <Plus className="size-6" aria-hidden="true" />
      </button>
      {value !== null ? (
        <button
          type="button"
          onClick={() => onChange(null)}
          className="min-h-tap rounded-lg px-2 text-sm font-semibold text-muted underline"
        >
          Clear
        </button>
      ) : null}
    </div>
  );
}
