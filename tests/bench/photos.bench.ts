// `npm run bench:photos` — per-photo processing time for generated 12-megapixel JPEGs through
// processPhoto, the function every upload runs (decode, orient, two WebP derivatives, analysis on
// a copy of ANALYSIS_LONG_SIDE px); then the analysis step alone (analyzePixels, which processPhoto
// calls) on that copy and on every pixel, so the gain from downscaling is a ratio from one run.
// Last, the memory of BENCH_UPLOADS (10) concurrent ~11 MB uploads over HTTP, in a server process
// of its own (tests/bench/photo-upload-server.ts): its peak resident memory above where it stood
// before the burst (Linux VmHWM, reset first), with the body read whole before the photo limiter
// (how uploads were handled before) and streamed to a temporary file inside it (now).
import { spawn } from "node:child_process";
import { mkdirSync, writeFileSync } from "node:fs";
import http from "node:http";
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

const UPLOADS = Number(process.env.BENCH_UPLOADS ?? 10);
const uploadBody = await sharp(inputs[0]!)
  .jpeg({ quality: 100, chromaSubsampling: "4:4:4" })
  .toBuffer();
inputs.length = 0;

function call(port: number, method: string, path: string, body?: Buffer) {
  return new Promise<{ status: number; json: Record<string, unknown> }>((resolve, reject) => {
    const req = http.request(
      { host: "127.0.0.1", port, method, path, headers: { "content-type": "image/jpeg" } },
      (res) => {
        let text = "";
        res.on("data", (d: Buffer) => (text += d.toString()));
        res.on("end", () => resolve({ status: res.statusCode ?? 0, json: JSON.parse(text) }));
      },
    );
    req.on("error", reject);
    req.end(body);
  });
}

async function uploadBurst(mode: "buffered" | "streamed") {
  const child = spawn("node_modules/.bin/tsx", ["tests/bench/photo-upload-server.ts", mode], {
    stdio: ["ignore", "pipe", "inherit"],
    env: { ...process.env, UPLOAD_TMP_DIR: "tests/.artifacts/bench/uploads" },
  });
  try {
    const port = await new Promise<number>((resolve, reject) => {
      child.stdout.once("data", (d: Buffer) => resolve(JSON.parse(d.toString()).port as number));
      child.once("exit", (code) => reject(new Error(`upload server exited ${code}`)));
    });
    await call(port, "POST", "/", uploadBody); // warm-up: sharp and the code paths loaded
    const base = (await call(port, "POST", "/reset-peak")).json as { rssKb: number };
    const started = performance.now();
    const answers = await Promise.all(
      Array.from({ length: UPLOADS }, () => call(port, "POST", "/", uploadBody)),
    );
    const seconds = (performance.now() - started) / 1000;
    const mem = (await call(port, "GET", "/mem")).json as { peakKb: number };
    return {
      mode,
      uploads: UPLOADS,
      ok: answers.filter((a) => a.status === 201).length,
      peakRssDeltaMb: Math.round((mem.peakKb - base.rssKb) / 1024),
      seconds: Math.round(seconds * 10) / 10,
    };
  } finally {
    child.kill("SIGTERM");
  }
}

const burst = [await uploadBurst("buffered"), await uploadBurst("streamed")];
console.log(
  `bench:photos — ${UPLOADS} concurrent uploads of ${(uploadBody.length / 1024 / 1024).toFixed(1)} MB (12 MP JPEG), peak RSS above the server's resident size before the burst:`,
);
console.table(burst);

mkdirSync("tests/.artifacts/bench", { recursive: true });
writeFileSync(
  "tests/.artifacts/bench/photos.json",
  JSON.stringify(
    { at: new Date().toISOString(), rows, everyPixelOverDownscaledP50: ratio, uploadBurst: burst },
    null,
    2,
  ),
);
