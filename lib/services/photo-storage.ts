// The app's photo storage, chosen by configuration (PHOTO_STORAGE=local|s3).
import "server-only";

import path from "node:path";

import { serverEnv } from "@/lib/env";

import { localDiskStorage, s3Storage, type PhotoStorage } from "./storage";

let instance: PhotoStorage | undefined;

export function photoStorage(): PhotoStorage {
  if (instance) return instance;
  const env = serverEnv();
  instance =
    env.PHOTO_STORAGE === "s3"
      ? s3Storage({
          bucket: env.S3_BUCKET!,
          region: env.S3_REGION,
          endpoint: env.S3_ENDPOINT,
          accessKeyId: env.S3_ACCESS_KEY_ID,
          secretAccessKey: env.S3_SECRET_ACCESS_KEY,
        })
      : localDiskStorage(path.resolve(env.PHOTO_DIR));
  return instance;
}
