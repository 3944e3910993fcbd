// The outbox as a pg-boss queue: checked every minute (and when the worker starts or a digest is
// queued); each failed message waits out its own back-off (lib/mail/outbox.ts), and a run that
// fails because SMTP is down is retried with back-off and by the next minute's run.
import type PgBoss from "pg-boss";

export const MAIL_QUEUE = "mail-outbox";

export async function registerMailOutbox(boss: PgBoss, run: () => Promise<unknown>): Promise<void> {
  await boss.createQueue(MAIL_QUEUE, {
    name: MAIL_QUEUE,
    policy: "stately",
    retryLimit: 5,
    retryDelay: 20,
    retryBackoff: true,
    expireInSeconds: 5 * 60,
  });
  await boss.schedule(MAIL_QUEUE, "* * * * *", {}, { tz: "UTC" });
  await boss.work(MAIL_QUEUE, { pollingIntervalSeconds: 2 }, async () => run());
}
