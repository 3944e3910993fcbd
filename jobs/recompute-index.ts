// The recompute job: stores the Sward Index of every zone check again, property by property through
// afterWrite (run after changing the weights in lib/scoring/weights.ts): `npm run db:recompute-index`. A script of the app, beside the
// worker: db/ holds only the pool, the schema, migrations and database tools.
import { createDb, localDatabaseUrl } from "@/db/client";
import { recomputeAllIndexes } from "@/lib/after-write/recompute-all";

const db = createDb(process.env.DATABASE_URL ?? localDatabaseUrl("sward"), { max: 2 });
const started = Date.now();
try {
  const r = await recomputeAllIndexes(db);
  console.log(
    `recompute-index: ${r.checks} zone checks of ${r.properties} properties in ${((Date.now() - started) / 1000).toFixed(1)} s; Index changed on ${r.changed}; book rows and alerts brought up to date`,
  );
} catch (err) {
  console.error("recompute-index: failed:", err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
