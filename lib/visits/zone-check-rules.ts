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
