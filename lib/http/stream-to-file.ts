// Streams a request body to a temporary file instead of memory: the byte limit is enforced while
// streaming (413 from a declared Content-Length above it before anything is read, or as soon as
// the count passes it), the file is removed whenever the body is refused or breaks off (a client
// that aborts mid-upload), and its sha256 is computed on the way through. Used for photo uploads,
// inside the photo limiter, so a burst of uploads waits with its bodies unread (in the sockets)
// rather than buffered whole in the server's memory.
import { createHash, randomUUID } from "node:crypto";
import { mkdir, open, unlink } from "node:fs/promises";
import { tmpdir } from "node:os";
import path from "node:path";

import { AppError } from "./app-error";
import { assertDeclaredLength, tooLarge } from "./read-body";

export interface UploadedFile {
  path: string;
  bytes: number;
  sha256: string;
  /** Deletes the file (safe to call twice). */
  remove(): Promise<void>;
}

/** Where uploads wait while they are processed: UPLOAD_TMP_DIR, or sward-uploads in the system's temporary folder. */
function uploadTempDir(): string {
  return process.env.UPLOAD_TMP_DIR || path.join(tmpdir(), "sward-uploads");
}

export async function streamBodyToFile(
  request: Request,
  maxBytes: number,
  what = "The file",
): Promise<UploadedFile> {
  assertDeclaredLength(request, maxBytes, what);
  const dir = uploadTempDir();
  await mkdir(dir, { recursive: true, mode: 0o700 });
  const file = path.join(dir, `upload-${randomUUID()}`);
  const remove = () => unlink(file).catch(() => undefined);
  const handle = await open(file, "wx", 0o600);
  const hash = createHash("sha256");
  let total = 0;
  try {
    if (request.body) {
      const reader = request.body.getReader();
      for (;;) {
        const { done, value } = await reader.read().catch(() => {
          throw new AppError(
            "invalid_input",
            `${what} did not arrive whole (the upload broke off). Send it again.`,
          );
        });
        if (done) break;
        total += value.byteLength;
        if (total > maxBytes) {
          await reader.cancel().catch(() => undefined);
          throw tooLarge(maxBytes, what);
        }
        hash.update(value);
        await handle.write(value);
      }
    }
    await handle.close();
  } catch (err) {
    await handle.close().catch(() => undefined);
    await remove();
    throw err;
  }
  return { path: file, bytes: total, sha256: hash.digest("hex"), remove };
}
