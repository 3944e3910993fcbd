// When an application happened, bound to its visit (pure). The record is the legal one, so the
// time cannot be any date a client sends: it falls within the visit — from two hours before the
// visit started (or now, when the application starts it) to two hours after it finished (or now,
// while it is open), and never in the future beyond a few minutes of clock difference. Without a
// time, an open visit's application is dated now and a finished visit's at its finish. A time that
// differs from that by more than a few minutes is kept and audited.
export const VISIT_MARGIN_MS = 2 * 3_600_000;
export const CLOCK_SKEW_MS = 5 * 60_000;

export interface VisitTimes {
  startedAt: Date | null;
  completedAt: Date | null;
}

export type BoundTime =
  { ok: true; at: Date; expected: Date; differs: boolean } | { ok: false; from: Date; to: Date };

export function bindAppliedAt(requested: Date | null, visit: VisitTimes, now: Date): BoundTime {
  const expected = visit.completedAt ?? now;
  const from = new Date((visit.startedAt ?? now).getTime() - VISIT_MARGIN_MS);
  const to = new Date(
    Math.min(expected.getTime() + VISIT_MARGIN_MS, now.getTime() + CLOCK_SKEW_MS),
  );
  const at = requested ?? expected;
  if (at < from || at > to) return { ok: false, from, to };
  return {
    ok: true,
    at,
    expected,
    differs: Math.abs(at.getTime() - expected.getTime()) > CLOCK_SKEW_MS,
  };
}
