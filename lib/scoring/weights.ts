// The Sward Index weights and penalties: the one place to change them (and the reasons).
//
// Ratings carry most of the Index because they are the trade's own judgement on the 1–9 visual
// scale (9 = ideal, 6 = lowest acceptable; NTEP rating guide, common practice):
// - overall quality 0.35: already the evaluator's summary of the zone;
// - density 0.20: thin turf is what lets weeds and disease in, and what customers notice first;
// - colour 0.15: matters, but responds to a feeding within weeks, so it is weighed below density;
// - uniformity 0.10: a patchy lawn reads worse than its average.
// Photo metrics, when a photo exists, add a measured view of the same things:
// - green canopy cover 0.10 (Patrignani & Ochsner 2015 pixel rule) and DGCI 0.10 (Karcher &
//   Richardson 2003, averaged over the same canopy pixels), DGCI mapped from 0.25 (straw) to 0.65
//   (very dark green) onto 0–100 — the span of turf values reported for lawns in the DGCI
//   studies, from memory. A chlorotic yellow-green canopy (DGCI about 0.29) scores low on colour
//   while still counting as cover. A photo under the lighting caution is not scored
//   (lib/scoring/from-check.ts).
// Missing parts drop out and the remaining weights are rescaled, so a check without a photo is
// scored on its ratings alone.
// Penalties are subtracted after the weighted mean, so added bare ground, weeds or disease can
// only lower the Index:
// - bare ground 0.5 point per %, at most 40: bare soil is lost turf and an open door for weeds;
// - weeds 0.25 point per %, at most 20: a weedy lawn is still turf cover;
// - each symptom 5 / 10 / 20 points for severity 1 / 2 / 3, at most 40 in all: active disease or
//   insect damage is the clearest sign a zone needs attention.
export const INDEX_WEIGHTS = {
  quality: 0.35,
  density: 0.2,
  color: 0.15,
  uniformity: 0.1,
  cover: 0.1,
  dgci: 0.1,
} as const;

export const DGCI_SPAN = { low: 0.25, high: 0.65 } as const;

export const INDEX_PENALTIES = {
  perBarePct: 0.5,
  maxBare: 40,
  perWeedPct: 0.25,
  maxWeeds: 20,
  symptomBySeverity: { 1: 5, 2: 10, 3: 20 } as const,
  maxSymptoms: 40,
} as const;

/**
 * Trend words (lib/scoring/trend.ts, trendWord): a change is a slope of at least this many Index
 * points per 30 days whose 90 % interval excludes zero; "steady" needs the whole interval within
 * ± this margin.
 */
export const TREND_THRESHOLD_PER_30_DAYS = 2;
/** A trend word needs at least this many checks in the 120-day window. */
export const MIN_CHECKS_FOR_TREND_WORD = 5;
/** Two-sided confidence level of the slope interval. */
export const TREND_CONFIDENCE = 0.9;
/** Correlation words need Pearson's r significant at this two-sided level. */
export const CORRELATION_ALPHA = 0.05;
