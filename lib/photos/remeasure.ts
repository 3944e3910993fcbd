// Measures stored photos again when the measuring method changes: each photo's display image is
// read from storage (the original is not kept) and measured as an upload is (process.ts), then,
// one property at a time and in one transaction, the figures are written and afterWrite brings
// the checks' Index, the book row and the alerts up to date. Run by `npm run db:remeasure-photos`
// (jobs/remeasure-photos.ts) and by the demo seed; takes the database handle from its caller, like
// lib/after-write, so scripts can use it.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import type { PixelFigures } from "@/lib/photo-analysis/analyze";
import { MEASURED_BY } from "@/lib/photo-analysis/color";
import type { PhotoStorage } from "@/lib/services/storage";

import { measureStoredImage } from "./process";

interface RemeasuredPhoto {
  photoId: string;
  propertyId: string;
  zoneCheckId: string;
  before: { greenCoverPct: number; dgci: number | null; measuredBy: string };
  after: PixelFigures;
}

export interface RemeasureResult {
  photos: RemeasuredPhoto[];
  /** Photos whose display image is missing from storage: left as they were. */
  missing: string[];
  /** The Index of each zone check touched, before and after. */
  checks: { zoneCheckId: string; before: number | null; after: number | null }[];
  properties: number;
}

/**
 * Remeasures the photos not measured by the current method (all of them with `all`), of every
 * company or of those named. Idempotent: a second run finds nothing to do.
 */
export async function remeasurePhotos(
  executor: Kysely<Database>,
  storage: PhotoStorage,
  options: { companyIds?: string[]; all?: boolean } = {},
): Promise<RemeasureResult> {
  let query = executor
    .selectFrom("photos")
    .select([
      "id",
      "company_id",
      "property_id",
      "zone_check_id",
      "display_key",
      "green_cover_pct",
      "dgci",
      "measured_by",
    ])
    .orderBy("company_id")
    .orderBy("property_id")
    .orderBy("id");
  if (!options.all) query = query.where("measured_by", "<>", MEASURED_BY);
  if (options.companyIds) {
    if (!options.companyIds.length) query = query.where((eb) => eb.val(false));
    else query = query.where("company_id", "in", options.companyIds);
  }
  const rows = await query.execute();
  const byProperty = new Map<string, typeof rows>();
  for (const r of rows)
    byProperty.set(r.property_id, [...(byProperty.get(r.property_id) ?? []), r]);

  const result: RemeasureResult = { photos: [], missing: [], checks: [], properties: 0 };
  for (const [propertyId, photos] of byProperty) {
    // Storage and decoding outside the transaction: it holds the property's lock only to write.
    const measured: RemeasuredPhoto[] = [];
    for (const p of photos) {
      const image = await storage.get(p.display_key);
      if (!image) {
        result.missing.push(p.id);
        continue;
      }
      measured.push({
        photoId: p.id,
        propertyId,
        zoneCheckId: p.zone_check_id,
        before: { greenCoverPct: p.green_cover_pct, dgci: p.dgci, measuredBy: p.measured_by },
        after: await measureStoredImage(image),
      });
    }
    if (!measured.length) continue;
    const checkIds = [...new Set(measured.map((m) => m.zoneCheckId))];
    const checks = await executor.transaction().execute(async (trx) => {
      const before = await trx
        .selectFrom("zone_checks")
        .select(["id", "sward_index"])
        .where("id", "in", checkIds)
        .execute();
      for (const m of measured)
        await trx
          .updateTable("photos")
          .set({
            green_cover_pct: m.after.greenCoverPct,
            dgci: m.after.dgci,
            dark_pct: m.after.darkPct,
            clipped_pct: m.after.clippedPct,
            measured_by: MEASURED_BY,
          })
          .where("id", "=", m.photoId)
          .execute();
      await afterWrite(trx, {
        companyId: photos[0]!.company_id,
        propertyId,
        recheckIndexOf: checkIds,
        alerts: "evaluate", // as the daily sweep does: the rules read the checks' new Index
      });
      const after = await trx
        .selectFrom("zone_checks")
        .select(["id", "sward_index"])
        .where("id", "in", checkIds)
        .execute();
      return before.map((b) => ({
        zoneCheckId: b.id,
        before: b.sward_index,
        after: after.find((a) => a.id === b.id)?.sward_index ?? null,
      }));
    });
    result.photos.push(...measured);
    result.checks.push(...checks);
    result.properties++;
  }
  return result;
}
