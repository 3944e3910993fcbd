// Measured turf condition from a photo's pixels: percent green cover and the mean Dark Green
// Color Index of the green pixels (lib/photos/color.ts has the formulas and their sources).
// processPhoto (process.ts) runs it on a copy downscaled to ANALYSIS_LONG_SIDE px: cover and mean
// colour are proportions, which survive downscaling, and the work drops by the square of the factor.
import { dgciOf, isGreen, rgbToHsb } from "./color";

export const ANALYSIS_LONG_SIDE = 512;
/** Pixel-level DGCI is clamped to 0–1: hues of 57–60° (inside the green window) give values just below 0. */
const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

/** Counts green pixels and averages their DGCI over raw RGB(A) bytes. */
export function analyzePixels(
  data: Uint8Array,
  channels: number,
): { greenCoverPct: number; dgci: number | null } {
  let green = 0;
  let sum = 0;
  const total = data.length / channels;
  for (let i = 0; i < data.length; i += channels) {
    const { h, s, v } = rgbToHsb(data[i]!, data[i + 1]!, data[i + 2]!);
    if (isGreen(h, s, v)) {
      green++;
      sum += clamp01(dgciOf(h, s, v));
    }
  }
  return {
    greenCoverPct: total === 0 ? 0 : (100 * green) / total,
    dgci: green === 0 ? null : sum / green,
  };
}
