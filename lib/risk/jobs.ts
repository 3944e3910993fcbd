// The risk sweep as a pg-boss queue: "stately" (at most one sweep queued and one running, so
// sweeps never overlap), retried 3 times with back-off, scheduled daily at 05:15 local time.
// Shared by the worker process (jobs/worker.ts) and the tests.
import type PgBoss from "pg-boss";

export const SWEEP_QUEUE = "risk-sweep";
export const SWEEP_CRON = "15 5 * * *";

export async function registerRiskSweep(boss: PgBoss, run: () => Promise<unknown>, options: { timeZone: string; retryDelaySeconds?: number; schedule?: boolean }): Promise<void> {
  await boss.createQueue(SWEEP_QUEUE, { name: SWEEP_QUEUE, policy: "stately", retryLimit: 3, retryDelay: options.retryDelaySeconds ?? 30, retryBackoff: true, expireInSeconds: 15 * 60 });
  if (options.schedule !== false) await boss.schedule(SWEEP_QUEUE, SWEEP_CRON, {}, { tz: options.timeZone });
  await boss.work(SWEEP_QUEUE, { pollingIntervalSeconds: 2 }, async () => run());
}
