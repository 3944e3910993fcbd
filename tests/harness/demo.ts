// `npm run demo`: PostgreSQL on loopback, migrate, seed the invented scenario, build, and serve
// at http://localhost:3000 (listening on 127.0.0.1 only). Ctrl-C stops what it started.
import { spawn, spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import net from "node:net";

import { DEMO_PASSWORD, demoScenario } from "@/fixtures/demo/scenario";

process.chdir(new URL("../..", import.meta.url).pathname);
const PORT = Number(process.env.PORT ?? 3000);
const pgPort = process.env.SWARD_PG_PORT ?? "54329";
const DATABASE_URL = process.env.DATABASE_URL ?? `postgres://postgres@127.0.0.1:${pgPort}/sward`;

function must(command: string, args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(command, args, { stdio: "inherit", env: { ...process.env, ...env } });
  if (r.status !== 0) {
    console.error(`demo: "${command} ${args.join(" ")}" failed; see the messages above.`);
    process.exit(1);
  }
}

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

function portIsFree(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const probe = net.createServer().once("error", () => resolve(false));
    probe.listen(port, "127.0.0.1", () => probe.close(() => resolve(true)));
  });
}

const wasRunning = spawnSync("sh", ["db/cluster.sh", "status"], { stdio: "ignore" }).status === 0;
must("sh", ["db/cluster.sh", "start"]);
must("node_modules/.bin/tsx", ["db/ensure-database.ts", "sward"]);
must("node_modules/.bin/tsx", ["db/migrate.ts"], { DATABASE_URL });
must("node_modules/.bin/tsx", ["fixtures/demo/seed.ts"], { DATABASE_URL });

// A random session secret, made once and kept in the git-ignored .env.local (also used by `npm run dev`).
const local = readEnvLocal();
const AUTH_SECRET =
  process.env.AUTH_SECRET ?? local.AUTH_SECRET ?? randomBytes(32).toString("base64url");
const AUTH_URL = `http://localhost:${PORT}`;
if (!local.AUTH_SECRET) {
  writeFileSync(
    ".env.local",
    `DATABASE_URL=${DATABASE_URL}\nAUTH_SECRET=${AUTH_SECRET}\nAUTH_URL=${AUTH_URL}\n`,
  );
}

if (!(await portIsFree(PORT))) {
  console.error(
    `demo: port ${PORT} on 127.0.0.1 is already in use. Stop what is using it, or run PORT=3001 npm run demo.`,
  );
  process.exit(1);
}
must("node", ["node_modules/next/dist/bin/next", "build"], { NEXT_TELEMETRY_DISABLED: "1" });

// The local fake weather service (deterministic data on 127.0.0.1).
const WEATHER_PORT = Number(process.env.SWARD_WEATHER_PORT ?? 3999);
const WEATHER_BASE_URL = process.env.WEATHER_BASE_URL ?? `http://127.0.0.1:${WEATHER_PORT}`;
const weather = process.env.WEATHER_BASE_URL
  ? null
  : spawn("node_modules/.bin/tsx", ["tests/harness/weather-fake.ts", String(WEATHER_PORT)], {
      stdio: ["ignore", "ignore", "inherit"],
    });

// The local fake SMTP service: every message lands in .data/mail (managers read it at /dev/mail, or `npm run mail:inbox`).
const SMTP_PORT = Number(process.env.SWARD_SMTP_PORT ?? 2525);
const SMTP_URL = process.env.SMTP_URL ?? `smtp://127.0.0.1:${SMTP_PORT}`;
const smtp = process.env.SMTP_URL
  ? null
  : spawn(
      "node_modules/.bin/tsx",
      ["tests/harness/smtp-fake.ts", String(SMTP_PORT), ".data/mail"],
      { stdio: ["ignore", "ignore", "inherit"] },
    );
const MAIL_INBOX_DIR = process.env.SMTP_URL ? undefined : ".data/mail";

const server = spawn(
  "node",
  ["node_modules/next/dist/bin/next", "start", "-H", "127.0.0.1", "-p", String(PORT)],
  {
    stdio: ["ignore", "inherit", "inherit"],
    env: {
      ...process.env,
      NODE_ENV: "production",
      NEXT_TELEMETRY_DISABLED: "1",
      DATABASE_URL,
      AUTH_SECRET,
      AUTH_URL,
      WEATHER_BASE_URL,
      SMTP_URL,
      ...(MAIL_INBOX_DIR ? { MAIL_INBOX_DIR } : {}),
    },
  },
);

// The background worker (pg-boss): the daily risk sweep, and one sweep now; the managers' digest after it.
const worker = spawn("node_modules/.bin/tsx", ["jobs/worker.ts"], {
  stdio: ["ignore", "ignore", "inherit"],
  env: {
    ...process.env,
    DATABASE_URL,
    WEATHER_BASE_URL,
    SMTP_URL,
    AUTH_URL,
    LOG_LEVEL: process.env.LOG_LEVEL ?? "warn",
  },
});

for (let i = 0; i < 120; i++) {
  try {
    if ((await fetch(`${AUTH_URL}/sign-in`)).ok) break;
  } catch {
    /* not up yet */
  }
  await new Promise((r) => setTimeout(r, 250));
}

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

let stopping = false;
function stop() {
  if (stopping) return;
  stopping = true;
  if (server.exitCode === null) server.kill("SIGTERM");
  if (worker.exitCode === null) worker.kill("SIGTERM");
  if (smtp && smtp.exitCode === null) smtp.kill("SIGTERM");
  if (weather && weather.exitCode === null) weather.kill("SIGTERM");
}
process.on("SIGINT", stop);
process.on("SIGTERM", stop);
server.on("exit", (code) => {
  if (worker.exitCode === null) worker.kill("SIGTERM");
  if (smtp && smtp.exitCode === null) smtp.kill("SIGTERM");
  if (weather && weather.exitCode === null) weather.kill("SIGTERM");
  if (!wasRunning) spawnSync("sh", ["db/cluster.sh", "stop"], { stdio: "inherit" });
  process.exit(code ?? 0);
});
