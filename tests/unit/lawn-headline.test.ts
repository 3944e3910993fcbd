// The homeowner's headline (lib/scoring/words.ts lawnHeadline): every trend word × every size and
// sign of the season's change reads as one story — never "holding steady" beside a change of many
// points, never "getting healthier" beside a fall it does not explain, never "slipped" beside a
// rise it does not explain. Dates read the US way (CLDR en-US: "Wed, Jul 8, 2026").
import { describe, expect, it } from "vitest";

import type { TrendWord } from "@/lib/scoring/trend";
import { MIN_CHECKS_FOR_TREND_WORD } from "@/lib/scoring/weights";
import { lawnHeadline, SMALL_CHANGE_POINTS } from "@/lib/scoring/words";

import { scanWords } from "../helpers/house-words";

const WORDS: (TrendWord | null)[] = ["improving", "steady", "declining", null];
const CHANGES: (number | null)[] = [
  null,
  0,
  0.4, // rounds to 0
  1,
  SMALL_CHANGE_POINTS - 1,
  SMALL_CHANGE_POINTS,
  18,
  -1,
  -(SMALL_CHANGE_POINTS - 1),
  -SMALL_CHANGE_POINTS,
  -18,
];
const COUNTS = [1, MIN_CHECKS_FOR_TREND_WORD - 1, MIN_CHECKS_FOR_TREND_WORD, 9];
const SINCE = "2026-07-08";

describe("lawnHeadline", () => {
  const cases = WORDS.flatMap((word) =>
    CHANGES.flatMap((change) =>
      COUNTS.filter((n) => word === null || n >= MIN_CHECKS_FOR_TREND_WORD).map((n) => ({
        word,
        change,
        n,
      })),
    ),
  );

  it(`reads as one story in all ${cases.length} combinations of trend, change and visits`, () => {
    for (const c of cases) {
      const { tone, sentences } = lawnHeadline({ ...c, since: c.change === null ? null : SINCE });
      const text = sentences.join(" ");
      const where = JSON.stringify(c);
      const points = c.change === null ? 0 : Math.round(c.change);
      expect(sentences.length, where).toBeGreaterThan(0);
      // The tone follows the trend word (or its absence).
      expect(tone, where).toBe(c.word ?? (c.n < MIN_CHECKS_FOR_TREND_WORD ? "too-few" : "unclear"));
      // "Steady" never stands beside a change of SMALL_CHANGE_POINTS or more.
      if (/holding steady/.test(text))
        expect(Math.abs(points), where).toBeLessThan(SMALL_CHANGE_POINTS);
      // A big move under a steady trend is told as a move that has held.
      if (c.word === "steady" && points >= SMALL_CHANGE_POINTS)
        expect(text, where).toMatch(new RegExp(`${points} points healthier than on .* held there`));
      if (c.word === "steady" && points <= -SMALL_CHANGE_POINTS)
        expect(text, where).toMatch(new RegExp(`${-points} points lower than on .* held there`));
      // Improving never with a bare "Down"; declining never with a bare "Up".
      if (c.word === "improving") expect(text, where).not.toMatch(/\bDown\b|lower than/);
      if (c.word === "declining") expect(text, where).not.toMatch(/\bUp\b|higher than|healthier/);
      if (c.word === "improving" && points < 0)
        expect(text, where).toMatch(new RegExp(`still ${-points} points? below`));
      if (c.word === "declining" && points > 0)
        expect(text, where).toMatch(new RegExp(`still ${points} points? above`));
      // The number of points shown is the rounded change, with its unit word, singular for 1.
      if (Math.abs(points) === 1) expect(text, where).toMatch(/\b1 point\b/);
      if (Math.abs(points) > 1) expect(text, where).toContain(`${Math.abs(points)} points`);
      if (c.change !== null) expect(text, where).toContain("Wed, Jul 8, 2026");
      // No statistics notation and no British spelling.
      expect(scanWords(where, text, { homeowner: true }), where).toEqual([]);
    }
  });

  it("names the checks a direction needs while there are too few", () => {
    expect(lawnHeadline({ word: null, n: 2, change: 3, since: SINCE }).sentences).toEqual([
      `A direction shows after ${MIN_CHECKS_FOR_TREND_WORD} visits within 120 days (2 so far).`,
      "A little higher than on Wed, Jul 8, 2026 (3 points).",
    ]);
    expect(lawnHeadline({ word: null, n: 0, change: null, since: null }).sentences).toEqual([
      `A direction shows after ${MIN_CHECKS_FOR_TREND_WORD} visits within 120 days (none).`,
    ]);
  });

  it("the case seen on the demo: steady over 120 days, 18 points up since July", () => {
    expect(
      lawnHeadline({ word: "steady", n: 6, change: 18.2, since: SINCE }).sentences.join(" "),
    ).toBe(
      "Your lawn is 18 points healthier than on Wed, Jul 8, 2026 and has held there lately. Based on 6 visits in the last 120 days.",
    );
  });
});
