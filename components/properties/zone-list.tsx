// The zones of a property as cards (readable on a phone), with their facts in words.
import { Droplets, Mountain, Sun } from "lucide-react";
import type { ReactNode } from "react";

import { formatAreaFt2 } from "@/components/ui/format";
import { SLOPE_LABEL, SUN_EXPOSURE_LABEL, type ZoneDto } from "@/lib/properties/dto";

const SEASON_LABEL = { cool: "cool-season", warm: "warm-season" } as const;

export function ZoneList({
  zones,
  actions,
}: {
  zones: ZoneDto[];
  actions?: (zone: ZoneDto) => ReactNode;
}) {
  if (zones.length === 0)
    return (
      <p className="rounded-lg border border-line bg-card p-4">
        No zones are set up for this lawn yet.
      </p>
    );
  return (
    <ul className="grid gap-3 sm:grid-cols-2" aria-label="Zones">
      {zones.map((z) => (
        <li key={z.id} className="rounded-xl border border-line bg-card p-4 shadow-sm">
          <div className="flex items-baseline justify-between gap-2">
            <h3 className="text-lg font-bold">{z.name}</h3>
            <span className="font-semibold whitespace-nowrap">{formatAreaFt2(z.areaFt2)}</span>
          </div>
          <p className="mt-1">
            {z.grassSpecies.name}
            {z.grassSpecies.season ? (
              <span className="text-muted"> · {SEASON_LABEL[z.grassSpecies.season]}</span>
            ) : null}
          </p>
          <ul className="mt-3 flex flex-wrap gap-2 text-sm">
            <li className="inline-flex items-center gap-1 rounded-full bg-sun-tint px-2.5 py-1 text-ink">
              <Sun className="size-4 text-sun" aria-hidden="true" />
              {SUN_EXPOSURE_LABEL[z.sunExposure]}
            </li>
            <li className="inline-flex items-center gap-1 rounded-full bg-rain-tint px-2.5 py-1 text-ink">
              <Droplets className="size-4 text-rain" aria-hidden="true" />
              {z.isIrrigated ? "Irrigated" : "Not irrigated"}
            </li>
            <li className="inline-flex items-center gap-1 rounded-full bg-paper px-2.5 py-1 text-ink ring-1 ring-line">
              <Mountain className="size-4 text-muted" aria-hidden="true" />
              {SLOPE_LABEL[z.slope]}
            </li>
          </ul>
          {actions?.(z)}
        </li>
      ))}
    </ul>
  );
}
