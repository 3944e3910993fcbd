// Kysely's Migrator over db/migrations, shared by db/migrate.ts and the migration tests so both run
// the same code. On PostgreSQL the Migrator runs a whole call (one step or many) inside a single
// transaction, under an advisory lock: when one migration fails, every migration of that call is
// rolled back with it and the schema stays as it was (PostgreSQL's DDL is transactional).
import { promises as fs } from "node:fs";
import path from "node:path";
import { fileURLToPath, pathToFileURL } from "node:url";
import {
  Migrator,
  NO_MIGRATIONS,
  type Kysely,
  type Migration,
  type MigrationProvider,
  type MigrationResult,
} from "kysely";

const MIGRATIONS_FOLDER = path.join(path.dirname(fileURLToPath(import.meta.url)), "migrations");

export const DIRECTIONS = ["latest", "up", "down", "reset"] as const;
export type Direction = (typeof DIRECTIONS)[number];

/**
 * The migration files of a folder (name = file name without extension), imported as modules.
 * Kysely treats down() as optional and skips a missing one on the way down while the migration
 * stays recorded as applied; here a file without down() is refused.
 */
export function folderMigrations(folder: string = MIGRATIONS_FOLDER): MigrationProvider {
  return {
    async getMigrations() {
      const migrations: Record<string, Migration> = {};
      for (const file of (await fs.readdir(folder)).sort()) {
        if (!/\.(ts|js|mjs)$/.test(file) || file.endsWith(".d.ts")) continue;
        const loaded = (await import(
          pathToFileURL(path.join(folder, file)).href
        )) as Partial<Migration>;
        if (typeof loaded.up !== "function") throw new Error(`migration ${file} exports no up()`);
        if (typeof loaded.down !== "function")
          throw new Error(
            `migration ${file} exports no down(); every migration must be reversible`,
          );
        migrations[file.replace(/\.(ts|js|mjs)$/, "")] = { up: loaded.up, down: loaded.down };
      }
      return migrations;
    },
  };
}

export interface MigrationRun {
  ok: boolean;
  error?: unknown;
  results: MigrationResult[];
  /** What happened, one line each, as the script prints it. */
  lines: string[];
}

export async function runMigrations<DB>(
  db: Kysely<DB>,
  direction: Direction,
  provider: MigrationProvider = folderMigrations(),
): Promise<MigrationRun> {
  const migrator = new Migrator({ db, provider });
  const { error, results = [] } =
    direction === "up"
      ? await migrator.migrateUp()
      : direction === "down"
        ? await migrator.migrateDown()
        : direction === "reset"
          ? await migrator.migrateTo(NO_MIGRATIONS)
          : await migrator.migrateToLatest();

  const lines: string[] = [];
  for (const r of results) {
    const verb = r.direction === "Up" ? "applied" : "reverted";
    if (r.status === "Error")
      lines.push(`migrate: FAILED ${r.migrationName} (${r.direction === "Up" ? "up" : "down"})`);
    // The whole call was one transaction: what "succeeded" before the failure was rolled back.
    else if (r.status === "Success")
      lines.push(
        error
          ? `migrate: rolled back ${r.migrationName} (${verb}, then undone with the failed run)`
          : `migrate: ${verb} ${r.migrationName}`,
      );
  }
  if (!error && results.length === 0) lines.push("migrate: already up to date");
  if (error) {
    const message = error instanceof Error ? error.message : String(error);
    lines.push(`migrate: error: ${message}`);
    if (results.length > 0)
      lines.push("migrate: nothing was changed: the run is one transaction and it was rolled back");
  }
  return { ok: !error, error, results, lines };
}
