// Checks one application against a fertiliser rule set (pure). A breached limit of a rule set
// whose limits are law is a refusal (a manager may override with a reason category and text);
// otherwise a warning. The annual nitrogen range of the species is always advice (a warning).
// Each finding names the section that states its limit (the rule set's per-limit sources).
//
// Dates are read as the statutes word them. N.J.S.A. 58:10A-62b: "No professional fertilizer
// applicator shall apply fertilizer containing phosphorus or nitrogen to turf before March 1st or
// after December 1st in any calendar year"; 58:10A-62a(3), any person: "before March 1st or after
// November 15th". So a window is { after, before } and both named days are allowed.

/** No fertilizer after `after` (MM-DD) or before `before` (MM-DD); the two days themselves are allowed. */
type NoFertilizerWindow = [after: string, before: string];

export interface RuleSetLimits {
  name: string;
  citation: string;
  limitsAreLaw: boolean;
  maxNLbPer1000: number | null;
  maxWsnLbPer1000: number | null;
  minSlowReleasePct: number | null;
  proBlackout: NoFertilizerWindow | null;
  homeownerBlackout: NoFertilizerWindow | null;
  phosphorusRule: "allowed" | "soil_test_or_establishment";
  /** A soil test counts when made no more than this many years before the application. */
  soilTestMaxAgeYears: number | null;
  /** Phosphorus allowed when turf is first established (seeding or sodding). */
  phosphorusExemptEstablishment: boolean;
  /** Phosphorus allowed when turf is re-established or repaired. */
  phosphorusExemptRepair: boolean;
  /** The section stating the N, WSN and slow-release limits. */
  nLimitsSource: string;
  blackoutSource: string;
  phosphorusSource: string;
  /** Non-empty when the rule set names frozen or saturated ground and heavy rain: the section. */
  conditionsSource: string;
}

export interface ApplicationFacts {
  appliedOn: string; // YYYY-MM-DD, in the property's time zone
  byProfessional: boolean;
  nPct: number;
  nLb: number; // per 1,000 ft²
  wsnLb: number;
  p2o5Lb: number;
  slowReleasePctOfN: number;
  /** First establishment of turf (seeding or sodding). */
  isEstablishing: boolean;
  /** Re-establishment or repair of a turf area. */
  isRepairing: boolean;
  soilTestOn: string | null; // a soil test showing phosphorus need
  yearToDateNLb: number; // before this application, lb N / 1,000 ft²
  annualNRange: { min: number; max: number } | null;
  /** The visit day's weather as kept with the visit (null when none is kept). */
  weather: { tminF: number | null; precipIn: number | null; isForecast: boolean } | null;
}

type FindingKey =
  | "max_n"
  | "max_wsn"
  | "min_slow_release"
  | "blackout"
  | "phosphorus"
  | "annual_n"
  | "conditions"
  | "label_max_rate"
  | "label_yearly"
  | "label_interval"
  | "label_missing"
  | "label_conditions"
  | "seeding_conflict"
  | "seed_rate";

export interface RuleFinding {
  key: FindingKey;
  severity: "refusal" | "warning";
  /** What the limit rests on: a product label is the law and its refusals are never overridden. */
  basis?: "law" | "company" | "species" | "label";
  message: string;
  value: number | string;
  limit: number | string;
  source: string;
}

/** Is MM-DD inside the window where fertilizer is not allowed? Windows may cross the new year. */
export function inNoFertilizerWindow(
  monthDay: string,
  [after, before]: readonly [string, string],
): boolean {
  return after < before
    ? monthDay > after && monthDay < before
    : monthDay > after || monthDay < before;
}

const MONTHS = [
  "January",
  "February",
  "March",
  "April",
  "May",
  "June",
  "July",
  "August",
  "September",
  "October",
  "November",
  "December",
];
/** "12-01" → "December 1". */
export const monthDayWords = (md: string) =>
  `${MONTHS[Number(md.slice(0, 2)) - 1]} ${Number(md.slice(3))}`;

const fmt = (x: number) => (Math.round(x * 100) / 100).toFixed(2);

/** What the visit's weather says about frozen ground and rain, in words. */
export function weatherNotes(w: ApplicationFacts["weather"]): string[] {
  return [
    typeof w?.tminF === "number" && w.tminF <= 32
      ? `The day's low is ${w.tminF} °F: the ground may be frozen.`
      : "",
    typeof w?.precipIn === "number" && w.precipIn > 0
      ? `${w.precipIn} in of rain ${w.isForecast ? "in the day's forecast" : "recorded for the day"}.`
      : "",
    w ? "" : "No weather is kept for this visit.",
  ].filter(Boolean);
}

/** Was a soil test made on `testOn` no more than `years` calendar years before `on`? */
export function soilTestCounts(testOn: string, on: string, years: number | null): boolean {
  if (testOn > on) return false; // a test after the application does not count
  if (years === null) return true;
  return `${Number(testOn.slice(0, 4)) + years}${testOn.slice(4)}` >= on;
}

export function checkApplication(rules: RuleSetLimits, a: ApplicationFacts): RuleFinding[] {
  const severity = rules.limitsAreLaw ? "refusal" : "warning";
  const basis = rules.limitsAreLaw ? "law" : "company";
  const sourceOf = (section: string) => `${rules.name}: ${section || rules.citation}`;
  const findings: RuleFinding[] = [];
  const isFertiliser = a.nLb > 0 || a.p2o5Lb > 0;

  if (rules.maxNLbPer1000 !== null && a.nLb > rules.maxNLbPer1000 + 1e-9) {
    findings.push({
      key: "max_n",
      severity,
      basis,
      source: sourceOf(rules.nLimitsSource),
      value: a.nLb,
      limit: rules.maxNLbPer1000,
      message: `${fmt(a.nLb)} lb N per 1,000 ft² is above the ${fmt(rules.maxNLbPer1000)} lb limit per application.`,
    });
  }
  if (rules.maxWsnLbPer1000 !== null && a.wsnLb > rules.maxWsnLbPer1000 + 1e-9) {
    findings.push({
      key: "max_wsn",
      severity,
      basis,
      source: sourceOf(rules.nLimitsSource),
      value: a.wsnLb,
      limit: rules.maxWsnLbPer1000,
      message: `${fmt(a.wsnLb)} lb water-soluble N per 1,000 ft² is above the ${fmt(rules.maxWsnLbPer1000)} lb limit.`,
    });
  }
  if (
    rules.minSlowReleasePct !== null &&
    a.nPct > 0 &&
    a.slowReleasePctOfN + 1e-9 < rules.minSlowReleasePct
  ) {
    findings.push({
      key: "min_slow_release",
      severity,
      basis,
      source: sourceOf(rules.nLimitsSource),
      value: a.slowReleasePctOfN,
      limit: rules.minSlowReleasePct,
      message: `The product's slow-release share (${a.slowReleasePctOfN} % of N) is below the required ${rules.minSlowReleasePct} %.`,
    });
  }
  const window = a.byProfessional ? rules.proBlackout : rules.homeownerBlackout;
  if (window && isFertiliser && inNoFertilizerWindow(a.appliedOn.slice(5), window)) {
    findings.push({
      key: "blackout",
      severity,
      basis,
      source: sourceOf(rules.blackoutSource),
      value: a.appliedOn,
      limit: `after ${window[0]}, before ${window[1]}`,
      message: `Fertilizer with nitrogen or phosphorus may not be applied after ${monthDayWords(window[0])} or before ${monthDayWords(window[1])}${a.byProfessional ? " by a professional applicator" : ""} under this rule set.`,
    });
  }
  if (rules.phosphorusRule === "soil_test_or_establishment" && a.p2o5Lb > 0) {
    const exempt =
      (a.isEstablishing && rules.phosphorusExemptEstablishment) ||
      (a.isRepairing && rules.phosphorusExemptRepair);
    const tested =
      a.soilTestOn !== null && soilTestCounts(a.soilTestOn, a.appliedOn, rules.soilTestMaxAgeYears);
    if (!exempt && !tested) {
      const allowed = [
        rules.soilTestMaxAgeYears
          ? `a soil test showing need made no more than ${rules.soilTestMaxAgeYears} years before`
          : "a soil test showing need",
        rules.phosphorusExemptEstablishment
          ? "first establishment of turf (seeding or sodding)"
          : "",
        rules.phosphorusExemptRepair ? "repair of a turf area" : "",
      ].filter(Boolean);
      const why =
        a.isRepairing && !rules.phosphorusExemptRepair
          ? " Repair is not an exemption under this rule set."
          : a.soilTestOn
            ? ` The soil test of ${a.soilTestOn} does not count for ${a.appliedOn}.`
            : "";
      findings.push({
        key: "phosphorus",
        severity,
        basis,
        source: sourceOf(rules.phosphorusSource),
        value: a.p2o5Lb,
        limit: allowed.join("; "),
        message: `Phosphorus (${fmt(a.p2o5Lb)} lb P₂O₅ per 1,000 ft²) needs ${allowed.join(", or ")}.${why}`,
      });
    }
  }
  if (rules.conditionsSource && isFertiliser) {
    // The law names conditions Sward cannot see (saturated soil, frozen ground): a warning on
    // every fertilizer application, with what the visit's weather says.
    const notes = weatherNotes(a.weather);
    findings.push({
      key: "conditions",
      severity: "warning",
      basis,
      source: sourceOf(rules.conditionsSource),
      value: notes.join(" ") || "none seen",
      limit: "not on frozen or saturated ground, nor with heavy rain occurring or predicted",
      message: `Not on frozen or saturated ground, nor when heavy rain is falling or forecast: check before applying.${notes.length ? ` ${notes.join(" ")}` : ""}`,
    });
  }
  // Only an application that brings nitrogen can take the zone over its yearly range: a product
  // without N (an insecticide, potash) says nothing about the year's nitrogen.
  if (a.annualNRange && a.nLb > 0 && a.yearToDateNLb + a.nLb > a.annualNRange.max + 1e-9) {
    findings.push({
      key: "annual_n",
      severity: "warning",
      basis: "species",
      source: "Species annual nitrogen range (grass-species reference table)",
      value: a.yearToDateNLb + a.nLb,
      limit: a.annualNRange.max,
      message: `This brings the zone to ${fmt(a.yearToDateNLb + a.nLb)} lb N per 1,000 ft² this year, above the species' ${a.annualNRange.min}–${a.annualNRange.max} lb range.`,
    });
  }
  return findings;
}

export const isRefused = (findings: RuleFinding[]) =>
  findings.some((f) => f.severity === "refusal");

/** A refusal by the product label: no one may override it. */
export const isLabelRefused = (findings: RuleFinding[]) =>
  findings.some((f) => f.severity === "refusal" && f.basis === "label");
