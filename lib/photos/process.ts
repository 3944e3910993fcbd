// Safe processing of an uploaded photo. The type is decided from the content (never the name);
// size, pixel count and time are bounded; the image is auto-oriented first; derivatives are
// WebP without any metadata; capture time and GPS are read from EXIF before they are dropped.
import { createHash } from "node:crypto";
import exifr from "exifr";
import sharp, { type Metadata } from "sharp";

import { AppError } from "@/lib/http/app-error";
import type { UploadedFile } from "@/lib/http/stream-to-file";
import { ANALYSIS_LONG_SIDE, analyzePixels, type PixelFigures } from "@/lib/photo-analysis/analyze";

export const PHOTO_LIMITS = {
  /** 25 MB: a 24 MP JPEG straight from a phone is 6–15 MB. */
  maxBytes: 25 * 1024 * 1024,
  /** 50 MP: above any phone's main camera (12–24 MP, 48 MP binned) and far below a pixel flood. */
  maxPixels: 50_000_000,
  timeoutSeconds: 20,
  displayLongSide: 1600,
  thumbLongSide: 320,
} as const;

const ACCEPTED = new Set(["jpeg", "png", "webp"]);

/** The photo's bytes and facts, and the figures measured on it (analyze.ts). */
export interface ProcessedPhoto extends PixelFigures {
  contentHash: string;
  format: "jpeg" | "png" | "webp";
  bytes: number;
  width: number;
  height: number;
  display: { data: Buffer; width: number; height: number };
  thumb: { data: Buffer; width: number; height: number };
  capturedLocal: string | null;
  gps: { latitude: number; longitude: number } | null;
}

const refuse = (message: string, code: "invalid_input" | "unsupported_media" = "invalid_input") =>
  new AppError(code === "unsupported_media" ? "unsupported_media" : "invalid_input", message);

async function readEvidence(
  input: Buffer | string,
): Promise<{ capturedLocal: string | null; gps: ProcessedPhoto["gps"] }> {
  try {
    const tags = (await exifr.parse(input, {
      pick: ["DateTimeOriginal", "CreateDate"],
      reviveValues: false,
    })) as Record<string, unknown> | undefined;
    const raw = (tags?.DateTimeOriginal ?? tags?.CreateDate) as string | undefined;
    const capturedLocal =
      typeof raw === "string" && /^\d{4}:\d{2}:\d{2} \d{2}:\d{2}:\d{2}/.test(raw)
        ? `${raw.slice(0, 10).replaceAll(":", "-")} ${raw.slice(11, 19)}`
        : null;
    const gps = await exifr.gps(input).catch(() => undefined);
    const valid =
      gps &&
      Number.isFinite(gps.latitude) &&
      Number.isFinite(gps.longitude) &&
      Math.abs(gps.latitude) <= 90 &&
      Math.abs(gps.longitude) <= 180;
    return {
      capturedLocal,
      gps: valid ? { latitude: gps.latitude, longitude: gps.longitude } : null,
    };
  } catch {
    return { capturedLocal: null, gps: null }; // unreadable EXIF is not a reason to refuse a photo
  }
}

/**
 * Processes a photo from memory (a Buffer) or from the temporary file an upload was streamed to
 * (lib/http/stream-to-file.ts: read by sharp and exifr from disk, its hash taken while streaming).
 */
export async function processPhoto(upload: Buffer | UploadedFile): Promise<ProcessedPhoto> {
  const inMemory = Buffer.isBuffer(upload);
  // sharp and exifr read a string as a file path.
  const input: Buffer | string = inMemory ? upload : upload.path;
  const size = inMemory ? upload.length : upload.bytes;
  if (size === 0) throw refuse("The file is empty. Choose the photo again.");
  if (size > PHOTO_LIMITS.maxBytes)
    throw new AppError(
      "payload_too_large",
      `The photo is larger than ${PHOTO_LIMITS.maxBytes / 1024 / 1024} MB. Send a smaller copy.`,
    );

  let meta: Metadata;
  try {
    meta = await sharp(input, { limitInputPixels: false }).metadata();
  } catch {
    throw refuse(
      "This file is not a photo Sward can read. Use a JPEG, PNG or WebP image.",
      "unsupported_media",
    );
  }
  const format = meta.format;
  if (format === "heif")
    throw refuse(
      "HEIC photos cannot be read here. On an iPhone choose Settings › Camera › Formats › Most Compatible, or share the photo as JPEG.",
      "unsupported_media",
    );
  if (!format || !ACCEPTED.has(format))
    throw refuse(
      `${String(format ?? "This").toUpperCase()} files are not accepted. Use a JPEG, PNG or WebP photo.`,
      "unsupported_media",
    );
  if (!meta.width || !meta.height) throw refuse("The photo has no readable size.");
  if (meta.width * meta.height > PHOTO_LIMITS.maxPixels)
    throw refuse(
      `The image is ${meta.width} × ${meta.height} pixels, above the ${PHOTO_LIMITS.maxPixels / 1_000_000} megapixel limit. Send a smaller copy.`,
    );
  if ((meta.pages ?? 1) > 1)
    throw refuse("Animated or multi-page images are not accepted. Send a single photo.");

  const evidence = await readEvidence(input);
  const base = () =>
    sharp(input, { failOn: "truncated", limitInputPixels: PHOTO_LIMITS.maxPixels })
      .timeout({ seconds: PHOTO_LIMITS.timeoutSeconds })
      .rotate();
  try {
    // Decode and orient once; every derivative comes from this copy. No withMetadata(): sharp
    // writes no EXIF, XMP or ICC into the WebP files.
    const { data: oriented, info } = await base()
      .toColourspace("srgb")
      .raw()
      .toBuffer({ resolveWithObject: true });
    const fromOriented = () =>
      sharp(oriented, {
        raw: { width: info.width, height: info.height, channels: info.channels },
        limitInputPixels: PHOTO_LIMITS.maxPixels,
      });
    const fit = (side: number) => ({
      width: side,
      height: side,
      fit: "inside" as const,
      withoutEnlargement: true,
    });
    const [display, thumb, small] = await Promise.all([
      fromOriented()
        .resize(fit(PHOTO_LIMITS.displayLongSide))
        .webp({ quality: 80 })
        .toBuffer({ resolveWithObject: true }),
      fromOriented()
        .resize(fit(PHOTO_LIMITS.thumbLongSide))
        .webp({ quality: 70 })
        .toBuffer({ resolveWithObject: true }),
      fromOriented()
        .resize(fit(ANALYSIS_LONG_SIDE))
        .removeAlpha()
        .raw()
        .toBuffer({ resolveWithObject: true }),
    ]);
    const analysis = analyzePixels(small.data, small.info.channels);
    return {
      contentHash: inMemory ? createHash("sha256").update(upload).digest("hex") : upload.sha256,
      format: format as ProcessedPhoto["format"],
      bytes: size,
      width: info.width,
      height: info.height,
      display: { data: display.data, width: display.info.width, height: display.info.height },
      thumb: { data: thumb.data, width: thumb.info.width, height: thumb.info.height },
      ...analysis,
      ...evidence,
    };
  } catch (err) {
    const message = err instanceof Error ? err.message : "";
    if (/timeout/i.test(message))
      throw refuse("The photo took too long to process. Send a smaller copy.");
    if (/pixel limit/i.test(message))
      throw refuse("The image has too many pixels. Send a smaller copy.");
    throw refuse(
      "The photo could not be read: it may be damaged or cut short. Take or choose it again.",
    );
  }
}

/**
 * Measures a stored derivative again (the display WebP: the original is not kept), the way
 * processPhoto measures an upload: oriented already, downscaled to ANALYSIS_LONG_SIDE px. Used
 * when the measuring method changes (remeasure.ts). Its figures differ from the upload's by the
 * WebP compression only (its half-resolution colour adds mixed leaf-and-soil pixels at patch
 * edges): within 1.5 points of cover and 0.01 DGCI in tests/unit/photo-analysis.test.ts.
 */
export async function measureStoredImage(image: Buffer): Promise<PixelFigures> {
  const small = await sharp(image, { limitInputPixels: PHOTO_LIMITS.maxPixels })
    .timeout({ seconds: PHOTO_LIMITS.timeoutSeconds })
    .toColourspace("srgb")
    .resize({
      width: ANALYSIS_LONG_SIDE,
      height: ANALYSIS_LONG_SIDE,
      fit: "inside",
      withoutEnlargement: true,
    })
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  return analyzePixels(small.data, small.info.channels);
}
