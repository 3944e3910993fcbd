// Which care notes a visit report carries (pure): the notes whose triggers match what was seen in
// the zones, the property's open alerts, or what was applied — each with the reasons in words.
// Readings: a "short cut" is below the bottom of the species' home-lawn range (extension tables,
// lib/reference/grass-species.ts; these replaced a blanket 2.5 in for cool-season turf that sat
// above perennial ryegrass's home-lawn range of 1.5–2.5 in); thick thatch is more than 0.5 in;
// bare ground or weeds count from 10 % of the zone.
import {
  CARE_NOTES,
  careNoteText,
  type CareNote,
  type CareTrigger,
} from "@/lib/reference/care-notes";
import { alertKindLabel } from "@/lib/risk/labels";

const THICK_THATCH_IN = 0.5;
const NOTABLE_PCT = 10;

export interface ObservedZone {
  zoneName: string;
  season: "cool" | "warm";
  speciesMinCutIn: number | null;
  mowingDirection: string | null;
  isMatted: boolean;
  hasTornTips: boolean;
  isScalped: boolean;
  hasClumpedClippings: boolean;
  heightOfCutIn: number | null;
  thatchIn: number | null;
  soilMoisture: string | null;
  barePct: number | null;
  weedsPct: number | null;
  symptomKeys: string[];
}

export interface AppliedProduct {
  zoneName: string;
  nLb: number;
  p2o5Lb: number;
  isPesticide: boolean;
  appliedOn: string;
  season: "cool" | "warm";
}

export interface MatchedNote {
  note: CareNote;
  because: string[];
}

type Finding = Extract<CareTrigger, { kind: "finding" }>["finding"];

function findingsOf(z: ObservedZone): Finding[] {
  const out: Finding[] = [];
  if (z.mowingDirection === "same") out.push("same_direction");
  if (z.isMatted) out.push("matted");
  if (z.hasTornTips) out.push("torn_tips");
  if (z.isScalped) out.push("scalped");
  if (z.heightOfCutIn !== null && z.speciesMinCutIn !== null && z.heightOfCutIn < z.speciesMinCutIn)
    out.push("short_cut");
  if (z.hasClumpedClippings) out.push("clumped_clippings");
  if (z.thatchIn !== null && z.thatchIn > THICK_THATCH_IN) out.push("thick_thatch");
  if (z.soilMoisture === "dry") out.push("dry_soil");
  if (z.soilMoisture === "wet") out.push("wet_soil");
  if ((z.barePct ?? 0) >= NOTABLE_PCT) out.push("bare_ground");
  if ((z.weedsPct ?? 0) >= NOTABLE_PCT) out.push("weeds");
  return out;
}

const FINDING_WORDS: Record<Finding, string> = {
  same_direction: "mowed the same way as last time",
  matted: "grass matted and laid over",
  torn_tips: "torn leaf tips",
  scalped: "scalped patches",
  short_cut: "cut short",
  clumped_clippings: "clumps of clippings",
  thick_thatch: "thick thatch",
  dry_soil: "dry soil",
  wet_soil: "wet soil",
  bare_ground: "bare ground",
  weeds: "weeds",
};

const isLateSeason = (a: AppliedProduct) =>
  a.season === "cool" &&
  a.nLb > 0 &&
  a.appliedOn.slice(5) >= "09-01" &&
  a.appliedOn.slice(5) <= "11-30";

export function matchCareNotes(
  zones: ObservedZone[],
  openAlertKinds: string[],
  applied: AppliedProduct[],
  symptomName: (key: string) => string = (k) => k,
  /** The visit's date and weather: a note's advice for the season and weather (careNoteText). */
  context?: { date: string; weather: { tmaxF: number } | null },
): MatchedNote[] {
  const matched: MatchedNote[] = [];
  for (const note of CARE_NOTES) {
    const because = new Set<string>();
    for (const t of note.triggers) {
      if (t.kind === "finding")
        for (const z of zones)
          if (findingsOf(z).includes(t.finding))
            because.add(`${z.zoneName}: ${FINDING_WORDS[t.finding]}`);
      if (t.kind === "symptom")
        for (const z of zones)
          for (const s of z.symptomKeys)
            if (t.symptoms.includes(s))
              because.add(`${z.zoneName}: ${symptomName(s).toLowerCase()}`);
      if (t.kind === "alert" && openAlertKinds.includes(t.alert))
        because.add(`${alertKindLabel(t.alert).toLowerCase()} (an open alert on your lawn)`);
      if (t.kind === "applied") {
        const hits = applied.filter((a) =>
          t.applied === "fertiliser"
            ? !a.isPesticide && (a.nLb > 0 || a.p2o5Lb > 0)
            : t.applied === "pesticide"
              ? a.isPesticide
              : isLateSeason(a),
        );
        for (const a of hits)
          because.add(
            `${a.zoneName}: ${t.applied === "pesticide" ? "treated today" : "fed today"}`,
          );
      }
    }
    if (because.size)
      matched.push({
        note: context ? { ...note, ...careNoteText(note, context) } : note,
        because: [...because],
      });
  }
  return matched;
}
