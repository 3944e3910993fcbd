// GET /book/map/worker — MapLibre GL's web worker script (manager), served from this origin so the
// map's worker runs under the pages' Content-Security-Policy (proxy.ts: worker-src 'self', and
// connect-src with the map service's origin for the outlines the worker fetches). MapLibre looks
// for the script beside its own bundle by default, which the app's bundler does not copy.
import { readFile } from "node:fs/promises";
import path from "node:path";

import { route } from "@/lib/auth/guards";

const WORKER_FILE = path.join(
  process.cwd(),
  "node_modules/maplibre-gl/dist/maplibre-gl-worker.mjs",
);
let script: Promise<Buffer> | null = null;

export const GET = route({ access: ["manager"] }, async () => {
  script ??= readFile(WORKER_FILE);
  return new Response(new Uint8Array(await script), {
    status: 200,
    headers: {
      "Content-Type": "text/javascript; charset=utf-8",
      "Cache-Control": "private, max-age=86400",
    },
  });
});
