// The background worker: `tsx jobs/worker.ts`. pg-boss queues in the app's own PostgreSQL; the
// daily risk sweep (lib/risk/jobs.ts) runs at 05:15 in the first company's time zone and once
// when the worker starts.
import PgBoss from "pg-boss";

import { createDb } from "@/db/client";
import { sweepBook } from "@/lib/after-write/sweep";
import { log } from "@/lib/log";
import { MAIL_QUEUE, registerMailOutbox } from "@/lib/mail/jobs";
import { deliverPendingMail } from "@/lib/mail/outbox";
import { sendHighAlertDigests } from "@/lib/risk-alerts/digest";
import {
  DIGEST_QUEUE,
  registerAlertDigest,
  registerRiskSweep,
  SWEEP_CRON,
  SWEEP_QUEUE,
} from "@/lib/risk-alerts/jobs";
import { smtpMailer } from "@/lib/services/mail";
import { jsonWeatherProvider } from "@/lib/services/weather/provider";

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("worker: DATABASE_URL is not set");
  process.exit(1);
}
const db = createDb(url, { max: 3 });
// The worker needs the database, the weather service and SMTP only (no sign-in secrets).
const mailer = process.env.SMTP_URL ? smtpMailer(process.env.SMTP_URL) : null;
const appUrl = process.env.AUTH_URL ?? "http://localhost:3000";
const weather = process.env.WEATHER_BASE_URL
  ? jsonWeatherProvider({
      baseUrl: process.env.WEATHER_BASE_URL,
      apiKey: process.env.WEATHER_API_KEY,
    })
  : null;
const boss = new PgBoss({ connectionString: url, schema: "pgboss", max: 3 });
boss.on("error", (err) => log.error({ err }, "job queue error"));

await boss.start();
const zone =
  (await db.selectFrom("companies").select("time_zone").orderBy("created_at").executeTakeFirst())
    ?.time_zone ?? "America/New_York";
await registerRiskSweep(
  boss,
  async () => {
    const result = await sweepBook(db, weather, {
      onError: (propertyId, err) => log.error({ err, propertyId }, "risk sweep: property failed"),
    });
    log.info(result, "risk sweep done");
    await boss.send(DIGEST_QUEUE, { after: "sweep" });
    return result;
  },
  { timeZone: zone },
);
await registerAlertDigest(boss, async () => {
  if (!mailer) {
    log.warn("alert digest: SMTP_URL is not set, nothing sent");
    return { messages: 0, alerts: 0 };
  }
  const result = await sendHighAlertDigests(db, mailer, { appUrl });
  log.info(result, "alert digest sent");
  return result;
});
await registerMailOutbox(
  boss,
  async () => {
    if (!mailer) return { sent: 0, pending: 0 };
    const result = await deliverPendingMail(db, mailer);
    if (result.sent) log.info(result, "outbox delivered");
    return result;
  },
  { timeZone: zone },
);
await boss.send(SWEEP_QUEUE, { reason: "worker start" });
await boss.send(MAIL_QUEUE, { reason: "worker start" });
console.log(`worker: ready (daily risk sweep "${SWEEP_CRON}" ${zone})`);

const stop = async () => {
  await boss.stop({ graceful: true, timeout: 10_000 });
  await db.destroy();
  process.exit(0);
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
