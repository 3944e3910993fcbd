// The risk sweep and the managers' digest as pg-boss queues, each company at its own local
// morning: a tick every 15 minutes (UTC) queues one sweep job per company whose local time has
// just reached DAILY_AT; the sweep then queues that company's digest. Jobs are "stately" per
// company (its singleton key): at most one queued and one running, so a company's sweeps never
// overlap. Retried with back-off. Shared by the worker process (jobs/worker.ts) and the tests.
import type { Kysely } from "kysely";
import type PgBoss from "pg-boss";

import type { Database } from "@/db/schema";

export const SWEEP_QUEUE = "risk-sweep";
const DIGEST_QUEUE = "alert-digest";
export const DAILY_TICK_QUEUE = "daily-tick";
/** The local time of each company's daily sweep (then its digest). */
export const DAILY_AT = { hour: 5, minute: 15 };
const TICK_MINUTES = 15;
export const DAILY_TICK_CRON = `*/${TICK_MINUTES} * * * *`;

/** A job of the sweep or the digest: one company, or (no id) every company. */
export interface CompanyJob {
  companyId?: string;
  reason?: string;
}

/** Whether `now` falls in the tick window that starts at DAILY_AT in `timeZone` (local wall clock). */
export function isDailyRunDue(timeZone: string, now: Date): boolean {
  const parts = new Intl.DateTimeFormat("en-US", {
    timeZone,
    hour: "numeric",
    minute: "numeric",
    hourCycle: "h23",
  }).formatToParts(now);
  const hour = Number(parts.find((p) => p.type === "hour")!.value);
  const minute = Number(parts.find((p) => p.type === "minute")!.value);
  const since = hour * 60 + minute - (DAILY_AT.hour * 60 + DAILY_AT.minute);
  return since >= 0 && since < TICK_MINUTES;
}

/** The companies whose daily run is due at `now`. */
export async function companiesDue(executor: Kysely<Database>, now: Date): Promise<string[]> {
  const companies = await executor
    .selectFrom("companies")
    .select(["id", "time_zone"])
    .orderBy("id")
    .execute();
  return companies.filter((c) => isDailyRunDue(c.time_zone, now)).map((c) => c.id);
}

const stately = (name: string, retryLimit: number, retryDelay: number, expireInSeconds: number) =>
  ({
    name,
    policy: "stately",
    retryLimit,
    retryDelay,
    retryBackoff: true,
    expireInSeconds,
  }) as const;

export async function registerRiskSweep(
  boss: PgBoss,
  run: (job: CompanyJob) => Promise<unknown>,
  options: { retryDelaySeconds?: number } = {},
): Promise<void> {
  await boss.createQueue(
    SWEEP_QUEUE,
    stately(SWEEP_QUEUE, 3, options.retryDelaySeconds ?? 30, 15 * 60),
  );
  // Earlier workers scheduled one daily sweep of everyone in the first company's time zone.
  await boss.unschedule(SWEEP_QUEUE);
  await boss.work<CompanyJob>(SWEEP_QUEUE, { pollingIntervalSeconds: 2 }, async ([job]) =>
    run(job?.data ?? {}),
  );
}

/** The managers' digest of new high-severity alerts: queued after each company's sweep. */
export async function registerAlertDigest(
  boss: PgBoss,
  run: (job: CompanyJob) => Promise<unknown>,
  options: { retryDelaySeconds?: number } = {},
): Promise<void> {
  await boss.createQueue(
    DIGEST_QUEUE,
    stately(DIGEST_QUEUE, 10, options.retryDelaySeconds ?? 60, 5 * 60),
  );
  await boss.work<CompanyJob>(DIGEST_QUEUE, { pollingIntervalSeconds: 2 }, async ([job]) =>
    run(job?.data ?? {}),
  );
}

/** Queues a company's sweep (or everyone's, one job per company), at most one waiting each. */
export async function queueSweeps(boss: PgBoss, companyIds: string[], reason: string) {
  for (const companyId of companyIds)
    await boss.send(SWEEP_QUEUE, { companyId, reason } satisfies CompanyJob, {
      singletonKey: companyId,
    });
}

/** Queues a company's digest, at most one waiting. */
export async function queueDigest(boss: PgBoss, companyId: string | undefined) {
  await boss.send(DIGEST_QUEUE, { companyId } satisfies CompanyJob, {
    singletonKey: companyId ?? "all",
  });
}

/** The 15-minute tick: queues the sweep of every company whose local morning it is. */
export async function registerDailyTick(
  boss: PgBoss,
  executor: Kysely<Database>,
  options: { now?: () => Date } = {},
): Promise<void> {
  await boss.createQueue(DAILY_TICK_QUEUE, stately(DAILY_TICK_QUEUE, 2, 30, 5 * 60));
  await boss.schedule(DAILY_TICK_QUEUE, DAILY_TICK_CRON, {}, { tz: "UTC" });
  await boss.work(DAILY_TICK_QUEUE, { pollingIntervalSeconds: 2 }, async () => {
    const due = await companiesDue(executor, options.now?.() ?? new Date());
    await queueSweeps(boss, due, "daily");
    return { due: due.length };
  });
}
