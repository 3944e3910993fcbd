// Stores the Sward Index of zone checks: on every save, when a photo is added, and in bulk when
// the weights change (jobs/recompute-index.ts). Never computed at read time.
// It takes the database handle from its caller (a transaction, the seed, the recompute job).
import type { Kysely, Transaction } from "kysely";

import type { Database } from "@/db/schema";
import { valuesOf } from "@/lib/visits/map";

import { indexInputOf } from "./from-check";
import { swardIndex } from "./sward-index";

export async function refreshCheckIndex(
  executor: Kysely<Database> | Transaction<Database>,
  zoneCheckIds: string[],
): Promise<void> {
  if (zoneCheckIds.length === 0) return;
  const checks = await executor
    .selectFrom("zone_checks")
    .selectAll()
    .where("id", "in", zoneCheckIds)
    .execute();
  const photos = await executor
    .selectFrom("photos")
    .select(["zone_check_id", "green_cover_pct", "dgci"])
    .where("zone_check_id", "in", zoneCheckIds)
    .execute();
  for (const c of checks) {
    const input = indexInputOf(
      valuesOf(c),
      photos
        .filter((p) => p.zone_check_id === c.id)
        .map((p) => ({ greenCoverPct: p.green_cover_pct, dgci: p.dgci })),
    );
    const result = input ? swardIndex(input) : null;
    await executor
      .updateTable("zone_checks")
      .set({
        sward_index: result?.index ?? null,
        index_parts: result ? JSON.stringify(result.parts) : null,
      })
      .where("id", "=", c.id)
      .execute();
  }
}

/** Recomputes every stored Index (after a change of weights). Returns how many checks it read. */
export async function recomputeAllIndexes(
  executor: Kysely<Database>,
  batch = 500,
): Promise<number> {
  let after = "00000000-0000-0000-0000-000000000000";
  let total = 0;
  for (;;) {
    const ids = (
      await executor
        .selectFrom("zone_checks")
        .select("id")
        .where("id", ">", after)
        .orderBy("id")
        .limit(batch)
        .execute()
    ).map((r) => r.id);
    if (!ids.length) return total;
    await refreshCheckIndex(executor, ids);
    total += ids.length;
    after = ids[ids.length - 1]!;
  }
}
