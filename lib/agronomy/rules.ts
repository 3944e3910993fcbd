// Checks one application against a fertiliser rule set (pure). A breached limit of a rule set
// whose limits are law is a refusal (a manager may override with a reason); otherwise a warning.
// The annual nitrogen range of the species is always advice (a warning), never law.

export interface RuleSetLimits {
  name: string;
  citation: string;
  limitsAreLaw: boolean;
  maxNLbPer1000: number | null;
  maxWsnLbPer1000: number | null;
  minSlowReleasePct: number | null;
  proBlackout: [string, string] | null;
  homeownerBlackout: [string, string] | null;
  phosphorusRule: "allowed" | "soil_test_or_establishment";
  soilTestMaxAgeYears: number | null;
}

export interface ApplicationFacts {
  appliedOn: string; // YYYY-MM-DD, in the property's time zone
  byProfessional: boolean;
  nPct: number;
  nLb: number; // per 1,000 ft²
  wsnLb: number;
  p2o5Lb: number;
  slowReleasePctOfN: number;
  isEstablishing: boolean;
  soilTestOn: string | null; // a soil test showing phosphorus need
  yearToDateNLb: number; // before this application, lb N / 1,000 ft²
  annualNRange: { min: number; max: number } | null;
}

type FindingKey = "max_n" | "max_wsn" | "min_slow_release" | "blackout" | "phosphorus" | "annual_n";

export interface RuleFinding {
  key: FindingKey;
  severity: "refusal" | "warning";
  message: string;
  value: number | string;
  limit: number | string;
  source: string;
}

/** Is MM-DD inside the window [start, end], both inclusive? Windows may cross the new year. */
export function isInWindow(monthDay: string, [start, end]: [string, string]): boolean {
  return start <= end ? monthDay >= start && monthDay <= end : monthDay >= start || monthDay <= end;
}

const fmt = (x: number) => (Math.round(x * 100) / 100).toFixed(2);

function yearsBetween(from: string, to: string): number {
  return (
    (Date.parse(`${to}T00:00:00Z`) - Date.parse(`${from}T00:00:00Z`)) / (365.2425 * 86_400_000)
  );
}

export function checkApplication(rules: RuleSetLimits, a: ApplicationFacts): RuleFinding[] {
  const severity = rules.limitsAreLaw ? "refusal" : "warning";
  const source = `${rules.name}: ${rules.citation}`;
  const findings: RuleFinding[] = [];
  const isFertiliser = a.nLb > 0 || a.p2o5Lb > 0;

  if (rules.maxNLbPer1000 !== null && a.nLb > rules.maxNLbPer1000 + 1e-9) {
    findings.push({
      key: "max_n",
      severity,
      source,
      value: a.nLb,
      limit: rules.maxNLbPer1000,
      message: `${fmt(a.nLb)} lb N per 1,000 ft² is above the ${fmt(rules.maxNLbPer1000)} lb limit per application.`,
    });
  }
  if (rules.maxWsnLbPer1000 !== null && a.wsnLb > rules.maxWsnLbPer1000 + 1e-9) {
    findings.push({
      key: "max_wsn",
      severity,
      source,
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
      source,
      value: a.slowReleasePctOfN,
      limit: rules.minSlowReleasePct,
      message: `The product's slow-release share (${a.slowReleasePctOfN} % of N) is below the required ${rules.minSlowReleasePct} %.`,
    });
  }
  const window = a.byProfessional ? rules.proBlackout : rules.homeownerBlackout;
  if (window && isFertiliser && isInWindow(a.appliedOn.slice(5), window)) {
    findings.push({
      key: "blackout",
      severity,
      source,
      value: a.appliedOn,
      limit: `${window[0]} to ${window[1]}`,
      message: `Fertiliser may not be applied between ${window[0]} and ${window[1]} (month-day) under this rule set.`,
    });
  }
  if (rules.phosphorusRule === "soil_test_or_establishment" && a.p2o5Lb > 0 && !a.isEstablishing) {
    const recent =
      a.soilTestOn !== null &&
      a.soilTestOn <= a.appliedOn &&
      (rules.soilTestMaxAgeYears === null ||
        yearsBetween(a.soilTestOn, a.appliedOn) <= rules.soilTestMaxAgeYears);
    if (!recent) {
      findings.push({
        key: "phosphorus",
        severity,
        source,
        value: a.p2o5Lb,
        limit: rules.soilTestMaxAgeYears
          ? `soil test within ${rules.soilTestMaxAgeYears} years`
          : "soil test showing need",
        message: `Phosphorus (${fmt(a.p2o5Lb)} lb P₂O₅ per 1,000 ft²) needs ${a.soilTestOn ? "a more recent" : "a"} soil test showing need, or turf being established or repaired.`,
      });
    }
  }
  if (a.annualNRange && a.yearToDateNLb + a.nLb > a.annualNRange.max + 1e-9) {
    findings.push({
      key: "annual_n",
      severity: "warning",
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
