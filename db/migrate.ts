// Runs Kysely's Migrator over db/migrations: `tsx db/migrate.ts [latest|up|down|reset]`
// (latest: every pending one; up: the next one; down: reverts the last one; reset: reverts all).
// Target database: DATABASE_URL, else the local cluster's "sward". Exits non-zero on failure; a
// failed run changes nothing (db/migrator.ts: one transaction per run).
import { createDb, localDatabaseUrl } from "./client";
import { DIRECTIONS, runMigrations, type Direction } from "./migrator";

const url = process.env.DATABASE_URL ?? localDatabaseUrl("sward");
const direction = process.argv[2] ?? "latest";
if (!(DIRECTIONS as readonly string[]).includes(direction)) {
  console.error(`usage: tsx db/migrate.ts [${DIRECTIONS.join("|")}]   (got "${direction}")`);
  process.exit(2);
}

const db = createDb(url, { max: 2 });
const run = await runMigrations(db, direction as Direction);
await db.destroy();
for (const line of run.lines) (run.ok ? console.log : console.error)(line);
if (!run.ok) process.exit(1);
