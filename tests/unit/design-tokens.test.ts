// Every text/background pair the UI uses meets WCAG 2.1 AA (4.5:1 for body text), computed with
// an independent colour library (colorjs.io), itself checked against the commonly cited
// #767676-on-white = 4.54:1 (WCAG's own example of the lightest grey passing AA on white).
import Color from "colorjs.io";
import { describe, expect, it } from "vitest";

import { palette } from "@/tailwind.config";

const contrast = (a: string, b: string) => new Color(a).contrast(new Color(b), "WCAG21");

describe("design tokens", () => {
  it("the reference library reproduces the known value", () => {
    expect(contrast("#767676", "#ffffff")).toBeCloseTo(4.54, 2);
  });

  const pairs: [string, string, string][] = [
    ["ink on paper", palette.ink, palette.paper],
    ["ink on card", palette.ink, palette.card],
    ["muted on paper", palette.muted, palette.paper],
    ["muted on card", palette.muted, palette.card],
    ["white on sward (primary button)", "#ffffff", palette.sward.DEFAULT],
    ["white on sward-deep (button hover)", "#ffffff", palette.sward.deep],
    ["sward-deep on sward tint (current nav)", palette.sward.deep, palette.sward.tint],
    ["sward on card (links)", palette.sward.DEFAULT, palette.card],
    ["clay on clay tint (errors)", palette.clay.DEFAULT, palette.clay.tint],
    ["clay on card", palette.clay.DEFAULT, palette.card],
    ["sun on sun tint (caution)", palette.sun.DEFAULT, palette.sun.tint],
    ["sun on card", palette.sun.DEFAULT, palette.card],
    ["rain on rain tint (water)", palette.rain.DEFAULT, palette.rain.tint],
    ["ink on sun tint", palette.ink, palette.sun.tint],
    ["ink on rain tint", palette.ink, palette.rain.tint],
    ["rain on card (check soon in tables)", palette.rain.DEFAULT, palette.card],
    // The book map's markers on the base map's background (tests/harness/map-tiles-fake.ts,
    // components/book/book-map.tsx): held to the text ratio though graphics need only 3:1.
    ["good marker on the map", palette.sward.DEFAULT, "#eef0e6"],
    ["fair marker on the map", palette.sun.DEFAULT, "#eef0e6"],
    ["low marker on the map", palette.clay.DEFAULT, "#eef0e6"],
    ["not-rated marker on the map", palette.muted, "#eef0e6"],
    ["white on clay", "#ffffff", palette.clay.DEFAULT],
    ["white on muted (disabled button)", "#ffffff", palette.muted],
  ];

  it.each(pairs)("%s meets 4.5:1", (_name, fg, bg) => {
    expect(contrast(fg, bg)).toBeGreaterThanOrEqual(4.5);
  });
});
