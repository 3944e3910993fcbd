// `npm run demo`: PostgreSQL on loopback, migrate, seed the invented scenario, build (unless the
// build is up to date), and serve at http://localhost:3000 (listening on 127.0.0.1 only) with the
// worker and the fake weather, geocoder, routing, map tiles and SMTP services. Ctrl-C, SIGTERM (to this process or to npm), a
// failed step or the end of npm stop everything it started (tests/harness/supervisor.ts).
// Environment: PORT, SWARD_PG_PORT / SWARD_PG_DATA, SWARD_WEATHER_PORT, SWARD_GEOCODER_PORT,
// SWARD_ROUTING_PORT, SWARD_MAP_TILES_PORT, SWARD_SMTP_PORT, MAIL_INBOX_DIR, DATABASE_URL, AUTH_SECRET,
// WEATHER_BASE_URL, GEOCODER_BASE_URL, ROUTING_BASE_URL, MAP_STYLE_URL / MAP_API_KEY, SMTP_URL.
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import net from "node:net";

import { DEMO_PASSWORD, demoScenario } from "@/fixtures/demo/scenario";

import { isBuildStale } from "../helpers/build";
import { waitForUrl } from "../helpers/processes";
import { FAKE_STYLE_PATH } from "./map-tiles-fake";
import { StepFailed, Supervisor } from "./supervisor";

process.chdir(new URL("../..", import.meta.url).pathname);
const PORT = Number(process.env.PORT ?? 3000);
const pgPort = process.env.SWARD_PG_PORT ?? "54329";
const DATABASE_URL = process.env.DATABASE_URL ?? `postgres://postgres@127.0.0.1:${pgPort}/sward`;
const TSX = "node_modules/.bin/tsx";

function readEnvLocal(): Record<string, string> {
  if (!existsSync(".env.local")) return {};
  return Object.fromEntries(
    readFileSync(".env.local", "utf8")
      .split("\n")
      .map((line) => line.match(/^([A-Z_]+)=(.*)$/))
      .filter((m): m is RegExpMatchArray => m !== null)
      .map((m) => [m[1], m[2]]),
  );
}

async function waitForPort(port: number, timeoutMs: number): Promise<void> {
  const deadline = Date.now() + timeoutMs;
  while (!(await answers(port))) {
    if (Date.now() > deadline)
      throw new StepFailed(`demo: nothing answers on 127.0.0.1:${port} after ${timeoutMs} ms`);
    await new Promise((r) => setTimeout(r, 250));
  }
}

function answers(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: "127.0.0.1", port });
    socket.once("connect", () => (socket.destroy(), resolve(true)));
    socket.once("error", () => resolve(false));
  });
}

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = net.createServer().once("error", () => resolve(false));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve(true)));
  });
}

// Everything below runs under the supervisor: Ctrl-C, SIGTERM (also to npm), SIGHUP, a failed step
// or the end of npm stop all it started (PostgreSQL only when it was not already running).
const sup = new Supervisor("demo");
await sup.main(async () => {
  await sup.cluster();
  await sup.step("database", TSX, ["db/ensure-database.ts", "sward"]);
  await sup.step("migrate", TSX, ["db/migrate.ts"], { env: { DATABASE_URL } });
  await sup.step("seed", TSX, ["fixtures/demo/seed.ts"], { env: { DATABASE_URL } });

  // A random session secret, made once and kept in the git-ignored .env.local (also used by `npm run dev`).
  const local = readEnvLocal();
  const AUTH_SECRET =
    process.env.AUTH_SECRET ?? local.AUTH_SECRET ?? randomBytes(32).toString("base64url");
  const AUTH_URL = `http://localhost:${PORT}`;
  if (!process.env.AUTH_SECRET && !local.AUTH_SECRET) {
    writeFileSync(
      ".env.local",
      `DATABASE_URL=${DATABASE_URL}\nAUTH_SECRET=${AUTH_SECRET}\nAUTH_URL=${AUTH_URL}\n`,
    );
  }

  if (!(await portIsFree(PORT)))
    throw new StepFailed(
      `demo: port ${PORT} on 127.0.0.1 is already in use. Stop what is using it, or run PORT=3001 npm run demo.`,
    );
  // The build is skipped when it is newer than every source file (as the e2e tests do).
  if (isBuildStale() || process.env.SWARD_HARNESS_FAIL_STEP === "build")
    await sup.step("build", "node", ["node_modules/next/dist/bin/next", "build"], {
      env: { NEXT_TELEMETRY_DISABLED: "1" },
    });
  else console.log("demo: the production build is up to date; not building again");

  // The local fake weather service (deterministic data on 127.0.0.1).
  const WEATHER_PORT = Number(process.env.SWARD_WEATHER_PORT ?? 3999);
  const WEATHER_BASE_URL = process.env.WEATHER_BASE_URL ?? `http://127.0.0.1:${WEATHER_PORT}`;
  if (!process.env.WEATHER_BASE_URL)
    sup.start("weather fake", TSX, ["tests/harness/weather-fake.ts", String(WEATHER_PORT)], {
      stdio: ["ignore", "ignore", "inherit"],
    });

  // The local fake geocoder (the Census Bureau's address API, answering for the scenario's addresses).
  const GEOCODER_PORT = Number(process.env.SWARD_GEOCODER_PORT ?? 3998);
  const GEOCODER_BASE_URL = process.env.GEOCODER_BASE_URL ?? `http://127.0.0.1:${GEOCODER_PORT}`;
  if (!process.env.GEOCODER_BASE_URL)
    sup.start("geocoder fake", TSX, ["tests/harness/geocoder-fake.ts", String(GEOCODER_PORT)], {
      stdio: ["ignore", "ignore", "inherit"],
    });

  // The local fake routing service (OSRM's Table API: great-circle distance × the US road factor).
  const ROUTING_PORT = Number(process.env.SWARD_ROUTING_PORT ?? 3997);
  const ROUTING_BASE_URL = process.env.ROUTING_BASE_URL ?? `http://127.0.0.1:${ROUTING_PORT}`;
  if (!process.env.ROUTING_BASE_URL)
    sup.start("routing fake", TSX, ["tests/harness/routing-fake.ts", String(ROUTING_PORT)], {
      stdio: ["ignore", "ignore", "inherit"],
    });

  // The local fake map service (a plain MapLibre style with county and state outlines).
  const MAP_TILES_PORT = Number(process.env.SWARD_MAP_TILES_PORT ?? 3996);
  const MAP_TILES_ORIGIN = `http://127.0.0.1:${MAP_TILES_PORT}`;
  const MAP_STYLE_URL =
    process.env.MAP_STYLE_URL ?? `${MAP_TILES_ORIGIN}${FAKE_STYLE_PATH}?key={key}`;
  const MAP_API_KEY = process.env.MAP_STYLE_URL ? process.env.MAP_API_KEY : "sward-demo-map-key";
  if (!process.env.MAP_STYLE_URL)
    sup.start("map tiles fake", TSX, ["tests/harness/map-tiles-fake.ts", String(MAP_TILES_PORT)], {
      stdio: ["ignore", "ignore", "inherit"],
    });

  // The local fake SMTP service: every message lands in .data/mail (managers read it at /dev/mail, or `npm run mail:inbox`).
  const SMTP_PORT = Number(process.env.SWARD_SMTP_PORT ?? 2525);
  const SMTP_URL = process.env.SMTP_URL ?? `smtp://127.0.0.1:${SMTP_PORT}`;
  const MAIL_INBOX_DIR = process.env.SMTP_URL
    ? undefined
    : (process.env.MAIL_INBOX_DIR ?? ".data/mail");
  if (MAIL_INBOX_DIR)
    sup.start("SMTP fake", TSX, ["tests/harness/smtp-fake.ts", String(SMTP_PORT), MAIL_INBOX_DIR], {
      stdio: ["ignore", "ignore", "inherit"],
    });

  const server = sup.start(
    "server",
    "node",
    [
      "--import",
      "./lib/http/edge-address.mjs",
      "node_modules/next/dist/bin/next",
      "start",
      "-H",
      "127.0.0.1",
      "-p",
      String(PORT),
    ],
    {
      stdio: ["ignore", "inherit", "inherit"],
      env: {
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL,
        AUTH_SECRET,
        AUTH_URL,
        WEATHER_BASE_URL,
        GEOCODER_BASE_URL,
        MAP_STYLE_URL,
        MAP_API_KEY,
        ROUTING_BASE_URL,
        ROUTING_API_KEY: process.env.ROUTING_API_KEY,
        SMTP_URL,
        MAIL_INBOX_DIR,
      },
    },
  );

  // The background worker (pg-boss): the daily risk sweep, and one sweep now; the managers' digest after it.
  const worker = sup.start("worker", TSX, ["jobs/worker.ts"], {
    stdio: ["ignore", "ignore", "inherit"],
    env: {
      DATABASE_URL,
      WEATHER_BASE_URL,
      SMTP_URL,
      AUTH_URL,
      LOG_LEVEL: process.env.LOG_LEVEL ?? "warn",
    },
  });

  const serverEnded = server.done.then(({ code, signal }) => {
    throw new StepFailed(
      `demo: the server ended while starting (${signal ?? `exit code ${code}`}); see the messages above.`,
    );
  });
  await Promise.race([
    Promise.all([
      waitForUrl(`${AUTH_URL}/sign-in`, 60_000),
      process.env.WEATHER_BASE_URL ? null : waitForUrl(`${WEATHER_BASE_URL}/health`, 60_000),
      process.env.GEOCODER_BASE_URL ? null : waitForUrl(`${GEOCODER_BASE_URL}/health`, 60_000),
      process.env.MAP_STYLE_URL ? null : waitForUrl(`${MAP_TILES_ORIGIN}/health`, 60_000),
      process.env.ROUTING_BASE_URL ? null : waitForUrl(`${ROUTING_BASE_URL}/health`, 60_000),
      MAIL_INBOX_DIR ? waitForPort(SMTP_PORT, 60_000) : null,
    ]),
    serverEnded,
  ]);

  console.log(
    `\nSward is running at ${AUTH_URL}  (server PID ${server.pid}, worker PID ${worker.pid}; Ctrl-C to stop)\n`,
  );
  console.log("Demo sign-ins:");
  for (const company of demoScenario)
    for (const p of company.people)
      console.log(`  ${p.email.padEnd(28)} ${p.role.padEnd(11)} ${company.name}`);
  console.log(`Demo password: ${DEMO_PASSWORD}`);
  console.log(
    `Homeowners can also sign in with an e-mailed link. Mail the demo sends (sign-in links, visit reports, the managers' digest)\nis kept by a local fake: signed in as the manager, open ${AUTH_URL}/dev/mail — or run npm run mail:inbox\n`,
  );

  // Serves until a signal (the supervisor stops everything) or until the server ends by itself.
  const { code, signal } = await server.done;
  if (!sup.isStopping) console.error(`demo: the server ended (${signal ?? `exit code ${code}`})`);
  return code ?? 1;
});
