// Creates a database on the local cluster if missing: `tsx db/ensure-database.ts NAME [--fresh]`.
// --fresh drops it first (tests start from an empty, freshly migrated database).
import pg from "pg";

import { localDatabaseUrl } from "./client";

const [name, flag] = process.argv.slice(2);
if (!name || !/^[a-z][a-z0-9_]{0,62}$/.test(name)) {
  console.error(
    "usage: tsx db/ensure-database.ts NAME [--fresh]   (NAME: lower-case letters, digits, _)",
  );
  process.exit(2);
}

const client = new pg.Client({ connectionString: localDatabaseUrl("postgres") });
await client.connect();
try {
  if (flag === "--fresh") await client.query(`drop database if exists "${name}" with (force)`);
  const { rowCount } = await client.query("select 1 from pg_database where datname = $1", [name]);
  if (!rowCount) {
    await client.query(`create database "${name}"`);
    console.log(`db: created database ${name}`);
  }
} finally {
  await client.end();
}
