"use client";

// A 1–9 visual rating: 1–5 on the first row (below acceptable), 6–9 on the second (acceptable).
import { ChoiceGroup } from "@/components/ui/choice-group";
import { RATING_SCALE } from "@/lib/reference/visit-options";

const LOW = [1, 2, 3, 4, 5].map((n) => ({ value: n, label: String(n), tone: "low" as const }));
const OK = [6, 7, 8, 9].map((n) => ({ value: n, label: String(n), tone: "ok" as const }));

export function RatingPicker({
  id,
  label,
  value,
  onChange,
  error,
  lastValue,
}: {
  id: string;
  label: string;
  value: number | null;
  onChange: (v: number | null) => void;
  error?: string;
  /** The zone's last check's rating (undefined: no last check to compare with). */
  lastValue?: number | null;
}) {
  const hintId = `${id}-hint`;
  return (
    <fieldset className="space-y-2">
      <legend className="flex w-full items-baseline justify-between gap-2 font-bold">
        <span>{label}</span>
        <span className="text-lg">
          {value === null ? <span className="text-muted">not rated</span> : `${value} of 9`}
        </span>
      </legend>
      <p id={hintId} className="text-sm text-muted">
        9 ideal · {RATING_SCALE.acceptable} lowest acceptable
        {lastValue !== undefined ? (
          <>
            {" · "}
            <span className="font-semibold text-ink">
              last check: {lastValue === null ? "not rated" : lastValue}
            </span>
          </>
        ) : null}
      </p>
      <div className="space-y-2">
        <ChoiceGroup
          label={`${label}, below acceptable`}
          choices={LOW}
          value={value !== null && value < 6 ? value : null}
          onChange={onChange}
          describedBy={hintId}
        />
        <ChoiceGroup
          label={`${label}, acceptable`}
          choices={OK}
          value={value !== null && value >= 6 ? value : null}
          onChange={onChange}
          columns={5}
          describedBy={hintId}
        />
      </div>
      {error ? <p className="font-semibold text-clay">{error}</p> : null}
    </fieldset>
  );
}
