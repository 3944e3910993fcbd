// A zone's yearly nitrogen and its spread over a program's rounds (pure).
//
// 1. The yearly target (lb N / 1,000 ft²) starts from the species' annual range
//    (lib/reference/grass-species.ts, each range with its source): the top of the range for an
//    irrigated zone, the middle for one that is not (turf without water grows less and uses less
//    nitrogen); shade takes a quarter off in part shade and half in shade (shaded turf grows
//    slower and needs less nitrogen — common practice of extension lawn advice, from memory, no
//    single published figure). It is never above the yearly limit the caller passes (a rule set's
//    or label's yearly maximum) and never below zero.
// 2. Rounds with a fixed target get it; what is left of the yearly target is spread over the rounds
//    marked "from growth potential" in proportion to the mean growth potential of each round's
//    window (growth-potential.ts): nitrogen follows the grass's use, which Woods' worked examples
//    make proportional to GP (Asian Turfgrass Center, "Explaining the turfgrass growth potential":
//    monthly N use = GP × the most the grass uses in a month; REFERENCES.md). A cool-season summer
//    round therefore gets less without a rule of its own.
// 3. Only days outside the no-fertilizer window count (rules.ts reads the window as the statute
//    words it): a round wholly inside it gets no nitrogen and its share goes to the others; a round
//    that straddles it is planned on its allowed days (the late-fall round before the closing day).
// 4. No round gets more than the per-application maximum (the rule set's or the label's); a capped
//    round's excess goes to the uncapped ones (water filling), and what no round can take is
//    reported as unplaced, never hidden.
import { addDays, daysBetween, type IsoDate } from "@/lib/dates";
import type { GrassSeason } from "@/lib/reference/grass-species";

import { windowGrowthPotential, type MonthlyMeansC } from "./growth-potential";
import { inNoFertilizerWindow } from "./rules";

type SunExposure = "full_sun" | "part_shade" | "shade";

/** Share of the unshaded target by sun exposure (common practice, see above). */
const SHADE_FACTOR: Record<SunExposure, number> = {
  full_sun: 1,
  part_shade: 0.75,
  shade: 0.5,
};

export function yearlyNTarget(zone: {
  annualNitrogenLb: { min: number; max: number };
  sun: SunExposure;
  irrigated: boolean;
  /** The yearly maximum of the rule set or label, lb N / 1,000 ft²; null when none. */
  yearlyLimitLb: number | null;
}): { lb: number; cappedByLimit: boolean } {
  const { min, max } = zone.annualNitrogenLb;
  const unshaded = zone.irrigated ? max : (min + max) / 2;
  const lb = unshaded * SHADE_FACTOR[zone.sun];
  if (zone.yearlyLimitLb !== null && lb > zone.yearlyLimitLb)
    return { lb: Math.max(0, zone.yearlyLimitLb), cappedByLimit: true };
  return { lb: Math.max(0, lb), cappedByLimit: false };
}

export type RoundTarget =
  | { kind: "lb"; lb: number }
  | { kind: "growth_potential" }
  /** A round that puts down no nitrogen (weed or grub control, lime, aeration). */
  | { kind: "none" };

export interface SpreadRound {
  key: string;
  start: IsoDate;
  end: IsoDate;
  target: RoundTarget;
}

export type SpreadReason =
  "fixed" | "growth_potential" | "capped" | "no_fertilizer_window" | "no_nitrogen";

export interface PlannedRound {
  key: string;
  nLb: number;
  /** Mean GP over the round's allowed days (0 when none). */
  gp: number;
  /** The first and last day nitrogen may go down in the window; null when none may. */
  allowed: { from: IsoDate; to: IsoDate } | null;
  reason: SpreadReason;
}

export interface SpreadInput {
  season: GrassSeason;
  normals: MonthlyMeansC;
  /** Daily mean temperatures already observed (°C), read before the normals. */
  daily?: ReadonlyMap<IsoDate, number>;
  yearlyTargetLb: number;
  perApplicationMaxLb: number | null;
  /** [after, before] as MM-DD (rules.ts), or null. */
  noFertilizerWindow: readonly [string, string] | null;
  rounds: readonly SpreadRound[];
}

const EPS = 1e-9;

export function spreadNitrogen(input: SpreadInput): {
  rounds: PlannedRound[];
  totalLb: number;
  unplacedLb: number;
} {
  const cap = input.perApplicationMaxLb ?? Infinity;
  const window = input.noFertilizerWindow;
  const counts = (day: IsoDate) => !window || !inNoFertilizerWindow(day.slice(5), window);

  const planned: PlannedRound[] = input.rounds.map((r) => {
    const { gp, days } = windowGrowthPotential(r.start, r.end, input.season, input.normals, {
      daily: input.daily,
      counts,
    });
    const allowed = days ? allowedSpan(r.start, r.end, counts) : null;
    if (r.target.kind === "none") return { key: r.key, nLb: 0, gp, allowed, reason: "no_nitrogen" };
    if (!allowed) return { key: r.key, nLb: 0, gp, allowed, reason: "no_fertilizer_window" };
    if (r.target.kind === "lb") {
      const capped = r.target.lb > cap + EPS;
      return {
        key: r.key,
        nLb: capped ? cap : r.target.lb,
        gp,
        allowed,
        reason: capped ? "capped" : "fixed",
      };
    }
    return { key: r.key, nLb: 0, gp, allowed, reason: "growth_potential" };
  });

  const fixedLb = planned.reduce((s, p) => s + p.nLb, 0);
  let remaining = Math.max(0, input.yearlyTargetLb - fixedLb);
  // Water filling: spread in proportion to GP; a round over the cap takes the cap and leaves.
  let open = planned.filter((p) => p.reason === "growth_potential" && p.gp > 0);
  while (open.length && remaining > EPS) {
    const gpSum = open.reduce((s, p) => s + p.gp, 0);
    const over = open.filter((p) => (remaining * p.gp) / gpSum > cap + EPS);
    if (!over.length) {
      for (const p of open) p.nLb = (remaining * p.gp) / gpSum;
      remaining = 0;
      break;
    }
    for (const p of over) {
      p.nLb = cap;
      p.reason = "capped";
      remaining -= cap;
    }
    open = open.filter((p) => !over.includes(p));
  }
  const totalLb = planned.reduce((s, p) => s + p.nLb, 0);
  // With no round "from growth potential" the yearly target plans nothing: nothing is unplaced.
  const spreads = input.rounds.some((r) => r.target.kind === "growth_potential");
  return { rounds: planned, totalLb, unplacedLb: spreads ? Math.max(0, remaining) : 0 };
}

function allowedSpan(
  start: IsoDate,
  end: IsoDate,
  counts: (day: IsoDate) => boolean,
): { from: IsoDate; to: IsoDate } | null {
  let from: IsoDate | null = null;
  let to: IsoDate | null = null;
  for (let i = 0; i <= daysBetween(start, end); i++) {
    const day = addDays(start, i);
    if (!counts(day)) continue;
    from ??= day;
    to = day;
  }
  return from && to ? { from, to } : null;
}
