// Reads a request body into memory up to a byte limit; refuses with 413 before reading when the
// declared Content-Length is above it, and as soon as the count passes it while streaming (a
// chunked body, or a Content-Length that lies).
import { AppError } from "./app-error";

function sizeWords(bytes: number): string {
  return bytes >= 1024 * 1024
    ? `${Math.round(bytes / 1024 / 1024)} MB`
    : `${Math.round(bytes / 1024)} KB`;
}

export function tooLarge(maxBytes: number, what: string): AppError {
  return new AppError(
    "payload_too_large",
    `${what} is larger than ${sizeWords(maxBytes)}. Send a smaller one.`,
  );
}

/** 413 when the declared length is above the limit (nothing is read). */
export function assertDeclaredLength(request: Request, maxBytes: number, what: string): void {
  const declared = Number(request.headers.get("content-length") ?? "0");
  if (Number.isFinite(declared) && declared > maxBytes) throw tooLarge(maxBytes, what);
}

export async function readBodyLimited(
  request: Request,
  maxBytes: number,
  what = "The file",
): Promise<Buffer> {
  assertDeclaredLength(request, maxBytes, what);
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel().catch(() => undefined);
      throw tooLarge(maxBytes, what);
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}
