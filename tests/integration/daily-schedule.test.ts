// The worker's daily tick through pg-boss: at a given moment only the companies whose local time
// is 05:15 get a sweep job (one per company, never two waiting for the same company).
import PgBoss from "pg-boss";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { otherCompany } from "@/fixtures/demo/scenario";
import {
  companiesDue,
  DAILY_TICK_QUEUE,
  queueSweeps,
  registerDailyTick,
  SWEEP_QUEUE,
} from "@/lib/risk-alerts/jobs";

import { createTestCompany, testDb, type TestCompany } from "../helpers/factories";

let east: TestCompany;
let west: TestCompany;
let boss: PgBoss;

beforeAll(async () => {
  [east, west] = await Promise.all([createTestCompany(), createTestCompany(otherCompany)]);
  await testDb()
    .updateTable("companies")
    .set({ time_zone: "America/New_York" })
    .where("id", "=", east.companyId)
    .execute();
  await testDb()
    .updateTable("companies")
    .set({ time_zone: "America/Los_Angeles" })
    .where("id", "=", west.companyId)
    .execute();
  boss = new PgBoss({ connectionString: process.env.DATABASE_URL!, schema: "pgboss_tick", max: 2 });
  await boss.start();
});
afterAll(async () => {
  await boss.stop({ graceful: false, wait: true });
});

const queuedSweeps = async () =>
  (await boss.fetch<{ companyId?: string }>(SWEEP_QUEUE, { batchSize: 50 })).map(
    (j) => j.data.companyId,
  );

describe("the daily tick", () => {
  it("picks each company at 05:15 on its own clock (New York 09:15Z, Los Angeles 12:15Z in July)", async () => {
    const ours = (ids: string[]) =>
      ids.filter((id) => id === east.companyId || id === west.companyId);
    expect(ours(await companiesDue(testDb(), new Date("2026-07-15T09:15:30Z")))).toEqual([
      east.companyId,
    ]);
    expect(ours(await companiesDue(testDb(), new Date("2026-07-15T12:20:00Z")))).toEqual([
      west.companyId,
    ]);
    expect(ours(await companiesDue(testDb(), new Date("2026-07-15T10:15:00Z")))).toEqual([]);
  });

  it("queues one sweep job per due company when the tick runs", async () => {
    await registerDailyTick(boss, testDb(), { now: () => new Date("2026-07-15T09:16:00Z") });
    await boss.unschedule(DAILY_TICK_QUEUE); // this test sends its own tick
    await boss.createQueue(SWEEP_QUEUE, { name: SWEEP_QUEUE, policy: "stately" });
    await boss.send(DAILY_TICK_QUEUE, {});
    let swept: (string | undefined)[] = [];
    for (let i = 0; i < 40 && !swept.includes(east.companyId); i++) {
      await new Promise((r) => setTimeout(r, 250));
      swept = swept.concat(await queuedSweeps());
    }
    expect(swept).toContain(east.companyId);
    expect(swept).not.toContain(west.companyId);
  });

  it("never keeps two sweeps of one company waiting", async () => {
    await queueSweeps(boss, [west.companyId, west.companyId], "test");
    await queueSweeps(boss, [west.companyId], "test");
    expect((await queuedSweeps()).filter((id) => id === west.companyId)).toHaveLength(1);
  });
});
