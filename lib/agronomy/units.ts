// Unit definitions used by the nutrient and water maths (exact where a definition exists).
const LB_IN_KG = 0.45359237; // international pound
const FT2_IN_M2 = 0.09290304; // (0.3048 m)²
export const US_GAL_IN_L = 3.785411784;
export const FL_OZ_PER_GAL = 128;
export const OZ_PER_LB = 16;
const FT2_PER_ACRE = 43_560;
const M2_PER_HA = 10_000;
export const IN_IN_MM = 25.4;

/** 1 lb per 1,000 ft² expressed in kg/ha (≈ 48.824). */
export const KG_HA_PER_LB_1000FT2 = (LB_IN_KG / (1000 * FT2_IN_M2)) * M2_PER_HA;
/** 1 lb per 1,000 ft² in g/m² (≈ 4.8824). */
export const G_M2_PER_LB_1000FT2 = (LB_IN_KG * 1000) / (1000 * FT2_IN_M2);
/** 1 lb per 1,000 ft² in lb/acre (43.56). */
export const LB_ACRE_PER_LB_1000FT2 = FT2_PER_ACRE / 1000;
/** Number of 1,000 ft² units in a hectare (≈ 107.64). */
export const THOUSAND_FT2_PER_HA = M2_PER_HA / (1000 * FT2_IN_M2);
/** US gallons of water in one inch over 1,000 ft² (≈ 623.4). */
export const GAL_PER_INCH_1000FT2 = (1000 * 144 * 1) / 231; // 1,000 ft² × 1 in = 144,000 in³; 231 in³ per gallon

/** Elemental P from P₂O₅ and K from K₂O (molar mass ratios). */
export const P_PER_P2O5 = (2 * 30.973762) / (2 * 30.973762 + 5 * 15.999); // ≈ 0.4364
export const K_PER_K2O = (2 * 39.0983) / (2 * 39.0983 + 15.999); // ≈ 0.8301
