// Green cover and DGCI against their published definitions, measured through processPhoto — the
// function every upload runs (the upload route handler and the demo seed call it):
// - DGCI formula: Karcher & Richardson (2003), Crop Science 43:943–951, anchor points (60°,1,1) → 0
//   and (120°,0,0) → 1; uniform colours checked against HSB from an independent library (colorjs.io).
// - Green cover: Richardson, Karcher & Purcell (2001), Crop Science 41:1884–1888 (hue window from
//   memory and read on a 0–255 scale, see lib/photos/color.ts), on generated images of known
//   green fraction.
import Color from "colorjs.io";
import fc from "fast-check";
import sharp from "sharp";
import { describe, expect, it } from "vitest";

import { analyzePixels } from "@/lib/photos/analyze";
import { dgciOf, GREEN_WINDOW, rgbToHsb } from "@/lib/photos/color";
import { processPhoto } from "@/lib/photos/process";

import { lawnImage, stripedImage, uniformImage } from "../helpers/images";

/** HSB (= HSV) from colorjs.io: h in degrees, s and v in 0–100. */
function referenceHsb(rgb: [number, number, number]) {
  const [h, s, v] = new Color("srgb", rgb.map((c) => c / 255) as [number, number, number]).to(
    "hsv",
  ).coords;
  return { h: Number.isNaN(h) ? 0 : (h as number), s: (s as number) / 100, v: (v as number) / 100 };
}

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

describe("processPhoto: green cover and DGCI of an uploaded photo", () => {
  const TURF: [number, number, number] = [58, 122, 44]; // a mid turf green
  const SOIL: [number, number, number] = [121, 85, 58]; // dry soil brown

  it.each([0, 0.25, 0.5, 1])(
    "an image %s green measures that cover within ±1.5 points",
    async (fraction) => {
      const result = await processPhoto(await stripedImage(1200, 800, fraction, TURF, SOIL));
      expect(Math.abs(result.greenCoverPct - fraction * 100)).toBeLessThanOrEqual(1.5);
      expect(result).toMatchObject({ width: 1200, height: 800, format: "png" });
      if (fraction === 0) expect(result.dgci).toBeNull();
    },
  );

  it("a mottled lawn photo (JPEG) with 30 % soil patches measures about 70 % cover", async () => {
    const result = await processPhoto(await lawnImage(1600, 1200, 0.3));
    expect(result.format).toBe("jpeg");
    expect(result.greenCoverPct).toBeGreaterThan(62);
    expect(result.greenCoverPct).toBeLessThan(78);
  });

  it("measuring on the downscaled copy agrees with every pixel of the photo within 2 points", async () => {
    const jpeg = await lawnImage(2400, 1800, 0.35);
    const full = await sharp(jpeg).removeAlpha().raw().toBuffer({ resolveWithObject: true });
    const everyPixel = analyzePixels(full.data, full.info.channels);
    const result = await processPhoto(jpeg);
    const gap = Math.abs(result.greenCoverPct - everyPixel.greenCoverPct);
    console.log(
      `photos: cover ${result.greenCoverPct.toFixed(1)} % at 512 px vs ${everyPixel.greenCoverPct.toFixed(1)} % on every pixel (${gap.toFixed(2)} points)`,
    );
    expect(gap).toBeLessThan(2);
    expect(result.dgci).toBeCloseTo(everyPixel.dgci!, 2);
  });

  it.each<[string, [number, number, number]]>([
    ["mid turf green", [58, 122, 44]],
    ["dark green", [30, 80, 35]],
    ["yellowish green", [100, 150, 40]],
    ["blue-green", [45, 115, 70]],
  ])("DGCI of uniform %s equals the formula on colorjs.io's HSB", async (_name, rgb) => {
    const ref = referenceHsb(rgb);
    const expected = dgciOf(ref.h, ref.s, ref.v);
    const { dgci, greenCoverPct } = await processPhoto(await uniformImage(rgb));
    expect(greenCoverPct).toBe(100);
    expect(dgci).toBeCloseTo(expected, 6);
  });

  it("the window is 57–107 on a 0–255 hue scale, i.e. 80.5–151.1°", () => {
    expect(GREEN_WINDOW.hueMin).toBeCloseTo(80.47, 2);
    expect(GREEN_WINDOW.hueMax).toBeCloseTo(151.06, 2);
  });

  it("a uniform colour outside the window is not green: soil, straw, grey, black, blue", async () => {
    for (const rgb of [SOIL, [190, 170, 90], [200, 200, 200], [20, 20, 20], [40, 60, 200]] as [
      number,
      number,
      number,
    ][]) {
      const hsb = referenceHsb(rgb);
      const inWindow =
        hsb.h >= GREEN_WINDOW.hueMin &&
        hsb.h <= GREEN_WINDOW.hueMax &&
        hsb.s >= GREEN_WINDOW.minSaturation &&
        hsb.v >= GREEN_WINDOW.minBrightness;
      expect(inWindow).toBe(false);
      const result = await processPhoto(await uniformImage(rgb));
      expect(result.greenCoverPct).toBe(0);
      expect(result.dgci).toBeNull();
    }
  });

  it("reports the size after orientation (EXIF orientation 6 = rotated 90°)", async () => {
    const rotated = await sharp(await stripedImage(400, 300, 0.5, TURF, SOIL, "jpeg"))
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
});
