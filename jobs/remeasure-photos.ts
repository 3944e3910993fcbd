// Measures stored photos again by the current method (lib/photos/remeasure.ts) and brings their
// checks' Index, the book rows and the alerts up to date: `npm run db:remeasure-photos [-- --all]`.
// Without --all only photos measured by a retired method are read. The demo seed and the worker's
// start run the same step.
import { createDb, localDatabaseUrl } from "@/db/client";
import { remeasurePhotos } from "@/lib/photos/remeasure";
import { services } from "@/lib/services";

const db = createDb(process.env.DATABASE_URL ?? localDatabaseUrl("sward"), { max: 2 });
const started = Date.now();
try {
  const r = await remeasurePhotos(db, services().photoStorage, {
    all: process.argv.includes("--all"),
  });
  const mean = (xs: number[]) => (xs.length ? xs.reduce((a, b) => a + b, 0) / xs.length : NaN);
  const changed = r.checks.filter((c) => c.before !== c.after).length;
  console.log(
    `remeasure-photos: ${r.photos.length} photos of ${r.properties} properties in ${((Date.now() - started) / 1000).toFixed(1)} s; ` +
      `mean green cover ${mean(r.photos.map((p) => p.before.greenCoverPct)).toFixed(1)} → ${mean(r.photos.map((p) => p.after.greenCoverPct)).toFixed(1)} %; ` +
      `Index changed on ${changed} of ${r.checks.length} zone checks`,
  );
  if (r.missing.length) {
    console.error(
      `remeasure-photos: ${r.missing.length} photos have no display image in storage and keep their old figures: ${r.missing.join(", ")}`,
    );
    process.exitCode = 1;
  }
} catch (err) {
  console.error("remeasure-photos: failed:", err instanceof Error ? err.message : err);
  process.exitCode = 1;
} finally {
  await db.destroy();
}
