// A bare HTTP server for `npm run bench:photos` (run in a child process so its memory is its own):
// POST / takes a photo body through one of two pipelines, GET /mem answers this process's resident
// and peak resident memory (Linux /proc), POST /reset-peak resets the peak.
//   buffered — the body read whole into memory (readBodyLimited), then the photo limiter: how
//              uploads were handled before;
//   streamed — the photo limiter first, then the body streamed to a temporary file
//              (streamBodyToFile) and processed from it: what the upload route does now.
import { readFileSync, writeFileSync } from "node:fs";
import http from "node:http";
import { Readable } from "node:stream";

import { readBodyLimited } from "@/lib/http/read-body";
import { streamBodyToFile } from "@/lib/http/stream-to-file";
import { limitPhotoWork } from "@/lib/photos/limiter";
import { PHOTO_LIMITS, processPhoto } from "@/lib/photos/process";

const mode = process.argv[2];
if (mode !== "buffered" && mode !== "streamed") throw new Error("mode: buffered | streamed");

function memory() {
  const status = readFileSync("/proc/self/status", "utf8");
  const kb = (key: string) => Number(new RegExp(`${key}:\\s+(\\d+)`).exec(status)?.[1] ?? 0);
  return { rssKb: kb("VmRSS"), peakKb: kb("VmHWM") };
}

async function handle(request: Request) {
  if (mode === "buffered") {
    const bytes = await readBodyLimited(request, PHOTO_LIMITS.maxBytes, "The photo");
    return limitPhotoWork(() => processPhoto(bytes));
  }
  return limitPhotoWork(async () => {
    const upload = await streamBodyToFile(request, PHOTO_LIMITS.maxBytes, "The photo");
    try {
      return await processPhoto(upload);
    } finally {
      await upload.remove();
    }
  });
}

const server = http.createServer((req, res) => {
  const send = (status: number, body: unknown) => {
    res.writeHead(status, { "content-type": "application/json" });
    res.end(JSON.stringify(body));
  };
  if (req.method === "GET" && req.url === "/mem") return send(200, memory());
  if (req.method === "POST" && req.url === "/reset-peak") {
    global.gc?.();
    writeFileSync("/proc/self/clear_refs", "5"); // resets VmHWM to the current resident size
    return send(200, memory());
  }
  const request = new Request(`http://127.0.0.1${req.url}`, {
    method: "POST",
    headers: req.headers as Record<string, string>,
    body: Readable.toWeb(req) as ReadableStream<Uint8Array>,
    duplex: "half",
  } as RequestInit);
  handle(request).then(
    (p) => send(201, { bytes: p.bytes, greenCoverPct: p.greenCoverPct }),
    (err: unknown) => send(500, { error: err instanceof Error ? err.message : String(err) }),
  );
});
server.listen(0, "127.0.0.1", () => {
  const address = server.address();
  process.stdout.write(
    `${JSON.stringify({ port: typeof address === "object" ? address?.port : 0 })}\n`,
  );
});
