// The Sward Index in three bands, the same everywhere an Index is coloured (the book's map, its
// legend, the table beside it). Pure.
//
// The cut-offs follow the 1–9 visual scale the Index is built on (lib/scoring/weights.ts), mapped
// linearly onto 0–100 ((rating − 1) / 8 × 100): a rating of 6 is commonly the lowest acceptable
// turf (NTEP rating guide, common practice) → 62.5, so "low" starts below 60, the same line the
// book's "needs attention" reasons use; a rating of 7 → 75 is where "good" starts.
// Each band has a word and a shape as well as a colour, so it never rests on colour alone.

/** Below this the Index is low (also the book's "needs attention" reason, lib/after-write/summary.ts). */
export const LOW_INDEX = 60;
/** From this the Index is good. */
const GOOD_INDEX = 75;

export const INDEX_BANDS = ["good", "fair", "low", "none"] as const;
export type IndexBand = (typeof INDEX_BANDS)[number];

export function indexBand(index: number | null): IndexBand {
  if (index === null || !Number.isFinite(index)) return "none";
  if (index >= GOOD_INDEX) return "good";
  if (index >= LOW_INDEX) return "fair";
  return "low";
}

/** Word, range, palette colour (tailwind.config.ts) and marker shape of each band. */
export const BAND_STYLE: Record<
  IndexBand,
  { word: string; range: string; color: string; shape: "circle" | "diamond" | "square" | "ring" }
> = {
  good: { word: "Good", range: `${GOOD_INDEX}–100`, color: "#2f6b3a", shape: "circle" },
  fair: {
    word: "Fair",
    range: `${LOW_INDEX}–${GOOD_INDEX - 1}`,
    color: "#8f5e08",
    shape: "diamond",
  },
  low: { word: "Low", range: `below ${LOW_INDEX}`, color: "#a8321f", shape: "square" },
  none: { word: "Not rated yet", range: "no Index yet", color: "#4f5a52", shape: "ring" },
};
