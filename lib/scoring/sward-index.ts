// The Sward Index (0–100) of a zone check, from its ratings, photo metrics and penalties.
// Weights and their reasons: lib/scoring/weights.ts.
import { DGCI_SPAN, INDEX_PENALTIES, INDEX_WEIGHTS } from "./weights";

export interface IndexInput {
  qualityRating: number;
  colorRating: number;
  densityRating: number;
  uniformityRating?: number;
  bareSoilPct?: number;
  weedPct?: number;
  symptoms?: { severity: 1 | 2 | 3 }[];
  photo?: { greenCoverPct: number; dgci: number | null };
}

const clamp = (x: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, x));
/** A 1–9 rating on 0–100. */
const ratingScore = (r: number) => (clamp(r, 1, 9) - 1) * 12.5;

export function swardIndex(check: IndexInput): { index: number; parts: Record<string, number> } {
  const scores: Partial<Record<keyof typeof INDEX_WEIGHTS, number>> = {
    quality: ratingScore(check.qualityRating),
    color: ratingScore(check.colorRating),
    density: ratingScore(check.densityRating),
  };
  if (check.uniformityRating !== undefined) scores.uniformity = ratingScore(check.uniformityRating);
  if (check.photo) {
    scores.cover = clamp(check.photo.greenCoverPct, 0, 100);
    if (check.photo.dgci !== null)
      scores.dgci = clamp(
        ((check.photo.dgci - DGCI_SPAN.low) / (DGCI_SPAN.high - DGCI_SPAN.low)) * 100,
        0,
        100,
      );
  }
  let weightSum = 0;
  let weighted = 0;
  for (const [key, score] of Object.entries(scores) as [keyof typeof INDEX_WEIGHTS, number][]) {
    weightSum += INDEX_WEIGHTS[key];
    weighted += INDEX_WEIGHTS[key] * score;
  }
  const base = weighted / weightSum;
  const barePenalty = Math.min(
    INDEX_PENALTIES.maxBare,
    INDEX_PENALTIES.perBarePct * clamp(check.bareSoilPct ?? 0, 0, 100),
  );
  const weedPenalty = Math.min(
    INDEX_PENALTIES.maxWeeds,
    INDEX_PENALTIES.perWeedPct * clamp(check.weedPct ?? 0, 0, 100),
  );
  const symptomPenalty = Math.min(
    INDEX_PENALTIES.maxSymptoms,
    (check.symptoms ?? []).reduce((s, x) => s + INDEX_PENALTIES.symptomBySeverity[x.severity], 0),
  );
  const index = clamp(base - barePenalty - weedPenalty - symptomPenalty, 0, 100);
  return {
    index: Math.round(index * 10) / 10,
    parts: { ...scores, base, barePenalty, weedPenalty, symptomPenalty },
  };
}

/** Property index: the area-weighted mean of the zones checked at a visit. */
export function propertyIndex(zones: { index: number; areaFt2: number }[]): number | null {
  const area = zones.reduce((s, z) => s + z.areaFt2, 0);
  if (!zones.length || area <= 0) return null;
  return Math.round((zones.reduce((s, z) => s + z.index * z.areaFt2, 0) / area) * 10) / 10;
}
