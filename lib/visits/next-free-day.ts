// The day offered for a stop that was rained out or canceled: pure, so the rule is tested alone.
import { inNoFertilizerWindow } from "@/lib/agronomy/rules";
import { addDays, type IsoDate } from "@/lib/dates";

/**
 * The first day after `today` that is free for the stop: the property has no other visit that day,
 * it is not a Sunday (crews work Monday to Saturday — common practice, not a rule of any
 * standard), and a round that puts down nitrogen or phosphorus is not inside the rule set's
 * no-fertilizer window. Null when no such day exists within `aheadDays`.
 */
export function nextFreeDay({
  today,
  taken,
  window,
  putsDownNOrP,
  aheadDays,
}: {
  today: IsoDate;
  /** Days the property already has a visit (canceled ones do not count). */
  taken: readonly IsoDate[];
  /** The professional no-fertilizer window, month-days [after, before], or null. */
  window: readonly [string, string] | null;
  putsDownNOrP: boolean;
  aheadDays: number;
}): IsoDate | null {
  const busy = new Set(taken);
  for (let i = 1; i <= aheadDays; i++) {
    const day = addDays(today, i);
    if (busy.has(day)) continue;
    if (new Date(`${day}T00:00:00Z`).getUTCDay() === 0) continue;
    if (window && putsDownNOrP && inNoFertilizerWindow(day.slice(5), window)) continue;
    return day;
  }
  return null;
}
