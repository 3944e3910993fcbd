// RGB → HSB (hue in degrees, saturation and brightness 0–1), the colour space of the Dark Green
// Color Index. Tests check it against an independent colour library.
export function rgbToHsb(r: number, g: number, b: number): { h: number; s: number; v: number } {
  const rn = r / 255;
  const gn = g / 255;
  const bn = b / 255;
  const max = Math.max(rn, gn, bn);
  const min = Math.min(rn, gn, bn);
  const delta = max - min;
  let h = 0;
  if (delta > 0) {
    if (max === rn) h = 60 * (((gn - bn) / delta) % 6);
    else if (max === gn) h = 60 * ((bn - rn) / delta + 2);
    else h = 60 * ((rn - gn) / delta + 4);
  }
  if (h < 0) h += 360;
  return { h, s: max === 0 ? 0 : delta / max, v: max };
}

/**
 * Dark Green Color Index — Karcher & Richardson (2003), "Quantifying turfgrass color using digital
 * image analysis", Crop Science 43:943–951: DGCI = [(H − 60)/60 + (1 − S) + (1 − B)] / 3.
 * Anchors: (60°, 1, 1) → 0 and (120°, 0, 0) → 1.
 */
export function dgciOf(h: number, s: number, v: number): number {
  return ((h - 60) / 60 + (1 - s) + (1 - v)) / 3;
}

/**
 * Green pixels. Richardson, Karcher & Purcell (2001), "Quantifying turfgrass cover using digital
 * image analysis", Crop Science 41:1884–1888, selected green pixels with a hue window of 57–107
 * and any saturation in their image-analysis software (as remembered; the primary text was not
 * read). Read as degrees, that window would leave out healthy dark turf (hue 110–125°, where the
 * DGCI scale itself peaks at 120°), so Sward reads the two numbers on a 0–255 hue scale, which is
 * an inference, not a quotation: 57/255 × 360 = 80.5° to 107/255 × 360 = 151.1°. Sward also asks
 * for saturation and brightness of at least 0.10, because the hue of a near-grey or near-black
 * pixel is noise. Revisit when the primary text is read.
 */
export const GREEN_WINDOW = {
  hueMin: (57 / 255) * 360,
  hueMax: (107 / 255) * 360,
  minSaturation: 0.1,
  minBrightness: 0.1,
} as const;

export function isGreen(h: number, s: number, v: number): boolean {
  return (
    h >= GREEN_WINDOW.hueMin &&
    h <= GREEN_WINDOW.hueMax &&
    s >= GREEN_WINDOW.minSaturation &&
    v >= GREEN_WINDOW.minBrightness
  );
}
