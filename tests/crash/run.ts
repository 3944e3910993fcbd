// `npm run test:crash`: PostgreSQL's durability promise, end to end through the app.
//
// On a cluster of its own (port 54339, its own data folder, fsync on, default durability
// settings) and the production server on 127.0.0.1:3300, a technician's client saves 1,000 zone
// checks, each under a fresh client-generated UUID with PUT, and uploads a photo every 50 checks.
// Like the app's offline queue it sends a request again, unchanged, after a network error or a
// 5xx. Meanwhile the PostgreSQL postmaster is killed with SIGKILL 5 times and the web server 5
// times, at random points of the run, each restarted at once. Then the database must hold every
// acknowledged (2xx) zone check exactly once with the values sent, no duplicates, and no photo row
// may name a missing file. Last, a visit at a lawn with a homeowner is finished over HTTP and the
// web server killed with SIGKILL as the 200 arrives, before its after-response delivery (its SMTP
// port never answers): the worker's outbox run must then send that report exactly once
// (tests/crash/report-mail.ts). Exit 1 otherwise. Everything it started is stopped in `finally`,
// and on Ctrl-C, SIGTERM or the end of npm by tests/harness/supervisor.ts.
//
// Environment: CRASH_SEED (repeat a run's crash points), CRASH_SUBMISSIONS (default 1000),
// SWARD_CRASH_PORT (3300), SWARD_CRASH_PG_PORT (54339).
import { randomBytes, randomUUID } from "node:crypto";
import { mkdirSync, readdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { sql } from "kysely";

import { createDb } from "@/db/client";
import { lawnImage } from "@/fixtures/demo/photos";
import { DEMO_PASSWORD } from "@/fixtures/demo/scenario";
import { todayIn } from "@/lib/dates";
import type { PropertyDetailDto } from "@/lib/properties/dto";
import { symptomKeys } from "@/lib/reference/symptoms";
import type { VisitDetailDto, VisitSummaryDto } from "@/lib/visits/dto";
import type { ZoneCheckInput } from "@/lib/visits/schemas";

import { Supervisor } from "../harness/supervisor";
import { isBuildStale } from "../helpers/build";
import { TSX } from "../helpers/processes";
import { seededRandom } from "../helpers/seeded-random";
import { doneCheck } from "../helpers/zone-checks";
import { Client } from "./client";
import {
  crashCluster,
  freshCluster,
  isListening,
  kill9 as killPostgres,
  postmasterPid,
  processState,
  restartAfterCrash,
  stopCluster,
  type Cluster,
} from "./postgres";
import { reportMailAfterKill, silentSmtp } from "./report-mail";
import { verify, type Submission } from "./verify";
import { WebServer } from "./web";

const PORT = Number(process.env.SWARD_CRASH_PORT ?? 3300);
const BASE = `http://localhost:${PORT}`;
const SUBMISSIONS = Number(process.env.CRASH_SUBMISSIONS ?? 1000);
const PHOTO_EVERY = 50;
const LANES = 4; // requests the client keeps in flight
const CRASHES = { postgres: 5, web: 5 };
const ARTIFACTS = path.resolve("tests/.artifacts/crash");
const PHOTO_DIR = path.join(ARTIFACTS, "photos");
const DATABASE = "sward_crash";
const TECHNICIAN = "tech1@demo.sward.test";
const MANAGER = "manager@demo.sward.test";

const seed = Number(process.env.CRASH_SEED ?? randomBytes(4).readUInt32BE(0));
/** Seeded, so CRASH_SEED repeats the crash points and the values sent. */
const random = seededRandom(seed);
const pick = <T>(list: readonly T[]): T => list[Math.floor(random() * list.length)]!;
const between = (lo: number, hi: number) => lo + Math.floor(random() * (hi - lo + 1));
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));
const seconds = (ms: number) => `${(ms / 1000).toFixed(1)} s`;
const startedAt = Date.now();
const say = (line: string) =>
  console.log(`crash [${seconds(Date.now() - startedAt).padStart(7)}] ${line}`);
const sup = new Supervisor("crash suite");

/** Varied values a technician could send, valid for the zone-check schema. */
function checkValues(zoneId: string, n: number): ZoneCheckInput {
  const symptoms = [...symptomKeys]
    .sort(() => random() - 0.5)
    .slice(0, between(0, 2))
    .map((key) => ({ key, severity: pick([1, 2, 3] as const), extentPct: 5 * between(0, 8) }));
  return doneCheck(zoneId, {
    baseVersion: 0,
    quality: between(1, 9),
    color: between(1, 9),
    density: between(1, 9),
    uniformity: between(1, 9),
    barePct: 5 * between(0, 12),
    weedsPct: 5 * between(0, 12),
    thatchIn: pick([0, 0.25, 0.5, 0.75, 1]),
    soilMoisture: pick(["dry", "moist", "wet"] as const),
    heightOfCutIn: pick([2.5, 3, 3.25, 3.5, 4]),
    mowingDirection: pick(["same", "changed", "unknown"] as const),
    isMatted: random() < 0.2,
    hasTornTips: random() < 0.2,
    symptoms,
    notes: `Check ${n} of ${SUBMISSIONS} — crash suite, thatch by the drive, dew at 8 °C`,
  });
}

/** Visits of the technician with zones not yet checked; the manager schedules more (and the technician starts them) until there are enough. */
async function planSlots(
  tech: Client,
  manager: Client,
  needed: number,
): Promise<{
  slots: { visitId: string; zoneId: string }[];
  visitIds: string[];
  preexisting: Set<string>;
}> {
  const me = await tech.once<{ id: string }>("GET", "/api/v1/me");
  const mine = [
    ...(
      await tech.once<{ items: VisitSummaryDto[] }>(
        "GET",
        `/api/v1/visits?technicianId=${me.id}&status=in_progress`,
      )
    ).items,
    ...(
      await tech.once<{ items: VisitSummaryDto[] }>(
        "GET",
        `/api/v1/visits?technicianId=${me.id}&status=scheduled`,
      )
    ).items,
  ];
  const all = (
    await tech.once<{ items: VisitSummaryDto[] }>("GET", `/api/v1/visits?technicianId=${me.id}`)
  ).items;
  const propertyIds = [...new Set(all.map((v) => v.propertyId))];
  if (!propertyIds.length)
    throw new Error(`crash: ${TECHNICIAN} has no visits in the seeded scenario`);
  const zones = new Map<string, string[]>();
  for (const id of propertyIds)
    zones.set(
      id,
      (await tech.once<PropertyDetailDto>("GET", `/api/v1/properties/${id}`)).zones.map(
        (z) => z.id,
      ),
    );

  const slots: { visitId: string; zoneId: string }[] = [];
  const visitIds: string[] = [];
  const preexisting = new Set<string>();
  const toStart: string[] = [];
  let timeZone = "UTC";
  for (const v of mine) {
    const detail = await tech.once<VisitDetailDto>("GET", `/api/v1/visits/${v.id}`);
    timeZone = detail.timeZone;
    visitIds.push(v.id);
    for (const c of detail.checks) preexisting.add(c.id);
    for (const z of detail.zones)
      if (!detail.checks.some((c) => c.zoneId === z.id))
        slots.push({ visitId: v.id, zoneId: z.id });
    if (v.status === "scheduled") toStart.push(v.id);
  }
  // More stops of the day at the technician's properties, as the manager schedules them.
  const today = todayIn(timeZone);
  const extra: { id: string; propertyId: string }[] = [];
  for (let i = 0; slots.length < needed; i++) {
    const propertyId = propertyIds[i % propertyIds.length]!;
    const id = randomUUID();
    extra.push({ id, propertyId });
    visitIds.push(id);
    toStart.push(id);
    for (const zoneId of zones.get(propertyId)!) slots.push({ visitId: id, zoneId });
  }
  const inParallel = async <T>(items: T[], work: (item: T) => Promise<unknown>) => {
    let next = 0;
    await Promise.all(
      Array.from({ length: LANES }, async () => {
        while (next < items.length) await work(items[next++]!);
      }),
    );
  };
  await inParallel(extra, (v) =>
    manager.once("POST", "/api/v1/visits", {
      id: v.id,
      propertyId: v.propertyId,
      scheduledFor: today,
      technicianId: me.id,
      plannedService: "inspection",
      stopOrder: 10,
      notes: "",
      confirmSameDay: true, // a second visit at a property with a stop today
    }),
  );
  await inParallel(toStart, (id) =>
    tech.once("POST", `/api/v1/visits/${id}/start`, { latitude: null, longitude: null }),
  );
  // Shuffled, so requests in flight at the same time fall on different visits.
  const shuffled = slots
    .map((s) => ({ s, k: random() }))
    .sort((a, b) => a.k - b.k)
    .map((x) => x.s)
    .slice(0, needed);
  return { slots: shuffled, visitIds, preexisting };
}

async function main(): Promise<number> {
  const cluster: Cluster = crashCluster(
    process.env.SWARD_CRASH_PG_PORT ?? "54339",
    "tests/.artifacts/crash-pg",
  );
  const databaseUrl = cluster.url(DATABASE);
  // SMTP for the web server: a port that accepts and never answers (tests/crash/report-mail.ts).
  const silent = await silentSmtp();
  const web = new WebServer(
    sup,
    PORT,
    {
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL: databaseUrl,
      AUTH_SECRET: randomBytes(32).toString("base64url"), // one per run, the same across restarts
      AUTH_URL: BASE,
      LOG_LEVEL: "warn",
      PHOTO_DIR,
      SMTP_URL: `smtp://127.0.0.1:${silent.port}`,
    },
    path.join(ARTIFACTS, "server.log"),
  );

  let cleanedUp = false;
  const cleanup = async () => {
    if (cleanedUp) return;
    cleanedUp = true;
    web.keepAlive = false;
    await web.stop().catch((err) => console.error("crash: stopping the web server:", err));
    await stopCluster(cluster).catch((err) => console.error("crash: stopping PostgreSQL:", err));
    await silent.close();
  };
  // On a signal, the supervisor stops the running step and the web server, then runs this.
  sup.defer("stop the web server and PostgreSQL", cleanup, {
    argv: ["sh", "db/cluster.sh", "stop"],
    env: cluster.env,
  });

  try {
    say(`seed ${seed} (CRASH_SEED=${seed} repeats the crash points and values)`);
    rmSync(ARTIFACTS, { recursive: true, force: true });
    mkdirSync(PHOTO_DIR, { recursive: true });
    await freshCluster(cluster);
    await sup.step("database", TSX, ["db/ensure-database.ts", DATABASE, "--fresh"], {
      env: cluster.env,
    });
    await sup.step("migrate", TSX, ["db/migrate.ts"], {
      env: { ...cluster.env, DATABASE_URL: databaseUrl },
    });
    await sup.step("seed", TSX, ["fixtures/demo/seed.ts"], {
      env: { ...cluster.env, DATABASE_URL: databaseUrl, PHOTO_DIR },
    });
    const db = createDb(databaseUrl, { max: 2 });
    try {
      const settings = await sql<{
        name: string;
        setting: string;
      }>`select name, setting from pg_settings where name in ('fsync', 'synchronous_commit', 'full_page_writes', 'wal_sync_method') order by name`.execute(
        db,
      );
      const s = Object.fromEntries(settings.rows.map((r) => [r.name, r.setting]));
      say(
        `PostgreSQL on 127.0.0.1:${cluster.port} (data ${cluster.data}): fsync ${s.fsync}, synchronous_commit ${s.synchronous_commit}, full_page_writes ${s.full_page_writes}, wal_sync_method ${s.wal_sync_method}`,
      );
      if (s.fsync !== "on" || s.synchronous_commit !== "on")
        throw new Error(
          "crash: durability settings are not the defaults; the test would prove nothing",
        );
    } finally {
      await db.destroy();
    }
    if (isBuildStale())
      await sup.step("build", "node", ["node_modules/next/dist/bin/next", "build"], {
        env: { NEXT_TELEMETRY_DISABLED: "1" },
      });
    if (await isListening(PORT))
      throw new Error(
        `crash: port ${PORT} is taken by a server this suite did not start; set SWARD_CRASH_PORT`,
      );
    await web.start();
    web.keepAlive = true;
    say(
      `serving ${BASE} (PID ${web.pid}; log ${path.relative(process.cwd(), path.join(ARTIFACTS, "server.log"))})`,
    );

    const tech = await Client.signIn(BASE, TECHNICIAN, DEMO_PASSWORD);
    const manager = await Client.signIn(BASE, MANAGER, DEMO_PASSWORD);
    const { slots, visitIds, preexisting } = await planSlots(tech, manager, SUBMISSIONS);
    const submissions: Submission[] = slots.map((slot, i) => ({
      n: i + 1,
      visitId: slot.visitId,
      zoneCheckId: randomUUID(),
      body: checkValues(slot.zoneId, i + 1),
    }));
    for (const s of submissions.filter((x) => x.n % PHOTO_EVERY === 0))
      s.photo = { bytes: await lawnImage(640, 480, 0.05 + random() * 0.4, "jpeg", 1000 + s.n) };
    say(
      `${submissions.length} zone checks on ${new Set(slots.map((s) => s.visitId)).size} started visits, ${submissions.filter((s) => s.photo).length} photos; ${LANES} requests in flight`,
    );

    // The client: LANES requests at a time; a photo goes up right after its check was acknowledged.
    let acknowledged = 0;
    let finished = false;
    const sendAll = async () => {
      let next = 0;
      await Promise.all(
        Array.from({ length: LANES }, async () => {
          while (next < submissions.length && !tech.stopped) {
            const s = submissions[next++]!;
            const r = await tech.deliver(
              "PUT",
              `/api/v1/visits/${s.visitId}/zone-checks/${s.zoneCheckId}`,
              JSON.stringify(s.body),
              "application/json",
            );
            Object.assign(s, { status: r.status, attempts: r.attempts, lastSentAt: r.lastSentAt });
            if (r.status < 200 || r.status >= 300) continue;
            acknowledged++;
            if (!s.photo) continue;
            const p = await tech.deliver(
              "POST",
              `/api/v1/visits/${s.visitId}/zone-checks/${s.zoneCheckId}/photos`,
              s.photo.bytes,
              "image/jpeg",
            );
            Object.assign(s.photo, {
              status: p.status,
              attempts: p.attempts,
              photoId: (p.body as { id?: string } | null)?.id,
            });
          }
        }),
      ).finally(() => (finished = true));
    };

    // The crashes: one at a random point of each tenth of the run (between 4 % and 90 % of the
    // acknowledgements), PostgreSQL or the web server in a random order, each restarted at once.
    const kinds = [
      ...Array<"postgres">(CRASHES.postgres).fill("postgres"),
      ...Array<"web">(CRASHES.web).fill("web"),
    ].sort(() => random() - 0.5);
    const from = Math.floor(SUBMISSIONS * 0.04);
    const span = (SUBMISSIONS * 0.9 - from) / kinds.length;
    const points = kinds.map((_, i) => Math.floor(from + span * i + random() * span));
    const cycles: string[] = [];
    const crashAll = async () => {
      for (const [i, kind] of kinds.entries()) {
        while (acknowledged < points[i]! && !finished) await sleep(5);
        if (finished)
          throw new Error(`crash: the submissions ended before crash ${i + 1} of ${kinds.length}`);
        await sleep(random() * 40); // somewhere between two acknowledgements
        const at = `${acknowledged} acknowledged, ${tech.inFlight} requests in flight`;
        const t0 = Date.now();
        let line: string;
        if (kind === "postgres") {
          const { pid, settledMs } = await killPostgres(cluster);
          const recovery = await restartAfterCrash(cluster);
          line = `PostgreSQL: kill -9 postmaster ${pid} (${at}); old processes gone in ${seconds(settledMs)}; up again in ${seconds(Date.now() - t0)} (${recovery}, new postmaster ${postmasterPid(cluster)})`;
        } else {
          const pid = await web.kill9();
          await web.start();
          line = `web server: kill -9 ${pid} (${at}); serving again in ${seconds(Date.now() - t0)} (new PID ${web.pid})`;
        }
        cycles.push(line);
        say(`cycle ${i + 1}/${kinds.length} ${line}`);
      }
    };
    const t1 = Date.now();
    await Promise.all([
      sendAll(),
      crashAll().catch((err) => {
        tech.stopped = true; // no point retrying against servers about to be stopped
        throw err;
      }),
    ]);
    const submitMs = Date.now() - t1;
    web.keepAlive = false;

    const answered = submissions.filter((s) => s.status !== undefined);
    const refused = answered.filter((s) => s.status !== 0 && (s.status! < 200 || s.status! >= 300));
    const gaveUp = answered.filter((s) => s.status === 0);
    const retried = submissions.filter((s) => (s.attempts ?? 0) > 1).length;
    say(
      `${submissions.length} submissions in ${seconds(submitMs)}; ${retried} needed more than one attempt (${tech.networkRetries} retries after network errors, ${tech.serverErrorRetries} after 5xx); refused ${refused.length}, gave up ${gaveUp.length}`,
    );
    for (const s of refused.slice(0, 5)) console.log(`  refused #${s.n}: ${s.status}`);

    const check = createDb(databaseUrl, { max: 4 });
    const found = await verify(check, submissions, visitIds, preexisting, PHOTO_DIR).catch(
      async (err: unknown) => {
        await check.destroy();
        throw err;
      },
    );
    // Last, as it ends with the web server killed: the report e-mail of a finish it acknowledged.
    const mail = await reportMailAfterKill({
      db: check,
      web,
      tech,
      manager,
      silent,
      inboxDir: path.join(ARTIFACTS, "mail"),
    }).finally(() => check.destroy());
    const leftovers = readdirSync(PHOTO_DIR, { recursive: true, encoding: "utf8" }).filter((f) =>
      f.endsWith(".tmp"),
    ).length;
    // Next logs and survives an uncaught exception; a plain Node process (the worker) would die of it.
    const uncaught = readFileSync(path.join(ARTIFACTS, "server.log"), "utf8")
      .split("\n")
      .filter((l) => l.includes("uncaughtException"));

    const problems = [
      ...found.lost,
      ...found.duplicated,
      ...found.storedDifferently.map((l) => `stored differently: ${l}`),
      ...found.photosLost,
      ...found.photoRowsMissingFiles.map((l) => `missing file: ${l}`),
      ...found.indexOutOfDate.map((l) => `Sward Index out of date: ${l}`),
      ...refused.map((s) => `#${s.n} refused with ${s.status}`),
      ...gaveUp.map((s) => `#${s.n} never acknowledged`),
      ...web.unexpectedExits.map((e) => `the web server exited by itself (${e})`),
      ...uncaught
        .slice(0, 3)
        .map((l) => `the server log has an uncaught exception: ${l.slice(0, 200)}`),
      ...mail.problems,
      ...(cycles.length === kinds.length
        ? []
        : [`only ${cycles.length} of ${kinds.length} crash cycles ran`]),
    ];
    console.log("");
    console.log(
      `acknowledged ${found.acknowledged}, lost ${found.lost.length}, duplicated ${found.duplicated.length}`,
    );
    console.log(
      `photos acknowledged ${found.photosAcknowledged}, rows pointing to missing files ${found.photoRowsMissingFiles.length}`,
    );
    console.log(
      `  acknowledged after a retry ${found.ackedAfterRetry}, of which answered from the row an earlier attempt had committed (its answer lost in a crash) ${found.answeredFromStoredRow}`,
    );
    console.log(
      `  stored differently from what was sent ${found.storedDifferently.length}; Sward Index out of date ${found.indexOutOfDate.length}; photo rows checked ${found.photoRowsChecked} (seed included); acknowledged photos without a row ${found.photosLost.length}; unfinished temporary photo files ${leftovers}`,
    );
    console.log(
      `  crash cycles ${cycles.length} (PostgreSQL ${CRASHES.postgres}, web server ${CRASHES.web}); web server exits nobody caused ${web.unexpectedExits.length}; uncaught exceptions in the server log ${uncaught.length}`,
    );
    console.log(mail.line);
    if (problems.length) {
      console.error(`\ncrash: FAILED (${problems.length}):`);
      for (const p of problems.slice(0, 30)) console.error(`  ${p}`);
      const log = readFileSync(path.join(ARTIFACTS, "server.log"), "utf8")
        .trim()
        .split("\n")
        .slice(-15);
      console.error(`\nlast lines of the server log:\n${log.join("\n")}`);
      return 1;
    }
    say(`passed in ${seconds(Date.now() - startedAt)}`);
    return 0;
  } finally {
    await cleanup();
    const pg = postmasterPid(cluster);
    const left = [web.pid, pg !== null && processState(pg) === "alive" ? pg : undefined].filter(
      Boolean,
    );
    console.log(
      left.length
        ? `crash: still running: ${left.join(", ")}`
        : "crash: web server and PostgreSQL stopped",
    );
  }
}

// Exits with main's code once everything is stopped: nothing of this run may keep the process alive.
await sup.main(main);
