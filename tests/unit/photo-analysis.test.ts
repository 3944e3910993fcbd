// Green canopy cover, DGCI and the lighting caution against their published definitions, measured
// through processPhoto — the function every upload runs (the upload route handler and the demo
// seed call it) — on generated images of known composition:
// - green canopy: Patrignani & Ochsner (2015), Agronomy Journal 107:2312–2320, pixel rule
//   R/G < 0.95, B/G < 0.95, 2G − R − B > 20 on 8-bit RGB (defaults as quoted in REFERENCES.md; the
//   paper's own text not read). The rule is written out again below, straight from those
//   inequalities, and the expected cover of each image is computed with it, not with Sward's code;
// - DGCI: Karcher & Richardson (2003), Crop Science 43:943–951, anchor points (60°,1,1) → 0 and
//   (120°,0,0) → 1, on HSB from an independent library (colorjs.io), averaged over the same mask;
// - the lighting thresholds are Sward's own (lib/photo-analysis/color.ts, LIGHTING; no published source).
import Color from "colorjs.io";
import fc from "fast-check";
import sharp from "sharp";
import { describe, expect, it } from "vitest";

import { ANALYSIS_LONG_SIDE, analyzePixels } from "@/lib/photo-analysis/analyze";
import {
  CANOPY_RULE,
  dgciOf,
  isGreenCanopy,
  LIGHTING,
  lightingOf,
  rgbToHsb,
} from "@/lib/photo-analysis/color";
import { measureStoredImage, processPhoto } from "@/lib/photos/process";
import { lightingCaution } from "@/lib/photos/words";
import { indexInputOf } from "@/lib/scoring/from-check";

import {
  bandedImage,
  exposedImage,
  lawnImage,
  stripedImage,
  uniformImage,
} from "../helpers/images";

type Rgb = readonly [number, number, number];

/** Patrignani & Ochsner (2015): green canopy when R/G < P1, B/G < P2 and 2G − R − B > P3. */
const P1 = 0.95;
const P2 = 0.95;
const P3 = 20;
const publishedRule = ([r, g, b]: Rgb) => r / g < P1 && b / g < P2 && 2 * g - r - b > P3;

/** HSB (= HSV) from colorjs.io: h in degrees, s and v in 0–1. */
function referenceHsb(rgb: Rgb) {
  const [h, s, v] = new Color("srgb", rgb.map((c) => c / 255) as [number, number, number]).to(
    "hsv",
  ).coords;
  return { h: Number.isNaN(h) ? 0 : (h as number), s: (s as number) / 100, v: (v as number) / 100 };
}
const referenceDgci = (rgb: Rgb) => {
  const { h, s, v } = referenceHsb(rgb);
  return Math.min(1, Math.max(0, dgciOf(h, s, v)));
};

/**
 * Surfaces a lawn photo shows (invented sRGB values; hues from colorjs.io in the comments). The
 * chlorotic yellow-greens sit in the 60–80° band where living yellowing leaves are.
 */
const SURFACES = {
  healthy: [58, 122, 44], // mid turf green, 109°
  darkGreen: [30, 80, 35], // well-fed dark green, 126°
  yellowGreen: [140, 160, 50], // chlorotic, 71°
  paleYellowGreen: [150, 165, 70], // chlorotic, paler, 70°
  yellowed: [170, 175, 60], // yellowed further, 63°
  straw: [200, 180, 110], // 47°
  deadTurf: [140, 110, 70], // 34°
  soil: [121, 85, 58], // 26°
  openShade: [28, 60, 25], // healthy turf in open shade, 115°
  deepShadow: [14, 20, 12], // brightest channel below 32: too dark to read
  concrete: [165, 165, 160],
  asphalt: [70, 72, 75],
  glare: [252, 253, 250], // clipped
} as const satisfies Record<string, Rgb>;
type Surface = keyof typeof SURFACES;

/** Expected cover and DGCI of a banded image, from the published rule and colorjs.io only. */
function expected(mix: [Surface, number][]) {
  const canopy = mix.filter(([k]) => publishedRule(SURFACES[k]));
  const share = canopy.reduce((s, [, x]) => s + x, 0);
  return {
    cover: 100 * share,
    dgci: share
      ? canopy.reduce((s, [k, x]) => s + x * referenceDgci(SURFACES[k]), 0) / share
      : null,
  };
}
const photoOf = (mix: [Surface, number][], format: "png" | "jpeg" = "png") =>
  bandedImage(
    1200,
    900,
    mix.map(([k, share]) => ({ rgb: SURFACES[k], share })),
    format,
  );

describe("the published rule", () => {
  it("Sward's parameters are the published defaults", () => {
    expect(CANOPY_RULE).toEqual({ maxRedToGreen: P1, maxBlueToGreen: P2, minExcessGreen: P3 });
  });

  it("Sward's classifier agrees with the rule written from the paper on every 8-bit colour", () => {
    let disagreements = 0;
    for (let r = 0; r < 256; r++)
      for (let g = 0; g < 256; g++)
        for (let b = 0; b < 256; b++)
          if (isGreenCanopy(r, g, b) !== publishedRule([r, g, b])) disagreements++;
    expect(disagreements).toBe(0);
  });

  it("what each surface is: healthy, shaded and yellow-green leaves are canopy; yellowed leaves, straw, dead turf, soil, paving and deep shadow are not", () => {
    const canopy = (Object.keys(SURFACES) as Surface[]).filter((k) => publishedRule(SURFACES[k]));
    expect(canopy).toEqual(["healthy", "darkGreen", "yellowGreen", "paleYellowGreen", "openShade"]);
  });

  // Where the rule and chlorosis meet. For a green-dominant pixel (hue 60–120°) the inequalities
  // read, in HSB: S > 0.05, H > 60° + 3°/S, and 255·V·S·H/60 > 20 (from R/G = 1 − S + S(120 − H)/60,
  // B/G = 1 − S, 2G − R − B = G·S·H/60). So a saturated yellow-green passes down to about 64°
  // and a paler one stops higher; this is the published rule, and Sward shows it as it is.
  it("in HSB the rule keeps green-dominant pixels with H > 60° + 3°/S (checked on random colours away from the edges)", () => {
    fc.assert(
      fc.property(fc.tuple(fc.nat(255), fc.nat(255), fc.nat(255)), ([r, g, b]) => {
        const { h, s, v } = referenceHsb([r, g, b]);
        fc.pre(g >= r && g >= b && h > 60 && h <= 120 && s > 0);
        const margins = [s - 0.05, h - (60 + 3 / s), (255 * v * s * h) / 60 - 20];
        fc.pre(margins.every((m) => Math.abs(m) > 0.02));
        expect(isGreenCanopy(r, g, b)).toBe(margins.every((m) => m > 0));
      }),
      { numRuns: 2000 },
    );
  });

  it("chlorotic leaves of hue 60–80°: the rule counts them from 60° + 3°/S; below that they read as not canopy", () => {
    for (const s of [0.3, 0.5, 0.7, 0.9])
      for (let h = 60.5; h <= 80; h += 0.5) {
        const rgb = new Color("hsv", [h, s * 100, 65])
          .to("srgb")
          .coords.map((c) => Math.round((c as number) * 255)) as unknown as Rgb;
        const edge = 60 + 3 / s;
        if (Math.abs(h - edge) < 1.5) continue; // 8-bit rounding decides at the edge itself
        expect(isGreenCanopy(...rgb), `hue ${h}° S ${s}`).toBe(h > edge);
      }
  });
});

// Photos of 1–12 MP through processPhoto take seconds each on a loaded two-core machine.
describe(
  "processPhoto: green canopy cover and DGCI of an uploaded photo",
  { timeout: 60_000 },
  () => {
    const cases: [string, [Surface, number][]][] = [
      [
        "the issue's mix: 50 % healthy, 30 % yellowing, 20 % soil",
        [
          ["healthy", 0.5],
          ["yellowGreen", 0.3],
          ["soil", 0.2],
        ],
      ],
      ["a full stand of yellowing turf", [["yellowGreen", 1]]],
      ["a full stand of turf yellowed further (hue 63°)", [["yellowed", 1]]],
      [
        "healthy turf with straw and dead patches",
        [
          ["healthy", 0.6],
          ["straw", 0.25],
          ["deadTurf", 0.15],
        ],
      ],
      [
        "turf along a driveway, part in open shade",
        [
          ["healthy", 0.45],
          ["openShade", 0.25],
          ["concrete", 0.2],
          ["asphalt", 0.1],
        ],
      ],
      [
        "every surface at once",
        [
          ["healthy", 0.2],
          ["darkGreen", 0.1],
          ["yellowGreen", 0.1],
          ["paleYellowGreen", 0.05],
          ["yellowed", 0.05],
          ["straw", 0.1],
          ["deadTurf", 0.1],
          ["soil", 0.1],
          ["openShade", 0.1],
          ["deepShadow", 0.05],
          ["concrete", 0.05],
        ],
      ],
      ["bare soil only", [["soil", 1]]],
    ];

    it.each(cases)("%s: cover and DGCI as the published rule gives them", async (_name, mix) => {
      const want = expected(mix);
      const got = await processPhoto(await photoOf(mix));
      expect(Math.abs(got.greenCoverPct - want.cover)).toBeLessThanOrEqual(1);
      if (want.dgci === null) expect(got.dgci).toBeNull();
      else expect(Math.abs(got.dgci! - want.dgci)).toBeLessThanOrEqual(0.01);
    });

    it("the issue's mix measures about 80 % where the retired 80.5–151° hue window measured 50 %", async () => {
      const mix: [Surface, number][] = [
        ["healthy", 0.5],
        ["yellowGreen", 0.3],
        ["soil", 0.2],
      ];
      const got = await processPhoto(await photoOf(mix));
      const retiredWindow = mix
        .filter(([k]) => {
          const { h, s, v } = referenceHsb(SURFACES[k]);
          return h >= (57 / 255) * 360 && h <= (107 / 255) * 360 && s >= 0.1 && v >= 0.1;
        })
        .reduce((sum, [, x]) => sum + 100 * x, 0);
      console.log(
        `photos: 50 % healthy + 30 % yellow-green + 20 % soil → ${got.greenCoverPct.toFixed(1)} % green canopy (published rule), ${retiredWindow} % by the retired hue window; DGCI ${got.dgci!.toFixed(3)}`,
      );
      expect(retiredWindow).toBe(50);
      expect(got.greenCoverPct).toBeGreaterThan(79);
      expect(got.greenCoverPct).toBeLessThan(81);
    });

    it("yellowing shows as colour, not as missing grass: a yellow-green stand keeps its cover and its DGCI falls below the healthy stand's", async () => {
      const healthy = await processPhoto(await photoOf([["healthy", 1]]));
      const yellowing = await processPhoto(await photoOf([["yellowGreen", 1]]));
      expect(healthy.greenCoverPct).toBe(100);
      expect(yellowing.greenCoverPct).toBe(100);
      expect(healthy.dgci! - yellowing.dgci!).toBeGreaterThan(0.25);
    });

    it("random mixes of the surfaces measure what the published rule gives, within 1 point", async () => {
      const keys = Object.keys(SURFACES).filter((k) => k !== "glare") as Surface[];
      await fc.assert(
        fc.asyncProperty(
          fc.array(fc.integer({ min: 0, max: 10 }), {
            minLength: keys.length,
            maxLength: keys.length,
          }),
          async (weights) => {
            const total = weights.reduce((a, b) => a + b, 0);
            fc.pre(total > 0);
            const mix = keys
              .map((k, i) => [k, weights[i]! / total] as [Surface, number])
              .filter(([, x]) => x > 0);
            const got = await processPhoto(await photoOf(mix));
            // The image rounds each band to whole rows of 900: at most 1/900 per band.
            expect(Math.abs(got.greenCoverPct - expected(mix).cover)).toBeLessThanOrEqual(1);
          },
        ),
        { numRuns: 12 },
      );
    });

    it("a mottled lawn photo (JPEG) with 30 % soil patches measures about 70 % cover", async () => {
      const result = await processPhoto(await lawnImage(1600, 1200, 0.3));
      expect(result.format).toBe("jpeg");
      expect(result.greenCoverPct).toBeGreaterThan(62);
      expect(result.greenCoverPct).toBeLessThan(78);
    });

    it("the demo's lawn with 30 % yellow-green patches keeps its cover and loses DGCI", async () => {
      const green = await processPhoto(await lawnImage(1200, 900, 0.1, "jpeg", 21));
      const yellowing = await processPhoto(await lawnImage(1200, 900, 0.1, "jpeg", 21, 0.3));
      expect(Math.abs(yellowing.greenCoverPct - green.greenCoverPct)).toBeLessThan(1.5);
      // 30 % of the canopy at the yellow-green's DGCI (about 0.29) instead of the green's (0.57).
      expect(green.dgci! - yellowing.dgci!).toBeGreaterThan(0.06);
    });

    it("a JPEG of the issue's mix agrees with its PNG within 1.5 points", async () => {
      const mix: [Surface, number][] = [
        ["healthy", 0.5],
        ["yellowGreen", 0.3],
        ["soil", 0.2],
      ];
      const png = await processPhoto(await photoOf(mix, "png"));
      const jpeg = await processPhoto(await photoOf(mix, "jpeg"));
      expect(Math.abs(png.greenCoverPct - jpeg.greenCoverPct)).toBeLessThanOrEqual(1.5);
    });

    it("measuring on the downscaled copy agrees with every pixel of the photo within 2 points", async () => {
      const jpeg = await lawnImage(2400, 1800, 0.35);
      const full = await sharp(jpeg).removeAlpha().raw().toBuffer({ resolveWithObject: true });
      const everyPixel = analyzePixels(full.data, full.info.channels);
      const result = await processPhoto(jpeg);
      const gap = Math.abs(result.greenCoverPct - everyPixel.greenCoverPct);
      console.log(
        `photos: cover ${result.greenCoverPct.toFixed(1)} % at ${ANALYSIS_LONG_SIDE} px vs ${everyPixel.greenCoverPct.toFixed(1)} % on every pixel (${gap.toFixed(2)} points)`,
      );
      expect(gap).toBeLessThan(2);
      expect(result.dgci).toBeCloseTo(everyPixel.dgci!, 2);
    });

    it("measuring the stored display WebP again (the remeasure path) agrees with the upload within 1.5 points and 0.01 DGCI", async () => {
      const photos = [
        await lawnImage(2000, 1500, 0.25, "jpeg", 5),
        await photoOf([
          ["healthy", 0.4],
          ["yellowGreen", 0.2],
          ["straw", 0.2],
          ["soil", 0.2],
        ]),
      ];
      for (const photo of photos) {
        const upload = await processPhoto(photo);
        const again = await measureStoredImage(upload.display.data);
        console.log(
          `photos: upload ${upload.greenCoverPct.toFixed(2)} % / DGCI ${upload.dgci!.toFixed(3)}; from the stored WebP ${again.greenCoverPct.toFixed(2)} % / ${again.dgci!.toFixed(3)}`,
        );
        // WebP's half-resolution colour blends leaf and soil at patch edges: a little more canopy.
        expect(Math.abs(again.greenCoverPct - upload.greenCoverPct)).toBeLessThanOrEqual(1.5);
        expect(Math.abs(again.dgci! - upload.dgci!)).toBeLessThanOrEqual(0.01);
      }
    });

    it.each<[string, Rgb]>([
      ["mid turf green", [58, 122, 44]],
      ["dark green", [30, 80, 35]],
      ["yellowish green", [100, 150, 40]],
      ["blue-green", [45, 115, 70]],
      ["chlorotic yellow-green", [140, 160, 50]],
    ])("DGCI of uniform %s equals the formula on colorjs.io's HSB", async (_name, rgb) => {
      const { dgci, greenCoverPct } = await processPhoto(await uniformImage([...rgb]));
      expect(greenCoverPct).toBe(100);
      expect(dgci).toBeCloseTo(referenceDgci(rgb), 6);
    });

    it("reports the size after orientation (EXIF orientation 6 = rotated 90°)", async () => {
      const rotated = await sharp(
        await stripedImage(400, 300, 0.5, [58, 122, 44], [121, 85, 58], "jpeg"),
      )
        .withMetadata({ orientation: 6 })
        .jpeg()
        .toBuffer();
      const result = await processPhoto(rotated);
      expect(result).toMatchObject({ width: 300, height: 400 });
      expect(result.display).toMatchObject({ width: 300, height: 400 });
    });

    it("refuses input that is not an image, in words", async () => {
      await expect(processPhoto(Buffer.from("certainly not a picture"))).rejects.toMatchObject({
        code: "unsupported_media",
        message: "This file is not a photo Sward can read. Use a JPEG, PNG or WebP image.",
      });
    });
  },
);

describe("DGCI formula", () => {
  it("hits the published anchor points", () => {
    expect(dgciOf(60, 1, 1)).toBe(0);
    expect(dgciOf(120, 0, 0)).toBe(1);
  });

  it("Sward's RGB → HSB agrees with colorjs.io", () => {
    fc.assert(
      fc.property(fc.tuple(fc.nat(255), fc.nat(255), fc.nat(255)), (rgb) => {
        const ours = rgbToHsb(...rgb);
        const ref = referenceHsb(rgb);
        expect(ours.s).toBeCloseTo(ref.s, 6);
        expect(ours.v).toBeCloseTo(ref.v, 6);
        if (ref.s > 0) expect(Math.abs(ours.h - ref.h) % 360).toBeLessThan(1e-6);
      }),
    );
  });
});

describe(
  "the lighting caution (Sward's thresholds: LIGHTING in lib/photo-analysis/color.ts)",
  { timeout: 60_000 },
  () => {
    const withShare = (surface: Surface, pct: number) =>
      photoOf([
        ["healthy", 1 - pct / 100],
        [surface, pct / 100],
      ]);

    it.each<[string, Surface, number, string]>([
      ["20 % deep shadow is normal", "deepShadow", 20, "ok"],
      ["30 % deep shadow is too dark", "deepShadow", 30, "too_dark"],
      ["5 % glare is normal", "glare", 5, "ok"],
      ["15 % glare is too bright", "glare", 15, "too_bright"],
    ])("%s", async (_name, surface, pct, verdict) => {
      const got = await processPhoto(await withShare(surface, pct));
      const share = surface === "deepShadow" ? got.darkPct : got.clippedPct;
      expect(Math.abs(share - pct)).toBeLessThanOrEqual(0.5);
      expect(lightingOf(got.darkPct, got.clippedPct)).toBe(verdict);
    });

    it("an underexposed and an overexposed copy of the same lawn get the caution; the lawn itself does not", async () => {
      const lawn = await lawnImage(1200, 900, 0.2, "png", 3);
      const verdict = async (buf: Buffer) => {
        const r = await processPhoto(buf);
        return lightingOf(r.darkPct, r.clippedPct);
      };
      expect(await verdict(lawn)).toBe("ok");
      expect(await verdict(await exposedImage(lawn, 0.15))).toBe("too_dark");
      expect(await verdict(await exposedImage(lawn, 3))).toBe("too_bright");
    });

    it("the thresholds are the ones stated beside the code, at their edges", () => {
      expect(LIGHTING).toEqual({
        darkPixelBelow: 32,
        clippedPixelFrom: 250,
        maxDarkPct: 25,
        maxClippedPct: 10,
      });
      expect(lightingOf(24.9, 9.9)).toBe("ok");
      expect(lightingOf(25, 0)).toBe("too_dark");
      expect(lightingOf(0, 10)).toBe("too_bright");
      expect(lightingOf(30, 12)).toBe("dark_and_bright");
    });

    it("the caution says what is wrong in US English, and a photo under it is left out of the Index", () => {
      const caution = lightingCaution({ lighting: "too_dark", darkPct: 31, clippedPct: 0 });
      expect(caution?.title).toBe("Too dark to measure");
      expect(caution?.detail).toMatch(
        /^31 % of the photo is too dark to read \(the limit is 25 %\)/,
      );
      expect(caution?.detail).toMatch(/not counted in the Sward Index/);
      expect(lightingCaution({ lighting: "ok", darkPct: 3, clippedPct: 1 })).toBeNull();

      const check = {
        status: "done" as const,
        quality: 7,
        color: 7,
        density: 7,
        uniformity: null,
        barePct: null,
        weedsPct: null,
        symptoms: [],
      };
      const measured = { greenCoverPct: 90, dgci: 0.55, darkPct: 5, clippedPct: 1 };
      const tooDark = { greenCoverPct: 10, dgci: 0.7, darkPct: 40, clippedPct: 0 };
      expect(indexInputOf(check, [tooDark])?.photo).toBeUndefined();
      expect(indexInputOf(check, [measured, tooDark])?.photo).toEqual({
        greenCoverPct: 90,
        dgci: 0.55,
      });
    });
  },
);
