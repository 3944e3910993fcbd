// The risk rule catalogue (pure): each rule takes what Sward knows about a zone or a property on
// a day and answers { raised, severity, evidence, source, summary }. The evaluator
// (lib/after-write/alerts.ts) gathers the inputs; nothing here reads a database or a clock.
//
// Thresholds we chose, and why (each rule's `source` names where it comes from):
// - Matted canopy is high when a disease is already showing in the zone, else moderate.
// - Warm and humid (matted canopy): 5-day mean ≥ 20 °C (68 °F) and 5-day mean RH ≥ 70 %. At
//   20 °C the Smith et al. (2018) dollar spot model crosses its 20 % action threshold near
//   RH5 69 %, so this is where the published disease weather starts to count.
// - Drought: the 14-day balance (rain + watering − Kc × ETo) at or below −1.0 in — a week's
//   summer water need unmet ("about 1 inch a week", common practice) — with less than 0.25 in of
//   rain forecast in the next 3 days; −2.0 in or worse is high. Wilt observed raises it too.
// - Heat feeding: N applied when the high reaches 90 °F (32.2 °C) on the day or the 2 days after,
//   with less than 0.1 in of rain in those days (common practice: do not push N on heat-stressed
//   turf); looked at for 7 days after the application.
// - Mowing too short: the cut below the species' range (University of Tennessee table), or the
//   one-third rule read between checks: a cut lower than two thirds of the previous check's cut
//   means more than a third of the blade came off at once (common practice, extension-wide).
// - Declining Index: the zone's trend word is "declining" (slope ≤ −2 points per 30 days over
//   120 days, n ≥ 3; lib/scoring/weights.ts); −6 or worse is high.
// - Late-season feeding: cool-season turf, from 1 September to the start of the rule set's
//   blackout (else 30 November), with no N since 1 September — a reminder (low).
import { findSymptom } from "@/lib/reference/symptoms";

import {
  BROWN_PATCH_THRESHOLD,
  brownPatchIndex,
  DOLLAR_SPOT_THRESHOLD,
  dollarSpotProbability,
  estimateHoursRhAbove90,
  PYTHIUM,
  pythiumWeatherRisk,
} from "./models";

export type AlertKind =
  | "matted_canopy"
  | "dollar_spot_weather"
  | "brown_patch_weather"
  | "pythium_weather"
  | "drought_stress"
  | "heat_feeding"
  | "over_application"
  | "blackout_application"
  | "mowing_too_short"
  | "torn_tips"
  | "declining_index"
  | "late_season_feeding";

export type Severity = "low" | "moderate" | "high";

export interface Evidence {
  values: Record<string, number | string | boolean | null>;
  threshold: string;
  window: string;
}

export interface RuleResult {
  kind: AlertKind;
  raised: boolean;
  severity: Severity;
  evidence: Evidence;
  source: string;
  /** What was found, in plain words (shown with the evidence). */
  summary: string;
}

const WARM_HUMID = { tMean5dC: 20, rhMean5dPct: 70 } as const;
const DROUGHT = {
  balance14In: -1,
  highBalance14In: -2,
  forecastRainIn: 0.25,
  forecastDays: 3,
} as const;
const HEAT_FEEDING = { tmaxF: 90, rainIn: 0.1, daysAfter: 2, lookbackDays: 7 } as const;
const DECLINE = { highSlopePer30Days: -6 } as const;
const SAME_DIRECTION_CHECKS = 3;

const SOURCES = {
  matted:
    "Common practice; Kansas State University extension turf advice: mowing the same way every time lays the blades over and mats them, cutting air movement and favouring fungal disease in hot, humid weather. Warm-humid thresholds from the Smith et al. (2018) dollar spot model.",
  dollarSpot:
    "Smith, Kerns, Walker et al. (2018), PLoS ONE 13(3): e0194216 — 20 % action threshold.",
  brownPatch:
    "Fidanza, Dernoeden & Grybauskas (1996), Phytopathology 86:385–390 — two-variable index, warning at 6.",
  pythium: "Nutter, Cole & Schein (1983), Plant Disease 67:1126.",
  drought:
    "Common practice: about 1 inch of water a week in summer; balance = rain + watering − Kc × reference ET (FAO-56).",
  heat: "Common practice: do not push nitrogen on turf stressed by heat and drought.",
  mowing:
    "University of Tennessee height-of-cut table (via trade press); the one-third rule (common practice, extension-wide).",
  tornTips: "Common practice: dull blades tear leaf tips, which brown and let disease in.",
  decline: "Sward trend: least squares over 120 days (lib/scoring/history.ts).",
  lateSeason:
    "Common practice: a late-season nitrogen feeding for cool-season turf in the fall, before the ground freezes.",
} as const;

const round = (x: number, d = 2) => Math.round(x * 10 ** d) / 10 ** d;
const quiet = (kind: AlertKind, source: string, evidence: Evidence, summary = ""): RuleResult => ({
  kind,
  raised: false,
  severity: "low",
  evidence,
  source,
  summary,
});

/** One day of weather as the rules read it (°F and inches, as the derived weather gives them). */
export interface RiskDay {
  date: string;
  isForecast: boolean;
  tmaxF: number;
  tminF: number;
  rhMeanPct: number | null;
  rhMinPct: number | null;
  rhMaxPct: number | null;
  rainIn: number;
  tmean5dF: number;
  rhMean5dPct: number | null;
}

export interface CheckFacts {
  date: string;
  mowingDirection: "same" | "changed" | "unknown" | null;
  isMatted: boolean;
  isScalped: boolean;
  hasTornTips: boolean;
  heightOfCutIn: number | null;
  symptomKeys: string[];
}

const dayOf = (days: RiskDay[], date: string) => days.find((d) => d.date === date);
const f2c = (f: number) => ((f - 32) * 5) / 9;

/** Matted canopy: one mowing direction at 3 checks running, or matting seen, in warm humid weather. */
export function mattedCanopy(checks: CheckFacts[], days: RiskDay[], at: string): RuleResult {
  const last = checks.slice(-SAME_DIRECTION_CHECKS);
  const sameRun =
    last.length === SAME_DIRECTION_CHECKS && last.every((c) => c.mowingDirection === "same");
  const matted = checks.at(-1)?.isMatted ?? false;
  const d = dayOf(days, at);
  const t5 = d ? f2c(d.tmean5dF) : null;
  const rh5 = d?.rhMean5dPct ?? null;
  const warmHumid =
    t5 !== null && rh5 !== null && t5 >= WARM_HUMID.tMean5dC && rh5 >= WARM_HUMID.rhMean5dPct;
  const evidence: Evidence = {
    values: {
      sameDirectionChecks: last.filter((c) => c.mowingDirection === "same").length,
      mattingSeen: matted,
      tMean5dC: t5 === null ? null : round(t5, 1),
      rhMean5dPct: rh5 === null ? null : round(rh5, 0),
    },
    threshold: `${SAME_DIRECTION_CHECKS} checks in a row mowed the same way, or matting seen; and 5-day means ≥ ${WARM_HUMID.tMean5dC} °C and ≥ ${WARM_HUMID.rhMean5dPct} % RH`,
    window: `the last ${SAME_DIRECTION_CHECKS} checks; the 5 days to ${at}`,
  };
  if (!(sameRun || matted) || !warmHumid) return quiet("matted_canopy", SOURCES.matted, evidence);
  const disease = (checks.at(-1)?.symptomKeys ?? []).filter(
    (k) => findSymptom(k)?.kind === "disease",
  );
  evidence.values.diseaseSeen = disease.length > 0;
  return {
    kind: "matted_canopy",
    raised: true,
    severity: disease.length ? "high" : "moderate",
    evidence,
    source: SOURCES.matted,
    summary: `${sameRun ? `Mowed the same direction at the last ${SAME_DIRECTION_CHECKS} checks` : "Matted, laid-over grass seen"}${disease.length ? ", with disease already showing," : ""} while the weather is warm and humid (${round(t5!, 1)} °C, ${round(rh5!, 0)} % RH over 5 days): fungus risk. Vary the mowing direction every few mowings where the slope allows.`,
  };
}

export function dollarSpotWeather(days: RiskDay[], at: string): RuleResult {
  const d = dayOf(days, at);
  const t5 = d ? f2c(d.tmean5dF) : null;
  const rh5 = d?.rhMean5dPct ?? null;
  const p = t5 !== null && rh5 !== null ? dollarSpotProbability(rh5, t5) : null;
  const evidence: Evidence = {
    values: {
      tMean5dC: t5 === null ? null : round(t5, 1),
      rhMean5dPct: rh5 === null ? null : round(rh5, 0),
      probabilityPct: p === null ? null : round(p * 100, 1),
    },
    threshold: `probability ≥ ${DOLLAR_SPOT_THRESHOLD * 100} % (model defined for 5-day means of 10–35 °C)`,
    window: `the 5 days to ${at}`,
  };
  if (p === null || p < DOLLAR_SPOT_THRESHOLD)
    return quiet("dollar_spot_weather", SOURCES.dollarSpot, evidence);
  return {
    kind: "dollar_spot_weather",
    raised: true,
    severity: p >= 0.5 ? "high" : "moderate",
    evidence,
    source: SOURCES.dollarSpot,
    summary: `Dollar spot weather: ${round(p * 100, 0)} % probability from the last 5 days (threshold ${DOLLAR_SPOT_THRESHOLD * 100} %).`,
  };
}

export function brownPatchWeather(days: RiskDay[], at: string): RuleResult {
  const recent = days.filter((d) => d.date <= at && !d.isForecast).slice(-3);
  const scored = recent
    .filter((d) => d.rhMeanPct !== null)
    .map((d) => ({ date: d.date, e: brownPatchIndex(d.rhMeanPct!, f2c(d.tminF)) }));
  const worst = scored.reduce<{ date: string; e: number } | null>(
    (m, x) => (m === null || x.e > m.e ? x : m),
    null,
  );
  const evidence: Evidence = {
    values: { highestIndex: worst ? round(worst.e, 2) : null, on: worst?.date ?? null },
    threshold: `index ≥ ${BROWN_PATCH_THRESHOLD}`,
    window: `the 3 days to ${at}`,
  };
  if (!worst || worst.e < BROWN_PATCH_THRESHOLD)
    return quiet("brown_patch_weather", SOURCES.brownPatch, evidence);
  return {
    kind: "brown_patch_weather",
    raised: true,
    severity: "moderate",
    evidence,
    source: SOURCES.brownPatch,
    summary: `Brown patch weather: index ${round(worst.e, 1)} on ${worst.date} (warning at ${BROWN_PATCH_THRESHOLD}): humid nights above about 20 °C.`,
  };
}

export function pythiumWeather(days: RiskDay[], at: string): RuleResult {
  const recent = days.filter((d) => d.date <= at && !d.isForecast).slice(-3);
  const hit = recent.find((d) =>
    pythiumWeatherRisk({
      tmaxC: f2c(d.tmaxF),
      tminC: f2c(d.tminF),
      hoursRhAbove90: estimateHoursRhAbove90(d.rhMinPct, d.rhMaxPct),
    }),
  );
  const evidence: Evidence = {
    values: hit
      ? {
          on: hit.date,
          tmaxC: round(f2c(hit.tmaxF), 1),
          tminC: round(f2c(hit.tminF), 1),
          hoursRhAbove90: round(estimateHoursRhAbove90(hit.rhMinPct, hit.rhMaxPct), 1),
        }
      : { days: recent.length },
    threshold: `Tmax > ${PYTHIUM.tmaxAboveC} °C, Tmin > ${PYTHIUM.tminAboveC} °C, ≥ ${PYTHIUM.hoursRhAbove90AtLeast} h of RH > 90 % (hours estimated from the day's RH range)`,
    window: `the 3 days to ${at}`,
  };
  if (!hit) return quiet("pythium_weather", SOURCES.pythium, evidence);
  return {
    kind: "pythium_weather",
    raised: true,
    severity: "high",
    evidence,
    source: SOURCES.pythium,
    summary: `Pythium blight weather on ${hit.date}: a hot day followed by a long humid night above 20 °C.`,
  };
}

export function droughtStress(
  balance14In: number | null,
  days: RiskDay[],
  at: string,
  latest: CheckFacts | undefined,
): RuleResult {
  const forecastRain = days
    .filter((d) => d.isForecast && d.date > at)
    .slice(0, DROUGHT.forecastDays)
    .reduce((s, d) => s + d.rainIn, 0);
  const wilt = latest?.symptomKeys.includes("wilt") ?? false;
  const evidence: Evidence = {
    values: {
      balance14In: balance14In === null ? null : round(balance14In),
      forecastRainIn: round(forecastRain),
      wiltSeen: wilt,
    },
    threshold: `14-day balance ≤ ${DROUGHT.balance14In} in with < ${DROUGHT.forecastRainIn} in of rain forecast in ${DROUGHT.forecastDays} days, or wilt seen`,
    window: `the 14 days to ${at} and the next ${DROUGHT.forecastDays}`,
  };
  const dry =
    balance14In !== null &&
    balance14In <= DROUGHT.balance14In &&
    forecastRain < DROUGHT.forecastRainIn;
  if (!dry && !wilt) return quiet("drought_stress", SOURCES.drought, evidence);
  const high =
    (balance14In !== null && balance14In <= DROUGHT.highBalance14In && dry) || (wilt && dry);
  return {
    kind: "drought_stress",
    raised: true,
    severity: high ? "high" : "moderate",
    evidence,
    source: SOURCES.drought,
    summary: dry
      ? `Dry: ${round(-balance14In!, 1)} in short over 14 days with little rain forecast${wilt ? ", and wilt seen" : ""}. Water deeply and early.`
      : "Wilt seen at the last check.",
  };
}

export interface ApplicationFacts {
  date: string;
  nLb: number;
  productName: string;
  findings: { key: string; severity: string; message: string }[];
}

export function heatFeeding(
  applications: ApplicationFacts[],
  days: RiskDay[],
  at: string,
): RuleResult {
  const since = new Date(Date.parse(`${at}T00:00:00Z`) - HEAT_FEEDING.lookbackDays * 86_400_000)
    .toISOString()
    .slice(0, 10);
  for (const a of applications.filter((x) => x.nLb > 0 && x.date >= since && x.date <= at)) {
    const around = days.filter(
      (d) =>
        d.date >= a.date &&
        d.date <=
          new Date(Date.parse(`${a.date}T00:00:00Z`) + HEAT_FEEDING.daysAfter * 86_400_000)
            .toISOString()
            .slice(0, 10),
    );
    const hot = Math.max(-Infinity, ...around.map((d) => d.tmaxF));
    const rain = around.reduce((s, d) => s + d.rainIn, 0);
    if (around.length && hot >= HEAT_FEEDING.tmaxF && rain < HEAT_FEEDING.rainIn) {
      return {
        kind: "heat_feeding",
        raised: true,
        severity: "moderate",
        evidence: {
          values: {
            appliedOn: a.date,
            nLb: round(a.nLb),
            highestF: round(hot, 0),
            rainIn: round(rain),
          },
          threshold: `high ≥ ${HEAT_FEEDING.tmaxF} °F on the day or the ${HEAT_FEEDING.daysAfter} days after, with < ${HEAT_FEEDING.rainIn} in of rain`,
          window: `applications of the ${HEAT_FEEDING.lookbackDays} days to ${at}`,
        },
        source: SOURCES.heat,
        summary: `${round(a.nLb)} lb N (${a.productName}) went down on ${a.date} with highs of ${round(hot, 0)} °F and no rain: watch for burn and stress; water it in.`,
      };
    }
  }
  return quiet("heat_feeding", SOURCES.heat, {
    values: {},
    threshold: `high ≥ ${HEAT_FEEDING.tmaxF} °F with < ${HEAT_FEEDING.rainIn} in of rain`,
    window: `applications of the ${HEAT_FEEDING.lookbackDays} days to ${at}`,
  });
}

/** Over-application: a legal or advised limit breached by an application this year, or the year's N above the species' range. */
export function overApplication(
  applications: ApplicationFacts[],
  annualMaxLb: number | null,
  year: string,
  ruleSetSource: string | null,
): RuleResult {
  const thisYear = applications.filter((a) => a.date.startsWith(year));
  const ytd = thisYear.reduce((s, a) => s + a.nLb, 0);
  const limits = thisYear.flatMap((a) =>
    a.findings
      .filter((f) => f.key === "max_n" || f.key === "max_wsn" || f.key === "min_slow_release")
      .map((f) => ({ date: a.date, ...f })),
  );
  const overYear = annualMaxLb !== null && ytd > annualMaxLb + 1e-9;
  const evidence: Evidence = {
    values: { yearToDateNLb: round(ytd), speciesMaxLb: annualMaxLb, limitBreaches: limits.length },
    threshold: "the rule set's per-application limits; the species' annual N range",
    window: `applications of ${year}`,
  };
  const source = [
    ruleSetSource,
    "Annual N range: University of Illinois (1995) / UF-IFAS recommendations",
  ]
    .filter(Boolean)
    .join(" · ");
  if (!limits.length && !overYear) return quiet("over_application", source, evidence);
  return {
    kind: "over_application",
    raised: true,
    severity: limits.some((l) => l.severity === "refusal") ? "high" : "moderate",
    evidence,
    source,
    summary:
      [
        limits.length
          ? `${limits.length} application${limits.length === 1 ? "" : "s"} over a per-application limit (${limits[0]!.message})`
          : null,
        overYear
          ? `${round(ytd)} lb N this year, above the ${annualMaxLb} lb top of the species' range`
          : null,
      ]
        .filter(Boolean)
        .join("; ") + ".",
  };
}

export function blackoutApplication(
  applications: ApplicationFacts[],
  year: string,
  ruleSetSource: string | null,
): RuleResult {
  const hits = applications.filter(
    (a) => a.date.startsWith(year) && a.findings.some((f) => f.key === "blackout"),
  );
  const evidence: Evidence = {
    values: { applications: hits.length, dates: hits.map((h) => h.date).join(", ") || null },
    threshold: "no fertiliser in the rule set's blackout window",
    window: `applications of ${year}`,
  };
  const source = ruleSetSource ?? "The property's rule set";
  if (!hits.length) return quiet("blackout_application", source, evidence);
  return {
    kind: "blackout_application",
    raised: true,
    severity: "high",
    evidence,
    source,
    summary: `Fertiliser applied in the blackout period on ${hits.map((h) => h.date).join(", ")} (recorded with a manager's override).`,
  };
}

export function mowingTooShort(
  checks: CheckFacts[],
  range: { min: number; max: number } | null,
): RuleResult {
  const latest = checks.at(-1);
  const previous = checks.at(-2);
  const h = latest?.heightOfCutIn ?? null;
  const prev = previous?.heightOfCutIn ?? null;
  const belowRange = h !== null && range !== null && h < range.min;
  const oneThird = h !== null && prev !== null && h < (prev * 2) / 3 - 1e-9;
  const scalped = latest?.isScalped ?? false;
  const evidence: Evidence = {
    values: { heightOfCutIn: h, previousIn: prev, speciesMinIn: range?.min ?? null, scalped },
    threshold:
      "cut below the species' range, or below two thirds of the previous check's cut (one-third rule), or scalping seen",
    window: latest
      ? `the checks of ${previous ? `${previous.date} and ` : ""}${latest.date}`
      : "no check yet",
  };
  if (!belowRange && !oneThird && !scalped)
    return quiet("mowing_too_short", SOURCES.mowing, evidence);
  const reasons = [
    belowRange ? `cut at ${h} in, below the ${range!.min} in bottom of the range` : null,
    oneThird ? `cut dropped from ${prev} in to ${h} in — more than a third at once` : null,
    scalped ? "scalping seen" : null,
  ].filter(Boolean);
  return {
    kind: "mowing_too_short",
    raised: true,
    severity: belowRange || scalped ? "moderate" : "low",
    evidence,
    source: SOURCES.mowing,
    summary: `Mowing too short: ${reasons.join("; ")}. Raise the mowing height.`,
  };
}

export function tornTips(checks: CheckFacts[]): RuleResult {
  const latest = checks.at(-1);
  const evidence: Evidence = {
    values: { tornTipsSeen: latest?.hasTornTips ?? false },
    threshold: "torn, ragged leaf tips seen",
    window: latest ? `the check of ${latest.date}` : "no check yet",
  };
  if (!latest?.hasTornTips) return quiet("torn_tips", SOURCES.tornTips, evidence);
  return {
    kind: "torn_tips",
    raised: true,
    severity: "low",
    evidence,
    source: SOURCES.tornTips,
    summary: "Torn leaf tips: the mower blade needs sharpening.",
  };
}

export function decliningIndex(
  trend: { slopePer30Days: number; r2: number; n: number; word: string | null } | null,
): RuleResult {
  const evidence: Evidence = {
    values: {
      slopePer30Days: trend ? round(trend.slopePer30Days, 1) : null,
      r2: trend ? round(trend.r2, 2) : null,
      n: trend?.n ?? 0,
    },
    threshold: "trend word “declining”: ≤ −2 points per 30 days with n ≥ 3; high at ≤ −6",
    window: "the 120 days to the latest check",
  };
  if (!trend || trend.word !== "declining")
    return quiet("declining_index", SOURCES.decline, evidence);
  return {
    kind: "declining_index",
    raised: true,
    severity: trend.slopePer30Days <= DECLINE.highSlopePer30Days ? "high" : "moderate",
    evidence,
    source: SOURCES.decline,
    summary: `The Index is falling ${round(Math.abs(trend.slopePer30Days), 1)} points per 30 days (n ${trend.n}).`,
  };
}

export function lateSeasonFeeding(
  season: "cool" | "warm",
  applications: ApplicationFacts[],
  at: string,
  blackoutStart: string | null,
): RuleResult {
  const year = at.slice(0, 4);
  const windowStart = `${year}-09-01`;
  const windowEnd =
    blackoutStart && blackoutStart > "09-01" ? `${year}-${blackoutStart}` : `${year}-11-30`;
  const fedSince = applications.filter((a) => a.nLb > 0 && a.date >= windowStart && a.date <= at);
  const inWindow = at >= windowStart && at < windowEnd;
  const evidence: Evidence = {
    values: { nSinceSep1Lb: round(fedSince.reduce((s, a) => s + a.nLb, 0)), season },
    threshold: "cool-season turf with no nitrogen since 1 September",
    window: `${windowStart} to ${windowEnd}`,
  };
  if (season !== "cool" || !inWindow || fedSince.length)
    return quiet("late_season_feeding", SOURCES.lateSeason, evidence);
  return {
    kind: "late_season_feeding",
    raised: true,
    severity: "low",
    evidence,
    source: SOURCES.lateSeason,
    summary: `A late-season feeding is due before ${windowEnd}: no nitrogen since 1 September.`,
  };
}
