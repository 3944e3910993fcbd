// `npm run demo` stops everything it started on every exit path: SIGTERM to the npm process,
// Ctrl-C (SIGINT to the terminal's process group), npm killed with SIGKILL, the demo itself killed
// with SIGKILL (its watchdog), and a step that fails.
// The demo runs for real under `npm run` — its own PostgreSQL cluster (port SWARD_PG_PORT + 20,
// its own data folder), migrate, seed, the production server, the worker and the fake weather, SMTP,
// geocoder, routing and map services on SWARD_E2E_PORT + 5…9 and + 12 — and skips only the build, which the e2e setup made.
// While it runs, every process under npm and the postmaster are recorded; afterwards none may be
// alive (process.kill(pid, 0); a zombie counts as ended) and no port may accept a connection.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { readdirSync, readFileSync, rmSync } from "node:fs";
import path from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

import { crashCluster, isListening, postmasterPid, stopCluster } from "../crash/postgres";
import { procStat } from "../harness/supervisor";

const PG_PORT = Number(process.env.SWARD_PG_PORT ?? 54329) + 20;
const WEB_PORT = Number(process.env.SWARD_E2E_PORT ?? 3100) + 5;
const PORTS = {
  server: WEB_PORT,
  weather: WEB_PORT + 1,
  smtp: WEB_PORT + 2,
  geocoder: WEB_PORT + 3,
  routing: WEB_PORT + 4,
  mapTiles: WEB_PORT + 7,
  postgres: PG_PORT,
};
const ARTIFACTS = path.resolve("tests/.artifacts/harness-demo");
const cluster = crashCluster(String(PG_PORT), path.join(ARTIFACTS, "pg"));
const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

function demoEnv(extra: Record<string, string> = {}): NodeJS.ProcessEnv {
  const env: NodeJS.ProcessEnv = {
    ...process.env,
    ...cluster.env,
    PORT: String(PORTS.server),
    SWARD_WEATHER_PORT: String(PORTS.weather),
    SWARD_SMTP_PORT: String(PORTS.smtp),
    SWARD_GEOCODER_PORT: String(PORTS.geocoder),
    SWARD_ROUTING_PORT: String(PORTS.routing),
    SWARD_MAP_TILES_PORT: String(PORTS.mapTiles),
    MAIL_INBOX_DIR: path.join(ARTIFACTS, "mail"),
    PHOTO_DIR: path.join(ARTIFACTS, "photos"),
    DATABASE_URL: cluster.url("sward"),
    AUTH_SECRET: "harness-test-only-secret-0123456789abcdefghij",
    LOG_LEVEL: "warn",
    ...extra,
  };
  // As from a developer's shell, not from inside vitest.
  for (const key of Object.keys(env))
    if (key === "NODE_ENV" || key.startsWith("VITEST")) delete env[key];
  return env;
}

/** Alive and not a zombie (a zombie has ended; only its parent's wait() is missing). */
function alive(pid: number): boolean {
  try {
    process.kill(pid, 0);
  } catch (err) {
    return (err as NodeJS.ErrnoException).code === "EPERM";
  }
  return procStat(pid)?.state !== "Z";
}

/** Every live process below `root` (by parent PID, through /proc). */
function descendants(root: number): number[] {
  const children = new Map<number, number[]>();
  for (const name of readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    const stat = procStat(Number(name));
    if (!stat || stat.state === "Z") continue;
    children.set(stat.ppid, [...(children.get(stat.ppid) ?? []), Number(name)]);
  }
  const found: number[] = [];
  const queue = [root];
  while (queue.length)
    for (const child of children.get(queue.shift()!) ?? []) {
      found.push(child);
      queue.push(child);
    }
  return found;
}

interface Demo {
  npm: ChildProcess;
  output: () => string;
  /** Every PID seen under npm so far, and the postmaster's. */
  seen: Set<number>;
  exited: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
  stopWatching: () => void;
}

/** `npm run demo` in a process group of its own, as a terminal would run it. */
function startDemo(extra: Record<string, string> = {}): Demo {
  const npm = spawn("npm", ["run", "demo"], {
    detached: true,
    env: demoEnv(extra),
    stdio: ["ignore", "pipe", "pipe"],
  });
  let output = "";
  npm.stdout!.setEncoding("utf8").on("data", (d: string) => (output += d));
  npm.stderr!.setEncoding("utf8").on("data", (d: string) => (output += d));
  const seen = new Set<number>();
  const exited = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((r) =>
    npm.once("exit", (code, signal) => r({ code, signal })),
  );
  const watch = setInterval(() => {
    for (const pid of descendants(npm.pid!)) seen.add(pid);
    const pg = postmasterPid(cluster);
    if (pg !== null && alive(pg)) seen.add(pg);
  }, 100);
  return { npm, output: () => output, seen, exited, stopWatching: () => clearInterval(watch) };
}

async function untilServing(demo: Demo): Promise<void> {
  const deadline = Date.now() + 150_000;
  while (!demo.output().includes("Sward is running at")) {
    if (demo.npm.exitCode !== null || demo.npm.signalCode !== null)
      throw new Error(`the demo ended before serving:\n${demo.output()}`);
    if (Date.now() > deadline) throw new Error(`the demo did not start:\n${demo.output()}`);
    await sleep(200);
  }
  await sleep(300); // one more look at the process tree
}

async function openPorts(): Promise<string[]> {
  const open: string[] = [];
  for (const [name, port] of Object.entries(PORTS))
    if (await isListening(port)) open.push(`${name} ${port}`);
  return open;
}

/** Waits (up to 15 s) until none of the PIDs is alive and no port answers; returns what is left. */
async function leftovers(pids: Iterable<number>): Promise<{ pids: number[]; ports: string[] }> {
  const all = [...pids];
  const deadline = Date.now() + 15_000;
  for (;;) {
    const left = { pids: all.filter(alive), ports: await openPorts() };
    if ((!left.pids.length && !left.ports.length) || Date.now() > deadline) return left;
    await sleep(200);
  }
}

const demos: Demo[] = [];

beforeAll(async () => {
  await stopCluster(cluster);
  if ((await openPorts()).length)
    throw new Error(
      `harness test: one of ${JSON.stringify(PORTS)} is in use; set SWARD_E2E_PORT / SWARD_PG_PORT`,
    );
  rmSync(path.join(ARTIFACTS, "mail"), { recursive: true, force: true });
}, 30_000);

afterAll(async () => {
  // Whatever a failed assertion left behind.
  for (const d of demos) {
    d.stopWatching();
    for (const pid of d.seen) if (alive(pid)) process.kill(pid, "SIGKILL");
  }
  await stopCluster(cluster);
}, 30_000);

describe("npm run demo stops everything it started", () => {
  const serving = async (stop: (demo: Demo) => void) => {
    const demo = startDemo();
    demos.push(demo);
    await untilServing(demo);
    const started = [...demo.seen];
    // What the demo starts is really there: the checks below can fail.
    expect(await openPorts()).toEqual(Object.entries(PORTS).map(([n, p]) => `${n} ${p}`));
    expect(started.length).toBeGreaterThanOrEqual(9); // node, watchdog, server, worker, 3 fakes (+ tsx's), postmaster
    const server = Number(/server PID (\d+)/.exec(demo.output())?.[1]);
    const worker = Number(/worker PID (\d+)/.exec(demo.output())?.[1]);
    expect(started).toEqual(expect.arrayContaining([server, worker, postmasterPid(cluster)]));

    stop(demo);
    await demo.exited;
    demo.stopWatching();
    expect(await leftovers(demo.seen)).toEqual({ pids: [], ports: [] });
    return demo;
  };

  it("on SIGTERM sent to the npm process", async () => {
    const demo = await serving((d) => process.kill(d.npm.pid!, "SIGTERM"));
    expect(demo.output()).toContain("demo: SIGTERM; stopping what it started");
  }, 200_000);

  it("on Ctrl-C (SIGINT to the terminal's process group)", async () => {
    const demo = await serving((d) => process.kill(-d.npm.pid!, "SIGINT"));
    expect(demo.output()).toContain("demo: SIGINT; stopping what it started");
  }, 200_000);

  it("when npm is killed with SIGKILL (the demo notices its parent is gone)", async () => {
    const demo = await serving((d) => process.kill(d.npm.pid!, "SIGKILL"));
    expect(demo.output()).toMatch(/demo: the process that started it \(.*npm.*\) is gone/);
  }, 200_000);

  it("when the demo itself is killed with SIGKILL (its watchdog stops the rest)", async () => {
    const demo = await serving((d) => {
      const node = descendants(d.npm.pid!).find((pid) =>
        readFileSync(`/proc/${pid}/cmdline`, "utf8").includes("tests/harness/demo.ts"),
      );
      process.kill(node!, "SIGKILL");
    });
    expect(demo.output()).toContain("demo watchdog: the demo ended without stopping");
    expect(demo.output()).toMatch(/demo watchdog: .*db\/cluster\.sh stop/);
  }, 200_000);

  it("when a step fails: a broken DATABASE_URL (PostgreSQL it started is stopped)", async () => {
    const demo = startDemo({ DATABASE_URL: `postgres://postgres@127.0.0.1:${PG_PORT}/no_such_db` });
    demos.push(demo);
    const { code } = await demo.exited;
    demo.stopWatching();
    expect(code).not.toBe(0);
    expect(demo.output()).toContain('demo: migrate ("node_modules/.bin/tsx db/migrate.ts") exited');
    expect(demo.output()).toContain("db: stopped");
    expect([...demo.seen].length).toBeGreaterThanOrEqual(3); // node, watchdog, postmaster at least
    expect(await leftovers(demo.seen)).toEqual({ pids: [], ports: [] });
  }, 120_000);

  it("when the build fails, and leaves a PostgreSQL that was already running", async () => {
    const start = spawnSync("sh", ["db/cluster.sh", "start"], {
      env: { ...process.env, ...cluster.env },
    });
    expect(start.status).toBe(0);
    const postmaster = postmasterPid(cluster)!;
    const demo = startDemo({ SWARD_HARNESS_FAIL_STEP: "build" });
    demos.push(demo);
    const { code } = await demo.exited;
    demo.stopWatching();
    expect(code).not.toBe(0);
    expect(demo.output()).toContain('demo: step "build" failed');
    expect(demo.output()).toContain("reusing the server already running");
    demo.seen.delete(postmaster);
    expect(await leftovers(demo.seen)).toEqual({
      pids: [],
      ports: [`postgres ${PG_PORT}`], // still running, as before the demo
    });
    expect(alive(postmaster)).toBe(true);
    await stopCluster(cluster);
    expect(alive(postmaster)).toBe(false);
  }, 120_000);
});
