// Builds a Kysely instance over a pg pool. Used by db/index.ts (the app's singleton) and by
// scripts and tests that choose their own database.
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";

import { log } from "@/lib/log";

import type { Database } from "./schema";

// numeric and bigint arrive as strings by default; Sward's values fit in a double.
pg.types.setTypeParser(1700, (v) => Number.parseFloat(v));
pg.types.setTypeParser(20, (v) => Number.parseInt(v, 10));
// A calendar date stays a YYYY-MM-DD string: no time zone, no midnight shift.
pg.types.setTypeParser(1082, (v) => v);

export function createDb(
  connectionString: string,
  options: { max?: number } = {},
): Kysely<Database> {
  const pool = new pg.Pool({ connectionString, max: options.max ?? 10, idleTimeoutMillis: 30_000 });
  // A connection whose server went away (a restart, a crash) says so with an "error" event on its
  // client, which the pool passes on for idle connections. Unheard, Node takes it for an uncaught
  // exception and a plain process (the worker, a script) dies. A query that was running fails on
  // its own; the pool drops the connection and the next query opens a new one.
  pool.on("connect", (client) =>
    client.on("error", (err) => log.warn({ err: err.message }, "database connection lost")),
  );
  pool.on("error", () => undefined); // the same event, passed on by the pool: logged above
  return new Kysely<Database>({ dialect: new PostgresDialect({ pool }) });
}

/** The local cluster started by db/cluster.sh (loopback, trust auth). */
export function localDatabaseUrl(database: string): string {
  const port = process.env.SWARD_PG_PORT ?? "54329";
  return `postgres://postgres@127.0.0.1:${port}/${database}`;
}
