// A zone's and a property's Index history, put beside its feeding, watering and weather (pure).
// The queries gather the rows (lib/scoring/queries.ts); everything computed from them is here.
//
// Readings we chose, and why:
// - Trend: least squares over the checks of the last TREND_WINDOW_DAYS days before the latest
//   check, in points per 30 days with its 90 % interval; a word needs at least 5 checks and an
//   interval that excludes zero ("improving"/"declining") or lies within ±2 ("steady"); see
//   trendWord in lib/scoring/trend.ts.
// - Season: the calendar year of the latest check. Cool-season lawns in the northern states are
//   fed and scored from spring green-up to late fall, so a year is one season (common practice).
// - Nitrogen and water are taken *before* the check: an application made at the same visit comes
//   after the technician looked at the zone, so it cannot explain what was seen. Plant-available N
//   is the prior 45 days (lib/scoring/available-nitrogen.ts) up to the day before the check; the
//   water balance is the 14 days ending the day before (rain + watering − Kc × ETo).
// - A zone "responds to N" when Pearson's r of Index vs available N is significant (two-sided
//   p < 0.05 by t = r√(n−2)/√(1−r²)) and both Pearson and Spearman r are at least
//   RESPONDS_TO_N_R = 0.3, Cohen's "medium" correlation (J. Cohen, Statistical Power Analysis for
//   the Behavioral Sciences, 2nd ed., 1988: r = .1 small, .3 medium, .5 large; from memory).
//   Significance first: r = 0.5 over 6 checks has p = 0.31, no evidence of any pattern.
//   It is a pattern, not proof: correlation is not cause.
import { addDays } from "@/lib/dates";
import type { DerivedDay } from "@/lib/weather/derived";

import { availableNitrogen } from "./available-nitrogen";
import { propertyIndex } from "./sward-index";
import {
  correlate,
  indexTrend,
  trendWord,
  type Correlation,
  type IndexTrend,
  type TrendWord,
} from "./trend";

const TREND_WINDOW_DAYS = 120;
export const MIN_CHECKS_FOR_CORRELATION = 6;
export const NITROGEN_WINDOW_DAYS = 45;
export const RESPONDS_TO_N_R = 0.3;

export interface IndexPoint {
  date: string;
  index: number;
}

export interface CheckPoint extends IndexPoint {
  visitId: string;
  hasPhoto: boolean;
}

export interface NitrogenEvent {
  date: string;
  nLb: number; // lb N / 1,000 ft²
  wsnLb: number;
  productName: string;
}

export interface Trend extends IndexTrend {
  word: TrendWord | null;
}

export interface SeasonChange {
  from: IndexPoint;
  to: IndexPoint;
  change: number;
}

/** Trend over the TREND_WINDOW_DAYS before the latest point (points in any order). */
export function recentTrend(points: IndexPoint[]): Trend | null {
  const sorted = [...points].sort((a, b) => a.date.localeCompare(b.date));
  const latest = sorted.at(-1);
  if (!latest) return null;
  const since = addDays(latest.date, -TREND_WINDOW_DAYS);
  const trend = indexTrend(sorted.filter((p) => p.date >= since));
  return trend ? { ...trend, word: trendWord(trend) } : null;
}

/** Change from the first check of the latest point's calendar year to the latest; null with one. */
export function seasonChange(points: IndexPoint[]): SeasonChange | null {
  const sorted = [...points].sort((a, b) => a.date.localeCompare(b.date));
  const to = sorted.at(-1);
  if (!to) return null;
  const from = sorted.find((p) => p.date.slice(0, 4) === to.date.slice(0, 4))!;
  if (from === to) return null;
  return { from, to, change: to.index - from.index };
}

interface CorrelationPair {
  date: string;
  index: number;
  availableNLb: number;
  balance14In: number | null;
}

export interface ZoneCorrelations {
  pairs: CorrelationPair[];
  nitrogen: Correlation | null;
  water: Correlation | null;
  /** Checks counted; below MIN_CHECKS_FOR_CORRELATION there is "not enough visits yet". */
  n: number;
  respondsToNitrogen: boolean | null;
}

/**
 * Index against the N available before each check and the 14-day water balance before it.
 * `days` are the zone's derived weather days (with its own Kc and watering); checks without a
 * weather day the day before get no water value and are left out of the water correlation only.
 */
export function zoneCorrelations(
  checks: IndexPoint[],
  applications: NitrogenEvent[],
  days: DerivedDay[],
): ZoneCorrelations {
  const sorted = [...checks].sort((a, b) => a.date.localeCompare(b.date));
  const byDate = new Map(days.map((d) => [d.date, d]));
  const nInputs = applications.map((a) => ({
    date: a.date,
    wsnLb: a.wsnLb,
    slowLb: Math.max(0, a.nLb - a.wsnLb),
  }));
  const pairs = sorted.map((c) => {
    const dayBefore = addDays(c.date, -1);
    return {
      date: c.date,
      index: c.index,
      availableNLb: availableNitrogen(nInputs, dayBefore, NITROGEN_WINDOW_DAYS),
      balance14In: byDate.get(dayBefore)?.balance14In ?? null,
    };
  });
  const withWater = pairs.filter(
    (p): p is CorrelationPair & { balance14In: number } => p.balance14In !== null,
  );
  const nitrogen = correlate(
    pairs.map((p) => p.availableNLb),
    pairs.map((p) => p.index),
    MIN_CHECKS_FOR_CORRELATION,
  );
  const water = correlate(
    withWater.map((p) => p.balance14In),
    withWater.map((p) => p.index),
    MIN_CHECKS_FOR_CORRELATION,
  );
  return {
    pairs,
    nitrogen,
    water,
    n: pairs.length,
    respondsToNitrogen: nitrogen
      ? nitrogen.isSignificant &&
        nitrogen.pearson >= RESPONDS_TO_N_R &&
        nitrogen.spearman >= RESPONDS_TO_N_R
      : null,
  };
}

export interface PropertyVisitIndex {
  visitId: string;
  date: string;
  index: number;
  zonesChecked: number;
  areaCheckedFt2: number;
}

/**
 * The property index of each visit: the area-weighted mean of the zones checked at that visit
 * (zones skipped or not yet rated are left out, so a visit is scored on what was seen).
 */
export function propertyIndexByVisit(
  checks: { visitId: string; date: string; index: number; areaFt2: number }[],
): PropertyVisitIndex[] {
  const byVisit = new Map<string, { date: string; zones: { index: number; areaFt2: number }[] }>();
  for (const c of checks) {
    const entry = byVisit.get(c.visitId) ?? { date: c.date, zones: [] };
    entry.zones.push({ index: c.index, areaFt2: c.areaFt2 });
    byVisit.set(c.visitId, entry);
  }
  return [...byVisit.entries()]
    .map(([visitId, v]) => ({
      visitId,
      date: v.date,
      index: propertyIndex(v.zones)!,
      zonesChecked: v.zones.length,
      areaCheckedFt2: v.zones.reduce((s, z) => s + z.areaFt2, 0),
    }))
    .sort((a, b) => a.date.localeCompare(b.date) || a.visitId.localeCompare(b.visitId));
}

/** Property-wide N per application date: area-weighted lb N / 1,000 ft² over the whole lawn. */
export function propertyNitrogenEvents(
  applications: (NitrogenEvent & { areaFt2: number })[],
  lawnAreaFt2: number,
): NitrogenEvent[] {
  const byDate = new Map<string, NitrogenEvent>();
  for (const a of applications) {
    if (a.nLb <= 0) continue;
    const share = lawnAreaFt2 > 0 ? a.areaFt2 / lawnAreaFt2 : 0;
    const e = byDate.get(a.date) ?? { date: a.date, nLb: 0, wsnLb: 0, productName: a.productName };
    e.nLb += a.nLb * share;
    e.wsnLb += a.wsnLb * share;
    if (!e.productName.split(", ").includes(a.productName))
      e.productName = `${e.productName}, ${a.productName}`;
    byDate.set(a.date, e);
  }
  return [...byDate.values()].sort((a, b) => a.date.localeCompare(b.date));
}

/** Counts of property indexes in bins of 10 points (0–9, 10–19, …, 90–100). */
export function indexDistribution(
  indexes: number[],
): { from: number; to: number; count: number }[] {
  const bins = Array.from({ length: 10 }, (_, i) => ({
    from: i * 10,
    to: i === 9 ? 100 : i * 10 + 9,
    count: 0,
  }));
  for (const x of indexes) bins[Math.min(9, Math.max(0, Math.floor(x / 10)))]!.count++;
  return bins;
}
