// Soil tests read against their published sources (lib/agronomy/soil-test.ts).
import convert from "convert-units";
import { describe, expect, it } from "vitest";

import {
  mehlichBufferLimeLbPer1000,
  MLSN_PPM,
  ppmToLbPer1000,
  readSoilTest,
  type SoilTestValues,
} from "@/lib/agronomy/soil-test";

const mehlich3 = (over: Partial<SoilTestValues> = {}): SoilTestValues => ({
  extractant: "mehlich3",
  depthIn: 4,
  ph: 6.2,
  bufferPh: null,
  bufferMethod: null,
  labLimeLbPer1000: null,
  labPhosphorusNeeded: null,
  ppm: { p: 30, k: 60, ca: 900, mg: 120, s: 12 },
  ...over,
});

describe("MLSN guidelines (PACE Turf / Asian Turfgrass Center sheet, September 2014)", () => {
  it("are the published Mehlich-3 minimums: K 37, P 21, Ca 331, Mg 47, S 7 ppm", () => {
    expect(MLSN_PPM).toEqual({ k: 37, p: 21, ca: 331, mg: 47, s: 7 });
  });

  it("a result at the guideline meets it; one ppm below does not", () => {
    const at = readSoilTest(mehlich3({ ppm: { p: 21, k: 37, ca: 331, mg: 47, s: 7 } }));
    expect(at.elements.every((e) => e.meets && e.toGuidelineLbPer1000 === 0)).toBe(true);
    expect(at.showsPhosphorusNeed).toBe(false);
    const below = readSoilTest(mehlich3({ ppm: { p: 20, k: 36, ca: 330, mg: 46, s: 6 } }));
    expect(below.elements.map((e) => e.meets)).toEqual([false, false, false, false, false]);
    expect(below.showsPhosphorusNeed).toBe(true);
  });

  it("does not judge another extractant's numbers (the guidelines are Mehlich-3 only)", () => {
    const bray = readSoilTest(
      mehlich3({ extractant: "bray1", ppm: { p: 5, k: 10, ca: null, mg: null, s: null } }),
    );
    expect(bray.interpreted).toBe(false);
    expect(bray.elements).toEqual([]);
    expect(bray.showsPhosphorusNeed).toBe(false);
  });

  it("the lab's own word on phosphorus wins over the guideline, either way", () => {
    const low = { ppm: { p: 12, k: 60, ca: 900, mg: 120, s: 12 } };
    expect(readSoilTest(mehlich3({ ...low, labPhosphorusNeeded: false })).showsPhosphorusNeed).toBe(
      false,
    );
    expect(readSoilTest(mehlich3({ labPhosphorusNeeded: true })).showsPhosphorusNeed).toBe(true);
    expect(
      readSoilTest(mehlich3({ extractant: "bray1", labPhosphorusNeeded: true }))
        .showsPhosphorusNeed,
    ).toBe(true);
  });
});

describe("pounds from ppm (soil-testing convention: 1 ppm ≈ 2 lb/acre in the top 6⅔ in)", () => {
  it("1 ppm over 6⅔ in is 2 lb per acre, i.e. 2 ÷ 43.56 lb per 1,000 ft²", () => {
    expect(ppmToLbPer1000(1, 20 / 3)).toBeCloseTo(2 / 43.56, 10);
  });

  it("agrees with the soil's mass computed from first principles (convert-units, a general library)", () => {
    // An acre-furrow-slice of 2,000,000 lb over 6⅔ in is a bulk density of
    // 2e6 lb ÷ (43,560 ft² × 6⅔/12 ft) ≈ 82.6 lb/ft³ ≈ 1.32 g/cm³, a usual figure for a loam.
    const ft3 = 1000 * (4 / 12); // 1,000 ft² to 4 in
    const densityLbPerFt3 = 2e6 / (43_560 * (20 / 3 / 12));
    const gPerCm3 = convert(densityLbPerFt3).from("lb").to("g") / convert(1).from("ft3").to("ml");
    expect(gPerCm3).toBeCloseTo(1.32, 2);
    const soilLb = ft3 * densityLbPerFt3;
    expect(ppmToLbPer1000(10, 4)).toBeCloseTo((10 * soilLb) / 1e6, 10);
  });

  it("a phosphorus shortfall is stated as P₂O₅ (÷ 0.4364) and potassium as K₂O (÷ 0.8301)", () => {
    const r = readSoilTest(
      mehlich3({ depthIn: 4, ppm: { p: 11, k: 27, ca: null, mg: null, s: null } }),
    );
    const [p, k] = r.elements;
    // 10 ppm short in 4 in: 10 × 2 × (4 ÷ 6⅔) = 12 lb/acre of P = 0.2755 lb/1,000 ft².
    expect(p!.toGuidelineLbPer1000).toBeCloseTo(12 / 43.56 / 0.4364, 3);
    expect(p!.amountOf).toBe("P₂O₅");
    expect(k!.toGuidelineLbPer1000).toBeCloseTo(12 / 43.56 / 0.8301, 3);
    expect(k!.amountOf).toBe("K₂O");
  });
});

describe("lime from the Mehlich buffer (NCDA&CS lime requirement table)", () => {
  it("the table's worked example: pH 5.0, target 6.0, acidity 1.2 (buffer pH 6.3) → 0.75 ton/acre", () => {
    const lb = mehlichBufferLimeLbPer1000(5.0, 6.3, 6.0);
    expect((lb * 43.56) / 2000).toBeCloseTo(0.75, 6);
    expect(lb).toBeCloseTo(34.4, 1); // 0.75 ton/acre = 1,500 lb ÷ 43.56
  });

  it("asks for none at or above the target, and more as the buffer pH falls", () => {
    expect(mehlichBufferLimeLbPer1000(6.0, 6.0)).toBe(0);
    expect(mehlichBufferLimeLbPer1000(6.4, 6.1)).toBe(0);
    const a = mehlichBufferLimeLbPer1000(5.2, 6.4);
    const b = mehlichBufferLimeLbPer1000(5.2, 6.0);
    expect(b).toBeGreaterThan(a);
    expect(b / a).toBeCloseTo(0.6 / 0.2, 6); // acidity is linear in (6.6 − BpH)
  });

  it("advises lime only below the MLSN pH of 5.5, from the lab's own figure when it gave one", () => {
    expect(
      readSoilTest(mehlich3({ ph: 5.5, bufferPh: 6.2, bufferMethod: "mehlich" })).lime,
    ).toEqual({
      kind: "none_needed",
      ph: 5.5,
    });
    const low = readSoilTest(mehlich3({ ph: 5.0, bufferPh: 6.3, bufferMethod: "mehlich" })).lime;
    expect(low).toMatchObject({ kind: "mehlich_buffer", targetPh: 6.0 });
    expect(low.kind === "mehlich_buffer" && low.lbPer1000).toBeCloseTo(34.4, 1);
    expect(readSoilTest(mehlich3({ ph: 5.0, bufferPh: 6.6, bufferMethod: "smp" })).lime).toEqual({
      kind: "needs_buffer",
      ph: 5.0,
    });
    expect(
      readSoilTest(mehlich3({ ph: 5.0, bufferMethod: "smp", labLimeLbPer1000: 50 })).lime,
    ).toEqual({ kind: "lab", ph: 5.0, lbPer1000: 50, method: "smp" });
    expect(readSoilTest(mehlich3({ ph: null })).lime).toEqual({ kind: "no_ph" });
  });
});
