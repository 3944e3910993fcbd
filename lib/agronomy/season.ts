// What a lawn-care company does at a cool-season lawn in a given month (pure): the round's kind
// chosen by the month, the latitude band and the property's rule set, and the next day fertilizer
// with nitrogen or phosphorus is allowed again under a no-fertilizer window.
//
// The calendar is common practice of cool-season lawn programmes in the northern United States
// (no single published source; from memory of extension calendars, which put the main feedings in
// spring and fall, preventive grub control in early summer when eggs hatch, broadleaf weed control
// while weeds grow actively, aeration and overseeding in late summer to early fall, lime and soil
// sampling outside the feeding season, and no feeding of cool-season turf in midsummer heat). The
// northern band (about 43.5° N and above: Minnesota, Wisconsin, northern New England) starts a
// month later in spring, ends a month earlier in fall and keeps the frozen months for inspection.
//
// A window is read as the statutes word it (lib/agronomy/rules.ts): N.J.S.A. 58:10A-62b, "No
// professional fertilizer applicator shall apply fertilizer containing phosphorus or nitrogen to
// turf before March 1st or after December 1st in any calendar year". A round that would put down
// nitrogen or phosphorus inside the window becomes a lime round (lime carries neither).
import { addDays, type IsoDate } from "@/lib/dates";

import { inNoFertilizerWindow } from "./rules";

export type SeasonalService =
  | "feeding_round"
  | "fall_feeding"
  | "weed_control"
  | "insect_control"
  | "aeration_overseeding"
  | "soil_sampling"
  | "liming"
  | "inspection";

/** What the round puts down: fertilizer (N), starter (N and P, for repair), lime, a pesticide, or nothing. */
type RoundTreatment = "fertilizer" | "starter" | "lime" | "herbicide" | "insecticide" | null;

export interface SeasonalRound {
  service: SeasonalService;
  treatment: RoundTreatment;
  /** Why this round in this month, in plain words (shown to the office and the technician). */
  why: string;
}

const TREATMENT: Record<SeasonalService, RoundTreatment> = {
  feeding_round: "fertilizer",
  fall_feeding: "fertilizer",
  aeration_overseeding: "starter",
  liming: "lime",
  weed_control: "herbicide",
  insect_control: "insecticide",
  soil_sampling: null,
  inspection: null,
};

/** Whether the round's product carries nitrogen or phosphorus (what a no-fertilizer window forbids). */
export const putsDownNOrP = (service: string) =>
  service in TREATMENT &&
  (TREATMENT[service as SeasonalService] === "fertilizer" ||
    TREATMENT[service as SeasonalService] === "starter");

type Month = 1 | 2 | 3 | 4 | 5 | 6 | 7 | 8 | 9 | 10 | 11 | 12;
type Calendar = Record<Month, { service: SeasonalService; why: string }>;

const DORMANT =
  "Dormant-season inspection: the turf is not growing; check for snow mold, vole runs, salt and plow damage.";

/** Central latitudes (New Jersey, Pennsylvania, the lower Midwest): common practice. */
const TRANSITION: Calendar = {
  1: { service: "inspection", why: DORMANT },
  2: {
    service: "soil_sampling",
    why: "Soil sampling before the spring program: pH and nutrients decide lime and phosphorus.",
  },
  3: {
    service: "liming",
    why: "Lime ahead of green-up where the soil test shows acid soil; no nitrogen or phosphorus.",
  },
  4: {
    service: "feeding_round",
    why: "First spring feeding as the turf greens up and grows.",
  },
  5: {
    service: "weed_control",
    why: "Broadleaf weed control while weeds grow actively, as herbicide labels ask.",
  },
  6: { service: "feeding_round", why: "Late-spring feeding before summer heat." },
  7: {
    service: "insect_control",
    why: "Preventive grub control, timed for the egg hatch of early summer.",
  },
  8: {
    service: "inspection",
    why: "Summer stress inspection: no feeding of cool-season turf in the heat; check water, disease and insects.",
  },
  9: {
    service: "aeration_overseeding",
    why: "Core aeration and overseeding in the late-summer seeding window, with a starter fertilizer for the repair.",
  },
  10: {
    service: "fall_feeding",
    why: "Fall feeding, the most useful of the year for cool-season turf.",
  },
  11: {
    service: "fall_feeding",
    why: "Last fall feeding while the roots still take it up, before the winter no-fertilizer window.",
  },
  12: {
    service: "liming",
    why: "Lime while the ground is open; no nitrogen or phosphorus in the winter no-fertilizer window.",
  },
};

/** Northern latitudes (about 43.5° N and above): a shorter season, frozen ground December to March. */
const NORTHERN: Calendar = {
  1: { service: "inspection", why: DORMANT },
  2: { service: "inspection", why: DORMANT },
  3: { service: "inspection", why: DORMANT },
  4: {
    service: "soil_sampling",
    why: "Soil sampling once the ground thaws: pH and nutrients decide lime and phosphorus.",
  },
  5: { service: "feeding_round", why: "First spring feeding as the turf greens up and grows." },
  6: {
    service: "weed_control",
    why: "Broadleaf weed control while weeds grow actively, as herbicide labels ask.",
  },
  7: {
    service: "insect_control",
    why: "Preventive grub control, timed for the egg hatch of early summer.",
  },
  8: {
    service: "aeration_overseeding",
    why: "Core aeration and overseeding in the late-summer seeding window, with a starter fertilizer for the repair.",
  },
  9: {
    service: "fall_feeding",
    why: "Fall feeding, the most useful of the year for cool-season turf.",
  },
  10: {
    service: "fall_feeding",
    why: "Last fall feeding before the ground freezes.",
  },
  11: {
    service: "liming",
    why: "Lime before the ground freezes; no nitrogen or phosphorus this late.",
  },
  12: { service: "inspection", why: DORMANT },
};

/** The latitude (° N) from which the northern calendar applies. */
const NORTHERN_FROM_LATITUDE = 43.5;

export interface SeasonContext {
  latitude: number;
  /** The rule set's professional no-fertilizer window [after MM-DD, before MM-DD], or null. */
  proBlackout: readonly [string, string] | null;
}

/** The round a company would run at a cool-season lawn on `date`. */
export function seasonalRound(date: IsoDate, where: SeasonContext): SeasonalRound {
  const month = Number(date.slice(5, 7)) as Month;
  const calendar = where.latitude >= NORTHERN_FROM_LATITUDE ? NORTHERN : TRANSITION;
  const planned = calendar[month];
  if (
    where.proBlackout &&
    putsDownNOrP(planned.service) &&
    inNoFertilizerWindow(date.slice(5), where.proBlackout)
  ) {
    const allowed = nextFertilizerDate(date, where.proBlackout);
    return {
      service: "liming",
      treatment: "lime",
      why: `The rule set allows no fertilizer with nitrogen or phosphorus on this date${allowed ? ` (next allowed ${usDate(allowed)})` : ""}: lime instead, which carries neither.`,
    };
  }
  return { ...planned, treatment: TREATMENT[planned.service] };
}

/** "April 1, 2027": US English, for the sentences above. */
export const usDate = (date: IsoDate) =>
  new Intl.DateTimeFormat("en-US", { dateStyle: "long", timeZone: "UTC" }).format(
    new Date(`${date}T00:00:00Z`),
  );

/**
 * The first date on or after `date` outside the no-fertilizer window (the window's named days are
 * allowed), or `date` itself when it is outside. Null only for a window that covers every day.
 */
export function nextFertilizerDate(
  date: IsoDate,
  window: readonly [string, string],
): IsoDate | null {
  for (let d = date, i = 0; i <= 366; d = addDays(d, 1), i++)
    if (!inNoFertilizerWindow(d.slice(5), window)) return d;
  return null;
}
