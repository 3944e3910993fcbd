// What one zone-check save costs in SQL, counted with a Kysely log hook on the app's own database
// handle: the check is written with its Sward Index in one INSERT/UPDATE (never written, read back
// and written again), and the whole save stays a short transaction. Prints the statements per
// save and the time of a 200-save loop (figures, not asserted).
import { Kysely, PostgresDialect } from "kysely";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { saveZoneCheck, startVisit } from "@/lib/visits/mutations";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";
import { doneCheck, newId } from "../helpers/zone-checks";

const statements: string[] = [];
const pool = new pg.Pool({ connectionString: process.env.DATABASE_URL, max: 4 });
const counted = new Kysely<Database>({
  dialect: new PostgresDialect({ pool }),
  log: (event) => {
    if (event.level === "query") {
      statements.push(event.query.sql);
      if (process.env.SAVE_COST_TRACE)
        console.log(event.queryDurationMillis.toFixed(2), event.query.sql.slice(0, 90));
    }
  },
});
const globalForDb = globalThis as unknown as { swardDb?: Kysely<Database> };

let c: TestCompany;
let tech1: Actor;
let visitId: string;
let zoneId = "";
let otherZoneId = "";

beforeAll(async () => {
  c = await createTestCompany();
  globalForDb.swardDb = counted; // db() in the mutations now logs every statement here
  tech1 = await c.actor("tech1");
  visitId = (
    await testDb()
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", c.propertyIds["haddad"]!)
      .where("status", "=", "scheduled")
      .executeTakeFirstOrThrow()
  ).id;
  const zones = await testDb()
    .selectFrom("zones")
    .select("id")
    .where("property_id", "=", c.propertyIds["haddad"]!)
    .orderBy("sort_order")
    .execute();
  zoneId = zones[0]!.id;
  otherZoneId = zones[1]!.id;
  await startVisit(tech1, visitId, { latitude: null, longitude: null });
});
afterAll(async () => {
  delete globalForDb.swardDb;
  await counted.destroy();
});

const onZoneChecks = (sql: string) => /\bzone_checks\b/.test(sql);
const readsCheckBack = (sql: string) =>
  /^select .* from "zone_checks" where "id"/i.test(sql.trim());
const writesZoneCheck = (sql: string) => /^(insert into|update) "zone_checks"/i.test(sql.trim());

describe("a zone-check save", () => {
  it("writes the check and its Index in one statement, and reads nothing back", async () => {
    const id = newId();
    statements.length = 0;
    const first = await saveZoneCheck(tech1, visitId, id, doneCheck(zoneId));
    const insert = [...statements];
    statements.length = 0;
    const second = await saveZoneCheck(
      tech1,
      visitId,
      id,
      doneCheck(zoneId, { quality: 5, baseVersion: first.version }),
    );
    const update = [...statements];

    for (const [name, list] of [
      ["insert", insert],
      ["update", update],
    ] as const) {
      expect(list.filter(writesZoneCheck), name).toHaveLength(1);
      // The one read of the row is the locking read before the write; nothing reads it back.
      const write = list.findIndex(writesZoneCheck);
      expect(list.slice(write + 1).filter(readsCheckBack), name).toEqual([]);
      console.log(
        `zone-check save (${name}): ${list.length} SQL statements in all (begin and commit included), ` +
          `${list.filter(onZoneChecks).length} on zone_checks, ${list.filter(writesZoneCheck).length} write`,
      );
    }
    expect(first.swardIndex).not.toBeNull();
    expect(second.swardIndex!).toBeLessThan(first.swardIndex!);
    const stored = await testDb()
      .selectFrom("zone_checks")
      .select("sward_index")
      .where("id", "=", id)
      .executeTakeFirstOrThrow();
    expect(stored.sward_index).toBe(second.swardIndex);
  });

  it("200 saves in a row (printed, not asserted)", async () => {
    const id = newId();
    let version = (await saveZoneCheck(tech1, visitId, id, doneCheck(otherZoneId, { quality: 6 })))
      .version;
    statements.length = 0;
    const started = performance.now();
    for (let i = 0; i < 200; i++) {
      const saved = await saveZoneCheck(
        tech1,
        visitId,
        id,
        doneCheck(otherZoneId, { quality: 3 + (i % 6), baseVersion: version }),
      );
      version = saved.version;
    }
    const ms = performance.now() - started;
    console.log(
      `zone-check save: ${(ms / 200).toFixed(2)} ms per save over 200 saves, ${(statements.length / 200).toFixed(1)} statements each`,
    );
    expect(version).toBe(201);
  });
});
