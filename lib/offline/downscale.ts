// A photo taken with no signal is drawn smaller on the phone before it is queued: at most the
// display size the server keeps (QUEUED_PHOTO_LONG_SIDE, = PHOTO_LIMITS.displayLongSide), as a
// JPEG, turned upright from its EXIF orientation. Only that copy is kept (the full-quality file is
// not): a day of photos then fits in the phone's storage, and the server measures cover and color
// on a 1,024 px copy anyway. Client only (canvas).
import { fitWithin, QUEUED_PHOTO_LONG_SIDE } from "./rules";

const JPEG_QUALITY = 0.85;

export async function downscalePhoto(file: Blob): Promise<Blob> {
  const bitmap = await createImageBitmap(file, { imageOrientation: "from-image" });
  try {
    const { width, height } = fitWithin(bitmap.width, bitmap.height, QUEUED_PHOTO_LONG_SIDE);
    const canvas = document.createElement("canvas");
    canvas.width = width;
    canvas.height = height;
    const context = canvas.getContext("2d");
    if (!context) throw new Error("This browser cannot draw the photo smaller.");
    context.drawImage(bitmap, 0, 0, width, height);
    return await new Promise<Blob>((resolve, reject) =>
      canvas.toBlob(
        (blob) => (blob ? resolve(blob) : reject(new Error("The photo could not be drawn."))),
        "image/jpeg",
        JPEG_QUALITY,
      ),
    );
  } finally {
    bitmap.close();
  }
}
