// Names of alert kinds, severities and statuses in words (shared by pages and e-mails).
import { formatShortDate, isIsoDate } from "@/lib/dates";

import type { AlertKind, Severity } from "./rules";

export const ALERT_KINDS: Record<AlertKind, string> = {
  matted_canopy: "Matted canopy: fungus risk",
  dollar_spot_weather: "Dollar spot weather",
  brown_patch_weather: "Brown patch weather",
  pythium_weather: "Pythium blight weather",
  drought_stress: "Drought stress",
  heat_feeding: "Feeding under heat stress",
  over_application: "Over-application",
  blackout_application: "Application in a blackout period",
  mowing_too_short: "Mowing too short",
  torn_tips: "Torn tips (dull blade)",
  declining_index: "Declining Index",
  late_season_feeding: "Late-season feeding due",
};

export const SEVERITIES: Record<Severity, string> = {
  high: "High",
  moderate: "Moderate",
  low: "Low",
};
export const ALERT_STATUSES = {
  open: "Open",
  acknowledged: "Acknowledged",
  resolved: "Resolved",
} as const;

export const alertKindLabel = (kind: string) =>
  (ALERT_KINDS as Record<string, string>)[kind] ?? kind;

/** The evidence values of the rules, in words (unknown keys show as they are). */
export const EVIDENCE_LABELS: Record<string, string> = {
  sameDirectionChecks: "Of the last 3 checks, mowed the same way",
  mattingSeen: "Matting seen",
  diseaseSeen: "Disease already showing",
  tMean5dC: "5-day mean temperature",
  rhMean5dPct: "5-day mean humidity (%)",
  probabilityPct: "Probability (%)",
  highestIndex: "Highest index",
  on: "On",
  tmaxC: "High",
  tminC: "Low",
  hoursRhAbove90: "Hours above 90 % humidity (hourly, the night after)",
  nightMinC: "Night's low",
  nightsJudged: "Nights judged on hourly humidity",
  nightsWithoutHours: "Nights without hourly humidity (not judged)",
  model: "Model",
  builtOn: "Model built on",
  practice: "Basis",
  coolSeasonZones: "Cool-season zones",
  days: "Days looked at",
  balance14In: "14-day water balance (in)",
  forecastRainIn: "Rain forecast, next 3 days (in)",
  wiltSeen: "Wilt seen",
  appliedOn: "Applied on",
  nLb: "N applied (lb / 1,000 ft²)",
  highestF: "Highest temperature (°F)",
  rainIn: "Rain (in)",
  yearToDateNLb: "N this year (lb / 1,000 ft²)",
  speciesMaxLb: "Top of the species' range (lb / 1,000 ft² a year)",
  limitBreaches: "Applications over a limit",
  applications: "Applications",
  dates: "Dates",
  heightOfCutIn: "Height of cut (in)",
  mowedToday: "Mowed today",
  heightBeforeMowingIn: "Height before mowing (in)",
  removedPct: "Share of the blade taken off (%)",
  speciesMinIn: "Bottom of the species' home-lawn range (in)",
  scalped: "Scalping seen",
  tornTipsSeen: "Torn tips seen",
  slopePer30Days: "Trend (points per 30 days)",
  ciLowPer30Days: "90 % interval, low end (points per 30 days)",
  ciHighPer30Days: "90 % interval, high end (points per 30 days)",
  r2: "Share of the change the trend explains (r², 0–1)",
  n: "Checks",
  nSinceSep1Lb: "N since September 1 (lb / 1,000 ft²)",
  season: "Grass type",
};

/** Words for coded evidence values (grass type, model names …); anything else as it is. */
const VALUE_WORDS: Record<string, string> = {
  cool: "cool-season",
  warm: "warm-season",
};

/** Evidence the models keep in °C (their published form): shown in °F first, °C alongside. */
const CELSIUS_KEYS = new Set(["tMean5dC", "tmaxC", "tminC", "nightMinC"]);

/** One evidence entry in words: its label and its value, temperatures in °F (°C). */
export function evidenceEntry(key: string, v: unknown): { label: string; value: string } {
  const label = EVIDENCE_LABELS[key] ?? key;
  if (CELSIUS_KEYS.has(key) && typeof v === "number" && Number.isFinite(v)) {
    const f = Math.round(((v * 9) / 5 + 32) * 10) / 10;
    return { label, value: `${evidenceValue(f)} °F (${evidenceValue(v)} °C)` };
  }
  return { label, value: evidenceValue(v) };
}

export function evidenceValue(v: unknown): string {
  if (v === null || v === undefined) return "—";
  if (typeof v === "boolean") return v ? "yes" : "no";
  if (typeof v === "number")
    return v < 0 ? `−${Math.abs(v).toLocaleString("en-US")}` : v.toLocaleString("en-US");
  if (Array.isArray(v)) return v.map(evidenceValue).join("; ");
  if (typeof v === "string") {
    if (isIsoDate(v)) return formatShortDate(v);
    return VALUE_WORDS[v] ?? v;
  }
  return String(v);
}
