// The zone check's bounds: a probe reading is 0–100 % (volumetric water content is a share of the
// soil's volume, so by definition), heights of cut within the home-lawn ranges' margins
// (lib/reference/grass-species.ts: 0.5 in bermudagrass to 4.0 in bahiagrass, UF/IFAS LH028), and
// notes up to 4,000 characters — refused with the field's name and unit, never clamped.
import { describe, expect, it } from "vitest";

import { grassSpecies } from "@/lib/reference/grass-species";
import { parseProbeReading, ZONE_CHECK_BOUNDS } from "@/lib/visits/zone-check-bounds";
import { zoneCheckFields } from "@/lib/visits/zone-check-fields";

import { doneCheck } from "../helpers/zone-checks";

const messagesOf = (o: Record<string, unknown>) => {
  const r = zoneCheckFields.safeParse({
    ...doneCheck("5f0c4a8e-2d1b-4c3a-9e7f-1a2b3c4d5e6f"),
    ...o,
  });
  return r.success
    ? {}
    : Object.fromEntries(r.error.issues.map((i) => [String(i.path[0]), i.message]));
};

describe("probe reading as typed", () => {
  it("0 and 100 are kept; -5, 250 and text are refused, not clamped", () => {
    expect(parseProbeReading("0")).toEqual({ value: 0 });
    expect(parseProbeReading("100")).toEqual({ value: 100 });
    expect(parseProbeReading("23,5")).toEqual({ value: 23.5 });
    expect(parseProbeReading("")).toEqual({ value: null });
    for (const bad of ["-5", "250", "100.5"])
      expect(parseProbeReading(bad)).toEqual({
        error: expect.stringMatching(/^Soil moisture probe reading: between 0 and 100 %/),
      });
    expect(parseProbeReading("wet")).toEqual({
      error: "Soil moisture probe reading: enter a number, in %.",
    });
  });
});

describe("the server's schema", () => {
  it("probe: -5 and 250 are refused with the field's name and %", () => {
    expect(messagesOf({ soilMoisturePct: -5 }).soilMoisturePct).toMatch(
      /^Soil moisture probe reading: .*%/,
    );
    expect(messagesOf({ soilMoisturePct: 250 }).soilMoisturePct).toMatch(
      /^Soil moisture probe reading: .*%/,
    );
    expect(messagesOf({ soilMoisturePct: 0 })).toEqual({});
    expect(messagesOf({ soilMoisturePct: 100 })).toEqual({});
  });

  it("height of cut: every species' home-lawn range lies inside the accepted one", () => {
    const { min, max } = ZONE_CHECK_BOUNDS.heightOfCutIn;
    for (const s of grassSpecies) {
      expect(s.heightOfCutIn.min, s.key).toBeGreaterThanOrEqual(min);
      expect(s.heightOfCutIn.max, s.key).toBeLessThanOrEqual(max);
    }
    expect(messagesOf({ heightOfCutIn: 0.25 })).toEqual({});
    expect(messagesOf({ heightOfCutIn: 6 })).toEqual({});
    expect(messagesOf({ heightOfCutIn: 0 }).heightOfCutIn).toBe(
      "Height of cut: at least 0.25 in (lawns are cut at 0.5–4 in); check the reading.",
    );
    expect(messagesOf({ heightOfCutIn: 6.25 }).heightOfCutIn).toBe(
      "Height of cut: at most 6 in (lawns are cut at 0.5–4 in); check the reading.",
    );
  });

  it("height before mowing: 0.25–24 in, with the unit", () => {
    const mowed = { mowedToday: true, heightOfCutIn: 0.25 };
    expect(messagesOf({ ...mowed, heightBeforeMowingIn: 0.25 })).toEqual({});
    expect(messagesOf({ ...mowed, heightBeforeMowingIn: 24 })).toEqual({});
    expect(messagesOf({ ...mowed, heightBeforeMowingIn: 0 }).heightBeforeMowingIn).toBe(
      "Height before mowing: at least 0.25 in; check the reading.",
    );
    expect(messagesOf({ ...mowed, heightBeforeMowingIn: 24.25 }).heightBeforeMowingIn).toBe(
      "Height before mowing: at most 24 in; check the reading.",
    );
  });

  it("notes: 4,000 characters are kept, 4,001 refused with the field's name", () => {
    expect(messagesOf({ notes: "x".repeat(4000) })).toEqual({});
    expect(messagesOf({ notes: "x".repeat(4001) })).toEqual({
      notes: "Zone notes: at most 4,000 characters; shorten them.",
    });
  });
});
