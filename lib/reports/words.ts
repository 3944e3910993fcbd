// What a technician recorded, in a homeowner's words (pure).
/** What the sentences read of a zone check (a subset of its values). */
export interface CheckForWords {
  quality: number | null;
  color: number | null;
  density: number | null;
  uniformity: number | null;
  barePct: number | null;
  weedsPct: number | null;
  heightOfCutIn: number | null;
  soilMoisture: "dry" | "moist" | "wet" | null;
  mowingDirection: "same" | "changed" | "unknown" | null;
  isMatted: boolean;
  isScalped: boolean;
  hasTornTips: boolean;
  hasClumpedClippings: boolean;
  symptoms: { key: string; severity: 1 | 2 | 3; extentPct: number }[];
}

/** The 1–9 rating scale in words (9 ideal, 6 the lowest acceptable; NTEP guide, common practice). */
function ratingWord(r: number): string {
  if (r >= 9) return "excellent";
  if (r === 8) return "very good";
  if (r === 7) return "good";
  if (r === 6) return "acceptable";
  if (r === 5) return "fair";
  return "poor";
}

const SEVERITY = { 1: "light", 2: "moderate", 3: "severe" } as const;

export function zoneSentences(c: CheckForWords, symptomName: (key: string) => string): string[] {
  const out: string[] = [];
  const rated: [string, number | null][] = [
    ["Overall", c.quality],
    ["Color", c.color],
    ["Thickness", c.density],
    ["Evenness", c.uniformity],
  ];
  const parts = rated
    .filter(([, v]) => v !== null)
    .map(([label, v]) => `${label} ${ratingWord(v!)} (${v} of 9)`);
  if (parts.length) out.push(`${parts.join(", ")}.`);
  if ((c.barePct ?? 0) > 0) out.push(`About ${c.barePct} % bare ground.`);
  if ((c.weedsPct ?? 0) > 0) out.push(`About ${c.weedsPct} % weeds.`);
  const mowing = [
    c.heightOfCutIn !== null ? `cut at ${c.heightOfCutIn.toFixed(2).replace(/0$/, "")} in` : null,
    c.mowingDirection === "same" ? "mowed the same way as last time" : null,
    c.isMatted ? "grass matted and laid over" : null,
    c.hasTornTips ? "torn leaf tips (a dull blade)" : null,
    c.isScalped ? "scalped in places" : null,
    c.hasClumpedClippings ? "clumps of clippings" : null,
  ].filter(Boolean);
  if (mowing.length) out.push(`Mowing: ${mowing.join(", ")}.`);
  if (c.soilMoisture) out.push(`Soil ${c.soilMoisture}.`);
  for (const s of c.symptoms)
    out.push(
      `Signs of ${symptomName(s.key).toLowerCase()} (${SEVERITY[s.severity]}, about ${s.extentPct} % of the zone).`,
    );
  return out;
}
