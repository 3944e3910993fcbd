// Green canopy cover, DGCI and the lighting caution through the routes users hit, and the
// remeasure of photos stored under the retired hue window (lib/photos/remeasure.ts, run by
// `npm run db:remeasure-photos`, the demo seed and the worker's start):
// - a photo of known composition uploaded to a finished visit stores the cover and DGCI the
//   published rule gives (Patrignani & Ochsner 2015, Agronomy Journal 107:2312–2320: R/G < 0.95,
//   B/G < 0.95, 2G − R − B > 20, written out again here; DGCI by Karcher & Richardson 2003 on HSB
//   from colorjs.io), and the check's Index, the book row and the alerts follow at once;
// - a photo too dark to measure is stored and shown with its caution, and the Index ignores it;
// - a photo row left by the old method is measured again from its stored image, and its check's
//   Index and the book row follow; a photo whose image is missing is reported and left alone.
import Color from "colorjs.io";
import { beforeAll, describe, expect, it, vi } from "vitest";

import { afterWrite } from "@/lib/after-write";
import { evaluateProperty } from "@/lib/after-write/sweep";
import type { Actor } from "@/lib/auth/actor";
import { dgciOf } from "@/lib/photo-analysis/color";
import type { PhotoDto } from "@/lib/photos/dto";
import { remeasurePhotos } from "@/lib/photos/remeasure";
import { indexInputOf } from "@/lib/scoring/from-check";
import { propertyIndex, swardIndex } from "@/lib/scoring/sward-index";
import { services } from "@/lib/services";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { bandedImage, exposedImage, lawnImage } from "../helpers/images";

let current: Actor | null = null;
vi.mock("@/lib/auth/session", () => ({ getActor: async () => current }));
const upload = await import("@/app/api/v1/visits/[visitId]/zone-checks/[zoneCheckId]/photos/route");
const zonePhotos = await import("@/app/api/v1/zones/[zoneId]/photos/route");
const book = await import("@/app/api/v1/book/route");

type Rgb = readonly [number, number, number];
const publishedRule = ([r, g, b]: Rgb) => r / g < 0.95 && b / g < 0.95 && 2 * g - r - b > 20;
const referenceDgci = (rgb: Rgb) => {
  const [h, s, v] = new Color("srgb", rgb.map((x) => x / 255) as [number, number, number]).to("hsv")
    .coords as [number, number, number];
  return Math.min(1, Math.max(0, dgciOf(h, s / 100, v / 100)));
};
const HEALTHY: Rgb = [58, 122, 44];
const YELLOW_GREEN: Rgb = [140, 160, 50]; // chlorotic, hue 71°
const SOIL: Rgb = [121, 85, 58];
/** The photo: 50 % healthy, 30 % yellowing, 20 % soil. */
const MIX = [
  { rgb: HEALTHY, share: 0.5 },
  { rgb: YELLOW_GREEN, share: 0.3 },
  { rgb: SOIL, share: 0.2 },
];
const expectedCover =
  100 * MIX.filter((m) => publishedRule(m.rgb)).reduce((s, m) => s + m.share, 0);
const expectedDgci =
  MIX.filter((m) => publishedRule(m.rgb)).reduce((s, m) => s + m.share * referenceDgci(m.rgb), 0) /
  (expectedCover / 100);

let c: TestCompany;
let propertyId: string;
let visitId: string;
let checks: { id: string; zone_id: string }[];

async function post(zoneCheckId: string, bytes: Buffer) {
  const res = await upload.POST(
    // The visit is finished: a photo added to it is a manager's correction, with its reason.
    new Request(
      `http://localhost/api/x?correctionReason=${encodeURIComponent("Photo taken at the visit, uploaded later.")}`,
      {
        method: "POST",
        body: new Uint8Array(bytes),
        headers: {
          origin: "http://localhost:3000",
          host: "localhost",
          "content-type": "image/png",
        },
      },
    ),
    { params: Promise.resolve({ visitId, zoneCheckId }) },
  );
  expect(res.status).toBe(201);
  return (await res.json()) as PhotoDto;
}

async function bookIndex() {
  const res = await book.GET(new Request("http://localhost/api/v1/book?limit=100"), {
    params: Promise.resolve({}),
  });
  const page = (await res.json()) as { rows: { propertyId: string; latestIndex: number | null }[] };
  return page.rows.find((r) => r.propertyId === propertyId)!.latestIndex;
}

/** The property index of the visit from its stored checks (area-weighted, active zones). */
async function storedVisitIndex() {
  const rows = await testDb()
    .selectFrom("zone_checks")
    .innerJoin("zones", "zones.id", "zone_checks.zone_id")
    .select(["zone_checks.sward_index", "zones.area_ft2"])
    .where("zone_checks.visit_id", "=", visitId)
    .where("zones.archived_at", "is", null)
    .where("zone_checks.sward_index", "is not", null)
    .execute();
  return propertyIndex(rows.map((r) => ({ index: r.sward_index!, areaFt2: Number(r.area_ft2) })));
}

/** The Index the stored ratings and photo rows of a check give, computed here. */
async function indexFromRows(zoneCheckId: string) {
  const row = await testDb()
    .selectFrom("zone_checks")
    .selectAll()
    .where("id", "=", zoneCheckId)
    .executeTakeFirstOrThrow();
  const photos = await testDb()
    .selectFrom("photos")
    .selectAll()
    .where("zone_check_id", "=", zoneCheckId)
    .execute();
  const input = indexInputOf(
    {
      status: row.status,
      quality: row.quality,
      color: row.color,
      density: row.density,
      uniformity: row.uniformity,
      barePct: row.bare_pct,
      weedsPct: row.weeds_pct,
      symptoms: row.symptoms,
    },
    photos.map((p) => ({
      greenCoverPct: p.green_cover_pct,
      dgci: p.dgci,
      darkPct: p.dark_pct,
      clippedPct: p.clipped_pct,
    })),
  );
  return { stored: row.sward_index, computed: input ? swardIndex(input).index : null, input };
}

beforeAll(async () => {
  c = await createTestCompany();
  propertyId = c.propertyIds["oyelaran"]!;
  await evaluateProperty(testDb(), c.companyId, propertyId, { provider: null });
  const latest = await testDb()
    .selectFrom("visits")
    .innerJoin("zone_checks", "zone_checks.visit_id", "visits.id")
    .select(["visits.id", "visits.status"])
    .where("visits.property_id", "=", propertyId)
    .where("zone_checks.sward_index", "is not", null)
    .orderBy("visits.scheduled_for", "desc")
    .executeTakeFirstOrThrow();
  expect(latest.status).toBe("completed");
  visitId = latest.id;
  checks = await testDb()
    .selectFrom("zone_checks")
    .select(["id", "zone_id"])
    .where("visit_id", "=", visitId)
    .where("status", "=", "done")
    .orderBy("id")
    .execute();
  expect(checks.length).toBeGreaterThanOrEqual(3);
  current = await c.actor("manager");
});

describe("uploads measured by the green-canopy rule", () => {
  it("the issue's photo (50 % healthy, 30 % yellowing, 20 % soil) stores about 80 % cover and the canopy's DGCI; the Index and the book follow", async () => {
    const before = await indexFromRows(checks[0]!.id);
    const dto = await post(checks[0]!.id, await bandedImage(1200, 900, MIX));
    expect(Math.abs(dto.greenCoverPct - expectedCover)).toBeLessThanOrEqual(1);
    expect(expectedCover).toBe(80);
    expect(Math.abs(dto.dgci! - expectedDgci)).toBeLessThanOrEqual(0.01);
    expect(dto).toMatchObject({ lighting: "ok", measuredByCanopyRule: true });
    const row = await testDb()
      .selectFrom("photos")
      .select(["measured_by", "green_cover_pct"])
      .where("id", "=", dto.id)
      .executeTakeFirstOrThrow();
    expect(row.measured_by).toBe("canopy-rule-2015");

    const after = await indexFromRows(checks[0]!.id);
    expect(after.input?.photo?.greenCoverPct).toBeCloseTo(row.green_cover_pct, 6);
    expect(after.stored).toBe(after.computed);
    expect(after.stored).not.toBe(before.stored);
    expect(await bookIndex()).toBeCloseTo((await storedVisitIndex())!, 6);
  });

  it("a photo too dark to measure is stored with its caution, shown by the zone's photo list, and left out of the Index", async () => {
    const dark = await exposedImage(await lawnImage(800, 600, 0.1, "png", 4), 0.15);
    const check = checks[1]!;
    const before = await indexFromRows(check.id);
    const bookBefore = await bookIndex();
    const dto = await post(check.id, dark);
    expect(dto.lighting).toBe("too_dark");
    expect(dto.darkPct).toBeGreaterThanOrEqual(25);

    const listed = await zonePhotos.GET(new Request("http://localhost/x"), {
      params: Promise.resolve({ zoneId: check.zone_id }),
    });
    const items = ((await listed.json()) as { items: PhotoDto[] }).items;
    expect(items.find((p) => p.id === dto.id)).toMatchObject({ lighting: "too_dark" });

    const after = await indexFromRows(check.id);
    expect(after.stored).toBe(before.stored);
    expect(after.input?.photo).toBeUndefined();
    expect(await bookIndex()).toBe(bookBefore);
  });
});

describe("photos measured by the retired hue window are measured again", () => {
  it("the remeasure restores the rule's figures from the stored image and brings the Index and the book up to date; a second run has nothing to do", async () => {
    const check = checks[2]!;
    const dto = await post(check.id, await bandedImage(1200, 900, MIX));
    // What a row stored before the change looks like: the window counted only the healthy half.
    await testDb()
      .transaction()
      .execute(async (trx) => {
        await trx
          .updateTable("photos")
          .set({ measured_by: "hue-window-2001", green_cover_pct: 50.6, dgci: 0.568 })
          .where("id", "=", dto.id)
          .execute();
        await afterWrite(trx, {
          companyId: c.companyId,
          propertyId,
          recheckIndexOf: [check.id],
          alerts: "evaluate",
        });
      });
    const stale = await indexFromRows(check.id);
    expect(stale.input?.photo?.greenCoverPct).toBeCloseTo(50.6, 3);
    expect(await bookIndex()).toBeCloseTo((await storedVisitIndex())!, 6);

    const result = await remeasurePhotos(testDb(), services().photoStorage, {
      companyIds: [c.companyId],
    });
    expect(result.photos.map((p) => p.photoId)).toEqual([dto.id]);
    expect(result.missing).toEqual([]);
    const row = await testDb()
      .selectFrom("photos")
      .selectAll()
      .where("id", "=", dto.id)
      .executeTakeFirstOrThrow();
    expect(row.measured_by).toBe("canopy-rule-2015");
    expect(Math.abs(row.green_cover_pct - expectedCover)).toBeLessThanOrEqual(1.5);
    expect(Math.abs(row.dgci! - expectedDgci)).toBeLessThanOrEqual(0.01);

    const fresh = await indexFromRows(check.id);
    expect(fresh.stored).toBe(fresh.computed);
    expect(fresh.stored).not.toBe(stale.stored);
    expect(result.checks).toContainEqual({
      zoneCheckId: check.id,
      before: stale.stored,
      after: fresh.stored,
    });
    // The book row is the visit's area-weighted Index of the stored checks, the remeasured one too.
    expect(await bookIndex()).toBeCloseTo((await storedVisitIndex())!, 6);
    // The sweep's path finds nothing left to do, and neither does a second remeasure.
    const s = await evaluateProperty(testDb(), c.companyId, propertyId, { provider: null });
    expect(s.raised + s.reopened + s.updated + s.cleared + s.autoResolved).toBe(0);
    const again = await remeasurePhotos(testDb(), services().photoStorage, {
      companyIds: [c.companyId],
    });
    expect(again.photos).toEqual([]);
  });

  it("a photo whose stored image is missing is reported and keeps its figures", async () => {
    const dto = await post(checks[0]!.id, await lawnImage(400, 300, 0.3, "png", 8));
    const missingKey = `${c.companyId}/${"0".repeat(64)}-display.webp`;
    await testDb()
      .updateTable("photos")
      .set({ measured_by: "hue-window-2001", display_key: missingKey, green_cover_pct: 12.5 })
      .where("id", "=", dto.id)
      .execute();
    const result = await remeasurePhotos(testDb(), services().photoStorage, {
      companyIds: [c.companyId],
    });
    expect(result.missing).toEqual([dto.id]);
    const row = await testDb()
      .selectFrom("photos")
      .select(["measured_by", "green_cover_pct"])
      .where("id", "=", dto.id)
      .executeTakeFirstOrThrow();
    expect(row).toEqual({ measured_by: "hue-window-2001", green_cover_pct: 12.5 });
  });
});
