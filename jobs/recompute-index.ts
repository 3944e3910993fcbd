// The recompute job: stores the Sward Index of every zone check again (run after changing the
// weights in lib/scoring/weights.ts): `npm run db:recompute-index`. A script of the app, beside the
// worker: db/ holds only the pool, the schema, migrations and database tools.
import { createDb, localDatabaseUrl } from "@/db/client";
import { recomputeAllIndexes } from "@/lib/after-write/check-index";

const db = createDb(process.env.DATABASE_URL ?? localDatabaseUrl("sward"), { max: 2 });
const started = Date.now();
try {
  const n = await recomputeAllIndexes(db);
  console.log(
    `recompute-index: ${n} zone checks in ${((Date.now() - started) / 1000).toFixed(1)} s`,
  );
} catch (err) {
  console.error("recompute-index: failed:", err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
