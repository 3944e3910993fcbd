"use client";

// An on/off observation as a large pressed/unpressed button.
import clsx from "clsx";
import { Check } from "lucide-react";

export function ToggleChip({
  label,
  isOn,
  onChange,
}: {
  label: string;
  isOn: boolean;
  onChange: (isOn: boolean) => void;
}) {
  return (
    <button
      type="button"
      aria-pressed={isOn}
      onClick={() => onChange(!isOn)}
      className={clsx(
        "inline-flex min-h-tap items-center gap-2 rounded-lg border-2 px-3 py-2 text-left font-semibold",
        isOn ? "border-sun bg-sun-tint text-ink" : "border-line bg-card text-ink",
      )}
    >
      <span
        className={clsx(
          "grid size-6 place-items-center rounded border-2",
          isOn ? "border-sun bg-sun text-white" : "border-line",
        )}
        aria-hidden="true"
      >
        {isOn ? <Check className="size-4" /> : null}
      </span>
      {label}
    </button>
  );
}
