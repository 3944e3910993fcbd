// Names of alert kinds, severities and statuses in words (shared by pages and e-mails).
import { formatShortDate, isIsoDate } from "@/lib/dates";
import { en } from "@/lib/i18n/messages/en";

import type { AlertKind, Severity } from "./rules";

export const ALERT_KINDS: Record<AlertKind, string> = en.terms.alertKinds;

export const SEVERITIES: Record<Severity, string> = en.terms.severities;
export const ALERT_STATUSES = en.terms.alertStatuses;

export const alertKindLabel = (kind: string) =>
  (ALERT_KINDS as Record<string, string>)[kind] ?? kind;

/** The evidence values of the rules, in words (unknown keys show as they are). */
export const EVIDENCE_LABELS: Record<string, string> = en.terms.evidence;

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
