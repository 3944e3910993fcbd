// Nitrogen applied to a zone this year against its species' annual range, in words and a bar.
import { findGrassSpecies } from "@/lib/reference/grass-species";

export function NitrogenToDate({
  nLb,
  speciesKey,
  year,
}: {
  nLb: number;
  speciesKey: string;
  year: string;
}) {
  const range = findGrassSpecies(speciesKey)?.annualNitrogenLb;
  const max = range?.max ?? 4;
  const isOver = range ? nLb > range.max : false;
  const word = !range
    ? ""
    : isOver
      ? "above the range"
      : nLb >= range.min
        ? "within the range"
        : "below the range so far";
  return (
    <div className="mt-3 text-sm">
      <p>
        <span className="font-semibold">N in {year}:</span> {nLb.toFixed(2)} lb / 1,000 ft²
        {range ? ` (species range ${range.min}–${range.max} lb/yr; ${word})` : ""}
      </p>
      <div
        className="mt-1 h-2 w-full overflow-hidden rounded-full bg-paper ring-1 ring-line"
        aria-hidden="true"
      >
        <div
          className={`h-full ${isOver ? "bg-clay" : "bg-sward"}`}
          style={{ width: `${Math.min(100, (100 * nLb) / Math.max(max, 0.01))}%` }}
        />
      </div>
    </div>
  );
}
