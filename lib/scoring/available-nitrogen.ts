// Plant-available nitrogen in a window before a date (lb N / 1,000 ft²): water-soluble N counts
// in full on the day it is applied; slow-release N is released evenly over 8 weeks from the
// application (a simple linear-release model — common practice for coated and methylene-urea
// products, which label a release over 6–12 weeks; a stated assumption, not a measurement).
const DAY_MS = 86_400_000;
const SLOW_RELEASE_DAYS = 56;

export function availableNitrogen(
  applications: { date: string; wsnLb: number; slowLb: number }[],
  at: string,
  windowDays = 45,
): number {
  const end = Date.parse(`${at}T00:00:00Z`);
  const start = end - windowDays * DAY_MS;
  let total = 0;
  for (const a of applications) {
    const t = Date.parse(`${a.date}T00:00:00Z`);
    if (t > end) continue;
    if (t > start) total += a.wsnLb;
    // Slow-release: the share of its release period [t, t + 56 d] that falls inside (start, end].
    const releaseEnd = t + SLOW_RELEASE_DAYS * DAY_MS;
    const overlap = Math.max(0, Math.min(end, releaseEnd) - Math.max(start, t));
    total += (a.slowLb * overlap) / (SLOW_RELEASE_DAYS * DAY_MS);
  }
  return total;
}
