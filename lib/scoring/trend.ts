// Trends and correlations of the Index, with simple-statistics for the fits and student-t.ts for
// the interval of a slope and the significance of a correlation.
import {
  linearRegression,
  rSquared,
  sampleCorrelation,
  sampleRankCorrelation,
} from "simple-statistics";

import { studentTQuantile, twoSidedP } from "./student-t";
import {
  CORRELATION_ALPHA,
  MIN_CHECKS_FOR_TREND_WORD,
  TREND_CONFIDENCE,
  TREND_THRESHOLD_PER_30_DAYS,
} from "./weights";

const DAY_MS = 86_400_000;

/** Least-squares line y = a + b·x with its coefficient of determination. */
export function linearFit(
  xs: number[],
  ys: number[],
): { intercept: number; slope: number; r2: number } {
  const pairs = xs.map((x, i) => [x, ys[i]!] as [number, number]);
  const { m, b } = linearRegression(pairs);
  const line = (x: number) => b + m * x;
  const allSame = ys.every((y) => y === ys[0]);
  return { intercept: b, slope: m, r2: allSame ? 1 : rSquared(pairs, line) };
}

export interface IndexTrend {
  slopePer30Days: number;
  r2: number;
  n: number;
  /** The 90 % confidence interval of the slope, points per 30 days; null with fewer than 3 points. */
  ciLowPer30Days: number | null;
  ciHighPer30Days: number | null;
}

/**
 * Index slope in points per 30 days by least squares over the points given, with its 90 %
 * interval b ± t(0.95; n − 2) · s / √Sxx, s² = SSE / (n − 2) (the textbook interval of a
 * regression slope, e.g. NIST/SEMATECH e-Handbook of Statistical Methods §4.4.4; Montgomery &
 * Runger, Applied Statistics and Probability for Engineers, §11-4). Null with fewer than 2 points
 * or all on one day.
 */
export function indexTrend(points: { date: string; index: number }[]): IndexTrend | null {
  if (points.length < 2) return null;
  const t0 = Date.parse(`${points[0]!.date}T00:00:00Z`);
  const xs = points.map((p) => (Date.parse(`${p.date}T00:00:00Z`) - t0) / DAY_MS);
  if (xs.every((x) => x === xs[0])) return null; // all on one day: no slope
  const ys = points.map((p) => p.index);
  const fit = linearFit(xs, ys);
  const n = points.length;
  let ciLow: number | null = null;
  let ciHigh: number | null = null;
  if (n >= 3) {
    const meanX = xs.reduce((s, x) => s + x, 0) / n;
    const sxx = xs.reduce((s, x) => s + (x - meanX) ** 2, 0);
    const sse = xs.reduce((s, x, i) => s + (ys[i]! - (fit.intercept + fit.slope * x)) ** 2, 0);
    const se = Math.sqrt(sse / (n - 2) / sxx);
    const half = studentTQuantile(1 - (1 - TREND_CONFIDENCE) / 2, n - 2) * se;
    ciLow = (fit.slope - half) * 30;
    ciHigh = (fit.slope + half) * 30;
  }
  return {
    slopePer30Days: fit.slope * 30,
    r2: fit.r2,
    n,
    ciLowPer30Days: ciLow,
    ciHighPer30Days: ciHigh,
  };
}

export type TrendWord = "improving" | "steady" | "declining";

/**
 * A plain word for a trend, or null when the checks do not support one:
 * - fewer than MIN_CHECKS_FOR_TREND_WORD (5) checks: no word;
 * - "improving" / "declining": the 90 % interval of the slope excludes zero (the slope differs
 *   from zero at the 10 % level, two-sided) and the slope itself is at least
 *   TREND_THRESHOLD_PER_30_DAYS (2) points per 30 days that way;
 * - "steady": the whole 90 % interval lies within ±2 points per 30 days — equivalence shown by
 *   two one-sided tests at 5 % each (Schuirmann 1987, J. Pharmacokinet. Biopharm. 15:657–680:
 *   the 90 % interval inside the equivalence margins);
 * - anything else (a wide interval that includes zero, or a small change): no word, shown as
 *   "no clear trend".
 */
export function trendWord(
  trend: Pick<IndexTrend, "slopePer30Days" | "n" | "ciLowPer30Days" | "ciHighPer30Days"> | null,
): TrendWord | null {
  if (!trend || trend.n < MIN_CHECKS_FOR_TREND_WORD) return null;
  const { slopePer30Days: b, ciLowPer30Days: lo, ciHighPer30Days: hi } = trend;
  if (lo === null || hi === null) return null;
  const margin = TREND_THRESHOLD_PER_30_DAYS;
  if (lo > 0 && b >= margin) return "improving";
  if (hi < 0 && b <= -margin) return "declining";
  if (lo > -margin && hi < margin) return "steady";
  return null;
}

/**
 * Two-sided p-value of a correlation coefficient r over n pairs, from t = r·√(n − 2) / √(1 − r²)
 * with n − 2 degrees of freedom (the standard test of H0: ρ = 0 for Pearson's r; for Spearman's ρ
 * the same t is the usual large-sample approximation). 0 when |r| = 1.
 */
export function correlationPValue(r: number, n: number): number {
  if (n < 3) return 1;
  if (Math.abs(r) >= 1) return 0;
  const t = (r * Math.sqrt(n - 2)) / Math.sqrt(1 - r * r);
  return twoSidedP(t, n - 2);
}

export interface Correlation {
  pearson: number;
  spearman: number;
  n: number;
  /** Two-sided p-value of Pearson's r (correlationPValue). */
  pPearson: number;
  /** Pearson's r differs from zero at CORRELATION_ALPHA (two-sided). */
  isSignificant: boolean;
}

/** Pearson and Spearman correlation with n and the significance of r; null below the minimum sample (default 6). */
export function correlate(xs: number[], ys: number[], minimum = 6): Correlation | null {
  if (xs.length !== ys.length || xs.length < minimum) return null;
  if (xs.every((x) => x === xs[0]) || ys.every((y) => y === ys[0])) return null; // no variation, no correlation
  const pearson = sampleCorrelation(xs, ys);
  const pPearson = correlationPValue(pearson, xs.length);
  return {
    pearson,
    spearman: sampleRankCorrelation(xs, ys),
    n: xs.length,
    pPearson,
    isSignificant: pPearson < CORRELATION_ALPHA,
  };
}
