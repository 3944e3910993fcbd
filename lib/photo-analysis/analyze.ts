// Measured turf condition from a photo's pixels: percent green canopy cover, the mean Dark Green
// Color Index over that canopy, and the shares of pixels too dark to read or clipped (the lighting
// caution). color.ts has the rules and their sources. processPhoto (lib/photos/process.ts) runs it
// on a copy downscaled to ANALYSIS_LONG_SIDE px: cover and mean colour are proportions, which
// mostly survive downscaling, and the work drops by the square of the factor. Not entirely: a
// pixel averaged from leaf and soil is still green-dominant and passes the rule, so a smaller copy
// reads slightly more cover. On a fine 16 px mosaic of turf and soil (tests/unit/
// photo-analysis.test.ts) 512 px read 1.6–2.6 points above every pixel, 1024 px 1.1–1.4.
import { dgciOf, isGreenCanopy, LIGHTING, rgbToHsb } from "./color";

export const ANALYSIS_LONG_SIDE = 1024;
const clamp01 = (x: number) => Math.min(1, Math.max(0, x));

export interface PixelFigures {
  /** Share of the frame passing the green-canopy rule, %. */
  greenCoverPct: number;
  /** Mean DGCI of the canopy pixels (null when there are none). */
  dgci: number | null;
  /** Share of pixels whose brightest channel is below LIGHTING.darkPixelBelow, %. */
  darkPct: number;
  /** Share of pixels with a channel at or above LIGHTING.clippedPixelFrom, %. */
  clippedPct: number;
}

/** Classifies every pixel of raw RGB(A) bytes and averages DGCI over the canopy pixels. */
export function analyzePixels(data: Uint8Array, channels: number): PixelFigures {
  let canopy = 0;
  let sum = 0;
  let dark = 0;
  let clipped = 0;
  const total = data.length / channels;
  for (let i = 0; i < data.length; i += channels) {
    const r = data[i]!;
    const g = data[i + 1]!;
    const b = data[i + 2]!;
    const max = Math.max(r, g, b);
    if (max < LIGHTING.darkPixelBelow) dark++;
    if (max >= LIGHTING.clippedPixelFrom) clipped++;
    if (isGreenCanopy(r, g, b)) {
      canopy++;
      const { h, s, v } = rgbToHsb(r, g, b);
      sum += clamp01(dgciOf(h, s, v));
    }
  }
  const pct = (n: number) => (total === 0 ? 0 : (100 * n) / total);
  return {
    greenCoverPct: pct(canopy),
    dgci: canopy === 0 ? null : sum / canopy,
    darkPct: pct(dark),
    clippedPct: pct(clipped),
  };
}
