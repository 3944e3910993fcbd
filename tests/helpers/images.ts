// Generated test images: known green fractions, uniform colours, and hostile files.
import { deflateSync } from "node:zlib";
import sharp from "sharp";

export { lawnImage } from "@/fixtures/demo/photos";

/** RGB image whose first `greenFraction` of rows are `green` and the rest `soil`. */
export async function stripedImage(
  width: number,
  height: number,
  greenFraction: number,
  green: [number, number, number],
  soil: [number, number, number],
  format: "png" | "jpeg" = "png",
): Promise<Buffer> {
  const data = Buffer.alloc(width * height * 3);
  const greenRows = Math.round(height * greenFraction);
  for (let y = 0; y < height; y++) {
    const [r, g, b] = y < greenRows ? green : soil;
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      data[i] = r;
      data[i + 1] = g;
      data[i + 2] = b;
    }
  }
  const img = sharp(data, { raw: { width, height, channels: 3 } });
  return format === "png" ? img.png().toBuffer() : img.jpeg({ quality: 92 }).toBuffer();
}

/**
 * RGB image of horizontal bands, one per entry, each `share` of the height (shares sum to 1; the
 * last band takes the rounding): a photo of known composition whose downscaled copy blends only
 * the few rows where two bands meet.
 */
export async function bandedImage(
  width: number,
  height: number,
  bands: { rgb: readonly [number, number, number]; share: number }[],
  format: "png" | "jpeg" = "png",
): Promise<Buffer> {
  const data = Buffer.alloc(width * height * 3);
  const edges: number[] = [];
  let acc = 0;
  for (const band of bands) edges.push(Math.round(height * (acc += band.share)));
  edges[edges.length - 1] = height;
  for (let y = 0, k = 0; y < height; y++) {
    while (y >= edges[k]!) k++;
    const [r, g, b] = bands[k]!.rgb;
    for (let x = 0; x < width; x++) {
      const i = (y * width + x) * 3;
      data[i] = r;
      data[i + 1] = g;
      data[i + 2] = b;
    }
  }
  const img = sharp(data, { raw: { width, height, channels: 3 } });
  return format === "png" ? img.png().toBuffer() : img.jpeg({ quality: 92 }).toBuffer();
}

/** The same photo with every channel multiplied by `k` (under- or overexposed), as PNG or JPEG. */
export async function exposedImage(
  image: Buffer,
  k: number,
  format: "png" | "jpeg" = "png",
): Promise<Buffer> {
  const { data, info } = await sharp(image)
    .removeAlpha()
    .raw()
    .toBuffer({ resolveWithObject: true });
  const img = sharp(Buffer.from(data.map((x) => Math.min(255, Math.round(x * k)))), {
    raw: { width: info.width, height: info.height, channels: 3 },
  });
  return format === "png" ? img.png().toBuffer() : img.jpeg({ quality: 92 }).toBuffer();
}

export async function uniformImage(rgb: [number, number, number], size = 64): Promise<Buffer> {
  return sharp({
    create: {
      width: size,
      height: size,
      channels: 3,
      background: { r: rgb[0], g: rgb[1], b: rgb[2] },
    },
  })
    .png()
    .toBuffer();
}

/** A JPEG carrying camera EXIF: capture time and GPS (a point in the demo's region). */
export async function jpegWithGps(): Promise<Buffer> {
  return sharp({
    create: { width: 640, height: 480, channels: 3, background: { r: 60, g: 125, b: 45 } },
  })
    .withExif({
      IFD0: { Make: "Testcam", Model: "Field 1" },
      IFD2: { DateTimeOriginal: "2026:06:14 09:31:05" },
      IFD3: {
        GPSLatitudeRef: "N",
        GPSLatitude: "40/1 20/1 300/100",
        GPSLongitudeRef: "W",
        GPSLongitude: "74/1 44/1 2000/100",
      },
    })
    .jpeg()
    .toBuffer();
}

function crc32(buf: Buffer): number {
  let c = ~0;
  for (const byte of buf) {
    c ^= byte;
    for (let k = 0; k < 8; k++) c = c & 1 ? (c >>> 1) ^ 0xedb88320 : c >>> 1;
  }
  return ~c >>> 0;
}

function chunk(type: string, data: Buffer): Buffer {
  const head = Buffer.alloc(8);
  head.writeUInt32BE(data.length, 0);
  head.write(type, 4, "ascii");
  const crc = Buffer.alloc(4);
  crc.writeUInt32BE(crc32(Buffer.concat([head.subarray(4), data])), 0);
  return Buffer.concat([head, data, crc]);
}

/** A valid 1-bit greyscale PNG of the given size whose pixel data deflates to almost nothing. */
export function pixelFloodPng(width: number, height: number): Buffer {
  const ihdr = Buffer.alloc(13);
  ihdr.writeUInt32BE(width, 0);
  ihdr.writeUInt32BE(height, 4);
  ihdr[8] = 1; // bit depth
  ihdr[9] = 0; // greyscale
  const row = Buffer.alloc(1 + Math.ceil(width / 8));
  const rows = Buffer.alloc(row.length * Math.min(height, 64));
  // Only the first rows are real; the image is cut short, which is enough for a header check
  // and for a decoder that would try to allocate the whole canvas.
  const idat = deflateSync(rows);
  return Buffer.concat([
    Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a]),
    chunk("IHDR", ihdr),
    chunk("IDAT", idat),
    chunk("IEND", Buffer.alloc(0)),
  ]);
}
