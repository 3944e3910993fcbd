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

/** The catalogue's "report.zone" words (lib/i18n/translate.ts `words`). */
type ZoneWords = (key: string, values?: Record<string, string | number>) => string;

/**
 * The sentences of one zone check in a homeowner's words. Ratings on the 1–9 scale read as words
 * (9 ideal, 6 the lowest acceptable; NTEP guide, common practice): the catalogue's "rating".
 */
export function zoneSentences(
  c: CheckForWords,
  symptomName: (key: string) => string,
  t: ZoneWords,
): string[] {
  const out: string[] = [];
  const rated: [string, number | null][] = [
    [t("overall"), c.quality],
    [t("color"), c.color],
    [t("density"), c.density],
    [t("uniformity"), c.uniformity],
  ];
  const parts = rated
    .filter(([, v]) => v !== null)
    .map(([label, v]) =>
      t("rated", { label, word: t("rating", { value: Math.min(9, v!) }), value: v! }),
    );
  if (parts.length) out.push(`${parts.join(", ")}.`);
  if ((c.barePct ?? 0) > 0) out.push(t("bare", { pct: c.barePct! }));
  if ((c.weedsPct ?? 0) > 0) out.push(t("weeds", { pct: c.weedsPct! }));
  const mowing = [
    c.heightOfCutIn !== null
      ? t("cutAt", { inches: c.heightOfCutIn.toFixed(2).replace(/0$/, "") })
      : null,
    c.mowingDirection === "same" ? t("sameWay") : null,
    c.isMatted ? t("matted") : null,
    c.hasTornTips ? t("tornTips") : null,
    c.isScalped ? t("scalped") : null,
    c.hasClumpedClippings ? t("clumped") : null,
  ].filter(Boolean);
  if (mowing.length) out.push(t("mowing", { parts: mowing.join(", ") }));
  if (c.soilMoisture) out.push(t("soil", { moisture: c.soilMoisture }));
  for (const s of c.symptoms)
    out.push(
      t("symptom", {
        name: symptomName(s.key).toLowerCase(),
        severity: s.severity,
        pct: s.extentPct,
      }),
    );
  return out;
}
