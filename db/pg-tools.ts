// What db/backup.ts and db/restore.ts share: finding pg_dump / pg_restore of the server's major
// version, running them without putting a password on the command line, and counting rows.
import { spawn, spawnSync } from "node:child_process";
import { createHash } from "node:crypto";
import { accessSync, constants, createReadStream, readdirSync, statSync } from "node:fs";
import path from "node:path";
import type pg from "pg";

/** A failure the scripts print as one clear line (no stack trace) before exiting non-zero. */
export class ToolError extends Error {}

export type PgTool = "pg_dump" | "pg_restore";

function isExecutable(file: string): boolean {
  try {
    accessSync(file, constants.X_OK);
    return statSync(file).isFile();
  } catch {
    return false;
  }
}

function toolMajor(file: string): number | null {
  const out = spawnSync(file, ["--version"], { encoding: "utf8" });
  const match = /\(PostgreSQL\)\s+(\d+)/.exec(out.stdout ?? "");
  return match ? Number(match[1]) : null;
}

/**
 * The pg_dump or pg_restore to use with a server of `serverMajor`: $SWARD_PG_BIN when set (a folder;
 * nothing else is tried), else /usr/lib/postgresql/<major>/bin as db/cluster.sh finds the server,
 * else the newest newer version there, else the first one on PATH. A tool older than the server
 * cannot read it (pg_dump refuses, pg_restore misreads newer archives), so that is refused too.
 */
export function findPgTool(tool: PgTool, serverMajor: number): string {
  const candidates: string[] = [];
  const explicit = process.env.SWARD_PG_BIN;
  if (explicit) {
    candidates.push(path.join(explicit, tool));
  } else {
    let versions: number[] = [];
    try {
      versions = readdirSync("/usr/lib/postgresql")
        .map(Number)
        .filter((v) => Number.isInteger(v));
    } catch {
      // no Debian server packages: PATH only
    }
    for (const v of [
      serverMajor,
      ...versions.filter((v) => v > serverMajor).sort((a, b) => a - b),
    ]) {
      candidates.push(`/usr/lib/postgresql/${v}/bin/${tool}`);
    }
    for (const dir of (process.env.PATH ?? "").split(path.delimiter))
      if (dir) candidates.push(path.join(dir, tool));
  }
  const found = candidates.find(isExecutable);
  if (!found) {
    const where = explicit
      ? `in SWARD_PG_BIN=${explicit}`
      : "in /usr/lib/postgresql/*/bin or on PATH";
    throw new ToolError(
      `${tool} not found ${where}. Install the PostgreSQL ${serverMajor} client tools ` +
        `(Debian: apt-get install postgresql-client-${serverMajor}) or set SWARD_PG_BIN to the folder that holds ${tool}.`,
    );
  }
  const major = toolMajor(found);
  if (major === null)
    throw new ToolError(
      `${found} does not answer --version like ${tool}; set SWARD_PG_BIN to the folder of PostgreSQL ${serverMajor}'s tools.`,
    );
  if (major < serverMajor) {
    throw new ToolError(
      `${found} is version ${major}, older than the PostgreSQL ${serverMajor} server; install postgresql-client-${serverMajor} or set SWARD_PG_BIN.`,
    );
  }
  return found;
}

/** The server's major version (15 for 15.18). */
export async function serverMajor(client: pg.Client): Promise<number> {
  const { rows } = await client.query<{ v: string }>("select current_setting($1) as v", [
    "server_version_num",
  ]);
  return Math.floor(Number(rows[0]?.v ?? 0) / 10_000);
}

/**
 * A libpq connection for a child process: the URL without its password (so it never shows in the
 * process list) and the password in PGPASSWORD.
 */
export function libpqConnection(url: string): { dbname: string; env: NodeJS.ProcessEnv } {
  const parsed = new URL(url);
  const password = decodeURIComponent(parsed.password);
  parsed.password = "";
  return {
    dbname: parsed.toString(),
    env: password ? { ...process.env, PGPASSWORD: password } : { ...process.env },
  };
}

/** The URL as it may be printed: no password. */
export function displayUrl(url: string): string {
  const parsed = new URL(url);
  if (parsed.password) parsed.password = "***";
  return parsed.toString();
}

export function databaseName(url: string): string {
  const name = decodeURIComponent(new URL(url).pathname.replace(/^\//, ""));
  if (!name) throw new ToolError(`the database URL names no database: ${displayUrl(url)}`);
  return name;
}

/** The same server's maintenance database, to create or drop `url`'s database. */
export function maintenanceUrl(url: string): string {
  const parsed = new URL(url);
  parsed.pathname = "/postgres";
  return parsed.toString();
}

export interface ToolRun {
  code: number;
  signal: NodeJS.Signals | null;
  stderr: string;
}

/** Runs a tool to completion; its stderr is kept for the error message. */
export function runTool(file: string, args: string[], env: NodeJS.ProcessEnv): Promise<ToolRun> {
  return new Promise((resolve, reject) => {
    const child = spawn(file, args, { env, stdio: ["ignore", "ignore", "pipe"] });
    let stderr = "";
    child.stderr.setEncoding("utf8");
    child.stderr.on("data", (chunk: string) => {
      stderr += chunk;
    });
    child.on("error", (err) =>
      reject(new ToolError(`${path.basename(file)} could not start: ${err.message}`)),
    );
    child.on("close", (code, signal) =>
      resolve({ code: code ?? 128, signal, stderr: stderr.trim() }),
    );
  });
}

/** How a tool ended, in words: "exit 1" or "crashed with SIGSEGV", and its own message. */
export function describeRun(run: ToolRun): string {
  const how = run.signal ? `crashed with ${run.signal}` : `exit ${run.code}`;
  return run.stderr ? `${how}:\n${run.stderr}` : how;
}

/** sha256 of a file, as sha256sum prints it. */
export async function sha256File(file: string): Promise<string> {
  const hash = createHash("sha256");
  for await (const chunk of createReadStream(file)) hash.update(chunk as Buffer);
  return hash.digest("hex");
}

export interface TableCount {
  table: string;
  rows: number;
}

/** Exact row counts of every table outside the system schemas ("schema.table" outside public). */
export async function tableCounts(client: pg.Client): Promise<TableCount[]> {
  const { rows: tables } = await client.query<{ schema: string; name: string }>(
    `select n.nspname as schema, c.relname as name
       from pg_class c join pg_namespace n on n.oid = c.relnamespace
      where c.relkind in ('r', 'p') and not c.relispartition
        and n.nspname not in ('pg_catalog', 'information_schema') and n.nspname not like 'pg\\_%'
      order by n.nspname <> 'public', n.nspname, c.relname`,
  );
  const counts: TableCount[] = [];
  for (const { schema, name } of tables) {
    const ident = `"${schema.replaceAll('"', '""')}"."${name.replaceAll('"', '""')}"`;
    const { rows } = await client.query<{ n: string }>(`select count(*) as n from ${ident}`);
    counts.push({
      table: schema === "public" ? name : `${schema}.${name}`,
      rows: Number(rows[0]?.n ?? 0),
    });
  }
  return counts;
}

export function formatCounts(counts: TableCount[]): string {
  const width = Math.max(5, ...counts.map((c) => c.table.length));
  const total = counts.reduce((sum, c) => sum + c.rows, 0);
  return [
    ...counts.map(
      (c) => `  ${c.table.padEnd(width)}  ${c.rows.toLocaleString("en-US").padStart(10)}`,
    ),
    `  ${"total".padEnd(width)}  ${total.toLocaleString("en-US").padStart(10)}  (${counts.length} tables)`,
  ].join("\n");
}

export function formatBytes(bytes: number): string {
  if (bytes < 1024) return `${bytes} B`;
  if (bytes < 1024 * 1024) return `${(bytes / 1024).toFixed(1)} kB`;
  if (bytes < 1024 ** 3) return `${(bytes / 1024 / 1024).toFixed(1)} MB`;
  return `${(bytes / 1024 ** 3).toFixed(2)} GB`;
}
