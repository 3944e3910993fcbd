// `npm run bench:photos` — per-photo processing time for generated 12-megapixel JPEGs: the full
// pipeline (decode, orient, two WebP derivatives, analysis on a 512 px copy), and analysis alone
// at 512 px and at full resolution, so the gain from downscaling is a ratio from one run.
import { mkdirSync, writeFileSync } from "node:fs";

import { analyzeTurfPhoto } from "@/lib/photos/analyze";
import { processPhoto } from "@/lib/photos/process";

import { lawnImage } from "../helpers/images";

const RUNS = Number(process.env.BENCH_RUNS ?? 12);
const percentile = (xs: number[], p: number) =>
  [...xs].sort((a, b) => a - b)[Math.min(xs.length - 1, Math.ceil((p / 100) * xs.length) - 1)]!;

async function time(label: string, inputs: Buffer[], task: (b: Buffer) => Promise<unknown>) {
  const ms: number[] = [];
  for (const input of inputs) {
    const t = performance.now();
    await task(input);
    ms.push(performance.now() - t);
  }
  return { label, runs: ms.length, p50: percentile(ms, 50), p95: percentile(ms, 95) };
}

console.log(`bench:photos — generating ${RUNS} JPEGs of 4000 × 3000 (12 MP)…`);
const inputs: Buffer[] = [];
for (let i = 0; i < RUNS; i++) inputs.push(await lawnImage(4000, 3000, 0.1 + (0.4 * i) / RUNS));
await processPhoto(inputs[0]!); // warm-up

const rows = [
  await time(
    "full pipeline (decode, orient, 1600 + 320 px WebP, analysis at 512 px)",
    inputs,
    (b) => processPhoto(b),
  ),
  await time("analysis only, downscaled to 512 px", inputs, (b) => analyzeTurfPhoto(b)),
  await time("analysis only, full resolution", inputs, (b) =>
    analyzeTurfPhoto(b, { longSide: null }),
  ),
];
console.table(
  rows.map((r) => ({
    step: r.label,
    runs: r.runs,
    "p50 ms": Math.round(r.p50),
    "p95 ms": Math.round(r.p95),
  })),
);
const ratio = rows[2]!.p50 / rows[1]!.p50;
console.log(`analysis at full resolution / downscaled (p50): ${ratio.toFixed(1)}×`);
mkdirSync("tests/.artifacts/bench", { recursive: true });
writeFileSync(
  "tests/.artifacts/bench/photos.json",
  JSON.stringify({ at: new Date().toISOString(), rows, fullOverDownscaledP50: ratio }, null, 2),
);
