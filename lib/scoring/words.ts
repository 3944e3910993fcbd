// Scoring figures in plain words (pure): the sentences under the charts and in the tables.
import { formatDate } from "@/lib/dates";

import type { SeasonChange, Trend } from "./history";
import { TREND_THRESHOLD_PER_30_DAYS } from "./weights";

const signed = (x: number, digits = 1) => `${x >= 0 ? "+" : "−"}${Math.abs(x).toFixed(digits)}`;
/** A coefficient with a true minus sign: −0.84, 0.92. */
export const coefficient = (r: number) => `${r < 0 ? "−" : ""}${Math.abs(r).toFixed(2)}`;

/** Strength of a correlation after Cohen (1988): below .1 none, .1 weak, .3 moderate, .5 strong. */
export function correlationStrength(r: number): "no" | "a weak" | "a moderate" | "a strong" {
  const a = Math.abs(r);
  if (a < 0.1) return "no";
  if (a < 0.3) return "a weak";
  if (a < 0.5) return "a moderate";
  return "a strong";
}

export function correlationSentence(
  what: string,
  c: { pearson: number; spearman: number; n: number },
): string {
  const phrase = patternPhrase(c.pearson);
  return `${phrase[0]!.toUpperCase()}${phrase.slice(1)} with ${what}: Pearson r ${coefficient(c.pearson)}, Spearman ρ ${coefficient(c.spearman)} (n ${c.n}).`;
}

export function trendSentence(trend: Trend | null): string {
  if (!trend || trend.word === null)
    return "Not enough rated checks for a trend yet (at least 3 in 120 days).";
  const word = trend.word[0]!.toUpperCase() + trend.word.slice(1);
  return `${word}: ${signed(trend.slopePer30Days)} points per 30 days over the last 120 days (r² ${trend.r2.toFixed(2)}, n ${trend.n}; steady is within ±${TREND_THRESHOLD_PER_30_DAYS}).`;
}

export function seasonSentence(season: SeasonChange | null): string {
  if (!season) return "One check so far this season.";
  return `Since the first check of the season (${formatDate(season.from.date)}, ${Math.round(season.from.index)}): ${signed(season.change, 0)} points.`;
}

/** "a strong positive pattern", "no pattern"… */
export function patternPhrase(r: number): string {
  const strength = correlationStrength(r);
  return strength === "no"
    ? "no pattern"
    : `${strength} ${r > 0 ? "positive" : "negative"} pattern`;
}
