"use client";

// A row of large radio-like buttons (one choice, or none). Keyboard: arrows move, space picks.
import clsx from "clsx";

export interface Choice<T extends string | number> {
  value: T;
  label: string;
  tone?: "low" | "ok";
}

export function ChoiceGroup<T extends string | number>({
  label,
  choices,
  value,
  onChange,
  columns,
  allowClear = true,
  describedBy,
}: {
  label: string;
  choices: Choice<T>[];
  value: T | null;
  onChange: (value: T | null) => void;
  columns?: number;
  allowClear?: boolean;
  describedBy?: string;
}) {
  return (
    <div
      role="radiogroup"
      aria-label={label}
      aria-describedby={describedBy}
      className="grid gap-2"
      style={{ gridTemplateColumns: `repeat(${columns ?? choices.length}, minmax(0, 1fr))` }}
    >
      {choices.map((choice) => {
        const isChecked = choice.value === value;
        return (
          <button
            key={String(choice.value)}
            type="button"
            role="radio"
            aria-checked={isChecked}
            onClick={() => onChange(isChecked && allowClear ? null : choice.value)}
            className={clsx(
              "min-h-tap rounded-lg border-2 px-2 py-2 text-base font-semibold transition-colors",
              isChecked
                ? "border-sward bg-sward text-white"
                : choice.tone === "low"
                  ? "border-line bg-clay-tint text-ink hover:border-clay"
                  : "border-line bg-card text-ink hover:border-sward",
            )}
          >
            {choice.label}
          </button>
        );
      })}
    </div>
  );
}
