// Runs Kysely's Migrator over db/migrations: `tsx db/migrate.ts [latest|down|reset]`.
// Target database: DATABASE_URL, else the local cluster's "sward". Exits non-zero on failure.
import { promises as fs } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { FileMigrationProvider, Migrator, NO_MIGRATIONS } from "kysely";
import { createDb, localDatabaseUrl } from "./client";

const here = path.dirname(fileURLToPath(import.meta.url));
const url = process.env.DATABASE_URL ?? localDatabaseUrl("sward");
const direction = process.argv[2] ?? "latest";

const db = createDb(url, { max: 2 });
const migrator = new Migrator({
  db,
  provider: new FileMigrationProvider({ fs, path, migrationFolder: path.join(here, "migrations") }),
});

const { error, results } =
  direction === "down"
    ? await migrator.migrateDown()
    : direction === "reset"
      ? await migrator.migrateTo(NO_MIGRATIONS)
      : await migrator.migrateToLatest();

for (const r of results ?? []) {
  const verb = r.direction === "Up" ? "applied" : "reverted";
  if (r.status === "Success") console.log(`migrate: ${verb} ${r.migrationName}`);
  else if (r.status === "Error") console.error(`migrate: FAILED ${r.migrationName}`);
}
if (!error && (results ?? []).length === 0) console.log("migrate: already up to date");
await db.destroy();
if (error) {
  console.error("migrate: error:", error instanceof Error ? error.message : error);
  process.exit(1);
}
