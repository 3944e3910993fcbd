// What a zone check needs before it can be marked done or skipped, and an empty check as a form
// starts it. Free of zod, so the technician's page can check a zone without loading it; the
// server's schema (schemas.ts) applies the same rules.
import type { ZoneCheckInput } from "./zone-check-fields";

/** The fields still missing, with the message for each ({} when the check may be saved as it is). */
export function zoneCheckCompleteness(
  check: Pick<
    ZoneCheckInput,
    "status" | "quality" | "color" | "density" | "uniformity" | "skipReason" | "skipNote"
  >,
): Record<string, string> {
  const missing: Record<string, string> = {};
  if (check.status === "done") {
    for (const field of ["quality", "color", "density", "uniformity"] as const) {
      if (check[field] === null) missing[field] = "Rate this before marking the zone done.";
    }
  }
  if (check.status === "skipped") {
    if (!check.skipReason) missing.skipReason = "Say why the zone was skipped.";
    if (check.skipReason === "other" && !check.skipNote.trim())
      missing.skipNote = "Describe the reason.";
  }
  return missing;
}

/**
 * The mowing readings that contradict each other, with the message for each ({} when they agree):
 * a height before mowing needs "mowed today", and grass is never shorter before mowing than the
 * height it was cut to.
 */
export function mowingConsistency(check: {
  mowedToday?: boolean | null;
  heightBeforeMowingIn?: number | null;
  heightOfCutIn: number | null;
}): Record<string, string> {
  const before = check.heightBeforeMowingIn ?? null;
  if (before === null) return {};
  if (check.mowedToday !== true)
    return {
      heightBeforeMowingIn:
        "A height before mowing goes with “mowed today”; choose that, or clear the height.",
    };
  if (check.heightOfCutIn !== null && before < check.heightOfCutIn)
    return {
      heightBeforeMowingIn: `The grass before mowing (${before} in) cannot be shorter than the height of cut (${check.heightOfCutIn} in); check both readings.`,
    };
  return {};
}

/** An empty zone check, as a form starts it. */
export function emptyZoneCheck(zoneId: string): ZoneCheckInput {
  return {
    zoneId,
    baseVersion: 0,
    status: "draft",
    quality: null,
    color: null,
    density: null,
    uniformity: null,
    barePct: null,
    weedsPct: null,
    thatchIn: null,
    soilMoisture: null,
    soilMoisturePct: null,
    heightOfCutIn: null,
    mowedToday: null,
    heightBeforeMowingIn: null,
    mowingDirection: null,
    isMatted: false,
    isScalped: false,
    hasTornTips: false,
    hasClumpedClippings: false,
    symptoms: [],
    notes: "",
    skipReason: null,
    skipNote: "",
  };
}
