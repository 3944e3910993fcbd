// `npm run bench:photos` — per-photo processing time for generated 12-megapixel JPEGs through
// processPhoto, the function every upload runs (decode, orient, two WebP derivatives, analysis on
// a copy of ANALYSIS_LONG_SIDE px); then the analysis step alone (analyzePixels, which processPhoto
// calls) on that copy and on every pixel, so the gain from downscaling is a ratio from one run.
import { mkdirSync, writeFileSync } from "node:fs";
import sharp from "sharp";

import { ANALYSIS_LONG_SIDE, analyzePixels } from "@/lib/photo-analysis/analyze";
import { processPhoto } from "@/lib/photos/process";

import { lawnImage } from "../helpers/images";

const RUNS = Number(process.env.BENCH_RUNS ?? 12);
const percentile = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.ceil((p / 100) * xs.length) - 1)]!;

async function time<T>(label: string, inputs: T[], task: (input: T) => unknown) {
  const ms: number[] = [];
  for (const input of inputs) {
    const t = performance.now();
    await task(input);
    ms.push(performance.now() - t);
  }
  return { label, runs: ms.length, p50: percentile(ms, 50), p95: percentile(ms, 95) };
}

/** Decoded, oriented RGB pixels, optionally downscaled the way processPhoto does (not timed). */
async function pixels(jpeg: Buffer, longSide: number | null) {
  let image = sharp(jpeg).rotate();
  if (longSide)
    image = image.resize({
      width: longSide,
      height: longSide,
      fit: "inside",
      withoutEnlargement: true,
    });
  return image.removeAlpha().raw().toBuffer({ resolveWithObject: true });
}

console.log(`bench:photos — generating ${RUNS} JPEGs of 4000 × 3000 (12 MP)…`);
const inputs: Buffer[] = [];
for (let i = 0; i < RUNS; i++) inputs.push(await lawnImage(4000, 3000, 0.1 + (0.4 * i) / RUNS));
await processPhoto(inputs[0]!); // warm-up

const full = await time(
  `processPhoto (decode, orient, 1600 + 320 px WebP, analysis at ${ANALYSIS_LONG_SIDE} px)`,
  inputs,
  (b) => processPhoto(b),
);
const small = [];
for (const b of inputs) small.push(await pixels(b, ANALYSIS_LONG_SIDE));
const downscaled = await time(`analysis step at ${ANALYSIS_LONG_SIDE} px`, small, (p) =>
  analyzePixels(p.data, p.info.channels),
);
small.length = 0;
const large = [];
for (const b of inputs.slice(0, Math.min(RUNS, 4))) large.push(await pixels(b, null));
const everyPixel = await time("analysis step on every pixel (12 MP)", large, (p) =>
  analyzePixels(p.data, p.info.channels),
);
const rows = [full, downscaled, everyPixel];
console.table(
  rows.map((r) => ({
    step: r.label,
    runs: r.runs,
    "p50 ms": Math.round(r.p50 * 10) / 10,
    "p95 ms": Math.round(r.p95 * 10) / 10,
  })),
);
const ratio = everyPixel.p50 / downscaled.p50;
console.log(`analysis on every pixel / at ${ANALYSIS_LONG_SIDE} px (p50): ${ratio.toFixed(1)}×`);
mkdirSync("tests/.artifacts/bench", { recursive: true });
writeFileSync(
  "tests/.artifacts/bench/photos.json",
  JSON.stringify(
    { at: new Date().toISOString(), rows, everyPixelOverDownscaledP50: ratio },
    null,
    2,
  ),
);
