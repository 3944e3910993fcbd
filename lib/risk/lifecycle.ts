// What an evaluation does to an alert (pure): raise a new one (a new episode linked to the last
// resolved one when the condition recurs), update the live one, note that its condition has
// cleared, or resolve it automatically once the condition has stayed clear for
// AUTO_RESOLVE_AFTER_DAYS days. Acknowledging and resolving by hand are lib/risk-alerts/mutations.ts.
import { daysBetween } from "@/lib/dates";

import type { Severity } from "./rules";

/**
 * Days an alert's condition must stay clear before Sward resolves it on its own: a week, so a
 * condition that comes and goes with the weather does not open and close every day.
 */
export const AUTO_RESOLVE_AFTER_DAYS = 7;

export interface LiveAlert {
  id: string;
  status: "open" | "acknowledged";
  severity: Severity;
  summary: string;
  clearSince: string | null;
}

export type Decision =
  | { action: "none" }
  | { action: "raise"; previousAlertId: string | null }
  | { action: "update"; severityChanged: boolean; returned: boolean }
  | { action: "clearing"; since: string }
  | { action: "auto_resolve"; clearSince: string };

export function decide(
  live: LiveAlert | null,
  lastResolvedId: string | null,
  result: { raised: boolean; severity: Severity; summary: string },
  at: string,
): Decision {
  if (result.raised) {
    if (!live) return { action: "raise", previousAlertId: lastResolvedId };
    return {
      action: "update",
      severityChanged: live.severity !== result.severity,
      returned: live.clearSince !== null,
    };
  }
  if (!live) return { action: "none" };
  const since = live.clearSince ?? at;
  if (daysBetween(since, at) >= AUTO_RESOLVE_AFTER_DAYS)
    return { action: "auto_resolve", clearSince: since };
  return live.clearSince ? { action: "none" } : { action: "clearing", since: at };
}
