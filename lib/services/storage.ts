// Object storage for photo derivatives behind one small interface, with two drivers:
// the local disk (default; a git-ignored folder) and S3 (any S3-compatible service).
import { randomUUID } from "node:crypto";
import { mkdir, open, readFile, rename, unlink } from "node:fs/promises";
import path from "node:path";
import {
  DeleteObjectCommand,
  GetObjectCommand,
  HeadObjectCommand,
  NoSuchKey,
  PutObjectCommand,
  S3Client,
} from "@aws-sdk/client-s3";

export interface PhotoStorage {
  /** Stores bytes under a key; storing the same key again is harmless (keys are content hashes). */
  put(key: string, body: Buffer, contentType: string): Promise<void>;
  get(key: string): Promise<Buffer | null>;
  has(key: string): Promise<boolean>;
  /** Removes a key; removing one that is not there is harmless. */
  remove(key: string): Promise<void>;
}

const SAFE_KEY = /^[a-z0-9-]+(\/[a-z0-9.-]+)+$/;
function assertKey(key: string): void {
  if (!SAFE_KEY.test(key) || key.includes("..")) throw new Error(`unsafe storage key: ${key}`);
}

async function syncFolder(dir: string): Promise<void> {
  const handle = await open(dir, "r");
  try {
    await handle.sync();
  } finally {
    await handle.close();
  }
}

export function localDiskStorage(root: string): PhotoStorage {
  const file = (key: string) => {
    assertKey(key);
    return path.join(root, key);
  };
  return {
    async put(key, body) {
      const target = file(key);
      const dir = path.dirname(target);
      const created = await mkdir(dir, { recursive: true });
      // Unique per call: two uploads of the same photo at once write the same key, and must not share a temporary file.
      const temp = `${target}.${process.pid}.${randomUUID()}.tmp`;
      // The photo row is written once put() returns, so the file must be on the disk by then, not
      // only in the page cache: sync the bytes before the rename, then the folders whose entries
      // changed (the renamed file's, and those of any folder just created).
      const handle = await open(temp, "w");
      try {
        await handle.writeFile(body);
        await handle.sync();
      } finally {
        await handle.close();
      }
      await rename(temp, target); // atomic: readers never see half a file
      for (let d = dir; ; d = path.dirname(d)) {
        await syncFolder(d);
        if (!created || d === path.dirname(created) || d === path.dirname(d)) break;
      }
    },
    async get(key) {
      try {
        return await readFile(file(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code === "ENOENT") return null;
        throw err;
      }
    },
    async has(key) {
      return (await this.get(key)) !== null;
    },
    async remove(key) {
      try {
        await unlink(file(key));
      } catch (err) {
        if ((err as NodeJS.ErrnoException).code !== "ENOENT") throw err;
      }
    },
  };
}

export function s3Storage(options: {
  bucket: string;
  region: string;
  endpoint?: string;
  accessKeyId?: string;
  secretAccessKey?: string;
  forcePathStyle?: boolean;
}): PhotoStorage {
  const client = new S3Client({
    region: options.region,
    endpoint: options.endpoint,
    forcePathStyle: options.forcePathStyle ?? Boolean(options.endpoint),
    credentials:
      options.accessKeyId && options.secretAccessKey
        ? { accessKeyId: options.accessKeyId, secretAccessKey: options.secretAccessKey }
        : undefined,
  });
  return {
    async put(key, body, contentType) {
      assertKey(key);
      await client.send(
        new PutObjectCommand({
          Bucket: options.bucket,
          Key: key,
          Body: body,
          ContentType: contentType,
        }),
      );
    },
    async get(key) {
      assertKey(key);
      try {
        const out = await client.send(new GetObjectCommand({ Bucket: options.bucket, Key: key }));
        return out.Body ? Buffer.from(await out.Body.transformToByteArray()) : null;
      } catch (err) {
        if (err instanceof NoSuchKey || (err as { name?: string }).name === "NoSuchKey")
          return null;
        throw err;
      }
    },
    async has(key) {
      assertKey(key);
      try {
        await client.send(new HeadObjectCommand({ Bucket: options.bucket, Key: key }));
        return true;
      } catch (err) {
        if ((err as { $metadata?: { httpStatusCode?: number } }).$metadata?.httpStatusCode === 404)
          return false;
        throw err;
      }
    },
    async remove(key) {
      assertKey(key);
      await client.send(new DeleteObjectCommand({ Bucket: options.bucket, Key: key }));
    },
  };
}
