// The stored Sward Index of zone checks (never computed at read time): the columns for a check
// from the values in hand (a save writes them in its own INSERT/UPDATE), and the recompute from
// stored rows for a photo added or removed (through afterWrite) and for a change of weights
// (jobs/recompute-index.ts). Takes the database handle from its caller.
import type { Kysely } from "kysely";

import type { Database, ZoneCheck } from "@/db/schema";
import { indexInputOf, type CheckRatings, type PhotoFigures } from "@/lib/scoring/from-check";
import { swardIndex } from "@/lib/scoring/sward-index";

/** The Index columns of a check with these ratings and photos (null until the zone is rated). */
export function indexColumns(check: CheckRatings, photos: PhotoFigures[]) {
  const input = indexInputOf(check, photos);
  const result = input ? swardIndex(input) : null;
  return {
    sward_index: result?.index ?? null,
    index_parts: result ? JSON.stringify(result.parts) : null,
  };
}

/** What the Index reads of a stored zone-check row. */
function ratingsOfRow(
  row: Pick<
    ZoneCheck,
    | "status"
    | "quality"
    | "color"
    | "density"
    | "uniformity"
    | "bare_pct"
    | "weeds_pct"
    | "symptoms"
  >,
): CheckRatings {
  return {
    status: row.status,
    quality: row.quality,
    color: row.color,
    density: row.density,
    uniformity: row.uniformity,
    barePct: row.bare_pct,
    weedsPct: row.weeds_pct,
    symptoms: row.symptoms,
  };
}

/** Recomputes and stores the Index of these checks from their rows and photos. */
export async function refreshCheckIndex(
  executor: Kysely<Database>,
  zoneCheckIds: string[],
): Promise<void> {
  if (zoneCheckIds.length === 0) return;
  const checks = await executor
    .selectFrom("zone_checks")
    .select([
      "id",
      "status",
      "quality",
      "color",
      "density",
      "uniformity",
      "bare_pct",
      "weeds_pct",
      "symptoms",
    ])
    .where("id", "in", zoneCheckIds)
    .execute();
  const photos = await executor
    .selectFrom("photos")
    .select(["zone_check_id", "green_cover_pct", "dgci", "dark_pct", "clipped_pct"])
    .where("zone_check_id", "in", zoneCheckIds)
    .execute();
  for (const c of checks) {
    const figures = photos
      .filter((p) => p.zone_check_id === c.id)
      .map((p) => ({
        greenCoverPct: p.green_cover_pct,
        dgci: p.dgci,
        darkPct: p.dark_pct,
        clippedPct: p.clipped_pct,
      }));
    await executor
      .updateTable("zone_checks")
      .set(indexColumns(ratingsOfRow(c), figures))
      .where("id", "=", c.id)
      .execute();
  }
}
