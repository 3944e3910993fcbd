// The background worker: `tsx jobs/worker.ts`. pg-boss queues in the app's own PostgreSQL: every
// 15 minutes a tick queues the daily risk sweep of each company whose local time has reached
// 05:15 (lib/risk-alerts/jobs.ts); each company's sweep then queues its managers' digest (outbox
// rows); the outbox is delivered every minute. When the worker starts it sweeps every company.
import PgBoss from "pg-boss";

import { createDb } from "@/db/client";
import { sweepBook } from "@/lib/after-write/sweep";
import { appOrigin, serviceEnv } from "@/lib/env";
import { log } from "@/lib/log";
import { MAIL_QUEUE, registerMailOutbox } from "@/lib/mail/jobs";
import { deliverPendingMail } from "@/lib/mail/outbox";
import { remeasurePhotos } from "@/lib/photos/remeasure";
import { queueHighAlertDigests, queuePressureAreaDigests } from "@/lib/risk-alerts/digest";
import {
  DAILY_AT,
  queueDigest,
  queueSweeps,
  registerAlertDigest,
  registerDailyTick,
  registerRiskSweep,
} from "@/lib/risk-alerts/jobs";
import { services } from "@/lib/services";

const url = process.env.DATABASE_URL;
if (!url) {
  console.error("worker: DATABASE_URL is not set");
  process.exit(1);
}
const db = createDb(url, { max: 3 });
// The worker needs the database and the service clients only (no sign-in secrets): lib/services
// builds them from the validated configuration, as it does for the web server.
const { mailer, weather } = services();
const appUrl = appOrigin(serviceEnv());
const boss = new PgBoss({ connectionString: url, schema: "pgboss", max: 3 });
boss.on("error", (err) => log.error({ err }, "job queue error"));

await boss.start();
await registerRiskSweep(boss, async ({ companyId }) => {
  const result = await sweepBook(db, weather, {
    companyIds: companyId ? [companyId] : undefined,
    onError: (propertyId, err) => log.error({ err, propertyId }, "risk sweep: property failed"),
  });
  log.info({ ...result, companyId }, "risk sweep done");
  await queueDigest(boss, companyId);
  return result;
});
await registerAlertDigest(boss, async ({ companyId }) => {
  const companyIds = companyId ? [companyId] : undefined;
  const result = await queueHighAlertDigests(db, { appUrl, companyIds });
  // New pressure areas are named in their own message, once each.
  const areas = await queuePressureAreaDigests(db, { appUrl, companyIds });
  if (result.messages || areas.messages) {
    log.info({ ...result, pressureAreas: areas.areas, companyId }, "alert digest queued");
    await boss.send(MAIL_QUEUE, { reason: "digest" });
  }
  return result;
});
await registerMailOutbox(boss, async () => {
  if (!mailer) return { sent: 0, pending: 0 };
  const result = await deliverPendingMail(db, mailer);
  if (result.sent) log.info(result, "outbox delivered");
  return result;
});
await registerDailyTick(boss, db);
// Photos measured by a retired method are measured again from their stored images, with their
// checks' Index, book rows and alerts (lib/photos/remeasure.ts); nothing to do once done.
try {
  const r = await remeasurePhotos(db, services().photoStorage);
  if (r.photos.length || r.missing.length)
    log.info(
      { photos: r.photos.length, properties: r.properties, missing: r.missing.length },
      "photos remeasured",
    );
} catch (err) {
  log.error({ err }, "photo remeasure failed");
}
const companies = await db.selectFrom("companies").select("id").execute();
await queueSweeps(
  boss,
  companies.map((c) => c.id),
  "worker start",
);
await boss.send(MAIL_QUEUE, { reason: "worker start" });
const at = `${DAILY_AT.hour}:${String(DAILY_AT.minute).padStart(2, "0")}`;
console.log(`worker: ready (daily risk sweep at ${at} in each company's time zone)`);

const stop = async () => {
  await boss.stop({ graceful: true, timeout: 10_000 });
  await db.destroy();
  process.exit(0);
};
process.on("SIGTERM", stop);
process.on("SIGINT", stop);
