// The risk sweep as a pg-boss queue: "stately" (at most one sweep queued and one running, so
// sweeps never overlap), retried 3 times with back-off, scheduled daily at 05:15 local time.
// Shared by the worker process (jobs/worker.ts) and the tests.
import type PgBoss from "pg-boss";

export const SWEEP_QUEUE = "risk-sweep";
export const SWEEP_CRON = "15 5 * * *";

export async function registerRiskSweep(
  boss: PgBoss,
  run: () => Promise<unknown>,
  options: { timeZone: string; retryDelaySeconds?: number; schedule?: boolean },
): Promise<void> {
  await boss.createQueue(SWEEP_QUEUE, {
    name: SWEEP_QUEUE,
    policy: "stately",
    retryLimit: 3,
    retryDelay: options.retryDelaySeconds ?? 30,
    retryBackoff: true,
    expireInSeconds: 15 * 60,
  });
  if (options.schedule !== false)
    await boss.schedule(SWEEP_QUEUE, SWEEP_CRON, {}, { tz: options.timeZone });
  await boss.work(SWEEP_QUEUE, { pollingIntervalSeconds: 2 }, async () => run());
}

export const DIGEST_QUEUE = "alert-digest";

/** The managers' digest of new high-severity alerts: queued after each sweep, retried while SMTP is down. */
export async function registerAlertDigest(
  boss: PgBoss,
  run: () => Promise<unknown>,
  options: { retryDelaySeconds?: number } = {},
): Promise<void> {
  await boss.createQueue(DIGEST_QUEUE, {
    name: DIGEST_QUEUE,
    policy: "stately",
    retryLimit: 10,
    retryDelay: options.retryDelaySeconds ?? 60,
    retryBackoff: true,
    expireInSeconds: 5 * 60,
  });
  await boss.work(DIGEST_QUEUE, { pollingIntervalSeconds: 2 }, async () => run());
}
