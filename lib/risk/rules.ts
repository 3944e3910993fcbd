// The risk rule catalogue (pure): each rule takes what Sward knows about a zone or a property on
// a day and answers { raised, severity, evidence, source, summary }. The evaluator
// (lib/after-write/alerts.ts) gathers the inputs; nothing here reads a database or a clock.
//
// Thresholds we chose, and why (each rule's `source` names where it comes from):
// - Matted canopy (kept because crews are taught it): the link between one mowing direction or
//   a laid-over canopy and fungal disease is common practice with no published threshold, so the
//   alert is low, and moderate only when a disease is already showing in the zone (seen, not
//   inferred). Its weather part is the published models' own: the dollar spot model at its 20 %
//   action threshold, or (cool-season zones) the brown patch index at its warning level in the
//   last 3 days. Each disease weather alert carries its own severity.
// - Drought: the 14-day balance (rain + watering − Kc × ETo) at or below −1.0 in — a week's
//   summer water need unmet ("about 1 inch a week", common practice) — with less than 0.25 in of
//   rain forecast in the next 3 days; −2.0 in or worse is high. Wilt observed raises it too.
// - Heat feeding: cool-season zones only. N applied when the high reaches 90 °F (32.2 °C) on the
//   day or the 2 days after, with less than 0.1 in of rain in those days (common practice: do not
//   push N on cool-season turf stressed by heat — it grows best at about 60–75 °F and slows in
//   summer heat); looked at for 7 days after the application. Warm-season grasses (bermuda,
//   zoysia, St. Augustine, centipede, bahia) grow fastest in summer heat and are fed then, so the
//   rule is by season rather than by nitrogen source: a quick-release feeding of bermudagrass at
//   94 °F is the recommended practice, not a risk.
// - Brown patch weather runs for properties with a cool-season zone (the model was built on
//   perennial ryegrass); dollar spot and Pythium run for every property, and every disease alert
//   names the turf its model was built on.
// - Mowing too short: the cut below the bottom of the species' home-lawn range (extension tables,
//   lib/reference/grass-species.ts), or more than a third of the blade taken off at the mowing of
//   this visit — the height before mowing against the height of cut (the one-third rule,
//   lib/reference/mowing.ts). Never read between two checks: they may be weeks and several
//   mowings apart. Moderate below the range, when scalping is seen, or when half the blade or
//   more came off; low for a cut between a third and a half.
// - Declining Index: the zone's trend word is "declining" — at least 5 checks in 120 days, a
//   slope ≤ −2 points per 30 days whose 90 % interval lies below zero (trendWord in
//   lib/scoring/trend.ts); −6 or worse is high.
// - Pre-emergence and seeding: a seed product and a pre-emergence herbicide recorded on one zone
//   closer than the herbicide's interval (the label's, else the typical one —
//   lib/agronomy/seeding.ts), raised while the later of the two is within that interval of the
//   day (the seedlings are still at risk); moderate, since the seeding may fail. The label decides.
// - Late-season feeding: cool-season turf, from 1 September to the start of the rule set's
//   blackout (else 30 November), with no N since 1 September — a reminder (low).
import { seedingConflicts, type ZoneTreatment } from "@/lib/agronomy/seeding";
import { daysBetween, formatShortDate } from "@/lib/dates";
import { mowingReading, ONE_THIRD_RULE } from "@/lib/reference/mowing";
import { findSymptom } from "@/lib/reference/symptoms";

import {
  BROWN_PATCH_THRESHOLD,
  brownPatchIndex,
  DOLLAR_SPOT_THRESHOLD,
  dollarSpotProbability,
  MODEL_TURF,
  PYTHIUM,
  pythiumNight,
  type WeatherHour,
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
  | "late_season_feeding"
  | "seeding_conflict";

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
    "Common practice (taught to crews; Kansas State University extension turf advice): mowing the same way every time lays the blades over and mats them, cutting air movement and favoring fungal disease in hot, humid weather — no published study sets a threshold for it. The weather part is the published disease models': Smith et al. (2018) dollar spot at 20 %; Fidanza et al. (1996) brown patch index at 6.",
  dollarSpot: `Smith, Kerns, Walker et al. (2018), PLoS ONE 13(3): e0194216 — 20 % action threshold. Built on ${MODEL_TURF.dollarSpot}.`,
  brownPatch: `Fidanza, Dernoeden & Grybauskas (1996), Phytopathology 86:385–390 — two-variable index, warning at 6. Built on ${MODEL_TURF.brownPatch}.`,
  pythium: `Nutter, Cole & Schein (1983), Plant Disease 67:1126–1128, on hourly relative humidity. Built on ${MODEL_TURF.pythium}.`,
  drought:
    "Common practice: about 1 inch of water a week in summer; balance = rain + watering − Kc × reference ET (FAO-56).",
  heat: "Common practice (extension-wide): do not push nitrogen on cool-season turf in summer heat and drought; warm-season grasses are fed in summer, their season of growth.",
  mowing: `Home-lawn mowing heights from extension tables (University of Kentucky AGR-209; UF/IFAS “Mowing Your Florida Lawn”; University of Maine); ${ONE_THIRD_RULE.source}`,
  tornTips: "Common practice: dull blades tear leaf tips, which brown and let disease in.",
  decline:
    "Sward trend: least-squares slope over 120 days with its 90 % interval (Student's t, n − 2 degrees of freedom); a word needs at least 5 checks.",
  lateSeason:
    "Common practice: a late-season nitrogen feeding for cool-season turf in the fall, before the ground freezes.",
} as const;

/** A date in evidence and summaries as people read it (US style: "Dec 2, 2026"). */
const day = (iso: string) => formatShortDate(iso);
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
  /** The day's hours as the weather service gave them (local time), when it gave every hour. */
  hourly: { time: string[]; tempC: number[]; rhPct: number[] } | null;
}

export interface CheckFacts {
  date: string;
  mowingDirection: "same" | "changed" | "unknown" | null;
  isMatted: boolean;
  isScalped: boolean;
  hasTornTips: boolean;
  heightOfCutIn: number | null;
  /** Mowed at this visit (true), not mowed today (false), not recorded (null). */
  mowedToday: boolean | null;
  heightBeforeMowingIn: number | null;
  symptomKeys: string[];
}

const dayOf = (days: RiskDay[], date: string) => days.find((d) => d.date === date);
const f2c = (f: number) => ((f - 32) * 5) / 9;

/**
 * Matted canopy: one mowing direction at 3 checks running, or matting seen, while a published
 * disease model is at its action level (dollar spot ≥ 20 %; brown patch index ≥ 6 in the last 3
 * days on cool-season turf). Common practice; low, or moderate when disease already shows.
 */
export function mattedCanopy(
  checks: CheckFacts[],
  days: RiskDay[],
  at: string,
  season: "cool" | "warm",
): RuleResult {
  const last = checks.slice(-SAME_DIRECTION_CHECKS);
  const sameRun =
    last.length === SAME_DIRECTION_CHECKS && last.every((c) => c.mowingDirection === "same");
  const matted = checks.at(-1)?.isMatted ?? false;
  const d = dayOf(days, at);
  const t5 = d ? f2c(d.tmean5dF) : null;
  const rh5 = d?.rhMean5dPct ?? null;
  const p = t5 !== null && rh5 !== null ? dollarSpotProbability(rh5, t5) : null;
  const brownPatch = season === "cool" ? worstBrownPatch(days, at) : null;
  const dollarSpotAtAction = p !== null && p >= DOLLAR_SPOT_THRESHOLD;
  const brownPatchAtAction = brownPatch !== null && brownPatch.e >= BROWN_PATCH_THRESHOLD;
  const evidence: Evidence = {
    values: {
      sameDirectionChecks: last.filter((c) => c.mowingDirection === "same").length,
      mattingSeen: matted,
      practice: "common practice (no published threshold)",
      tMean5dC: t5 === null ? null : round(t5, 1),
      rhMean5dPct: rh5 === null ? null : round(rh5, 0),
      probabilityPct: p === null ? null : round(p * 100, 1),
      highestIndex: brownPatch ? round(brownPatch.e, 2) : null,
      model: "Smith et al. (2018) dollar spot; Fidanza et al. (1996) brown patch (cool-season)",
    },
    threshold: `${SAME_DIRECTION_CHECKS} checks in a row mowed the same way, or matting seen; and dollar spot probability ≥ ${DOLLAR_SPOT_THRESHOLD * 100} % or (cool-season turf) brown patch index ≥ ${BROWN_PATCH_THRESHOLD}`,
    window: `the last ${SAME_DIRECTION_CHECKS} checks; the 5 days to ${day(at)}`,
  };
  if (!(sameRun || matted) || !(dollarSpotAtAction || brownPatchAtAction))
    return quiet("matted_canopy", SOURCES.matted, evidence);
  const disease = (checks.at(-1)?.symptomKeys ?? []).filter(
    (k) => findSymptom(k)?.kind === "disease",
  );
  evidence.values.diseaseSeen = disease.length > 0;
  const weather = [
    dollarSpotAtAction ? `dollar spot weather at ${round(p! * 100, 0)} %` : null,
    brownPatchAtAction ? `brown patch index ${round(brownPatch!.e, 1)}` : null,
  ]
    .filter(Boolean)
    .join(" and ");
  return {
    kind: "matted_canopy",
    raised: true,
    severity: disease.length ? "moderate" : "low",
    evidence,
    source: SOURCES.matted,
    summary: `${sameRun ? `Mowed the same direction at the last ${SAME_DIRECTION_CHECKS} checks` : "Matted, laid-over grass seen"}${disease.length ? ", with disease already showing," : ""} while the disease models read ${weather}${t5 !== null && rh5 !== null ? ` (${round((t5 * 9) / 5 + 32, 0)} °F, ${round(rh5, 0)} % humidity over 5 days)` : ""}: a matted canopy holds moisture (common practice). Vary the mowing direction every few mowings where the slope allows.`,
  };
}

/** The highest brown patch index of the last 3 observed days to `at`, and its day. */
function worstBrownPatch(days: RiskDay[], at: string): { date: string; e: number } | null {
  return days
    .filter((d) => d.date <= at && !d.isForecast)
    .slice(-3)
    .filter((d) => d.rhMeanPct !== null)
    .map((d) => ({ date: d.date, e: brownPatchIndex(d.rhMeanPct!, f2c(d.tminF)) }))
    .reduce<{ date: string; e: number } | null>((m, x) => (m === null || x.e > m.e ? x : m), null);
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
      model: "Smith et al. (2018) logistic model",
      builtOn: MODEL_TURF.dollarSpot,
    },
    threshold: `probability ≥ ${DOLLAR_SPOT_THRESHOLD * 100} % (model defined for 5-day means of 50–95 °F)`,
    window: `the 5 days to ${day(at)}`,
  };
  if (p === null || p < DOLLAR_SPOT_THRESHOLD)
    return quiet("dollar_spot_weather", SOURCES.dollarSpot, evidence);
  return {
    kind: "dollar_spot_weather",
    raised: true,
    severity: p >= 0.5 ? "high" : "moderate",
    evidence,
    source: SOURCES.dollarSpot,
    summary: `Dollar spot weather: ${round(p * 100, 0)} % probability from the last 5 days (threshold ${DOLLAR_SPOT_THRESHOLD * 100} %; a model built on golf-course bentgrass).`,
  };
}

/** Brown patch weather, for a property with cool-season zones (named in `coolSeasonZones`). */
export function brownPatchWeather(
  days: RiskDay[],
  at: string,
  coolSeasonZones: string[],
): RuleResult {
  const worst = coolSeasonZones.length ? worstBrownPatch(days, at) : null;
  const evidence: Evidence = {
    values: {
      highestIndex: worst ? round(worst.e, 2) : null,
      on: worst?.date ?? null,
      coolSeasonZones: coolSeasonZones.join(", ") || null,
      model: "Fidanza et al. (1996) two-variable index",
      builtOn: MODEL_TURF.brownPatch,
    },
    threshold: `index ≥ ${BROWN_PATCH_THRESHOLD}; cool-season zones only`,
    window: `the 3 days to ${day(at)}`,
  };
  if (!worst || worst.e < BROWN_PATCH_THRESHOLD)
    return quiet("brown_patch_weather", SOURCES.brownPatch, evidence);
  return {
    kind: "brown_patch_weather",
    raised: true,
    severity: "moderate",
    evidence,
    source: SOURCES.brownPatch,
    summary: `Brown patch weather: index ${round(worst.e, 1)} on ${day(worst.date)} (warning at ${BROWN_PATCH_THRESHOLD}): humid nights above about 68 °F. For the cool-season zones (${coolSeasonZones.join(", ")}); the model was built on perennial ryegrass.`,
  };
}

/** The hours of the days given, in order, as the models read them. */
const hoursOf = (days: RiskDay[]): WeatherHour[] =>
  days.flatMap((d) =>
    d.hourly
      ? d.hourly.time.map((t, i) => ({
          at: `${d.date}T${t}`,
          tempC: d.hourly!.tempC[i]!,
          rhPct: d.hourly!.rhPct[i]!,
        }))
      : [],
  );

/**
 * Pythium blight weather: a hot day among the 3 days before `at` followed by a humid, warm
 * night, counted on the service's hourly humidity (Nutter et al. 1983). Without the hours of a
 * night the day is not judged (and the evidence says so) — never guessed from daily extremes.
 */
export function pythiumWeather(days: RiskDay[], at: string): RuleResult {
  const observed = days.filter((d) => d.date <= at && !d.isForecast);
  const hours = hoursOf(observed);
  const candidates = observed.filter((d) => d.date < at).slice(-3);
  const nights = candidates.map((d) => ({
    day: d,
    night: pythiumNight({ date: d.date, tmaxC: f2c(d.tmaxF) }, hours),
  }));
  const judged = nights.filter((n) => n.night !== null);
  const hit = judged.find((n) => n.night!.risk);
  const shown =
    hit ??
    judged.reduce<(typeof judged)[number] | null>(
      (m, n) => (m === null || n.night!.hoursRhAbove90 > m.night!.hoursRhAbove90 ? n : m),
      null,
    );
  const evidence: Evidence = {
    values: {
      on: shown?.day.date ?? null,
      tmaxC: shown ? round(f2c(shown.day.tmaxF), 1) : null,
      nightMinC: shown ? round(shown.night!.nightMinC, 1) : null,
      hoursRhAbove90: shown ? shown.night!.hoursRhAbove90 : null,
      nightsJudged: judged.length,
      nightsWithoutHours: nights.length - judged.length,
      model: "Nutter et al. (1983) Pythium blight rule, hourly humidity",
      builtOn: MODEL_TURF.pythium,
    },
    threshold: `high > ${PYTHIUM.tmaxAboveC} °C (86 °F), then ≥ ${PYTHIUM.hoursRhAbove90AtLeast} h of RH > 90 % with the low > ${PYTHIUM.tminAboveC} °C (68 °F), counted hour by hour from noon of the hot day to noon the next`,
    window: `the nights after the 3 days before ${day(at)}`,
  };
  if (!hit) return quiet("pythium_weather", SOURCES.pythium, evidence);
  return {
    kind: "pythium_weather",
    raised: true,
    severity: "high",
    evidence,
    source: SOURCES.pythium,
    summary: `Pythium blight weather after ${day(hit.day.date)}: a high of ${round(hit.day.tmaxF, 0)} °F, then ${hit.night!.hoursRhAbove90} hours above 90 % humidity with the night's low at ${round((hit.night!.nightMinC * 9) / 5 + 32, 0)} °F.`,
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
    window: `the 14 days to ${day(at)} and the next ${DROUGHT.forecastDays}`,
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

/** Feeding under heat stress: cool-season turf only (warm-season grasses are fed in summer). */
export function heatFeeding(
  applications: ApplicationFacts[],
  days: RiskDay[],
  at: string,
  season: "cool" | "warm",
): RuleResult {
  if (season === "warm")
    return quiet("heat_feeding", SOURCES.heat, {
      values: { season },
      threshold: "cool-season turf only: warm-season grasses are fed in summer heat",
      window: `applications of the ${HEAT_FEEDING.lookbackDays} days to ${day(at)}`,
    });
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
            season,
          },
          threshold: `cool-season turf; high ≥ ${HEAT_FEEDING.tmaxF} °F on the day or the ${HEAT_FEEDING.daysAfter} days after, with < ${HEAT_FEEDING.rainIn} in of rain`,
          window: `applications of the ${HEAT_FEEDING.lookbackDays} days to ${day(at)}`,
        },
        source: SOURCES.heat,
        summary: `${round(a.nLb)} lb N (${a.productName}) went down on ${day(a.date)} with highs of ${round(hot, 0)} °F and no rain, on cool-season grass that slows down in summer heat: watch for burn and stress; water it in.`,
      };
    }
  }
  return quiet("heat_feeding", SOURCES.heat, {
    values: { season },
    threshold: `cool-season turf; high ≥ ${HEAT_FEEDING.tmaxF} °F with < ${HEAT_FEEDING.rainIn} in of rain`,
    window: `applications of the ${HEAT_FEEDING.lookbackDays} days to ${day(at)}`,
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
    threshold: "no fertilizer in the rule set's blackout window",
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
    summary: `Fertilizer applied in the blackout period on ${hits.map((h) => day(h.date)).join("; ")} (recorded with a manager's override).`,
  };
}

export function mowingTooShort(
  checks: CheckFacts[],
  range: { min: number; max: number } | null,
): RuleResult {
  const latest = checks.at(-1);
  const h = latest?.heightOfCutIn ?? null;
  const reading = latest ? mowingReading(latest) : null;
  const belowRange = h !== null && range !== null && h < range.min;
  const oneThird = reading?.breaksOneThird ?? false;
  const half = reading !== null && reading.removedShare >= 0.5;
  const scalped = latest?.isScalped ?? false;
  const evidence: Evidence = {
    values: {
      heightOfCutIn: h,
      mowedToday: latest?.mowedToday ?? null,
      heightBeforeMowingIn: latest?.heightBeforeMowingIn ?? null,
      removedPct: reading ? round(reading.removedShare * 100, 0) : null,
      speciesMinIn: range?.min ?? null,
      scalped,
    },
    threshold:
      "cut below the bottom of the species' home-lawn range; more than a third of the blade taken off at this visit's mowing (height before mowing against height of cut: the one-third rule); or scalping seen",
    window: latest ? `the check of ${day(latest.date)}` : "no check yet",
  };
  if (!belowRange && !oneThird && !scalped)
    return quiet("mowing_too_short", SOURCES.mowing, evidence);
  const reasons = [
    belowRange ? `cut at ${h} in, below the ${range!.min} in bottom of the home-lawn range` : null,
    oneThird
      ? `mowed from ${reading!.beforeIn} in to ${reading!.cutIn} in, taking off ${round(reading!.removedShare * 100, 0)} % of the blade (more than the third the one-third rule allows; at ${reading!.cutIn} in, mow before the grass passes ${round(reading!.mowByIn, 2)} in)`
      : null,
    scalped ? "scalping seen" : null,
  ].filter(Boolean);
  return {
    kind: "mowing_too_short",
    raised: true,
    severity: belowRange || scalped || half ? "moderate" : "low",
    evidence,
    source: SOURCES.mowing,
    summary: `Mowing too short: ${reasons.join("; ")}. ${
      belowRange || scalped
        ? "Raise the mowing height."
        : "Mow more often, or bring tall grass down over two or three mowings."
    }`,
  };
}

export function tornTips(checks: CheckFacts[]): RuleResult {
  const latest = checks.at(-1);
  const evidence: Evidence = {
    values: { tornTipsSeen: latest?.hasTornTips ?? false },
    threshold: "torn, ragged leaf tips seen",
    window: latest ? `the check of ${day(latest.date)}` : "no check yet",
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
  trend: {
    slopePer30Days: number;
    r2: number;
    n: number;
    ciLowPer30Days: number | null;
    ciHighPer30Days: number | null;
    word: string | null;
  } | null,
): RuleResult {
  const evidence: Evidence = {
    values: {
      slopePer30Days: trend ? round(trend.slopePer30Days, 1) : null,
      ciLowPer30Days: trend?.ciLowPer30Days == null ? null : round(trend.ciLowPer30Days, 1),
      ciHighPer30Days: trend?.ciHighPer30Days == null ? null : round(trend.ciHighPer30Days, 1),
      r2: trend ? round(trend.r2, 2) : null,
      n: trend?.n ?? 0,
    },
    threshold:
      "trend “declining”: at least 5 checks and a fall of 2 points or more per 30 days whose 90 % interval is below zero; high severity from a fall of 6",
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
    summary: `The Index is falling ${round(Math.abs(trend.slopePer30Days), 1)} points per 30 days (90 % interval ${round(Math.abs(trend.ciHighPer30Days ?? 0), 1)} to ${round(Math.abs(trend.ciLowPer30Days ?? 0), 1)}; over ${trend.n} checks).`,
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
    threshold: "cool-season turf with no nitrogen since September 1",
    window: `${day(windowStart)} to ${day(windowEnd)}`,
  };
  if (season !== "cool" || !inWindow || fedSince.length)
    return quiet("late_season_feeding", SOURCES.lateSeason, evidence);
  return {
    kind: "late_season_feeding",
    raised: true,
    severity: "low",
    evidence,
    source: SOURCES.lateSeason,
    summary: `A late-season feeding is due before ${day(windowEnd)}: no nitrogen since September 1.`,
  };
}

/**
 * A seeding and a pre-emergence herbicide on one zone closer than the herbicide's interval
 * (lib/agronomy/seeding.ts), while the later of the two is still within it on `at`.
 */
export function seedingConflict(treatments: ZoneTreatment[], at: string): RuleResult {
  const live = seedingConflicts(treatments.filter((t) => t.date <= at)).filter((c) => {
    const later = c.seeding.date > c.preEmergence.date ? c.seeding.date : c.preEmergence.date;
    return daysBetween(later, at) < c.intervalDays;
  });
  const c = live[0];
  const source =
    "Product label (the label decides); typical intervals: Weed Technology 19(1), 2005 — see lib/agronomy/seeding.ts";
  if (!c)
    return quiet("seeding_conflict", source, {
      values: { seededOn: null, preEmergenceOn: null },
      threshold: "a seeding and a pre-emergence herbicide closer than the label's interval",
      window: "the last 12 months",
    });
  const after = c.daysApart > 0;
  return {
    kind: "seeding_conflict",
    raised: true,
    severity: "moderate",
    evidence: {
      values: {
        seededOn: c.seeding.date,
        seedProduct: c.seeding.productName,
        preEmergenceOn: c.preEmergence.date,
        preEmergenceProduct: c.preEmergence.productName,
        daysApart: Math.abs(c.daysApart),
        intervalDays: c.intervalDays,
        intervalFrom: c.intervalFromLabel ? "the product label" : c.source,
      },
      threshold: `fewer than ${c.intervalDays} days between the pre-emergence and seeding`,
      window: "the last 12 months",
    },
    source: c.intervalFromLabel ? `Product label: ${c.preEmergence.productName}` : c.source,
    summary: after
      ? `Seeded on ${formatShortDate(c.seeding.date)}, ${Math.abs(c.daysApart)} days after ${c.preEmergence.productName} (a pre-emergence herbicide) on ${formatShortDate(c.preEmergence.date)}; the interval is ${c.intervalDays} days. The seed may not come up: check the seeding and follow the product label.`
      : `${c.preEmergence.productName} (a pre-emergence herbicide) went down on ${formatShortDate(c.preEmergence.date)}, ${Math.abs(c.daysApart)} days after seeding on ${formatShortDate(c.seeding.date)}; the interval is ${c.intervalDays} days. The seedlings may fail: check them and follow the product label.`,
  };
}
