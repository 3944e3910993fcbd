// E2E suite: a fresh, seeded database (sward_e2e) and the production build served by `next start`
// on 127.0.0.1, with the local fake weather, geocoder, routing and SMTP services beside it. Builds first when no build
// exists or a source changed. Stops what it started afterwards, PostgreSQL too when it was not
// running; the watchdog of tests/harness/supervisor.ts does so if vitest ends without a teardown.
import { closeSync, openSync, rmSync } from "node:fs";
import path from "node:path";
import type { TestProject } from "vitest/node";

import { FAKE_STYLE_PATH } from "../harness/map-tiles-fake";
import { startSmtpFake } from "../harness/smtp-fake";
import { Supervisor } from "../harness/supervisor";
import { isBuildStale } from "./build";
import { TSX, waitForUrl } from "./processes";

const PORT = Number(process.env.SWARD_E2E_PORT ?? 3100);
const MAIL_DIR = path.resolve("tests/.artifacts/mail-e2e");
const AUTH_SECRET = "e2e-tests-only-secret-0123456789abcdefghijkl";
const PHOTO_DIR = "tests/.artifacts/photos-e2e";
const E2E_MAP_API_KEY = "e2e-map-key";
const SERVER_LOG = path.resolve("tests/.artifacts/e2e-server.log");
export default async function setup(project: TestProject): Promise<() => Promise<void>> {
  const sup = new Supervisor("e2e setup", false);
  let smtp: Awaited<ReturnType<typeof startSmtpFake>> | undefined;
  const teardown = async () => {
    await smtp?.close();
    await sup.stop();
  };
  try {
    smtp = await start(project, sup);
  } catch (err) {
    await teardown();
    throw err;
  }
  return teardown;
}

async function start(
  project: TestProject,
  sup: Supervisor,
): Promise<Awaited<ReturnType<typeof startSmtpFake>>> {
  const databaseUrl = `postgres://postgres@127.0.0.1:${process.env.SWARD_PG_PORT ?? "54329"}/sward_e2e`;
  await sup.cluster();
  await sup.step("database", TSX, ["db/ensure-database.ts", "sward_e2e", "--fresh"]);
  await sup.step("migrate", TSX, ["db/migrate.ts"], { env: { DATABASE_URL: databaseUrl } });
  await sup.step("seed", TSX, ["fixtures/demo/seed.ts"], {
    env: { DATABASE_URL: databaseUrl, PHOTO_DIR },
  });
  if (isBuildStale())
    await sup.step("build", "node", ["node_modules/next/dist/bin/next", "build"], {
      env: { NEXT_TELEMETRY_DISABLED: "1" },
    });

  const baseUrl = `http://localhost:${PORT}`;
  const weatherPort = PORT + 1;
  sup.start("weather fake", TSX, ["tests/harness/weather-fake.ts", String(weatherPort)], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  // The fake geocoder: SWARD_GEOCODER_PORT, or E2E + 4 (+1 is the weather fake; +2 and +3 are
  // the seasons suite's own server and weather fake).
  const geocoderPort = Number(process.env.SWARD_GEOCODER_PORT ?? PORT + 4);
  sup.start("geocoder fake", TSX, ["tests/harness/geocoder-fake.ts", String(geocoderPort)], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  // The fake map service: SWARD_MAP_TILES_PORT, or E2E + 11 (+5…+9 are the demo that the
  // harness-cleanup test runs, +10 the routing fake, +12 the demo's own map service).
  const mapTilesPort = Number(process.env.SWARD_MAP_TILES_PORT ?? PORT + 11);
  sup.start("map tiles fake", TSX, ["tests/harness/map-tiles-fake.ts", String(mapTilesPort)], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  // The fake routing service (OSRM's Table API): SWARD_ROUTING_PORT, or E2E + 10 (+5…+9 are the
  // demo that e2e/harness-cleanup.test.ts runs beside this server).
  const routingPort = Number(process.env.SWARD_ROUTING_PORT ?? PORT + 10);
  sup.start("routing fake", TSX, ["tests/harness/routing-fake.ts", String(routingPort)], {
    stdio: ["ignore", "ignore", "inherit"],
  });
  await waitForUrl(`http://127.0.0.1:${weatherPort}/health`, 20_000);
  await waitForUrl(`http://127.0.0.1:${mapTilesPort}/health`, 20_000);
  await waitForUrl(`http://127.0.0.1:${routingPort}/health`, 20_000);
  await waitForUrl(`http://127.0.0.1:${geocoderPort}/health`, 20_000);
  rmSync(MAIL_DIR, { recursive: true, force: true });
  const smtp = await startSmtpFake(0, MAIL_DIR);
  // The server's JSON log lines go to a file the log test reads (tests/e2e/security-logs.test.ts).
  const logFile = openSync(SERVER_LOG, "w");
  sup.start(
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
      stdio: ["ignore", logFile, "inherit"],
      env: {
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL: databaseUrl,
        AUTH_SECRET,
        AUTH_URL: baseUrl,
        LOG_LEVEL: "info",
        PHOTO_DIR,
        WEATHER_BASE_URL: `http://127.0.0.1:${weatherPort}`,
        GEOCODER_BASE_URL: `http://127.0.0.1:${geocoderPort}`,
        MAP_STYLE_URL: `http://127.0.0.1:${mapTilesPort}${FAKE_STYLE_PATH}?key={key}`,
        MAP_API_KEY: E2E_MAP_API_KEY,
        ROUTING_BASE_URL: `http://127.0.0.1:${routingPort}`,
        SMTP_URL: `smtp://127.0.0.1:${smtp.port}`,
        MAIL_INBOX_DIR: MAIL_DIR,
      },
    },
  );
  closeSync(logFile);
  await waitForUrl(`${baseUrl}/sign-in`, 30_000);
  project.provide("baseUrl", baseUrl);
  project.provide("mailDir", MAIL_DIR);
  project.provide("databaseUrl", databaseUrl);
  project.provide("authSecret", AUTH_SECRET);
  project.provide("photoDir", PHOTO_DIR);
  project.provide("serverLog", SERVER_LOG);
  return smtp;
}

declare module "vitest" {
  export interface ProvidedContext {
    baseUrl: string;
    mailDir: string;
    databaseUrl: string;
    /** The server's AUTH_SECRET, for tests that mint a session cookie as sign-in does. */
    authSecret: string;
    photoDir: string;
    serverLog: string;
  }
}
