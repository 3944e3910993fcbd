// The colour science of a zone photo: which pixels are green canopy, how dark green they are, and
// whether the light let the photo be measured at all. Pure; tests check each rule against its
// published statement on generated images (tests/unit/photo-analysis.test.ts).

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
 * Anchors: (60°, 1, 1) → 0 and (120°, 0, 0) → 1. Sward averages it over the green-canopy pixels
 * below (the same mask as the cover figure), each pixel's value clamped to 0–1: a canopy pixel
 * can have a hue above 120° (a bluish green, B > R) or a bright saturated yellow-green whose
 * formula value dips below 0, and the published scale is 0–1.
 */
export function dgciOf(h: number, s: number, v: number): number {
  return ((h - 60) / 60 + (1 - s) + (1 - v)) / 3;
}

/**
 * Green canopy — the pixel rule of Patrignani & Ochsner (2015), Agronomy Journal 107:2312–2320
 * (doi:10.2134/agronj15.0150), for fractional green canopy cover from RGB photographs. On 8-bit
 * RGB values a pixel is green canopy when all three hold:
 *
 *     R/G < P1    and    B/G < P2    and    2G − R − B > P3,
 *
 * with the published defaults P1 = 0.95, P2 = 0.95, P3 = 20. (The inequalities and defaults as
 * quoted in the project's reference list and in issue #17; public implementations of the rule use
 * the same defaults. The paper's own text was not read here.)
 *
 * What the rule counts, and what it does not (tests/unit/photo-analysis.test.ts shows each). For
 * a green-dominant pixel (hue H of 60–120°, saturation S, brightness V in HSB) the three
 * inequalities read S > 0.05, H > 60° + 3°/S and 255·V·S·H/60 > 20, since R/G = 1 − S·(H − 60)/60,
 * B/G = 1 − S and 2G − R − B = G·S·H/60. So:
 * - healthy turf, turf in open shade, and yellow-green (chlorotic) leaves pass: a saturated
 *   yellow-green down to about 64° (S 0.8), a paler one down to 66° (S 0.5) or 70° (S 0.3).
 *   Yellowing turf therefore still counts as canopy and shows as a lower DGCI, not as missing
 *   grass;
 * - leaves yellowed further (hue below 60° + 3°/S: red within 5 % of green), straw, dead turf,
 *   soil, grey paving and deep shadow fail: the rule counts green canopy only, so turf yellowed
 *   that far reads as uncovered, whatever is alive beneath. Sward says so under every photo
 *   (lib/photos/words.ts) rather than stretch the rule.
 * A pixel with G = 0 fails (R/G is not a number below P1, and 2G − R − B ≤ 0).
 */
export const CANOPY_RULE = {
  /** P1: red over green below this. */
  maxRedToGreen: 0.95,
  /** P2: blue over green below this. */
  maxBlueToGreen: 0.95,
  /** P3: excess green 2G − R − B above this (8-bit values). */
  minExcessGreen: 20,
} as const;

export function isGreenCanopy(r: number, g: number, b: number): boolean {
  return (
    r / g < CANOPY_RULE.maxRedToGreen &&
    b / g < CANOPY_RULE.maxBlueToGreen &&
    2 * g - r - b > CANOPY_RULE.minExcessGreen
  );
}

/**
 * When the light does not let a photo be measured. Sward's own thresholds (no published source;
 * chosen from how the rule above behaves):
 * - a pixel is **too dark to read** when its brightest channel is below 32 of 255: there the
 *   rule's fixed margin (2G − R − B > 20) is over a third of the signal, so a shaded leaf fails
 *   for want of light, not of green;
 * - a pixel is **clipped** when any channel is 250 or more: the sensor ran out of range and the
 *   ratios R/G and B/G no longer describe the leaf;
 * - the photo is **too dark** when 25 % or more of its pixels are too dark to read: a canopy
 *   always has shadows between its leaves in sun, so a smaller share is normal;
 * - the photo is **too bright** when 10 % or more of its pixels are clipped: a lawn photographed
 *   at the right exposure has almost none.
 * Either way the cover figure could be off by as many points as the share, so the figures are
 * shown with a caution and left out of the Sward Index (lib/scoring/from-check.ts).
 */
export const LIGHTING = {
  darkPixelBelow: 32,
  clippedPixelFrom: 250,
  maxDarkPct: 25,
  maxClippedPct: 10,
} as const;

export type Lighting = "ok" | "too_dark" | "too_bright" | "dark_and_bright";

/** The lighting verdict of a photo from its shares (%) of too-dark and clipped pixels. */
export function lightingOf(darkPct: number, clippedPct: number): Lighting {
  const dark = darkPct >= LIGHTING.maxDarkPct;
  const bright = clippedPct >= LIGHTING.maxClippedPct;
  return dark && bright ? "dark_and_bright" : dark ? "too_dark" : bright ? "too_bright" : "ok";
}

/** The method stored with each photo's figures (photos.measured_by). */
export const MEASURED_BY = "canopy-rule-2015";
