// Reads a request body into memory up to a byte limit; refuses with 413 as soon as it is passed.
import { AppError } from "./app-error";

export async function readBodyLimited(request: Request, maxBytes: number): Promise<Buffer> {
  const declared = Number(request.headers.get("content-length") ?? "0");
  const tooLarge = () =>
    new AppError(
      "payload_too_large",
      `The file is larger than ${Math.round(maxBytes / 1024 / 1024)} MB. Send a smaller copy.`,
    );
  if (declared > maxBytes) throw tooLarge();
  if (!request.body) return Buffer.alloc(0);
  const reader = request.body.getReader();
  const chunks: Uint8Array[] = [];
  let total = 0;
  for (;;) {
    const { done, value } = await reader.read();
    if (done) break;
    total += value.byteLength;
    if (total > maxBytes) {
      await reader.cancel();
      throw tooLarge();
    }
    chunks.push(value);
  }
  return Buffer.concat(chunks);
}
