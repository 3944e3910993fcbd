// npm run db:backup / db:restore on scratch databases (sward_backup_*), never on the shared ones:
// the demo scenario is backed up from sward_backup_src and restored into sward_backup_dst (new, then
// existing), and every table must come back with the same row count and the same contents
// (checksum of its rows); truncated or corrupt archives are refused and leave the target as it was;
// missing files, tools and databases fail with a message that says so.
import { spawnSync } from "node:child_process";
import { promises as fs } from "node:fs";
import path from "node:path";
import { sql, type Kysely } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { createDb, localDatabaseUrl } from "@/db/client";
import {
  fingerprintDiff,
  schemaFingerprint,
  withoutCheckParentheses,
} from "@/tests/helpers/schema-fingerprint";
import {
  fillEmptyTables,
  sequenceValues,
  tableData,
  type TableData,
} from "@/tests/helpers/table-data";

const SRC = "sward_backup_src";
const DST = "sward_backup_dst";
const NEW = "sward_backup_new";
const srcUrl = localDatabaseUrl(SRC);
const dstUrl = localDatabaseUrl(DST);
const newUrl = localDatabaseUrl(NEW);
const DIR = path.resolve("tests/.artifacts/backups");
const dump = path.join(DIR, "src.dump");

const tsx = (args: string[], env: Record<string, string> = {}) =>
  spawnSync("node_modules/.bin/tsx", args, { encoding: "utf8", env: { ...process.env, ...env } });
const backup = (args: string[], env: Record<string, string> = {}) =>
  tsx(["db/backup.ts", ...args], { DATABASE_URL: srcUrl, ...env });
const restore = (args: string[], env: Record<string, string> = {}) =>
  tsx(["db/restore.ts", ...args], { DATABASE_URL: dstUrl, ...env });

/** The "  table   1,234" lines both scripts print. */
function printedCounts(stdout: string): Record<string, number> {
  const counts: Record<string, number> = {};
  for (const match of stdout.matchAll(/^ {2}(\S+)\s+([\d,]+)$/gm))
    counts[match[1]!] = Number(match[2]!.replaceAll(",", ""));
  return counts;
}
const rowsOf = (data: TableData) =>
  Object.fromEntries(Object.entries(data).map(([t, d]) => [t, d.rows]));

async function withDb<T>(url: string, fn: (db: Kysely<unknown>) => Promise<T>): Promise<T> {
  const db = createDb(url, { max: 1 }) as unknown as Kysely<unknown>;
  try {
    return await fn(db);
  } finally {
    await db.destroy();
  }
}
const snapshot = (url: string) =>
  withDb(url, async (db) => ({
    data: await tableData(db),
    schema: await schemaFingerprint(db),
    sequences: await sequenceValues(db),
  }));

async function databaseExists(name: string): Promise<boolean> {
  return withDb(
    localDatabaseUrl("postgres"),
    async (db) =>
      (await sql`select 1 from pg_database where datname = ${name}`.execute(db)).rows.length > 0,
  );
}
async function dropDatabases(): Promise<void> {
  await withDb(localDatabaseUrl("postgres"), async (db) => {
    for (const name of [SRC, DST, NEW])
      await sql.raw(`drop database if exists ${name} with (force)`).execute(db);
  });
}

beforeAll(async () => {
  await dropDatabases();
  await fs.rm(DIR, { recursive: true, force: true });
  await fs.mkdir(DIR, { recursive: true });
  expect(tsx(["db/ensure-database.ts", SRC]).status).toBe(0);
  const migrate = tsx(["db/migrate.ts"], { DATABASE_URL: srcUrl });
  expect(migrate.status, migrate.stderr).toBe(0);
  const seed = tsx(["fixtures/demo/seed.ts"], {
    DATABASE_URL: srcUrl,
    PHOTO_DIR: "tests/.artifacts/photos-backup",
  });
  expect(seed.status, seed.stderr).toBe(0);
  await withDb(srcUrl, fillEmptyTables);
}, 240_000);
afterAll(dropDatabases);

describe("db:backup and db:restore", () => {
  it("backs up the demo scenario and restores it into a new database: every table's rows and checksum equal", async () => {
    const made = backup([dump]);
    expect(made.status, made.stderr).toBe(0);
    expect(made.stdout).toMatch(/^backup: file .*src\.dump$/m);
    expect(made.stdout).toMatch(/^backup: size [\d.]+ kB \(\d+ bytes\), \d+ tables, \d+ rows$/m);
    const source = await snapshot(srcUrl);
    expect(printedCounts(made.stdout)).toEqual(rowsOf(source.data));
    expect((await fs.stat(dump)).mode & 0o777).toBe(0o600);
    const [sha] = (await fs.readFile(`${dump}.sha256`, "utf8")).split(/\s+/);
    expect(made.stdout).toContain(`backup: sha256 ${sha}`);
    expect((await fs.readdir(DIR)).filter((f) => f.includes(".partial"))).toEqual([]);

    expect(await databaseExists(DST)).toBe(false);
    const restored = restore([dump]);
    expect(restored.status, restored.stderr).toBe(0);
    expect(restored.stdout).toMatch(/sha256 verified.*a new database/);

    const target = await snapshot(dstUrl);
    expect(printedCounts(restored.stdout)).toEqual(rowsOf(target.data));
    expect(Object.keys(target.data).sort()).toEqual(Object.keys(source.data).sort());
    const tables = Object.keys(source.data);
    const rows = Object.values(source.data).reduce((sum, t) => sum + t.rows, 0);
    const equal = tables.filter(
      (t) =>
        target.data[t]?.rows === source.data[t]!.rows &&
        target.data[t]?.checksum === source.data[t]!.checksum,
    );
    console.log(
      `backup → new database: tables ${tables.length}, rows ${rows}, checksums equal ${equal.length} of ${tables.length}`,
    );
    expect(target.data).toEqual(source.data);
    expect(
      fingerprintDiff(
        withoutCheckParentheses(source.schema),
        withoutCheckParentheses(target.schema),
      ),
    ).toEqual([]);
    expect(target.sequences).toEqual(source.sequences);
    expect(
      Object.values(source.sequences).filter((v) => v !== "never used").length,
    ).toBeGreaterThan(0);
    for (const table of [
      "companies",
      "users",
      "properties",
      "zones",
      "visits",
      "zone_checks",
      "photos",
      "applications",
    ])
      expect(source.data[table]!.rows, table).toBeGreaterThan(0);
  }, 120_000);

  it("restores over an existing database that has changed since: it comes back equal to the backup", async () => {
    await withDb(dstUrl, async (db) => {
      await sql`delete from zone_checks where id in (select id from zone_checks order by id limit 5)`.execute(
        db,
      );
      await sql`update companies set name = name || ' (edited)'`.execute(db);
      await sql`insert into sign_in_attempts (email_key, address, succeeded) values ('later@example.test', '127.0.0.1', true)`.execute(
        db,
      );
    });
    const restored = restore([dump]);
    expect(restored.status, restored.stderr).toBe(0);
    expect(restored.stdout).toMatch(/an existing database: its objects are replaced/);
    const [source, target] = [await snapshot(srcUrl), await snapshot(dstUrl)];
    const tables = Object.keys(source.data);
    const equal = tables.filter(
      (t) =>
        target.data[t]?.checksum === source.data[t]!.checksum &&
        target.data[t]?.rows === source.data[t]!.rows,
    );
    console.log(
      `backup → existing database: tables ${tables.length}, rows ${Object.values(target.data).reduce((s, t) => s + t.rows, 0)}, checksums equal ${equal.length} of ${tables.length}`,
    );
    expect(target.data).toEqual(source.data);
    expect(
      fingerprintDiff(
        withoutCheckParentheses(source.schema),
        withoutCheckParentheses(target.schema),
      ),
    ).toEqual([]);
    expect(target.sequences).toEqual(source.sequences);
  }, 120_000);

  it("writes backups/<database>-<timestamp>.dump by default", async () => {
    const made = backup([]);
    expect(made.status, made.stderr).toBe(0);
    const file = /^backup: file (backups\/sward_backup_src-\d{4}-\d{2}-\d{2}T\d{6}Z\.dump)$/m.exec(
      made.stdout,
    )?.[1];
    expect(file, made.stdout).toBeDefined();
    expect((await fs.stat("backups")).mode & 0o777).toBe(0o700);
    await fs.rm(file!);
    await fs.rm(`${file}.sha256`);
  }, 60_000);

  it("refuses truncated and corrupt archives and leaves the target database as it was", async () => {
    const bytes = await fs.readFile(dump);
    const before = await snapshot(dstUrl);
    const unchanged = async () => {
      const now = await snapshot(dstUrl);
      expect(now.data).toEqual(before.data);
      expect(now.sequences).toEqual(before.sequences);
      expect(fingerprintDiff(before.schema, now.schema)).toEqual([]);
    };
    const write = async (name: string, content: Buffer, withChecksum = false) => {
      const file = path.join(DIR, name);
      await fs.writeFile(file, content);
      if (withChecksum) await fs.copyFile(`${dump}.sha256`, `${file}.sha256`);
      return file;
    };
    // Cut inside the data, which a custom-format archive keeps after its table of contents: the
    // last kilobyte is always data (70 % of the file landed in the table of contents once the
    // schema's DDL outgrew the test data, and then --list already refuses the archive).
    const cut = bytes.length - 1000;
    const flipped = Buffer.from(bytes);
    for (let i = bytes.length - 2000; i < bytes.length - 1600; i++) flipped[i] = flipped[i]! ^ 0x5a;

    const cases: [string, string, RegExp][] = [
      [
        "a truncated archive beside its checksum",
        await write("cut-checked.dump", bytes.subarray(0, cut), true),
        /does not match its checksum.*Nothing was changed/,
      ],
      [
        "a truncated archive (data cut off)",
        await write("cut-data.dump", bytes.subarray(0, cut)),
        /truncated or corrupt; the restore ran as one transaction and was rolled back: sward_backup_dst is as it was/,
      ],
      [
        "a truncated archive (header only)",
        await write("cut-header.dump", bytes.subarray(0, 64)),
        /cannot be read: it is truncated or corrupt\. Nothing was changed/,
      ],
      [
        "a corrupt archive (bytes changed in the data)",
        await write("flipped.dump", flipped),
        /rolled back: sward_backup_dst is as it was/,
      ],
    ];
    for (const [what, file, message] of cases) {
      const run = restore([file]);
      expect(run.status, `${what}: ${run.stdout}`).toBe(1);
      expect(run.stderr, what).toMatch(message);
      expect(run.stderr, what).toMatch(/^restore: FAILED$/m);
      await unchanged();
    }

    // Into a database that does not exist yet: it is not left behind half restored.
    const intoNew = restore([path.join(DIR, "cut-data.dump")], { DATABASE_URL: newUrl });
    expect(intoNew.status).toBe(1);
    expect(intoNew.stderr).toMatch(
      /the database sward_backup_new created for it was dropped again/,
    );
    expect(await databaseExists(NEW)).toBe(false);
    console.log(
      `refused ${cases.length + 1} damaged archives; target unchanged (tables ${Object.keys(before.data).length}, checksums equal ${Object.keys(before.data).length} of ${Object.keys(before.data).length})`,
    );
  }, 180_000);

  it("says clearly what is missing: the file, the tools, the database", async () => {
    const none = restore([]);
    expect(none.status).toBe(2);
    expect(none.stderr).toMatch(/refusing to run without a backup file/);
    expect(none.stderr).toMatch(/usage: npm run db:restore -- <file\.dump>/);

    expect(restore([path.join(DIR, "no-such.dump")]).stderr).toMatch(
      /cannot read .*no-such\.dump: no such file/,
    );
    expect(restore([DIR]).stderr).toMatch(/is a folder/);
    const empty = path.join(DIR, "empty.dump");
    await fs.writeFile(empty, "");
    expect(restore([empty]).stderr).toMatch(/empty\.dump is empty/);
    const plain = path.join(DIR, "plain.sql");
    await fs.writeFile(plain, "-- a plain SQL dump\ncreate table t (id int);\n");
    expect(restore([plain]).stderr).toMatch(/not a pg_dump custom-format archive .*plain SQL dump/);
    if (process.getuid?.() !== 0) {
      const locked = path.join(DIR, "locked.dump");
      await fs.copyFile(dump, locked);
      await fs.chmod(locked, 0o000);
      expect(restore([locked]).stderr).toMatch(/permission denied/);
    }

    const noTools = { SWARD_PG_BIN: path.join(DIR, "no-tools-here") };
    const noDump = backup([path.join(DIR, "never.dump")], noTools);
    expect(noDump.status).toBe(1);
    expect(noDump.stderr).toMatch(
      /pg_dump not found in SWARD_PG_BIN=.*no-tools-here\. Install the PostgreSQL \d+ client tools/,
    );
    await expect(fs.stat(path.join(DIR, "never.dump"))).rejects.toThrow();
    const noRestore = restore([dump], noTools);
    expect(noRestore.status).toBe(1);
    expect(noRestore.stderr).toMatch(/pg_restore not found in SWARD_PG_BIN=/);

    const again = backup([dump]);
    expect(again.status).toBe(1);
    expect(again.stderr).toMatch(
      /src\.dump already exists; give another file name \(a backup is never overwritten\)/,
    );

    const unreachable = backup([path.join(DIR, "nowhere.dump")], {
      DATABASE_URL: localDatabaseUrl("sward_backup_no_such_database"),
    });
    expect(unreachable.status).toBe(1);
    expect(unreachable.stderr).toMatch(/cannot connect to .*sward_backup_no_such_database/);
    expect(
      (await fs.readdir(DIR)).filter((f) => f.startsWith("nowhere") || f.startsWith("never")),
    ).toEqual([]);
  }, 120_000);
});
