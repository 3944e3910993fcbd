// Scoring figures in plain words (pure): the sentences under the charts and in the tables.
import { formatDate } from "@/lib/dates";

import type { SeasonChange, Trend } from "./history";
import type { Correlation } from "./trend";
import {
  CORRELATION_ALPHA,
  MIN_CHECKS_FOR_TREND_WORD,
  TREND_THRESHOLD_PER_30_DAYS,
} from "./weights";

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

/** A p-value as printed beside a coefficient: "p 0.31", "p < 0.001". */
export const pValue = (p: number) => (p < 0.001 ? "p < 0.001" : `p ${p.toFixed(p < 0.01 ? 3 : 2)}`);

export function correlationSentence(what: string, c: Correlation): string {
  const phrase = patternPhrase(c);
  const significance = c.isSignificant
    ? pValue(c.pPearson)
    : `${pValue(c.pPearson)}, not significant at ${CORRELATION_ALPHA * 100} %`;
  return `${phrase[0]!.toUpperCase()}${phrase.slice(1)} with ${what}: Pearson r ${coefficient(c.pearson)} (${significance}), Spearman ρ ${coefficient(c.spearman)} (n ${c.n}).`;
}

/**
 * The trend in a sentence with n beside the word. Below MIN_CHECKS_FOR_TREND_WORD checks no slope is
 * given (three noisy checks make a steep line); otherwise the slope with its 90 % interval.
 */
export function trendSentence(trend: Trend | null): string {
  const n = trend?.n ?? 0;
  if (!trend || n < MIN_CHECKS_FOR_TREND_WORD)
    return `Not enough rated checks for a trend yet (n ${n} in the last 120 days; a trend needs at least ${MIN_CHECKS_FOR_TREND_WORD}).`;
  const interval =
    trend.ciLowPer30Days !== null && trend.ciHighPer30Days !== null
      ? `; 90 % interval ${signed(trend.ciLowPer30Days)} to ${signed(trend.ciHighPer30Days)}`
      : "";
  const figures = `${signed(trend.slopePer30Days)} points per 30 days over the last 120 days (n ${n}${interval})`;
  if (trend.word === null)
    return `No clear trend: ${figures}. Improving or declining needs an interval clear of zero; steady, an interval within ±${TREND_THRESHOLD_PER_30_DAYS}.`;
  const word = trend.word[0]!.toUpperCase() + trend.word.slice(1);
  return `${word}: ${figures}.`;
}

export function seasonSentence(season: SeasonChange | null): string {
  if (!season) return "One check so far this season.";
  return `Since the first check of the season (${formatDate(season.from.date)}, ${Math.round(season.from.index)}): ${signed(season.change, 0)} points.`;
}

/**
 * "a strong positive pattern", "no clear pattern"…: the strength word only for an r that is
 * significant (two-sided p < CORRELATION_ALPHA); r = 0.5 over 6 checks (p 0.31) is no clear pattern.
 */
export function patternPhrase(c: Pick<Correlation, "pearson" | "isSignificant">): string {
  const strength = correlationStrength(c.pearson);
  return !c.isSignificant || strength === "no"
    ? "no clear pattern"
    : `${strength} ${c.pearson > 0 ? "positive" : "negative"} pattern`;
}
