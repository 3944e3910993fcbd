// Stores the Sward Index of every zone check again (after a change of the weights in
// lib/scoring/weights.ts, or after the demo's photos are added): one property at a time, each in
// its own transaction through afterWrite, so the book rows and the alerts move with the Indexes
// exactly as they do after any other write, and no property is locked for longer than its own
// checks take.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";

import { afterWrite } from "./index";

export interface RecomputeResult {
  properties: number;
  checks: number;
  /** Checks whose stored Index is not the same after the recompute. */
  changed: number;
}

export async function recomputeAllIndexes(
  db: Kysely<Database>,
  options: { companyIds?: string[]; alerts?: "evaluate" | "keep" } = {},
): Promise<RecomputeResult> {
  let query = db.selectFrom("properties").select(["id", "company_id"]).orderBy("id");
  if (options.companyIds) {
    if (!options.companyIds.length) return { properties: 0, checks: 0, changed: 0 };
    query = query.where("company_id", "in", options.companyIds);
  }
  const properties = await query.execute();
  const result: RecomputeResult = { properties: 0, checks: 0, changed: 0 };
  for (const property of properties) {
    await db.transaction().execute(async (trx) => {
      const before = await trx
        .selectFrom("zone_checks")
        .innerJoin("visits", "visits.id", "zone_checks.visit_id")
        .select(["zone_checks.id", "zone_checks.sward_index"])
        .where("visits.property_id", "=", property.id)
        .where("zone_checks.company_id", "=", property.company_id)
        .execute();
      if (!before.length) return;
      const ids = before.map((c) => c.id);
      await afterWrite(trx, {
        companyId: property.company_id,
        propertyId: property.id,
        recheckIndexOf: ids,
        alerts: options.alerts ?? "evaluate", // as the daily sweep does: the rules read the new Index
      });
      const after = new Map(
        (
          await trx
            .selectFrom("zone_checks")
            .select(["id", "sward_index"])
            .where("id", "in", ids)
            .execute()
        ).map((c) => [c.id, c.sward_index]),
      );
      result.properties++;
      result.checks += ids.length;
      result.changed += before.filter((c) => after.get(c.id) !== c.sward_index).length;
    });
  }
  return result;
}
