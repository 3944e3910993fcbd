// Crabgrass pre-emergence timing by growing degree days (pure), from a property's daily weather.
//
// Two published air-temperature models, both by the plain averaging method of gdd.ts:
// - The window opens: GDD base 32 °F counted from 15 February reaching 250 — "Suggested Timing:
//   250–500 GDD", Calhoun, Michigan State University (2004), as the University of Wisconsin
//   Turfgrass Science "Crabgrass Pre-emergence Timer" gives it; MSU's GDDTracker "starts counting
//   GDDs on Feb. 15" and its crabgrass model "uses GDD (base 32 degrees Fahrenheit)" to find when
//   the 0–2 in soil reaches 50–55 °F (MSU Extension, "Timing crabgrass preemergence
//   applications in spring"). Base 32 °F = 0 °C.
// - Emergence: GDD base 50 °F (10 °C) counted from 1 January. "Crabgrass starts emerging when the
//   running total reaches 70 to 140 units" (Goatley, Askew, Horvath, Youngman & Ervin, Virginia
//   Tech Crop and Soil Environmental News, January 2007); "200 GDD need to accumulate with a base
//   of 50 °F … before crabgrass germinates" (Patton, Purdue Turfgrass Science, "When will
//   crabgrass germinate?", citing Calhoun).
// So: before 250 GDD₃₂ it is early; then apply now, until emergence may start at 70 GDD₅₀ (the
// window is closing: the herbicide must be down and watered in before it); from 200 GDD₅₀ crabgrass
// has germinated and a pre-emergence is too late — post-emergence control (dithiopyr alone also
// controls crabgrass up to one tiller, Purdue, per the product label).
import { growingDegreeDays } from "./gdd";

export const CRABGRASS = {
  openBase32F: { base: 32, from: "02-15", gdd: 250 },
  closingBase50F: { base: 50, from: "01-01", gdd: 70 },
  lateBase50F: { base: 50, from: "01-01", gdd: 200 },
} as const;

export type CrabgrassStage = "early" | "apply_now" | "closing" | "too_late";

export interface CrabgrassDay {
  date: string; // YYYY-MM-DD
  tmaxF: number;
  tminF: number;
}

export interface CrabgrassTiming {
  stage: CrabgrassStage;
  /** GDD base 50 °F since 1 January, and base 32 °F since 15 February, to the last day read. */
  gdd50: number;
  gdd32: number;
  /** The day each threshold was crossed this year (null: not yet). */
  openedOn: string | null;
  closingOn: string | null;
  lateOn: string | null;
  /** The last day read (today at most). */
  asOf: string;
  /** Days of this year missing from the history (a gap makes the totals low). */
  missingDays: number;
}

const DAY_MS = 86_400_000;
const dayIndex = (d: string) => Date.parse(`${d}T00:00:00Z`) / DAY_MS;

/**
 * The crabgrass timing on `today` from the year's daily highs and lows (°F). Days after `today`
 * (forecasts) and of other years are ignored; null without a single day of this year.
 */
export function crabgrassTiming(days: CrabgrassDay[], today: string): CrabgrassTiming | null {
  const year = today.slice(0, 4);
  const own = days
    .filter((d) => d.date.startsWith(year) && d.date <= today)
    .sort((a, b) => (a.date < b.date ? -1 : 1));
  if (!own.length) return null;
  let gdd50 = 0;
  let gdd32 = 0;
  let openedOn: string | null = null;
  let closingOn: string | null = null;
  let lateOn: string | null = null;
  const openFrom = `${year}-${CRABGRASS.openBase32F.from}`;
  for (const d of own) {
    gdd50 += growingDegreeDays(d.tmaxF, d.tminF, CRABGRASS.closingBase50F.base);
    if (d.date >= openFrom)
      gdd32 += growingDegreeDays(d.tmaxF, d.tminF, CRABGRASS.openBase32F.base);
    if (!openedOn && gdd32 >= CRABGRASS.openBase32F.gdd) openedOn = d.date;
    if (!closingOn && gdd50 >= CRABGRASS.closingBase50F.gdd) closingOn = d.date;
    if (!lateOn && gdd50 >= CRABGRASS.lateBase50F.gdd) lateOn = d.date;
  }
  const asOf = own[own.length - 1]!.date;
  const span = dayIndex(asOf) - dayIndex(`${year}-01-01`) + 1;
  const stage: CrabgrassStage = lateOn
    ? "too_late"
    : closingOn
      ? "closing"
      : openedOn
        ? "apply_now"
        : "early";
  return {
    stage,
    gdd50: Math.round(gdd50 * 10) / 10,
    gdd32: Math.round(gdd32 * 10) / 10,
    openedOn,
    closingOn,
    lateOn,
    asOf,
    missingDays: span - own.length,
  };
}
