// Photo uploads through the route handler against the real database and the local-disk store:
// the attack set is refused with a clear 4xx and stores nothing; derivatives carry no EXIF; the
// same photo is stored once; photo URLs are 404 outside the actor's scope; green cover and DGCI
// are measured on the upload (DGCI: Karcher & Richardson 2003, Crop Science 43:943–951, on HSB
// from colorjs.io; green canopy cover: the generated image's known green fraction, every band of
// which passes or fails the Patrignani & Ochsner (2015) rule). Mixed surfaces, the lighting
// caution and the remeasure: photo-measurement.test.ts.
import { readdirSync, rmSync, statSync } from "node:fs";
import path from "node:path";
import Color from "colorjs.io";
import exifr from "exifr";
import sharp from "sharp";
import { afterAll, beforeAll, describe, expect, it, vi } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import type { Actor } from "@/lib/auth/actor";
import { dgciOf } from "@/lib/photo-analysis/color";
import type { PhotoDto } from "@/lib/photos/dto";
import { PHOTO_LIMITS } from "@/lib/photos/process";
import { finishVisit } from "@/lib/reports/mutations";
import { useServices } from "@/lib/services";
import type { PhotoStorage } from "@/lib/services/storage";
import { saveZoneCheck } from "@/lib/visits/mutations";
import { emptyZoneCheck } from "@/lib/visits/schemas";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { jpegWithGps, lawnImage, pixelFloodPng, stripedImage } from "../helpers/images";
import { doneCheck, newId } from "../helpers/zone-checks";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const upload = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route");
const download = await import("@/app/api/v1/photos/[photoId]/[variant]/route");

const STORE = "tests/.artifacts/photos-integration";
let c: TestCompany;
let other: TestCompany;
let visitId: string;
let zoneIds: string[];
const checkIds: string[] = [];

function filesIn(dir: string): string[] {
  try {
    return readdirSync(dir, { recursive: true, withFileTypes: true })
      .filter((e) => e.isFile())
      .map((e) => path.join(e.parentPath, e.name));
  } catch {
    return [];
  }
}

async function post(body: Buffer | Uint8Array, checkIndex = 0, type = "image/jpeg") {
  // Uploads after the visit is finished are a manager's corrections: they carry a reason (an
  // open visit's upload ignores it).
  return upload.POST(
    new Request("http://localhost/api/x?correctionReason=added%20from%20the%20office", {
      method: "POST",
      body: new Uint8Array(body),
      headers: { origin: "http://localhost:3000", host: "localhost", "content-type": type },
    }),
    { params: Promise.resolve({ visitId, zoneCheckId: checkIds[checkIndex]! }) },
  );
}

/** A real JPEG with its SOF frame header changed to claim 60,000 × 60,000 pixels. */
async function jpegClaiming60k(): Promise<Buffer> {
  const jpeg = Buffer.from(await lawnImage(64, 48, 0.2));
  for (let i = 2; i < jpeg.length - 9;) {
    if (jpeg[i] !== 0xff) break;
    const marker = jpeg[i + 1]!;
    const length = jpeg.readUInt16BE(i + 2);
    if (marker >= 0xc0 && marker <= 0xc2) {
      jpeg.writeUInt16BE(60_000, i + 5); // height
      jpeg.writeUInt16BE(60_000, i + 7); // width
      return jpeg;
    }
    i += 2 + length;
  }
  throw new Error("no SOF segment found");
}

beforeAll(async () => {
  rmSync(STORE, { recursive: true, force: true });
  [c, other] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  const tech1 = await c.actor("tech1");
  const visit = await testDb()
    .selectFrom("visits")
    .select("id")
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .where("status", "=", "scheduled")
    .executeTakeFirstOrThrow();
  visitId = visit.id;
  zoneIds = (
    await testDb()
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .orderBy("sort_order")
      .execute()
  ).map((z) => z.id);
  for (const zoneId of zoneIds)
    checkIds.push((await saveZoneCheck(tech1, visitId, newId(), emptyZoneCheck(zoneId))).id);
  current = tech1;
});

describe("the attack set", () => {
  const truncatedJpeg = async () => (await lawnImage(800, 600, 0.2)).subarray(0, 4000);
  const cases: [string, () => Promise<Buffer> | Buffer, number, RegExp][] = [
    [
      "a text file named .jpg",
      () => Buffer.from("This is a note about the lawn, not a picture.\n".repeat(20)),
      415,
      /not a photo Sward can read/,
    ],
    ["a truncated JPEG", truncatedJpeg, 422, /damaged or cut short/],
    [
      "a 20,000 × 20,000 PNG",
      () => pixelFloodPng(20_000, 20_000),
      422,
      /20000 × 20000 pixels, above the 50 megapixel limit/,
    ],
    [
      "a file over the size limit",
      () => Buffer.alloc(PHOTO_LIMITS.maxBytes + 1, 0xff),
      413,
      /larger than 25 MB/,
    ],
    [
      "an SVG",
      () =>
        Buffer.from(
          '<svg xmlns="http://www.w3.org/2000/svg" width="100" height="100"><rect width="100" height="100" fill="green"/></svg>',
        ),
      415,
      /SVG files are not accepted/,
    ],
    ["a zero-byte file", () => Buffer.alloc(0), 422, /file is empty/],
    // Polyglots: JPEG magic bytes in front of another format (an HTML page, a ZIP archive).
    [
      "a JPEG/HTML polyglot",
      () =>
        Buffer.concat([
          Buffer.from([0xff, 0xd8, 0xff, 0xe0]),
          Buffer.from("<html><script>alert(document.cookie)</script></html>".repeat(40)),
        ]),
      415,
      /not a photo Sward can read/,
    ],
    [
      "a JPEG/ZIP polyglot",
      () =>
        Buffer.concat([
          Buffer.from([0xff, 0xd8, 0xff, 0xdb]),
          Buffer.from("PK\u0003\u0004", "latin1"),
          Buffer.alloc(3000, 0x41),
        ]),
      415,
      /not a photo Sward can read/,
    ],
    // Decompression bombs: a few kilobytes that would decode to gigabytes.
    [
      "a PNG bomb (60,000 × 60,000, 1-bit, deflated)",
      () => pixelFloodPng(60_000, 60_000),
      422,
      /60000 × 60000 pixels, above the 50 megapixel limit/,
    ],
    [
      "a JPEG whose frame header claims 60,000 × 60,000",
      jpegClaiming60k,
      422,
      /60000 × 60000 pixels, above the 50 megapixel limit/,
    ],
  ];

  // The route runs in this process: its peak memory while refusing the set is the server's.
  let peakRss = 0;
  let sampler: ReturnType<typeof setInterval> | undefined;
  let refused = 0;
  const startRss = process.memoryUsage().rss;
  beforeAll(() => {
    sampler = setInterval(() => (peakRss = Math.max(peakRss, process.memoryUsage().rss)), 5);
  });
  afterAll(() => {
    clearInterval(sampler);
    console.log(
      `uploads: attack set of ${cases.length} files — accepted 0, refused ${refused}; peak memory of the server process ${(peakRss / 2 ** 20).toFixed(0)} MB (${((peakRss - startRss) / 2 ** 20).toFixed(0)} MB above the start)`,
    );
  });

  it.each(cases)(
    "%s is refused with a clear message and nothing is stored",
    async (_name, make, status, message) => {
      const before = {
        files: filesIn(STORE).length,
        rows: (await testDb().selectFrom("photos").select("id").execute()).length,
      };
      const res = await post(await make());
      if (res.status >= 400 && res.status < 500) refused++;
      expect(res.status).toBe(status);
      const body = (await res.json()) as { error: { message: string } };
      expect(body.error.message).toMatch(message);
      expect(filesIn(STORE).length).toBe(before.files);
      expect((await testDb().selectFrom("photos").select("id").execute()).length).toBe(before.rows);
    },
  );
});

describe("accepted photos", () => {
  let photo: PhotoDto;

  it("a JPEG with GPS EXIF is accepted; GPS and capture time are kept as staff evidence; derivatives carry no EXIF", async () => {
    const res = await post(await jpegWithGps());
    expect(res.status).toBe(201);
    photo = (await res.json()) as PhotoDto;
    expect(photo.capturedLocal).toBe("2026-06-14 09:31:05");
    expect(photo.gps?.latitude).toBeCloseTo(40.334, 3);
    expect(photo.gps?.longitude).toBeCloseTo(-74.739, 3);
    expect(photo.greenCoverPct).toBe(100);

    for (const file of filesIn(STORE)) {
      const bytes = (await import("node:fs")).readFileSync(file);
      expect(await exifr.gps(bytes).catch(() => undefined)).toBeUndefined();
      expect(await exifr.parse(bytes).catch(() => undefined)).toBeUndefined();
      const meta = await sharp(bytes).metadata();
      expect(meta.format).toBe("webp");
      expect(meta.exif).toBeUndefined();
      expect(meta.xmp).toBeUndefined();
    }
    console.log(
      `uploads: ${filesIn(STORE).length} stored files, ${filesIn(STORE)
        .map((f) => statSync(f).size)
        .join(" + ")} bytes, 0 with EXIF`,
    );
  });

  it("the same photo uploaded twice to the check is one row and one set of files; on another check it reuses the files", async () => {
    const jpeg = await jpegWithGps();
    const again = await post(jpeg);
    expect(again.status).toBe(200);
    expect(((await again.json()) as PhotoDto).id).toBe(photo.id);
    const filesBefore = filesIn(STORE).length;
    const onOtherCheck = await post(jpeg, 1);
    expect(onOtherCheck.status).toBe(201);
    expect(filesIn(STORE).length).toBe(filesBefore);
    expect(
      (await testDb().selectFrom("photos").select("id").where("visit_id", "=", visitId).execute())
        .length,
    ).toBe(2);
  });

  it("measures green canopy cover and DGCI on upload: a PNG 40 % turf green, 60 % soil stores 40 ± 1.5 % and that green's DGCI", async () => {
    const turf: [number, number, number] = [58, 122, 44];
    const res = await post(await stripedImage(1000, 750, 0.4, turf, [121, 85, 58]), 0, "image/png");
    expect(res.status).toBe(201);
    const dto = (await res.json()) as PhotoDto;
    const [h, sat, v] = new Color("srgb", turf.map((x) => x / 255) as [number, number, number]).to(
      "hsv",
    ).coords as [number, number, number];
    const expectedDgci = dgciOf(h, sat / 100, v / 100);
    const row = await testDb()
      .selectFrom("photos")
      .select(["green_cover_pct", "dgci", "original_format"])
      .where("id", "=", dto.id)
      .executeTakeFirstOrThrow();
    for (const measured of [dto, { greenCoverPct: row.green_cover_pct, dgci: row.dgci }]) {
      expect(Math.abs(measured.greenCoverPct - 40)).toBeLessThanOrEqual(1.5);
      expect(measured.dgci).toBeCloseTo(expectedDgci, 2);
    }
    expect(row.original_format).toBe("png");
  });

  it("derivatives have the promised sizes and are served as WebP with the right headers", async () => {
    const big = await post(await lawnImage(4000, 3000, 0.25));
    expect(big.status).toBe(201);
    const dto = (await big.json()) as PhotoDto;
    expect(dto.width).toBe(4000);
    for (const [variant, longSide] of [
      ["display", 1600],
      ["thumb", 320],
    ] as const) {
      const res = await download.GET(new Request(`http://localhost${dto.displayUrl}`), {
        params: Promise.resolve({ photoId: dto.id, variant }),
      });
      expect(res.status).toBe(200);
      expect(res.headers.get("content-type")).toBe("image/webp");
      expect(res.headers.get("content-disposition")).toMatch(/^inline; filename=".+\.webp"$/);
      expect(res.headers.get("cache-control")).toBe("private, max-age=31536000, immutable");
      const meta = await sharp(Buffer.from(await res.arrayBuffer())).metadata();
      expect(Math.max(meta.width!, meta.height!)).toBe(longSide);
    }
  });

  it("photo URLs are 404 for another company's manager and another property's homeowner; the own homeowner only after the visit is finished", async () => {
    const get = () =>
      download.GET(new Request("http://localhost/x"), {
        params: Promise.resolve({ photoId: photo.id, variant: "thumb" }),
      });
    current = await other.actor("manager");
    expect((await get()).status).toBe(404);
    current = await c.actor("owner1"); // Oyelaran, not Haddad
    expect((await get()).status).toBe(404);
    current = await c.actor("owner2"); // Haddad's homeowner: the visit is not finished yet
    expect((await get()).status).toBe(404);
    current = await c.actor("manager");
    expect((await get()).status).toBe(200);

    const tech1 = await c.actor("tech1");
    for (const [i, zoneId] of zoneIds.entries())
      await saveZoneCheck(tech1, visitId, checkIds[i]!, { ...doneCheck(zoneId), baseVersion: 1 });
    await finishVisit(tech1, visitId);
    current = await c.actor("owner2");
    const res = await get();
    expect(res.status).toBe(200);
    // Homeowners never receive the GPS evidence.
    const { listVisitPhotos } = await import("@/lib/photos/queries");
    expect(
      (await listVisitPhotos(current, visitId)).every(
        (p) => p.gps === null && p.capturedLocal === null,
      ),
    ).toBe(true);
  });

  it("a technician cannot add photos to a finished visit", async () => {
    current = await c.actor("tech1");
    const res = await post(await lawnImage(300, 200, 0.1));
    expect(res.status).toBe(403);
  });
});

describe("the photo storage comes from lib/services (a fake injected with useServices)", () => {
  it("the upload route puts the display and thumbnail files in the configured storage", async () => {
    current = await c.actor("manager");
    const puts: string[] = [];
    const files = new Map<string, Buffer>();
    const recording: PhotoStorage = {
      async put(key, body) {
        puts.push(key);
        files.set(key, body);
      },
      async get(key) {
        return files.get(key) ?? null;
      },
      async has(key) {
        return files.has(key);
      },
      async remove(key) {
        files.delete(key);
      },
    };
    const before = filesIn(STORE).length;
    const restore = useServices({ photoStorage: recording });
    try {
      const res = await post(await lawnImage(320, 240, 0.2, "jpeg", 41), 1);
      expect(res.status).toBe(201);
    } finally {
      restore();
    }
    expect(puts).toHaveLength(2);
    expect(puts.every((k) => k.endsWith(".webp"))).toBe(true);
    expect(filesIn(STORE).length).toBe(before); // nothing went to the local disk
  });

  it("when the storage fails, the upload answers 500 without details and writes no photo row", async () => {
    current = await c.actor("manager");
    const failing: PhotoStorage = {
      put: async () => {
        throw new Error("disk full at /srv/photos");
      },
      get: async () => null,
      has: async () => false,
      remove: async () => undefined,
    };
    const count = async () =>
      (await testDb().selectFrom("photos").select("id").where("visit_id", "=", visitId).execute())
        .length;
    const rows = await count();
    const restore = useServices({ photoStorage: failing });
    let res: Response;
    try {
      res = await post(await lawnImage(320, 240, 0.3, "jpeg", 42), 1);
    } finally {
      restore();
    }
    expect(res.status).toBe(500);
    const text = await res.text();
    expect(JSON.parse(text)).toMatchObject({ error: { code: "internal" } });
    expect(text).not.toContain("/srv/photos");
    expect(await count()).toBe(rows);
  });
});

describe("what is stored", () => {
  it("no stored file carries EXIF, XMP or GPS, and none holds the bytes of an uploaded script", async () => {
    // A real JPEG carrying a script in a comment segment is a photo: it is accepted (here by the
    // manager, the visit being finished), and only its re-encoded WebP derivatives are stored.
    current = await c.actor("manager");
    const jpeg = Buffer.from(await lawnImage(320, 240, 0.1, "jpeg", 11));
    const comment = Buffer.from("<script>alert(document.cookie)</script>");
    const segment = Buffer.concat([
      Buffer.from([0xff, 0xfe]),
      Buffer.from([(comment.length + 2) >> 8, (comment.length + 2) & 0xff]),
      comment,
    ]);
    const res = await post(Buffer.concat([jpeg.subarray(0, 2), segment, jpeg.subarray(2)]), 1);
    expect(res.status).toBe(201);
    const files = filesIn(STORE);
    let withExif = 0;
    let withScript = 0;
    for (const file of files) {
      const bytes = (await import("node:fs")).readFileSync(file);
      const meta = await sharp(bytes).metadata();
      if (meta.exif || meta.xmp || (await exifr.parse(bytes).catch(() => undefined)) !== undefined)
        withExif++;
      if (bytes.includes("<script")) withScript++;
    }
    console.log(
      `uploads: ${files.length} stored files, ${withExif} with EXIF/XMP, ${withScript} holding an uploaded script`,
    );
    expect(withExif).toBe(0);
    expect(withScript).toBe(0);
  });
});
