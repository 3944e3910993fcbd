// The migration script on a scratch database: up, down to nothing, up again; and a non-zero exit
// with the error when it cannot run.
import { spawnSync } from "node:child_process";
import { sql } from "kysely";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { createDb, localDatabaseUrl } from "@/db/client";

const SCRATCH = "sward_migrations_check";
const url = localDatabaseUrl(SCRATCH);
const tsx = (args: string[], env: Record<string, string> = {}) =>
  spawnSync("node_modules/.bin/tsx", args, { encoding: "utf8", env: { ...process.env, ...env } });

async function tables(): Promise<string[]> {
  const db = createDb(url, { max: 1 });
  const { rows } = await sql<{ table_name: string }>`select table_name from information_schema.tables where table_schema = 'public' and table_name not like 'kysely_%' order by 1`.execute(db);
  await db.destroy();
  return rows.map((r) => r.table_name);
}

beforeAll(() => {
  expect(tsx(["db/ensure-database.ts", SCRATCH, "--fresh"]).status).toBe(0);
});
afterAll(async () => {
  const admin = createDb(localDatabaseUrl("postgres"), { max: 1 });
  await sql.raw(`drop database if exists ${SCRATCH} with (force)`).execute(admin);
  await admin.destroy();
});

describe("db/migrate.ts", () => {
  it("applies, reverts and re-applies every migration", async () => {
    const up = tsx(["db/migrate.ts"], { DATABASE_URL: url });
    expect(up.status, up.stderr).toBe(0);
    expect(up.stdout).toContain("applied");
    expect(await tables()).toEqual(expect.arrayContaining(["companies", "users", "memberships", "verification_tokens", "properties", "zones"]));

    const again = tsx(["db/migrate.ts"], { DATABASE_URL: url });
    expect(again.stdout).toContain("already up to date");

    const reset = tsx(["db/migrate.ts", "reset"], { DATABASE_URL: url });
    expect(reset.status, reset.stderr).toBe(0);
    expect(await tables()).toEqual([]);

    expect(tsx(["db/migrate.ts"], { DATABASE_URL: url }).status).toBe(0);
  });

  it("exits non-zero and prints the error when it cannot migrate", () => {
    const bad = tsx(["db/migrate.ts"], { DATABASE_URL: localDatabaseUrl("no_such_database_here") });
    expect(bad.status).not.toBe(0);
    expect(bad.stderr).toMatch(/migrate: error: .*no_such_database_here/);
  });
});
