// Migrations on scratch databases (sward_mig_*), never on the shared ones:
// - the script: up, down to nothing, up again; a non-zero exit with the error when it cannot run;
// - on a populated database (the demo scenario), every migration from the newest back is reverted
//   and applied again one step at a time: the schema fingerprint after the round trip equals the
//   one before, down() restores the schema of the step before, and the rows of tables the step
//   does not touch are kept;
// - a migration made to fail changes nothing: not the schema, not the data, not the migration log.
import { spawnSync } from "node:child_process";
import { sql, type Kysely, type Migration, type MigrationProvider } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { createDb, localDatabaseUrl } from "@/db/client";
import { folderMigrations, runMigrations } from "@/db/migrator";
import {
  fingerprintDiff,
  schemaFingerprint,
  tablesOf,
  type SchemaFingerprint,
} from "@/tests/helpers/schema-fingerprint";
import { fillEmptyTables, tableData } from "@/tests/helpers/table-data";

const SCRATCH = "sward_mig_check";
const POPULATED = "sward_mig_populated";
const url = localDatabaseUrl(SCRATCH);
const populatedUrl = localDatabaseUrl(POPULATED);
const tsx = (args: string[], env: Record<string, string> = {}) =>
  spawnSync("node_modules/.bin/tsx", args, { encoding: "utf8", env: { ...process.env, ...env } });

async function tables(): Promise<string[]> {
  const db = createDb(url, { max: 1 });
  const { rows } = await sql<{
    table_name: string;
  }>`select table_name from information_schema.tables where table_schema = 'public' and table_name not like 'kysely_%' order by 1`.execute(
    db,
  );
  await db.destroy();
  return rows.map((r) => r.table_name);
}

async function dropDatabases(): Promise<void> {
  const admin = createDb(localDatabaseUrl("postgres"), { max: 1 });
  for (const name of [SCRATCH, POPULATED])
    await sql.raw(`drop database if exists ${name} with (force)`).execute(admin);
  await admin.destroy();
}

beforeAll(async () => {
  await dropDatabases();
  expect(tsx(["db/ensure-database.ts", SCRATCH]).status).toBe(0);
});
afterAll(dropDatabases);

describe("db/migrate.ts", () => {
  it("applies, reverts and re-applies every migration", async () => {
    const up = tsx(["db/migrate.ts"], { DATABASE_URL: url });
    expect(up.status, up.stderr).toBe(0);
    expect(up.stdout).toContain("applied");
    expect(await tables()).toEqual(
      expect.arrayContaining([
        "companies",
        "users",
        "memberships",
        "verification_tokens",
        "properties",
        "zones",
      ]),
    );

    const again = tsx(["db/migrate.ts"], { DATABASE_URL: url });
    expect(again.stdout).toContain("already up to date");

    const reset = tsx(["db/migrate.ts", "reset"], { DATABASE_URL: url });
    expect(reset.status, reset.stderr).toBe(0);
    expect(await tables()).toEqual([]);

    const step = tsx(["db/migrate.ts", "up"], { DATABASE_URL: url });
    expect(step.status, step.stderr).toBe(0);
    expect(step.stdout.trim().split("\n")).toEqual([
      expect.stringMatching(/^migrate: applied .*-foundation$/),
    ]);

    expect(tsx(["db/migrate.ts"], { DATABASE_URL: url }).status).toBe(0);
  }, 60_000);

  it("exits non-zero and prints the error when it cannot migrate", () => {
    const bad = tsx(["db/migrate.ts"], { DATABASE_URL: localDatabaseUrl("no_such_database_here") });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toMatch(/migrate: error: .*no_such_database_here/);

    const typo = tsx(["db/migrate.ts", "donw"], { DATABASE_URL: url });
    expect(typo.status).toBe(2);
    expect(typo.stderr).toMatch(/usage: .*latest\|up\|down\|reset/);
  });
});

describe("migrations on a populated database", () => {
  let db: Kysely<unknown>;
  let names: string[] = [];
  /** fingerprints[k]: the schema with the first k migrations applied, built up one step at a time. */
  const fingerprints: SchemaFingerprint[] = [];

  const noExtensions = (print: SchemaFingerprint) =>
    Object.fromEntries(Object.entries(print).filter(([key]) => !key.startsWith("extension ")));
  const step = async (direction: "up" | "down", provider?: MigrationProvider) => {
    const run = await runMigrations(db, direction, provider);
    expect(run.ok, run.lines.join("\n")).toBe(true);
    return run;
  };

  beforeAll(async () => {
    expect(tsx(["db/ensure-database.ts", POPULATED]).status).toBe(0);
    db = createDb(populatedUrl, { max: 2 }) as unknown as Kysely<unknown>;
    names = Object.keys(await folderMigrations().getMigrations()).sort();
    fingerprints.push(await schemaFingerprint(db));
    for (let k = 1; k <= names.length; k++) {
      await step("up");
      fingerprints.push(await schemaFingerprint(db));
    }
    const seed = tsx(["fixtures/demo/seed.ts"], {
      DATABASE_URL: populatedUrl,
      PHOTO_DIR: "tests/.artifacts/photos-migrations",
    });
    expect(seed.status, seed.stderr).toBe(0);
    await fillEmptyTables(db);
  }, 240_000);
  afterAll(async () => {
    await db?.destroy();
  });

  it("reverts and re-applies every migration one step at a time, newest first, without changing the schema", async () => {
    const top = await schemaFingerprint(db);
    expect(
      fingerprintDiff(fingerprints[names.length]!, top),
      "the seed changed the schema",
    ).toEqual([]);
    const seeded = await tableData(db);
    for (const [table, { rows }] of Object.entries(seeded))
      expect(rows, `rows in ${table}`).toBeGreaterThan(0);

    let schemaDifferences = 0;
    const extensionsLeft: string[] = [];
    for (let k = names.length; k >= 1; k--) {
      const name = names[k - 1]!;
      const before = await schemaFingerprint(db);
      const dataBefore = await tableData(db);
      expect(fingerprintDiff(noExtensions(fingerprints[k]!), noExtensions(before))).toEqual([]);

      await step("down");
      const down = await schemaFingerprint(db);
      // down() is the inverse of up(): the schema of the step before, except extensions, which
      // the migrations create "if not exists" and leave in place (database-wide, maybe shared).
      const notInverse = fingerprintDiff(noExtensions(fingerprints[k - 1]!), noExtensions(down));
      expect(notInverse, `${name}: down() does not restore the schema before up()`).toEqual([]);
      for (const key of Object.keys(down))
        if (
          key.startsWith("extension ") &&
          !(key in fingerprints[k - 1]!) &&
          key in fingerprints[k]!
        )
          extensionsLeft.push(`${key.slice(10)} (${name})`);

      await step("up");
      const after = await schemaFingerprint(db);
      const differences = fingerprintDiff(before, after);
      schemaDifferences += differences.length;
      expect(differences, `${name}: down + up changed the schema`).toEqual([]);

      // Data: tables the step does not touch keep every row as it was; tables that existed before
      // the step keep their rows (a column the step adds comes back with its default); tables the
      // step creates come back empty.
      const [previous, current] = [fingerprints[k - 1]!, fingerprints[k]!];
      const touched = new Set(
        [...new Set([...Object.keys(previous), ...Object.keys(current)])]
          .filter((key) => previous[key] !== current[key])
          .flatMap(tablesOf),
      );
      const dataAfter = await tableData(db);
      let unchanged = 0;
      let rowsKept = 0;
      const created: string[] = [];
      for (const [table, was] of Object.entries(dataBefore)) {
        const now = dataAfter[table];
        expect(now, `${name}: table ${table} is gone`).toBeDefined();
        if (table.startsWith("kysely_")) continue; // the migration log itself
        if (!(`relation ${table}` in previous)) {
          created.push(`${table} ${was.rows}→${now!.rows}`);
          continue;
        }
        expect(now!.rows, `${name}: rows of ${table}`).toBe(was.rows);
        if (!touched.has(table)) {
          expect(
            now!.checksum,
            `${name}: contents of ${table}, which the step does not touch`,
          ).toBe(was.checksum);
          unchanged++;
        } else rowsKept++;
      }
      if (k >= 2)
        for (const table of ["companies", "users", "properties"])
          expect(dataAfter[table]?.rows, `${name}: ${table}`).toBe(seeded[table]?.rows);
      console.log(
        `  ${name}: schema equal after down + up; tables unchanged ${unchanged}, touched but every row kept ${rowsKept}` +
          (created.length ? `, created by the step (rows not kept): ${created.join(", ")}` : ""),
      );

      // Down once more, to round-trip the migration before it next.
      await step("down");
      expect(fingerprintDiff(down, await schemaFingerprint(db))).toEqual([]);
    }

    expect((await runMigrations(db, "latest")).ok).toBe(true);
    expect(fingerprintDiff(top, await schemaFingerprint(db))).toEqual([]);
    console.log(`  extensions left in place by down(): ${extensionsLeft.join(", ") || "none"}`);
    console.log(`migrations checked ${names.length}, schema differences ${schemaDifferences}`);
    expect(schemaDifferences).toBe(0);
  }, 240_000);

  it("a migration made to fail leaves the schema, the data and the migration log as they were", async () => {
    expect((await runMigrations(db, "latest")).ok).toBe(true);
    const failing: Migration = {
      async up(trx) {
        await sql`create table deliberately_failing (id integer primary key)`.execute(trx);
        await sql`insert into deliberately_failing values (1)`.execute(trx);
        await sql`alter table companies add column never_kept text`.execute(trx);
        await sql`update companies set name = name || ' (changed)'`.execute(trx);
        await sql`do $$ begin raise exception 'this migration fails on purpose'; end $$`.execute(
          trx,
        );
      },
      async down(trx) {
        await sql`drop table if exists deliberately_failing`.execute(trx);
      },
    };
    const withFailing: MigrationProvider = {
      async getMigrations() {
        return {
          ...(await folderMigrations().getMigrations()),
          "9999-12-31T2359-deliberately-failing": failing,
        };
      },
    };
    const log = async () =>
      (
        await sql<{ name: string }>`select name from kysely_migration order by name`.execute(db)
      ).rows.map((r) => r.name);

    // 1. Only the failing migration is pending.
    const before = await schemaFingerprint(db);
    const dataBefore = await tableData(db);
    const logBefore = await log();
    const run = await runMigrations(db, "latest", withFailing);
    expect(run.ok).toBe(false);
    expect(String(run.error)).toMatch(/this migration fails on purpose/);
    expect(run.results).toEqual([
      { migrationName: "9999-12-31T2359-deliberately-failing", direction: "Up", status: "Error" },
    ]);
    expect(run.lines).toContain("migrate: FAILED 9999-12-31T2359-deliberately-failing (up)");
    expect(fingerprintDiff(before, await schemaFingerprint(db))).toEqual([]);
    expect(await tableData(db)).toEqual(dataBefore);
    expect(await log()).toEqual(logBefore);

    // 2. A real migration and the failing one in the same run: both are rolled back.
    await step("down");
    const last = names[names.length - 1]!;
    const beforeBoth = await schemaFingerprint(db);
    expect(
      fingerprintDiff(noExtensions(fingerprints[names.length - 1]!), noExtensions(beforeBoth)),
    ).toEqual([]);
    const dataBeforeBoth = await tableData(db);
    const both = await runMigrations(db, "latest", withFailing);
    expect(both.ok).toBe(false);
    expect(both.results.map((r) => `${r.migrationName} ${r.status}`)).toEqual([
      `${last} Success`,
      "9999-12-31T2359-deliberately-failing Error",
    ]);
    expect(both.lines).toContain(
      `migrate: rolled back ${last} (applied, then undone with the failed run)`,
    );
    expect(fingerprintDiff(beforeBoth, await schemaFingerprint(db))).toEqual([]);
    expect(await tableData(db)).toEqual(dataBeforeBoth);
    expect(await log()).not.toContain(last);

    expect((await runMigrations(db, "latest")).ok).toBe(true);
    expect(fingerprintDiff(fingerprints[names.length]!, await schemaFingerprint(db))).toEqual([]);
    console.log(
      `failing migration: rolled back (alone, and with ${last} in the same run); schema differences 0`,
    );
  }, 120_000);
});
