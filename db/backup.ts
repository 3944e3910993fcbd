// Backs up a database with pg_dump's custom format: `npm run db:backup [-- file]`.
// Source: DATABASE_URL, else the local cluster's "sward". File: the one given, else
// backups/<database>-<UTC timestamp>.dump (git-ignored). Prints the file, its size and the row count
// of every table — counted in the very snapshot pg_dump writes, so they are the dump's own counts.
// The archive is written under a temporary name, read back with `pg_restore --list`, its sha256
// written beside it (<file>.sha256, checked by db:restore), and only then given its name: a file
// with a final name is a complete archive. Backups hold personal data and password hashes: the
// folder is created 0700 and the files 0600.
import { constants, promises as fs } from "node:fs";
import path from "node:path";
import pg from "pg";

import { localDatabaseUrl } from "./client";
import {
  databaseName,
  describeRun,
  displayUrl,
  findPgTool,
  formatBytes,
  formatCounts,
  libpqConnection,
  runTool,
  serverMajor,
  sha256File,
  tableCounts,
  ToolError,
} from "./pg-tools";

const url = process.env.DATABASE_URL ?? localDatabaseUrl("sward");

function timestamp(now = new Date()): string {
  // 2026-12-02T031500Z: sortable, no colons (safe in every file system).
  return now
    .toISOString()
    .replace(/\.\d+Z$/, "Z")
    .replaceAll(":", "");
}

async function main(): Promise<void> {
  const name = databaseName(url);
  const target = path.resolve(
    process.argv[2] ?? path.join("backups", `${name}-${timestamp()}.dump`),
  );
  if (process.argv[2] === undefined)
    await fs.mkdir(path.dirname(target), { recursive: true, mode: 0o700 });
  for (const file of [target, `${target}.sha256`]) {
    const taken = await fs.access(file, constants.F_OK).then(
      () => true,
      () => false,
    );
    if (taken)
      throw new ToolError(
        `${file} already exists; give another file name (a backup is never overwritten).`,
      );
  }
  const partial = `${target}.partial-${process.pid}`;
  let renamed = false;

  const client = new pg.Client({ connectionString: url });
  try {
    await client.connect();
  } catch (err) {
    throw new ToolError(
      `cannot connect to ${displayUrl(url)}: ${err instanceof Error ? err.message : String(err)}`,
    );
  }
  try {
    const pgDump = findPgTool("pg_dump", await serverMajor(client));
    const pgRestore = findPgTool("pg_restore", await serverMajor(client));

    // Created here with 0600 so the dump is never readable by others, even while it is written.
    try {
      await (await fs.open(partial, "wx", 0o600)).close();
    } catch (err) {
      throw new ToolError(
        `cannot write ${partial}: ${err instanceof Error ? err.message : String(err)}`,
      );
    }

    // One snapshot for pg_dump and for the counts printed below.
    await client.query("begin isolation level repeatable read read only");
    const { rows } = await client.query<{ snapshot: string }>(
      "select pg_export_snapshot() as snapshot",
    );
    const { dbname, env } = libpqConnection(url);
    const dumping = runTool(
      pgDump,
      [
        "--format=custom",
        `--file=${partial}`,
        `--snapshot=${rows[0]!.snapshot}`,
        "--no-password",
        `--dbname=${dbname}`,
      ],
      env,
    );
    const [counted, dumped] = await Promise.allSettled([tableCounts(client), dumping]);
    await client.query("commit");
    if (dumped.status === "rejected") throw dumped.reason;
    if (dumped.value.code !== 0 || dumped.value.signal)
      throw new ToolError(`pg_dump failed (${describeRun(dumped.value)})`);
    if (counted.status === "rejected") throw counted.reason;
    const counts = counted.value;

    const check = await runTool(pgRestore, ["--list", partial], process.env);
    if (check.code !== 0 || check.signal)
      throw new ToolError(
        `the new archive cannot be read back (pg_restore --list ${describeRun(check)})`,
      );
    const handle = await fs.open(partial, "r");
    await handle.sync();
    await handle.close();
    // The checksum beside the archive (sha256sum format): db:restore refuses a file that changed.
    const sha256 = await sha256File(partial);
    await fs.writeFile(`${target}.sha256`, `${sha256}  ${path.basename(target)}\n`, {
      mode: 0o600,
    });
    await fs.rename(partial, target);
    renamed = true;

    const { size } = await fs.stat(target);
    const total = counts.reduce((sum, c) => sum + c.rows, 0);
    console.log(`backup: ${displayUrl(url)} (${pgDump})`);
    const shown = path.relative(process.cwd(), target);
    console.log(`backup: file ${shown.startsWith("..") ? target : shown}`);
    console.log(
      `backup: size ${formatBytes(size)} (${size} bytes), ${counts.length} tables, ${total} rows`,
    );
    console.log(`backup: sha256 ${sha256} (in ${path.basename(target)}.sha256)`);
    console.log(formatCounts(counts));
  } catch (err) {
    if (!renamed) await fs.rm(`${target}.sha256`, { force: true });
    throw err;
  } finally {
    await fs.rm(partial, { force: true });
    await client.end().catch(() => undefined);
  }
}

try {
  await main();
} catch (err) {
  console.error(
    `backup: ${err instanceof ToolError ? err.message : err instanceof Error ? err.stack : String(err)}`,
  );
  console.error("backup: FAILED — no backup file was written.");
  process.exitCode = 1;
}
