// The bounds of a zone check's typed numbers and notes, free of zod so the technician's page can
// check a reading as it is typed (the server parses the same bounds in zone-check-fields.ts).
/**
 * What a zone check accepts where a person types or steps a number, and the notes' length. A
 * reading outside is refused with the field's name and unit, never clamped.
 * - Probe reading: volumetric soil moisture is a share of the soil's volume, 0–100 % by definition.
 * - Height of cut: the home-lawn ranges in lib/reference/grass-species.ts run from 0.5 in
 *   (bermudagrass, reel-mowed: UF/IFAS LH028) to 4.0 in (bahiagrass, St. Augustinegrass: UF/IFAS
 *   LH028); 0.25–6 in leaves room on both sides. Below 0.25 in is golf-green height and above 6 in
 *   no lawn mower deck is set (both common practice, from memory).
 * - Height before mowing: at least the lowest height of cut; up to 24 in for a lawn left to grow
 *   long (common practice; most lawn grasses head out below 2 ft, from memory).
 * - Notes: the same 4,000 characters as a visit's notes (the columns' limit), with a counter.
 */
export const ZONE_CHECK_BOUNDS = {
  soilMoisturePct: { min: 0, max: 100, unit: "%" },
  heightOfCutIn: { min: 0.25, max: 6, unit: "in" },
  heightBeforeMowingIn: { min: 0.25, max: 24, unit: "in" },
  notesMax: 4000,
} as const;

export const PROBE_READING_MESSAGE =
  "Soil moisture probe reading: between 0 and 100 % (a probe reads the share of the soil's volume that is water).";

/**
 * A typed probe reading: the number to keep (null for an empty box), or the message that refuses
 * it. "abc", "-5" and "250" are refused, never clamped.
 */
export function parseProbeReading(text: string): { value: number | null } | { error: string } {
  const t = text.trim().replace(",", ".");
  if (t === "") return { value: null };
  const n = Number(t);
  if (!Number.isFinite(n)) return { error: "Soil moisture probe reading: enter a number, in %." };
  const { min, max } = ZONE_CHECK_BOUNDS.soilMoisturePct;
  if (n < min || n > max) return { error: PROBE_READING_MESSAGE };
  return { value: n };
}
