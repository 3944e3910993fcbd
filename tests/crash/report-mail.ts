// The homeowner's report e-mail when the web server is killed right after a finish commits.
//
// The web server's SMTP_URL names a "silent" port: it accepts the connection and never greets,
// so the delivery the finish route runs after its response hangs (nodemailer's 5 s greeting
// timeout) instead of failing at once — a refused connection would fail within a millisecond and
// put the row on its 30 s back-off before the kill, racing the kill. A visit at a lawn with a
// homeowner is finished over HTTP as the technician, and the server is sent SIGKILL the moment
// the 200 arrives. Then:
//   - the visit is completed and exactly one report row per homeowner is pending, never tried
//     (the kill came before any delivery), written by the finish's own transaction (same xmin as
//     the visit row: a row queued in a step of its own after the commit fails this);
//   - the worker's outbox run (deliverPendingMail with the mailer of lib/services, as
//     jobs/worker.ts calls it), twice at once and then once more, against the local SMTP fake,
//     delivers exactly one copy to that homeowner and marks the row sent.
import { randomUUID } from "node:crypto";
import net from "node:net";
import { sql, type Kysely } from "kysely";

import type { Database } from "@/db/schema";
import { todayIn } from "@/lib/dates";
import { deliverPendingMail } from "@/lib/mail/outbox";
import type { PropertyDetailDto } from "@/lib/properties/dto";
import { smtpMailer } from "@/lib/services/mail";
import type { VisitDetailDto } from "@/lib/visits/dto";

import { readInbox, startSmtpFake } from "../harness/smtp-fake";
import { doneCheck } from "../helpers/zone-checks";
import type { Client } from "./client";
import type { WebServer } from "./web";

/** A TCP listener that accepts SMTP connections and never answers (holds them until closed). */
export async function silentSmtp(): Promise<{
  port: number;
  connections: () => number;
  close: () => Promise<void>;
}> {
  const sockets = new Set<net.Socket>();
  let accepted = 0;
  const server = net.createServer((socket) => {
    accepted++;
    sockets.add(socket);
    socket.on("error", () => undefined);
    socket.on("close", () => sockets.delete(socket));
  });
  await new Promise<void>((resolve, reject) => {
    server.once("error", reject);
    server.listen(0, "127.0.0.1", () => resolve());
  });
  const address = server.address();
  if (!address || typeof address !== "object") throw new Error("crash: silent SMTP has no port");
  return {
    port: address.port,
    connections: () => accepted,
    close: () =>
      new Promise((resolve) => {
        for (const s of sockets) s.destroy();
        server.close(() => resolve());
      }),
  };
}

export interface ReportMailOutcome {
  line: string;
  problems: string[];
}

export async function reportMailAfterKill(options: {
  db: Kysely<Database>;
  web: WebServer;
  tech: Client;
  manager: Client;
  silent: { connections: () => number };
  inboxDir: string;
}): Promise<ReportMailOutcome> {
  const { db, web, tech, manager, silent, inboxDir } = options;
  const problems: string[] = [];

  // A lawn of this technician with an active homeowner.
  const me = await tech.once<{ id: string }>("GET", "/api/v1/me");
  const lawn = await db
    .selectFrom("property_homeowners as ph")
    .innerJoin("users as u", "u.id", "ph.user_id")
    .select(["ph.property_id", "u.id as homeownerId", "u.email"])
    .where("u.disabled_at", "is", null)
    .where((eb) =>
      eb.exists(
        eb
          .selectFrom("visits as v")
          .select("v.id")
          .whereRef("v.property_id", "=", "ph.property_id")
          .where("v.technician_id", "=", me.id),
      ),
    )
    .orderBy("ph.property_id")
    .executeTakeFirst();
  if (!lawn)
    throw new Error("crash: no lawn of the technician has a homeowner in the seeded scenario");
  const homeowners = await db
    .selectFrom("property_homeowners as ph")
    .innerJoin("users as u", "u.id", "ph.user_id")
    .select("u.id")
    .where("ph.property_id", "=", lawn.property_id)
    .where("u.disabled_at", "is", null)
    .execute();
  const property = await tech.once<PropertyDetailDto>(
    "GET",
    `/api/v1/properties/${lawn.property_id}`,
  );

  // The manager schedules a stop for today; the technician starts it and checks every zone.
  const visitId = randomUUID();
  const anyVisit = (
    await tech.once<{ items: { id: string }[] }>("GET", `/api/v1/visits?technicianId=${me.id}`)
  ).items[0];
  const timeZone = anyVisit
    ? (await tech.once<VisitDetailDto>("GET", `/api/v1/visits/${anyVisit.id}`)).timeZone
    : "UTC";
  await manager.once("POST", "/api/v1/visits", {
    id: visitId,
    propertyId: lawn.property_id,
    scheduledFor: todayIn(timeZone),
    technicianId: me.id,
    plannedService: "inspection",
    stopOrder: 20,
    notes: "",
    confirmSameDay: true,
  });
  await tech.once("POST", `/api/v1/visits/${visitId}/start`, { latitude: null, longitude: null });
  for (const zone of property.zones)
    await tech.once(
      "PUT",
      `/api/v1/visits/${visitId}/zone-checks/${randomUUID()}`,
      doneCheck(zone.id, { baseVersion: 0 }),
    );

  // Finish over HTTP; SIGKILL the server as soon as the 200 arrives (before reading the body).
  const res = await fetch(`${tech.base}/api/v1/visits/${visitId}/finish`, {
    method: "POST",
    headers: { ...tech.headers(), "content-type": "application/json" },
    body: "{}",
  });
  if (res.status !== 200) {
    const text = await res.text();
    throw new Error(`crash: finishing ${visitId} answered ${res.status}: ${text.slice(0, 300)}`);
  }
  await web.kill9();
  void res.body?.cancel().catch(() => undefined);
  const attemptsInFlight = silent.connections();

  const visit = await db
    .selectFrom("visits")
    .select(["status", sql<string>`xmin::text`.as("xmin")])
    .where("id", "=", visitId)
    .executeTakeFirstOrThrow();
  if (visit.status !== "completed")
    problems.push(`report mail: the finished visit ${visitId} is ${visit.status} after the kill`);

  // The killed server's sessions end with it; a row it had claimed is free once they are gone.
  for (const started = Date.now(); ;) {
    const held = await sql<{
      n: string;
    }>`select count(*) as n from pg_locks where relation = 'mail_outbox'::regclass and pid <> pg_backend_pid()`.execute(
      db,
    );
    if (Number(held.rows[0]!.n) === 0) break;
    if (Date.now() - started > 15_000) {
      problems.push("report mail: the killed server's locks on the outbox were not released");
      break;
    }
    await new Promise((r) => setTimeout(r, 50));
  }

  const rowsOf = () =>
    db
      .selectFrom("mail_outbox")
      .select([
        "id",
        "status",
        "attempts",
        "to_address",
        "sent_at",
        sql<string>`xmin::text`.as("xmin"),
      ])
      .where("dedupe_key", "like", `visit_report:${visitId}:%`)
      .execute();
  const atKill = await rowsOf();
  if (atKill.length !== homeowners.length)
    problems.push(
      `report mail: ${atKill.length} report rows committed with the finish, expected ${homeowners.length} (one per homeowner)`,
    );
  for (const r of atKill) {
    if (r.status !== "pending" || r.attempts !== 0)
      problems.push(
        `report mail: row ${r.id} was ${r.status} after ${r.attempts} attempts at the kill; the kill came after a delivery, proving nothing`,
      );
    if (r.xmin !== visit.xmin)
      problems.push(
        `report mail: row ${r.id} was written by transaction ${r.xmin}, the finish by ${visit.xmin}: not in the finish's transaction`,
      );
  }

  // The worker's outbox run against the local SMTP fake: two at once, then one more.
  const smtp = await startSmtpFake(0, inboxDir);
  let runs = 0;
  try {
    const mailer = smtpMailer(`smtp://127.0.0.1:${smtp.port}`);
    const run = () => (runs++, deliverPendingMail(db, mailer));
    await Promise.all([run(), run()]);
    await run();
  } finally {
    await smtp.close();
  }
  const copies = (await readInbox(inboxDir)).filter(
    (m) => m.to.includes(lawn.email) && m.html.includes(visitId),
  );
  const after = await rowsOf();
  const sent = after.filter((r) => r.status === "sent" && r.sent_at !== null);
  if (copies.length !== 1)
    problems.push(`report mail: ${copies.length} copies reached ${lawn.email}, expected exactly 1`);
  if (sent.length !== after.length || after.length === 0)
    problems.push(`report mail: ${sent.length} of ${after.length} report rows marked sent`);

  const pendingAtKill = atKill.filter((r) => r.status === "pending" && r.attempts === 0).length;
  const sameTransaction = atKill.filter((r) => r.xmin === visit.xmin).length;
  const line = `report mail after kill -9: rows ${atKill.length} (pending at the kill ${pendingAtKill}, in the finish's transaction ${sameTransaction}), after-response deliveries in flight ${attemptsInFlight}, worker runs ${runs} (2 at once), delivered ${sent.length}, copies ${copies.length}`;
  return { line, problems };
}
