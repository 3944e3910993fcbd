// Care notes match what was observed and applied, say why, and carry their safety cautions.
import { describe, expect, it } from "vitest";

import { CARE_NOTES } from "@/lib/reference/care-notes";
import { matchCareNotes, type ObservedZone } from "@/lib/reports/care-notes";

const zone = (o: Partial<ObservedZone> = {}): ObservedZone => ({
  zoneName: "Front lawn",
  season: "cool",
  speciesMinCutIn: 2, // tall fescue's home-lawn minimum (University of Kentucky AGR-209)
  mowingDirection: "changed",
  isMatted: false,
  hasTornTips: false,
  isScalped: false,
  hasClumpedClippings: false,
  heightOfCutIn: 3.5,
  thatchIn: 0.25,
  soilMoisture: "moist",
  barePct: 0,
  weedsPct: 0,
  symptomKeys: [],
  ...o,
});
const keys = (m: ReturnType<typeof matchCareNotes>) => m.map((x) => x.note.key);

describe("care notes", () => {
  it("a healthy zone with nothing applied carries no note", () => {
    expect(matchCareNotes([zone()], [], [])).toEqual([]);
  });
  it("matting or one mowing direction → vary the direction, with mower safety", () => {
    const m = matchCareNotes([zone({ isMatted: true, mowingDirection: "same" })], [], []);
    expect(keys(m)).toEqual(["vary_mowing_direction"]);
    expect(m[0]!.because).toEqual([
      "Front lawn: mowed the same way as last time",
      "Front lawn: grass matted and laid over",
    ]);
    expect(m[0]!.note.cautions!.join(" ")).toMatch(/Mower safety/);
  });
  it("torn tips → sharpen the blade, cutting away from yourself and others", () => {
    const m = matchCareNotes([zone({ hasTornTips: true })], [], []);
    expect(keys(m)).toEqual(["sharpen_blade"]);
    expect(m[0]!.note.cautions!.join(" ")).toMatch(/cut away from yourself and others/);
  });
  it("a cut below the species' home-lawn range → raise the height (extension tables)", () => {
    expect(keys(matchCareNotes([zone({ heightOfCutIn: 1.75 })], [], []))).toEqual([
      "raise_mowing_height",
    ]);
    expect(keys(matchCareNotes([zone({ heightOfCutIn: 2 })], [], []))).toEqual([]);
    // Perennial ryegrass's home-lawn range is 1.5–2.5 in: 2.25 in is not short.
    expect(
      keys(matchCareNotes([zone({ speciesMinCutIn: 1.5, heightOfCutIn: 2.25 })], [], [])),
    ).toEqual([]);
  });
  it("dry soil or wilt → water deeply and early; disease symptoms → help the grass dry off", () => {
    expect(keys(matchCareNotes([zone({ soilMoisture: "dry" })], [], []))).toEqual(["water_deeply"]);
    expect(
      keys(matchCareNotes([zone({ symptomKeys: ["dollar_spot"] })], [], [], () => "Dollar spot")),
    ).toEqual(["disease_weather"]);
  });
  it("a feeding → keep children and pets off until dry; a fall feeding → results next spring", () => {
    const m = matchCareNotes(
      [zone()],
      [],
      [
        {
          zoneName: "Front lawn",
          nLb: 0.9,
          p2o5Lb: 0,
          isPesticide: false,
          appliedOn: "2026-10-20",
          season: "cool",
        },
      ],
    );
    expect(keys(m)).toEqual(["after_fertiliser", "late_season_results"]);
    expect(m[0]!.note.cautions!.join(" ")).toMatch(
      /Keep children and pets off treated grass until it has been watered in and has dried/,
    );
  });
  it("open alerts bring their notes, once", () => {
    expect(
      keys(
        matchCareNotes(
          [zone(), zone({ zoneName: "Back yard" })],
          ["declining_index", "torn_tips"],
          [],
        ),
      ),
    ).toEqual(["sharpen_blade", "declining"]);
  });
  it("every note has a title, a body and at least one trigger; keys are unique", () => {
    expect(new Set(CARE_NOTES.map((n) => n.key)).size).toBe(CARE_NOTES.length);
    for (const n of CARE_NOTES) expect(n.title && n.body && n.triggers.length).toBeTruthy();
  });
});
