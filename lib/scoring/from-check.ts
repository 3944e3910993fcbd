// From a zone check's values (and its photos' figures) to the Index input: null until the zone
// is rated. Pure: the caller maps its row or its input to this shape.
import { lightingOf } from "@/lib/photo-analysis/color";

import type { IndexInput } from "./sward-index";

/** What the Index reads of a zone check (a subset of the check's values). */
export interface CheckRatings {
  status: "draft" | "done" | "skipped";
  quality: number | null;
  color: number | null;
  density: number | null;
  uniformity: number | null;
  barePct: number | null;
  weedsPct: number | null;
  symptoms: { severity: 1 | 2 | 3 }[];
}

/** A photo's measured figures (lib/photos/analyze.ts). */
export interface PhotoFigures {
  greenCoverPct: number;
  dgci: number | null;
  darkPct: number;
  clippedPct: number;
}

export function indexInputOf(check: CheckRatings, allPhotos: PhotoFigures[]): IndexInput | null {
  if (
    check.status === "skipped" ||
    check.quality === null ||
    check.color === null ||
    check.density === null
  )
    return null;
  // A photo too dark or too bright to measure (lib/photo-analysis/color.ts, LIGHTING) is shown with its
  // caution but not scored: its cover could be off by as many points as the unreadable share.
  const photos = allPhotos.filter((p) => lightingOf(p.darkPct, p.clippedPct) === "ok");
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
