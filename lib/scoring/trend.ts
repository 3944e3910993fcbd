// Trends and correlations of the Index, with simple-statistics for the statistics.
import {
  linearRegression,
  rSquared,
  sampleCorrelation,
  sampleRankCorrelation,
} from "simple-statistics";

import { TREND_THRESHOLD_PER_30_DAYS } from "./weights";

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

/** Index slope in points per 30 days by least squares over the points given; null with fewer than 2. */
export function indexTrend(
  points: { date: string; index: number }[],
): { slopePer30Days: number; r2: number; n: number } | null {
  if (points.length < 2) return null;
  const t0 = Date.parse(`${points[0]!.date}T00:00:00Z`);
  const xs = points.map((p) => (Date.parse(`${p.date}T00:00:00Z`) - t0) / DAY_MS);
  if (xs.every((x) => x === xs[0])) return null; // all on one day: no slope
  const fit = linearFit(
    xs,
    points.map((p) => p.index),
  );
  return { slopePer30Days: fit.slope * 30, r2: fit.r2, n: points.length };
}

export type TrendWord = "improving" | "steady" | "declining";

/** A plain word for a trend: ± TREND_THRESHOLD_PER_30_DAYS points per 30 days, with at least 3 checks. */
export function trendWord(trend: { slopePer30Days: number; n: number } | null): TrendWord | null {
  if (!trend || trend.n < 3) return null;
  if (trend.slopePer30Days >= TREND_THRESHOLD_PER_30_DAYS) return "improving";
  if (trend.slopePer30Days <= -TREND_THRESHOLD_PER_30_DAYS) return "declining";
  return "steady";
}

/** Pearson and Spearman correlation with n; null below the minimum sample (default 6). */
export function correlate(
  xs: number[],
  ys: number[],
  minimum = 6,
): { pearson: number; spearman: number; n: number } | null {
  if (xs.length !== ys.length || xs.length < minimum) return null;
  if (xs.every((x) => x === xs[0]) || ys.every((y) => y === ys[0])) return null; // no variation, no correlation
  return {
    pearson: sampleCorrelation(xs, ys),
    spearman: sampleRankCorrelation(xs, ys),
    n: xs.length,
  };
}
