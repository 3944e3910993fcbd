// The book's map data (lib/book/map.ts toBookMap) and the Index bands (lib/scoring/bands.ts).
import { describe, expect, it } from "vitest";

import { toBookMap, type BookMapRow } from "@/lib/book/map";
import { BAND_STYLE, indexBand, LOW_INDEX } from "@/lib/scoring/bands";
import { palette } from "@/tailwind.config";

const row = (o: Partial<BookMapRow>): BookMapRow => ({
  id: "p1",
  name: "Oyelaran residence",
  latitude: 40.334212345,
  longitude: -74.739149999,
  latest_index: 71.6,
  alerts_high: 0,
  alerts_moderate: 0,
  alerts_low: 0,
  alert_kinds: [],
  ...o,
});

describe("Index bands", () => {
  it("follow the 1–9 scale mapped onto 0–100: rating 6 (lowest acceptable, NTEP guide) is fair, 7 good", () => {
    // (rating − 1) / 8 × 100: 6 → 62.5, 7 → 75 (common practice reading of the NTEP scale).
    const fromRating = (r: number) => ((r - 1) / 8) * 100;
    expect(indexBand(fromRating(6))).toBe("fair");
    expect(indexBand(fromRating(7))).toBe("good");
    expect(indexBand(fromRating(5))).toBe("low");
    expect(indexBand(LOW_INDEX)).toBe("fair");
    expect(indexBand(LOW_INDEX - 0.01)).toBe("low");
    expect(indexBand(74.99)).toBe("fair");
    expect(indexBand(null)).toBe("none");
    expect(indexBand(Number.NaN)).toBe("none");
  });

  it("use the palette's colours, a word and a distinct shape each (never colour alone)", () => {
    expect(BAND_STYLE.good.color).toBe(palette.sward.DEFAULT);
    expect(BAND_STYLE.fair.color).toBe(palette.sun.DEFAULT);
    expect(BAND_STYLE.low.color).toBe(palette.clay.DEFAULT);
    expect(BAND_STYLE.none.color).toBe(palette.muted);
    const shapes = Object.values(BAND_STYLE).map((b) => b.shape);
    expect(new Set(shapes).size).toBe(4);
    expect(new Set(Object.values(BAND_STYLE).map((b) => b.word)).size).toBe(4);
  });
});

describe("the map's compact points", () => {
  it("round coordinates to 5 decimals and the Index to a whole number, and name each kind once", () => {
    const data = toBookMap(
      [
        row({ alerts_moderate: 1, alert_kinds: ["dollar_spot_weather"] }),
        row({
          id: "p2",
          name: "Okafor residence",
          latest_index: null,
          alerts_high: 1,
          alerts_low: 2,
          alert_kinds: ["drought_stress", "dollar_spot_weather"],
        }),
      ],
      new Set(["p2"]),
    );
    expect(data.kinds).toEqual(["dollar_spot_weather", "drought_stress"]);
    expect(data.points).toEqual([
      ["p1", "Oyelaran residence", 40.33421, -74.73915, 72, [0, 1, 0], [0], 0],
      ["p2", "Okafor residence", 40.33421, -74.73915, null, [1, 0, 2], [1, 0], 1],
    ]);
  });

  it("an empty view is empty, not an error", () => {
    expect(toBookMap([], new Set())).toEqual({ kinds: [], points: [] });
  });
});
