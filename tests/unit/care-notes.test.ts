// Care notes match what was observed and applied, say why, and carry their safety cautions.
import { describe, expect, it } from "vitest";

import { CARE_NOTES, careNoteText, yearSeason } from "@/lib/reference/care-notes";
import { symptomKeys } from "@/lib/reference/symptoms";
import { matchCareNotes, type ObservedZone } from "@/lib/reports/care-notes";
import { ALERT_KINDS } from "@/lib/risk/labels";

import { scanWords } from "../helpers/house-words";

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
  it("every finding, every symptom of the catalogue and every alert kind has a care note", () => {
    const findings = [
      "same_direction",
      "matted",
      "torn_tips",
      "scalped",
      "short_cut",
      "clumped_clippings",
      "thick_thatch",
      "dry_soil",
      "wet_soil",
      "bare_ground",
      "weeds",
    ];
    const triggered = (pred: (t: (typeof CARE_NOTES)[number]["triggers"][number]) => boolean) =>
      CARE_NOTES.some((n) => n.triggers.some(pred));
    const missing = [
      ...findings.filter((f) => !triggered((t) => t.kind === "finding" && t.finding === f)),
      ...symptomKeys.filter(
        (k) => !triggered((t) => t.kind === "symptom" && t.symptoms.includes(k)),
      ),
      ...Object.keys(ALERT_KINDS).filter(
        (k) => !triggered((t) => t.kind === "alert" && t.alert === k),
      ),
    ];
    expect(missing).toEqual([]);
  });
  it("dog urine spots bring their own note", () => {
    const m = matchCareNotes(
      [zone({ symptomKeys: ["dog_spots"] })],
      [],
      [],
      () => "Dog urine spots",
    );
    expect(keys(m)).toEqual(["dog_spots"]);
    expect(m[0]!.because).toEqual(["Front lawn: dog urine spots"]);
    expect(m[0]!.note.body).toMatch(/Soak the spot/);
  });
  it("every note states its source, and reads in US English without internals", () => {
    for (const n of CARE_NOTES) {
      expect(n.source, n.key).toMatch(/\w{5,}/);
      const text = [
        n.title,
        n.body,
        n.source,
        ...(n.cautions ?? []),
        ...(n.variants ?? []).map((v) => v.body),
      ].join(" ");
      expect(scanWords(n.key, text, { homeowner: true }), n.key).toEqual([]);
    }
  });
  // Meteorological seasons (Dec–Feb winter …); warm from a high of 75 °F, cold below 50 °F.
  it("the advice follows the visit's season and weather: no warm, humid weather in December", () => {
    expect(["2026-12-02", "2026-03-01", "2026-07-15", "2026-11-30"].map(yearSeason)).toEqual([
      "winter",
      "spring",
      "summer",
      "fall",
    ]);
    const december = { date: "2026-12-02", weather: { tmaxF: 41 } };
    for (const n of CARE_NOTES) {
      const { body } = careNoteText(n, december);
      expect(body, n.key).not.toMatch(/warm|humid|summer heat|In summer/i);
    }
    const matted = CARE_NOTES.find((n) => n.key === "vary_mowing_direction")!;
    expect(careNoteText(matted, { date: "2026-07-15", weather: { tmaxF: 88 } }).body).toMatch(
      /warm, humid weather/,
    );
    expect(careNoteText(matted, december).body).toMatch(/when you start mowing again in spring/);
    // A mild fall day, or no weather known: the advice that holds in any season.
    expect(careNoteText(matted, { date: "2026-10-10", weather: { tmaxF: 62 } }).body).toBe(
      matted.body,
    );
    expect(careNoteText(matted, { date: "2026-07-15", weather: null }).body).toBe(matted.body);
    // The report picks the December text for a matted lawn seen on 2 December.
    const m = matchCareNotes([zone({ isMatted: true })], [], [], undefined, december);
    expect(m[0]!.note.body).toMatch(/when you start mowing again in spring/);
    const water = CARE_NOTES.find((n) => n.key === "water_deeply")!;
    expect(careNoteText(water, december).body).not.toMatch(/an inch of water a week/);
  });
});
