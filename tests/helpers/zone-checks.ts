// Builders for zone-check payloads in tests.
import { randomUUID } from "node:crypto";

import { emptyZoneCheck, type ZoneCheckInput } from "@/lib/visits/schemas";

export function doneCheck(zoneId: string, overrides: Partial<ZoneCheckInput> = {}): ZoneCheckInput {
  return {
    ...emptyZoneCheck(zoneId),
    status: "done",
    quality: 7,
    color: 7,
    density: 6,
    uniformity: 7,
    barePct: 5,
    weedsPct: 10,
    thatchIn: 0.5,
    soilMoisture: "moist",
    heightOfCutIn: 3.25,
    mowingDirection: "changed",
    symptoms: [{ key: "red_thread", severity: 1, extentPct: 5 }],
    notes: "Even colour; a little red thread by the drive.",
    ...overrides,
  };
}

export const newId = () => randomUUID();
