// Restores a pg_dump custom-format archive: `npm run db:restore -- <file>`.
// Target: DATABASE_URL, else the local cluster's "sward".
// - The target exists: `pg_restore --clean --if-exists --no-owner --single-transaction` replaces
//   every object of the archive. One transaction: when anything fails (a truncated or corrupt
//   archive, an object that cannot be dropped), nothing is changed.
// - The target does not exist: it is created, restored into, and dropped again if that fails.
// The file is checked first (readable, a custom-format archive, the sha256 db:backup wrote beside
// it when it is there, its table of contents readable);
// after the restore the planner statistics are rebuilt (ANALYZE) and every table's row count printed.
import { constants, promises as fs } from "node:fs";
import pg from "pg";

import { localDatabaseUrl } from "./client";
import {
  databaseName,
  describeRun,
  displayUrl,
  findPgTool,
  formatCounts,
  libpqConnection,
  maintenanceUrl,
  runTool,
  serverMajor,
  sha256File,
  tableCounts,
  ToolError,
  type ToolRun,
} from "./pg-tools";

const url = process.env.DATABASE_URL ?? localDatabaseUrl("sward");
const USAGE =
  "usage: npm run db:restore -- <file.dump>   (into DATABASE_URL, else the local database sward)";

/** Refuses anything that is not a readable custom-format archive, before the database is touched. */
async function checkArchive(file: string): Promise<number> {
  let size: number;
  try {
    const stat = await fs.stat(file);
    if (stat.isDirectory())
      throw new ToolError(
        `${file} is a folder; db:restore reads the single-file archives db:backup writes (pg_dump --format=custom).`,
      );
    size = stat.size;
    await fs.access(file, constants.R_OK);
  } catch (err) {
    if (err instanceof ToolError) throw err;
    const code = (err as NodeJS.ErrnoException).code;
    if (code === "ENOENT") throw new ToolError(`cannot read ${file}: no such file.`);
    if (code === "EACCES") throw new ToolError(`cannot read ${file}: permission denied.`);
    throw new ToolError(`cannot read ${file}: ${err instanceof Error ? err.message : String(err)}`);
  }
  if (size === 0) throw new ToolError(`${file} is empty: not a backup.`);
  const handle = await fs.open(file, "r");
  const head = Buffer.alloc(5);
  try {
    await handle.read(head, 0, 5, 0);
  } finally {
    await handle.close();
  }
  if (head.toString("latin1") !== "PGDMP") {
    const plain = head.toString("latin1").startsWith("--");
    throw new ToolError(
      `${file} is not a pg_dump custom-format archive (it does not start with PGDMP)` +
        (plain
          ? "; it looks like a plain SQL dump, which is restored with psql."
          : "; it is damaged or not a backup."),
    );
  }
  return size;
}

/** Verifies <file>.sha256 when db:backup wrote one; a copy without it is restored unverified. */
async function checkChecksum(file: string): Promise<string> {
  const sidecar = `${file}.sha256`;
  let expected: string;
  try {
    expected = (await fs.readFile(sidecar, "utf8")).trim().split(/\s+/)[0] ?? "";
  } catch (err) {
    if ((err as NodeJS.ErrnoException).code === "ENOENT")
      return "no checksum beside it: not verified";
    throw new ToolError(
      `cannot read ${sidecar}: ${err instanceof Error ? err.message : String(err)}`,
    );
  }
  if (!/^[0-9a-f]{64}$/.test(expected))
    throw new ToolError(`${sidecar} holds no sha256; remove it to restore the archive unverified.`);
  const actual = await sha256File(file);
  if (actual !== expected) {
    throw new ToolError(
      `${file} does not match its checksum (${sidecar}): it changed since the backup (truncated or corrupt). Nothing was changed.`,
    );
  }
  return "sha256 verified";
}

function whatFailed(run: ToolRun): string {
  if (
    run.signal ||
    /could not read|end of file|unexpected|unrecognized|corrupt|invalid|uncompress|decompress/i.test(
      run.stderr,
    )
  )
    return "the archive is truncated or corrupt";
  return "pg_restore failed";
}

async function connect(connectionString: string): Promise<pg.Client> {
  const client = new pg.Client({ connectionString });
  try {
    await client.connect();
    return client;
  } catch (err) {
    throw new ToolError(
      `cannot connect to ${displayUrl(connectionString)}: ${err instanceof Error ? err.message : String(err)}`,
    );
  }
}

async function main(): Promise<void> {
  const file = process.argv[2];
  if (!file || file.startsWith("-")) {
    console.error(`restore: refusing to run without a backup file.\n${USAGE}`);
    process.exitCode = 2;
    return;
  }
  await checkArchive(file);
  const verified = await checkChecksum(file);
  const name = databaseName(url);

  const admin = await connect(maintenanceUrl(url));
  let exists: boolean;
  let others: number;
  let pgRestore: string;
  try {
    pgRestore = findPgTool("pg_restore", await serverMajor(admin));
    exists =
      ((await admin.query("select 1 from pg_database where datname = $1", [name])).rowCount ?? 0) >
      0;
    others = Number(
      (
        await admin.query<{ n: string }>(
          "select count(*) as n from pg_stat_activity where datname = $1",
          [name],
        )
      ).rows[0]?.n ?? 0,
    );
  } finally {
    await admin.end().catch(() => undefined);
  }

  const list = await runTool(pgRestore, ["--list", file], process.env);
  if (list.code !== 0 || list.signal) {
    throw new ToolError(
      `${file} cannot be read: it is truncated or corrupt. Nothing was changed. (pg_restore --list ${describeRun(list)})`,
    );
  }

  const { dbname, env } = libpqConnection(url);
  const common = [
    "--no-owner",
    "--single-transaction",
    "--exit-on-error",
    "--no-password",
    `--dbname=${dbname}`,
  ];
  if (exists) {
    console.log(
      `restore: ${file} (${verified}) → ${displayUrl(url)}, an existing database: its objects are replaced, in one transaction`,
    );
    if (others > 0)
      console.log(
        `restore: ${others} other session(s) use ${name}; the restore waits for their locks (stop the app and the worker first)`,
      );
    const run = await runTool(pgRestore, ["--clean", "--if-exists", ...common, file], env);
    if (run.code !== 0 || run.signal) {
      throw new ToolError(
        `${whatFailed(run)}; the restore ran as one transaction and was rolled back: ${name} is as it was. (pg_restore ${describeRun(run)})` +
          (/depends? on/.test(run.stderr)
            ? "\nThe database holds objects the backup does not know (a newer migration?): restore into a new database instead, DATABASE_URL=…/<new name> npm run db:restore -- <file>"
            : ""),
      );
    }
  } else {
    console.log(`restore: ${file} (${verified}) → ${displayUrl(url)}, a new database`);
    const creator = await connect(maintenanceUrl(url));
    try {
      await creator.query(`create database "${name.replaceAll('"', '""')}"`);
      const run = await runTool(pgRestore, common.concat(file), env);
      if (run.code !== 0 || run.signal) {
        await creator.query(`drop database if exists "${name.replaceAll('"', '""')}" with (force)`);
        throw new ToolError(
          `${whatFailed(run)}; the database ${name} created for it was dropped again. (pg_restore ${describeRun(run)})`,
        );
      }
    } finally {
      await creator.end().catch(() => undefined);
    }
  }

  const client = await connect(url);
  try {
    await client.query("analyze");
    const counts = await tableCounts(client);
    const total = counts.reduce((sum, c) => sum + c.rows, 0);
    console.log(
      `restore: done, ${counts.length} tables, ${total} rows (${pgRestore}); planner statistics rebuilt`,
    );
    console.log(formatCounts(counts));
  } finally {
    await client.end().catch(() => undefined);
  }
}

try {
  await main();
} catch (err) {
  console.error(
    `restore: ${err instanceof ToolError ? err.message : err instanceof Error ? err.stack : String(err)}`,
  );
  console.error("restore: FAILED");
  process.exitCode = 1;
}
