// The one-third rule of mowing, as the zone check reads it: the grass height before mowing against
// the height of cut at the same mowing.
//
// The rule (common practice, taught by extension services nationwide): never remove more than one
// third of the leaf blade at a single mowing. Cornell University home gardening: "if your mowing
// height is 3 inches, you need to mow when the grass is about 4.5 inches tall" (height before
// mowing ≤ 1.5 × height of cut, the same rule read from the other side). Penn State Center for
// Turfgrass Science, Lawn Management Through the Seasons: "if the turf is cut at two inches, it
// should be mowed when it reaches a height no greater than three inches" (read as quoted second-
// hand; primary text not read). Its usual origin, Crider (1955, USDA Technical Bulletin 1102,
// root-growth stoppage after defoliation), measured removal as a share of leaf volume, not of
// height; the rule as practised reads heights, and so does Sward.

export const ONE_THIRD_RULE = {
  /** Most of the blade one mowing may take off. */
  maxRemovedShare: 1 / 3,
  source:
    "The one-third rule (common practice, extension-wide): remove no more than a third of the leaf blade at one mowing — Cornell University home gardening (mow a 3 in lawn at about 4.5 in); Penn State Center for Turfgrass Science, Lawn Management Through the Seasons.",
} as const;

export interface MowingReading {
  beforeIn: number;
  cutIn: number;
  /** Inches taken off at this mowing. */
  removedIn: number;
  /** Share of the blade taken off, 0–1. */
  removedShare: number;
  /** More than a third came off. */
  breaksOneThird: boolean;
  /** The tallest the grass may grow before mowing at this height of cut (1.5 × cut). */
  mowByIn: number;
}

/** The one-third reading of one mowing; null unless the zone was mowed today and both heights are known. */
export function mowingReading(check: {
  mowedToday: boolean | null;
  heightBeforeMowingIn: number | null;
  heightOfCutIn: number | null;
}): MowingReading | null {
  const before = check.heightBeforeMowingIn;
  const cut = check.heightOfCutIn;
  if (check.mowedToday !== true || before === null || cut === null || before <= 0) return null;
  const removedIn = Math.max(0, before - cut);
  const removedShare = removedIn / before;
  return {
    beforeIn: before,
    cutIn: cut,
    removedIn,
    removedShare,
    // 1e-9: 4.5 in cut to 3 in is exactly a third, which the rule allows.
    breaksOneThird: removedShare > ONE_THIRD_RULE.maxRemovedShare + 1e-9,
    mowByIn: cut * 1.5, // cut / (1 − ⅓)
  };
}

/** "4.50 in before mowing, cut to 3.00 in: 33 % of the blade taken off (the one-third rule allows 33 %)." */
export function mowingSentence(r: MowingReading): string {
  const pct = Math.round(r.removedShare * 100);
  return `${r.beforeIn.toFixed(2)} in before mowing, cut to ${r.cutIn.toFixed(2)} in: ${pct} % of the blade taken off (${
    r.breaksOneThird
      ? `more than the third the one-third rule allows; at this height mow by ${r.mowByIn.toFixed(2)} in`
      : "within the one-third rule"
  }).`;
}
