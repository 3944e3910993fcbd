// From a stored zone check (and its photos) to the Index input: null until the zone is rated.
import type { ZoneCheckValues } from "@/lib/visits/dto";

import type { IndexInput } from "./sward-index";

export function indexInputOf(
  check: Pick<
    ZoneCheckValues,
    "status" | "quality" | "color" | "density" | "uniformity" | "barePct" | "weedsPct" | "symptoms"
  >,
  photos: { greenCoverPct: number; dgci: number | null }[],
): IndexInput | null {
  if (
    check.status === "skipped" ||
    check.quality === null ||
    check.color === null ||
    check.density === null
  )
    return null;
  const dgcis = photos.map((p) => p.dgci).filter((d): d is number => d !== null);
  return {
    qualityRating: check.quality,
    colorRating: check.color,
    densityRating: check.density,
    uniformityRating: check.uniformity ?? undefined,
    bareSoilPct: check.barePct ?? undefined,
    weedPct: check.weedsPct ?? undefined,
    symptoms: check.symptoms.map((s) => ({ severity: s.severity })),
    photo: photos.length
      ? {
          greenCoverPct: photos.reduce((s, p) => s + p.greenCoverPct, 0) / photos.length,
          dgci: dgcis.length ? dgcis.reduce((a, b) => a + b, 0) / dgcis.length : null,
        }
      : undefined,
  };
}
