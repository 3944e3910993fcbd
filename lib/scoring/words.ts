// Scoring figures in plain words (pure): the sentences under the charts and in the tables.
import { formatDate } from "@/lib/dates";
import { translator } from "@/lib/i18n/translate";

import type { SeasonChange, Trend } from "./history";
import type { Correlation, TrendWord } from "./trend";
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

/** A change of the Index below this many points reads as "a little" (common practice: about the
 * spread of two ratings of one lawn by one technician; Sward's own choice, not a published value). */
export const SMALL_CHANGE_POINTS = 5;

export type LawnTone = "improving" | "steady" | "declining" | "unclear" | "too-few";

/**
 * The homeowner's headline about their lawn's Index, composed from the trend (the last 120 days)
 * and the change since the season's first visit, so the two can never contradict each other: a
 * "steady" lawn that moved many points over the season says it rose (or fell) and has held there;
 * an improving lawn still below its start says so; a slipping lawn still above its start says so.
 */
export function lawnHeadline(
  input: {
    word: TrendWord | null;
    n: number;
    change: number | null;
    since: string | null;
  },
  locale?: string,
): { tone: LawnTone; sentences: string[] } {
  const t = translator(locale, "lawn");
  const points = input.change === null ? null : Math.round(input.change);
  const date = input.since ? formatDate(input.since, locale) : "";
  const size =
    points === null || !input.since
      ? "none"
      : points === 0
        ? "same"
        : Math.abs(points) < SMALL_CHANGE_POINTS
          ? points > 0
            ? "small-up"
            : "small-down"
          : points > 0
            ? "up"
            : "down";
  const abs = Math.abs(points ?? 0);
  const plainChange = () =>
    size === "up"
      ? t("up", { points: abs, date })
      : size === "down"
        ? t("down", { points: abs, date })
        : size === "small-up"
          ? t("upSmall", { points: abs, date })
          : size === "small-down"
            ? t("downSmall", { points: abs, date })
            : size === "same"
              ? t("same", { date })
              : null;
  const basedOn = t("basedOn", { count: input.n });
  const out = (tone: LawnTone, ...sentences: (string | null)[]) => ({
    tone,
    sentences: sentences.filter((s): s is string => Boolean(s)),
  });
  switch (input.word) {
    case "improving":
      return size === "down" || size === "small-down"
        ? out("improving", t("improving"), t("recoveringBelow", { points: abs, date }), basedOn)
        : size === "same"
          ? out("improving", t("improving"), t("backToStart", { date }), basedOn)
          : out("improving", t("improving"), plainChange(), basedOn);
    case "declining":
      return size === "up" || size === "small-up"
        ? out(
            "declining",
            t("declining"),
            t("slippingAbove", { points: abs, date }),
            t("decliningNext"),
            basedOn,
          )
        : size === "same"
          ? out(
              "declining",
              t("declining"),
              t("backToStart", { date }),
              t("decliningNext"),
              basedOn,
            )
          : out("declining", t("declining"), plainChange(), t("decliningNext"), basedOn);
    case "steady":
      return size === "up"
        ? out("steady", t("heldAfterRise", { points: abs, date }), basedOn)
        : size === "down"
          ? out("steady", t("heldAfterFall", { points: abs, date }), basedOn)
          : out("steady", t("steady"), plainChange(), basedOn);
    default:
      return input.n < MIN_CHECKS_FOR_TREND_WORD
        ? out(
            "too-few",
            t("noTrendYet", { needed: String(MIN_CHECKS_FOR_TREND_WORD), count: input.n }),
            plainChange(),
          )
        : out("unclear", t("noClearTrend"), plainChange(), basedOn);
  }
}
