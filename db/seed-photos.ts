// Demo photos: for each zone check of the demo's past visits, a generated lawn photo whose bare
// share shrinks from one visit to the next (or grows where the scenario records a problem), so
// the before/after views have something to show. Stored like any upload (processed, local disk).
import path from "node:path";
import type { Kysely } from "kysely";

import { lawnImage } from "@/fixtures/demo/photos";
import { addDays, todayIn } from "@/lib/dates";
import { processPhoto } from "@/lib/photos/process";
import { localDiskStorage } from "@/lib/services/storage";

import type { Database } from "./schema";

export async function seedDemoPhotos(
  db: Kysely<Database>,
  companySlug: string,
  photoDir: string,
): Promise<number> {
  const storage = localDiskStorage(path.resolve(photoDir));
  const checks = await db
    .selectFrom("zone_checks")
    .innerJoin("visits", "visits.id", "zone_checks.visit_id")
    .innerJoin("companies", "companies.id", "visits.company_id")
    .innerJoin("zones", "zones.id", "zone_checks.zone_id")
    .select([
      "zone_checks.id",
      "zone_checks.visit_id",
      "zone_checks.zone_id",
      "zone_checks.company_id",
      "zone_checks.bare_pct",
      "zone_checks.density",
      "visits.property_id",
      "visits.scheduled_for",
      "visits.technician_id",
      "zones.sort_order",
    ])
    .where("companies.slug", "=", companySlug)
    .where("visits.status", "=", "completed")
    // Photos from the last three visits of the season: enough for before/after and a strip.
    .where("visits.scheduled_for", ">=", addDays(todayIn("America/New_York"), -70))
    .orderBy("visits.scheduled_for")
    .execute();
  let count = 0;
  for (const [i, c] of checks.entries()) {
    const soil = Math.min(0.6, 0.05 + (c.bare_pct ?? 0) / 100 + (9 - (c.density ?? 7)) * 0.04);
    const processed = await processPhoto(await lawnImage(1200, 900, soil, "jpeg", 11 + i));
    const prefix = `${c.company_id}/${processed.contentHash}`;
    await storage.put(`${prefix}-display.webp`, processed.display.data, "image/webp");
    await storage.put(`${prefix}-thumb.webp`, processed.thumb.data, "image/webp");
    await db
      .insertInto("photos")
      .values({
        company_id: c.company_id,
        visit_id: c.visit_id,
        zone_check_id: c.id,
        zone_id: c.zone_id,
        property_id: c.property_id,
        content_hash: processed.contentHash,
        original_format: processed.format,
        original_bytes: processed.bytes,
        width: processed.width,
        height: processed.height,
        display_key: `${prefix}-display.webp`,
        display_width: processed.display.width,
        display_height: processed.display.height,
        thumb_key: `${prefix}-thumb.webp`,
        green_cover_pct: processed.greenCoverPct,
        dgci: processed.dgci,
        captured_local: `${c.scheduled_for} 10:${String(10 + (c.sort_order % 40)).padStart(2, "0")}:00`,
        uploaded_by: c.technician_id,
      })
      .onConflict((oc) => oc.columns(["zone_check_id", "content_hash"]).doNothing())
      .execute();
    count++;
  }
  return count;
}
