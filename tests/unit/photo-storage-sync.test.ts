// The local photo store makes a file durable before put() returns (and so before its photo row is
// written): the bytes are synced before the rename, and the folder is synced after it, as
// fsync(2) and rename(2) require for a new file to survive a power cut (the Linux man page of
// fsync: "Calling fsync() does not necessarily ensure that the entry in the directory containing
// the file has also reached disk. For that an explicit fsync() on a file descriptor for the
// directory is also needed."). The file-system calls are recorded in order; the files are real.
import { mkdtempSync, readFileSync, rmSync } from "node:fs";
import os from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it, vi } from "vitest";

const calls = vi.hoisted(() => [] as string[]);
vi.mock("node:fs/promises", async (importOriginal) => {
  const real = await importOriginal<typeof import("node:fs/promises")>();
  const open: typeof real.open = async (file, flags, mode) => {
    const handle = await real.open(file, flags, mode);
    const sync = handle.sync.bind(handle);
    handle.sync = async () => {
      calls.push(`sync ${String(file)}`);
      return sync();
    };
    return handle;
  };
  const rename: typeof real.rename = async (from, to) => {
    calls.push(`rename ${String(from)} -> ${String(to)}`);
    return real.rename(from, to);
  };
  return { ...real, default: { ...real, open, rename }, open, rename };
});

const { localDiskStorage } = await import("@/lib/services/storage");

const root = mkdtempSync(path.join(os.tmpdir(), "sward-store-"));
afterAll(() => rmSync(root, { recursive: true, force: true }));

describe("local photo storage", () => {
  it("syncs the file before the rename, then the folders whose entries changed", async () => {
    const store = localDiskStorage(path.join(root, "photos"));
    const key = "c0ffee00-0000-4000-8000-000000000000/abc123-display.webp";
    await store.put(key, Buffer.from("RIFF0000WEBP"), "image/webp");

    const target = path.join(root, "photos", key);
    const [syncTemp, renamed, ...folders] = calls;
    expect(syncTemp).toMatch(new RegExp(`^sync ${target}\\.\\d+\\.[0-9a-f-]{36}\\.tmp$`));
    expect(renamed).toBe(`rename ${syncTemp!.slice(5)} -> ${target}`);
    // The company folder and the store's root were both created here: their parents' entries changed too.
    expect(folders).toEqual([
      `sync ${path.dirname(target)}`,
      `sync ${path.join(root, "photos")}`,
      `sync ${root}`,
    ]);
    expect(readFileSync(target, "utf8")).toBe("RIFF0000WEBP");

    calls.length = 0;
    await store.put(
      "c0ffee00-0000-4000-8000-000000000000/def456-thumb.webp",
      Buffer.from("RIFF0000WEBP"),
      "image/webp",
    );
    expect(calls.slice(1)).toEqual([
      expect.stringMatching(/^rename /),
      `sync ${path.dirname(target)}`,
    ]); // the folder existed: only its own entry changed
  });
});
