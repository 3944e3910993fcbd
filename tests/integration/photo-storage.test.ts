// The two storage drivers behind one interface: local disk, and S3 through @aws-sdk/client-s3
// against s3rver (a local S3-compatible fake) on 127.0.0.1.
import { mkdtempSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
// @ts-expect-error s3rver ships no type declarations
import S3rver from "s3rver";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { localDiskStorage, s3Storage, type PhotoStorage } from "@/lib/services/storage";

const dir = mkdtempSync(path.join(os.tmpdir(), "sward-s3-"));
let server: { run(): Promise<{ port: number }>; close(): Promise<void> };
let endpoint = "";

beforeAll(async () => {
  server = new S3rver({
    port: 0,
    address: "127.0.0.1",
    silent: true,
    directory: path.join(dir, "s3"),
    configureBuckets: [{ name: "sward-test" }],
  });
  const { port } = await server.run();
  endpoint = `http://127.0.0.1:${port}`;
});
afterAll(async () => {
  await server?.close();
  rmSync(dir, { recursive: true, force: true });
});

const drivers: [string, () => PhotoStorage][] = [
  ["local disk", () => localDiskStorage(path.join(dir, "disk"))],
  [
    "S3 (s3rver)",
    () =>
      s3Storage({
        bucket: "sward-test",
        region: "us-east-1",
        endpoint,
        accessKeyId: "S3RVER",
        secretAccessKey: "S3RVER",
      }),
  ],
];

describe.each(drivers)("%s", (_name, make) => {
  it("stores, reads back and reports presence", async () => {
    const storage = make();
    const key = "c0ffee00-0000-4000-8000-000000000000/abc123-display.webp";
    expect(await storage.has(key)).toBe(false);
    expect(await storage.get(key)).toBeNull();
    const body = Buffer.from([1, 2, 3, 4, 5, 250]);
    await storage.put(key, body, "image/webp");
    expect(await storage.has(key)).toBe(true);
    expect(Buffer.compare((await storage.get(key))!, body)).toBe(0);
    await storage.put(key, body, "image/webp"); // idempotent
  });

  it("refuses keys that could escape the store", async () => {
    const storage = make();
    for (const key of ["../etc/passwd", "/abs/path", "a/../../b", "UPPER/x.webp", "nokey"])
      await expect(storage.put(key, Buffer.from([1]), "image/webp")).rejects.toThrow(
        /unsafe storage key/,
      );
  });
});
