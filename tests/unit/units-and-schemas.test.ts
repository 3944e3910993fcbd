// Area conversion against an independent unit library (convert-units, from the registry) and
// the exact definition 1 ft = 0.3048 m (REFERENCES §9); zone-check schema rules.
import convert from "convert-units";
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import { areaInFt2, M2_PER_FT2 } from "@/lib/properties/schemas";
import { emptyZoneCheck, zoneCheckSchema } from "@/lib/visits/schemas";

const ZONE = "11111111-1111-4111-8111-111111111111";

describe("areaInFt2", () => {
  it("uses the exact definition: 1 ft² = 0.3048² m²", () => {
    expect(M2_PER_FT2).toBeCloseTo(0.3048 ** 2, 12);
    expect(areaInFt2(100, "m2")).toBe(1076.4); // 100 m² = 1,076.39 ft²
    expect(areaInFt2(2400, "ft2")).toBe(2400);
  });

  // convert-units uses 10.7639 ft² per m² (six significant figures), hence the relative allowance.
  it("agrees with convert-units to the stored 0.1 ft² and its six significant figures", () => {
    fc.assert(
      fc.property(fc.double({ min: 1, max: 100_000, noNaN: true }), (m2) => {
        const reference = convert(m2).from("m2").to("ft2");
        expect(Math.abs(areaInFt2(m2, "m2") - reference)).toBeLessThanOrEqual(
          0.05 + 2e-6 * reference,
        );
      }),
    );
  });
});

describe("zoneCheckSchema", () => {
  const base = { ...emptyZoneCheck(ZONE) };

  it("a draft may be partial; done needs the four ratings; skipped needs a reason", () => {
    expect(zoneCheckSchema.safeParse({ ...base, quality: 7 }).success).toBe(true);
    const done = zoneCheckSchema.safeParse({ ...base, status: "done", quality: 7 });
    expect(done.success).toBe(false);
    expect(done.error?.issues.map((i) => i.path[0]).sort()).toEqual([
      "color",
      "density",
      "uniformity",
    ]);
    expect(zoneCheckSchema.safeParse({ ...base, status: "skipped" }).success).toBe(false);
    expect(
      zoneCheckSchema.safeParse({ ...base, status: "skipped", skipReason: "other", skipNote: "" })
        .success,
    ).toBe(false);
    expect(
      zoneCheckSchema.safeParse({
        ...base,
        status: "skipped",
        skipReason: "other",
        skipNote: "Gate locked",
      }).success,
    ).toBe(true);
  });

  it("ratings are whole numbers 1–9; percentages in steps of 5; readings to 0.05 in", () => {
    for (const quality of [0, 10, 6.5, -1])
      expect(zoneCheckSchema.safeParse({ ...base, quality }).success).toBe(false);
    for (const barePct of [3, 101, -5])
      expect(zoneCheckSchema.safeParse({ ...base, barePct }).success).toBe(false);
    expect(
      zoneCheckSchema.safeParse({ ...base, barePct: 35, heightOfCutIn: 3.25, thatchIn: 0.75 })
        .success,
    ).toBe(true);
    expect(zoneCheckSchema.safeParse({ ...base, heightOfCutIn: 3.33 }).success).toBe(false);
  });

  it("symptoms come from the catalogue, once each, severity 1–3", () => {
    const s = { key: "dollar_spot", severity: 2, extentPct: 10 };
    expect(zoneCheckSchema.safeParse({ ...base, symptoms: [s] }).success).toBe(true);
    expect(zoneCheckSchema.safeParse({ ...base, symptoms: [s, s] }).success).toBe(false);
    expect(
      zoneCheckSchema.safeParse({ ...base, symptoms: [{ ...s, key: "made_up" }] }).success,
    ).toBe(false);
    expect(zoneCheckSchema.safeParse({ ...base, symptoms: [{ ...s, severity: 4 }] }).success).toBe(
      false,
    );
  });
});
