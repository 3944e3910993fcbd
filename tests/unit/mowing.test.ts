// The one-third rule (lib/reference/mowing.ts) against the extension examples that state it:
// Cornell University home gardening ("if your mowing height is 3 inches, you need to mow when the
// grass is about 4.5 inches tall"); Penn State Center for Turfgrass Science ("if the turf is cut at
// two inches, it should be mowed when it reaches a height no greater than three inches"; read as
// quoted second-hand).
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { mowingReading, mowingSentence } from "@/lib/reference/mowing";

const mowed = (before: number, cut: number) => ({
  mowedToday: true,
  heightBeforeMowingIn: before,
  heightOfCutIn: cut,
});

describe("the one-third rule", () => {
  it("Cornell: a 3 in lawn is mowed by 4.5 in; Penn State: a 2 in lawn by 3 in", () => {
    expect(mowingReading(mowed(4.5, 3))).toMatchObject({
      removedIn: 1.5,
      breaksOneThird: false,
      mowByIn: 4.5,
    });
    expect(mowingReading(mowed(4.75, 3))!.breaksOneThird).toBe(true);
    expect(mowingReading(mowed(3, 2))).toMatchObject({ breaksOneThird: false, mowByIn: 3 });
    expect(mowingReading(mowed(3.25, 2))!.breaksOneThird).toBe(true);
  });
  it("the two readings agree: before ≤ 1.5 × cut exactly when at most a third comes off", () => {
    // Heights in quarter inches, as the form's steppers give them.
    fc.assert(
      fc.property(fc.integer({ min: 1, max: 48 }), fc.integer({ min: 0, max: 48 }), (c, extra) => {
        const cut = c / 4;
        const before = (c + extra) / 4;
        expect(mowingReading(mowed(before, cut))!.breaksOneThird).toBe(before > 1.5 * cut);
      }),
    );
  });
  it("reads nothing unless the zone was mowed today with both heights", () => {
    expect(
      mowingReading({ mowedToday: false, heightBeforeMowingIn: null, heightOfCutIn: 3 }),
    ).toBeNull();
    expect(
      mowingReading({ mowedToday: null, heightBeforeMowingIn: 5, heightOfCutIn: 3 }),
    ).toBeNull();
    expect(
      mowingReading({ mowedToday: true, heightBeforeMowingIn: 5, heightOfCutIn: null }),
    ).toBeNull();
  });
  it("says it in words, with what to do", () => {
    expect(mowingSentence(mowingReading(mowed(4, 3))!)).toBe(
      "4.00 in before mowing, cut to 3.00 in: 25 % of the blade taken off (within the one-third rule).",
    );
    expect(mowingSentence(mowingReading(mowed(5, 3))!)).toBe(
      "5.00 in before mowing, cut to 3.00 in: 40 % of the blade taken off (more than the third the one-third rule allows; at this height mow by 4.50 in).",
    );
  });
});
