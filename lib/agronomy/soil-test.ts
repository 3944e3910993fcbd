// A soil test read against published guidelines (pure).
//
// Nutrients: the Minimum Levels for Sustainable Nutrition (MLSN) guidelines of Woods, Stowell &
// Gelernter, for Mehlich-3 extractable nutrients (PACE Turf and Asian Turfgrass Center reference
// sheet, September 2014; the same values cited as Woods et al. 2016 in extension tables): pH above
// 5.5; K 37, P 21, Ca 331, Mg 47 and sulfate-S 7 ppm. MLSN supplies what the grass will use plus,
// where the soil is below a guideline, what brings it up to it; this module gives that second part
// (the grass's use follows its nitrogen, which the season's plan holds). The guidelines are
// calibrated on Mehlich-3 only: results by another extractant are shown as the lab reported them,
// not judged.
//
// Pounds from ppm: soil-testing convention that an acre of soil to 6⅔ inches weighs about
// 2,000,000 lb, so 1 ppm ≈ 2 lb per acre in that layer (Spectrum Analytic, "Reporting
// conversions": "to convert parts per million readings to pounds per acre, multiply by 2");
// scaled linearly to the sampled depth.
//
// Lime from the Mehlich buffer: North Carolina Department of Agriculture & Consumer Services,
// Agronomic Division, "Lime requirement (buffer) table": acidity (meq/100 cm³) = (6.6 − BpH) × 4;
// lime (tons per acre) = acidity × (target pH − soil pH) ÷ (6.6 − soil pH). Its worked example:
// pH 5.0, target 6.0, acidity 1.2 → 1.2 × 0.625 = 0.75 ton per acre (the page prints 0.76). Other
// buffers (SMP, Sikora, Adams-Evans)
// have their own regional calibrations: Sward shows the lab's own lime recommendation for those.
import { K_PER_K2O, LB_ACRE_PER_LB_1000FT2, P_PER_P2O5 } from "./units";

export const SOIL_EXTRACTANTS = [
  "mehlich3",
  "bray1",
  "olsen",
  "ammonium_acetate",
  "other",
] as const;
export type SoilExtractant = (typeof SOIL_EXTRACTANTS)[number];
export const BUFFER_METHODS = ["mehlich", "smp", "sikora", "adams_evans", "other"] as const;
export type BufferMethod = (typeof BUFFER_METHODS)[number];

/** The elements the MLSN guidelines cover, in the order a report lists them. */
export const SOIL_ELEMENTS = ["p", "k", "ca", "mg", "s"] as const;
export type SoilElement = (typeof SOIL_ELEMENTS)[number];

/** MLSN guideline minimums, ppm Mehlich-3 (Woods, Stowell & Gelernter 2016). */
export const MLSN_PPM: Record<SoilElement, number> = { p: 21, k: 37, ca: 331, mg: 47, s: 7 };
/** MLSN: lime is considered below this soil pH (the guideline is pH > 5.5). */
export const MLSN_MIN_PH = 5.5;
/**
 * The pH a lime recommendation aims for: 6.0, the target the NCDA&CS table uses for turf on
 * mineral soils (from memory of its crop codes; the equation itself is the table's).
 */
const LIME_TARGET_PH = 6.0;
const MEHLICH_BUFFER_REFERENCE_PH = 6.6;
/** The depth the 2,000,000 lb/acre convention describes, in inches. */
const FURROW_SLICE_IN = 20 / 3;
const LB_PER_TON = 2000;

export interface SoilTestValues {
  extractant: SoilExtractant;
  depthIn: number;
  ph: number | null;
  bufferPh: number | null;
  bufferMethod: BufferMethod | null;
  /** The lab's own lime recommendation, lb of calcium carbonate per 1,000 ft², when it gave one. */
  labLimeLbPer1000: number | null;
  /** The lab report's own word on phosphorus, when it gives one: it wins over the guideline. */
  labPhosphorusNeeded: boolean | null;
  ppm: Record<SoilElement, number | null>;
}

interface ElementReading {
  element: SoilElement;
  ppm: number;
  guidelinePpm: number;
  meets: boolean;
  /**
   * What brings the sampled layer up to the guideline, lb per 1,000 ft² — of the oxide a
   * fertilizer label states for P (P₂O₅) and K (K₂O), of the element for the others. 0 when met.
   */
  toGuidelineLbPer1000: number;
  /** "P₂O₅", "K₂O" or the element's symbol: what the amount is of. */
  amountOf: string;
}

export type LimeAdvice =
  | { kind: "none_needed"; ph: number }
  | { kind: "mehlich_buffer"; ph: number; bufferPh: number; lbPer1000: number; targetPh: number }
  | { kind: "lab"; ph: number | null; lbPer1000: number; method: BufferMethod | null }
  | { kind: "needs_buffer"; ph: number }
  | { kind: "no_ph" };

export interface SoilTestReading {
  /** False when the extractant is not Mehlich-3: the guidelines do not apply. */
  interpreted: boolean;
  elements: ElementReading[];
  lime: LimeAdvice;
  /**
   * Whether the test shows that phosphorus is needed: the lab's own word when it gave one,
   * otherwise phosphorus below the guideline (Mehlich-3 only; another extractant without the
   * lab's word shows no need).
   */
  showsPhosphorusNeed: boolean;
}

const AMOUNT_OF: Record<SoilElement, string> = { p: "P₂O₅", k: "K₂O", ca: "Ca", mg: "Mg", s: "S" };
const ELEMENT_PER_LABEL_UNIT: Record<SoilElement, number> = {
  p: P_PER_P2O5,
  k: K_PER_K2O,
  ca: 1,
  mg: 1,
  s: 1,
};

/** Pounds of an element per 1,000 ft² in a layer `depthIn` deep that holds `ppm` of it. */
export function ppmToLbPer1000(ppm: number, depthIn: number): number {
  const lbPerAcre = ppm * 2 * (depthIn / FURROW_SLICE_IN);
  return lbPerAcre / LB_ACRE_PER_LB_1000FT2;
}

/**
 * Mehlich-buffer lime requirement, lb of calcium carbonate per 1,000 ft², to bring `ph` to
 * `targetPh` (NCDA&CS equation, no residual credit). 0 when the soil is at or above the target.
 */
export function mehlichBufferLimeLbPer1000(
  ph: number,
  bufferPh: number,
  targetPh: number = LIME_TARGET_PH,
): number {
  if (ph >= targetPh) return 0;
  const acidity = Math.max(0, (MEHLICH_BUFFER_REFERENCE_PH - bufferPh) * 4);
  const tonsPerAcre = (acidity * (targetPh - ph)) / (MEHLICH_BUFFER_REFERENCE_PH - ph);
  return (tonsPerAcre * LB_PER_TON) / LB_ACRE_PER_LB_1000FT2;
}

function limeAdvice(t: SoilTestValues): LimeAdvice {
  if (t.labLimeLbPer1000 !== null)
    return { kind: "lab", ph: t.ph, lbPer1000: t.labLimeLbPer1000, method: t.bufferMethod };
  if (t.ph === null) return { kind: "no_ph" };
  if (t.ph >= MLSN_MIN_PH) return { kind: "none_needed", ph: t.ph };
  if (t.bufferMethod === "mehlich" && t.bufferPh !== null)
    return {
      kind: "mehlich_buffer",
      ph: t.ph,
      bufferPh: t.bufferPh,
      targetPh: LIME_TARGET_PH,
      lbPer1000: mehlichBufferLimeLbPer1000(t.ph, t.bufferPh),
    };
  return { kind: "needs_buffer", ph: t.ph };
}

/** Reads a soil test against the MLSN guidelines and the lime equation above. */
export function readSoilTest(t: SoilTestValues): SoilTestReading {
  const interpreted = t.extractant === "mehlich3";
  const elements: ElementReading[] = [];
  if (interpreted)
    for (const element of SOIL_ELEMENTS) {
      const ppm = t.ppm[element];
      if (ppm === null) continue;
      const guidelinePpm = MLSN_PPM[element];
      const meets = ppm >= guidelinePpm;
      const elementLb = meets ? 0 : ppmToLbPer1000(guidelinePpm - ppm, t.depthIn);
      elements.push({
        element,
        ppm,
        guidelinePpm,
        meets,
        toGuidelineLbPer1000: elementLb / ELEMENT_PER_LABEL_UNIT[element],
        amountOf: AMOUNT_OF[element],
      });
    }
  const p = elements.find((e) => e.element === "p");
  return {
    interpreted,
    elements,
    lime: limeAdvice(t),
    showsPhosphorusNeed: t.labPhosphorusNeeded ?? (p !== undefined && !p.meets),
  };
}
