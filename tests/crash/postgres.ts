// The crash suite's own PostgreSQL cluster, run by db/cluster.sh with a data folder and a port of
// its own (SWARD_PG_DATA, SWARD_PG_PORT), so the project's everyday cluster is never touched.
// kill9() kills the postmaster with SIGKILL (its PID from postmaster.pid) and waits until it is
// safe to start again: PostgreSQL refuses to start while a process of the old server is alive.
import { spawn, spawnSync } from "node:child_process";
import { existsSync, mkdirSync, readFileSync, rmSync, statSync } from "node:fs";
import net from "node:net";
import path from "node:path";

export interface Cluster {
  port: string;
  data: string;
  /** Environment for db/cluster.sh and the db/*.ts scripts. */
  env: Record<string, string>;
  url(database: string): string;
}

/** `preferred` when the server user can reach it (as root the server runs as "postgres"), else a folder in /tmp. */
export function crashCluster(port: string, preferred: string): Cluster {
  let data = path.resolve(preferred);
  if (process.getuid?.() === 0) {
    mkdirSync(path.dirname(data), { recursive: true });
    if (
      spawnSync("runuser", ["-u", "postgres", "--", "test", "-x", path.dirname(data)]).status !== 0
    )
      data = `/tmp/sward-crash-pg-${port}`;
  }
  return {
    port,
    data,
    env: { SWARD_PG_PORT: port, SWARD_PG_DATA: data },
    url: (database) => `postgres://postgres@127.0.0.1:${port}/${database}`,
  };
}

/** Runs a command with its output captured; rejects with that output when it fails. */
function capture(
  command: string,
  args: string[],
  env: Record<string, string> = {},
): Promise<string> {
  return new Promise((resolve, reject) => {
    const child = spawn(command, args, {
      stdio: ["ignore", "pipe", "pipe"],
      env: { ...process.env, ...env },
    });
    let out = "";
    child.stdout.on("data", (d) => (out += d));
    child.stderr.on("data", (d) => (out += d));
    child.on("error", reject);
    child.on("exit", (code) =>
      code === 0
        ? resolve(out)
        : reject(new Error(`${command} ${args.join(" ")} exited with ${code}:\n${out}`)),
    );
  });
}

const lockFile = (c: Cluster) => path.join(c.data, "postmaster.pid");
const serverLog = (c: Cluster) => path.join(c.data, "server.log");

/** The postmaster's PID and its System V interlock segment, from postmaster.pid (null when absent). */
function lock(c: Cluster): { pid: number; shmId: number | null } | null {
  if (!existsSync(lockFile(c))) return null;
  const lines = readFileSync(lockFile(c), "utf8").split("\n");
  const pid = Number(lines[0]);
  const shm = lines[6]?.trim().split(/\s+/);
  return Number.isInteger(pid) && pid > 0
    ? { pid, shmId: shm?.length === 2 ? Number(shm[1]) : null }
    : null;
}

export const postmasterPid = (c: Cluster): number | null => lock(c)?.pid ?? null;

/** "alive", "zombie" (dead, not yet reaped by its parent) or "gone". */
export function processState(pid: number): "alive" | "zombie" | "gone" {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    return stat.slice(stat.lastIndexOf(")") + 2, stat.lastIndexOf(")") + 3) === "Z"
      ? "zombie"
      : "alive";
  } catch {
    return "gone";
  }
}

/** How many live processes still have the segment attached (0 when it no longer exists). */
function attachedTo(shmId: number): number {
  const table = readFileSync("/proc/sysvipc/shm", "utf8").trim().split("\n");
  const header = table[0]!.trim().split(/\s+/);
  const idCol = header.indexOf("shmid");
  const nattchCol = header.indexOf("nattch");
  for (const line of table.slice(1)) {
    const cols = line.trim().split(/\s+/);
    if (Number(cols[idCol]) === shmId) return Number(cols[nattchCol]);
  }
  return 0;
}

async function startCluster(c: Cluster): Promise<void> {
  await capture("sh", ["db/cluster.sh", "start"], c.env);
}

/** A clean stop (pg_ctl -m fast); if that fails, SIGKILL to this cluster's own postmaster. */
export async function stopCluster(c: Cluster): Promise<void> {
  const pid = postmasterPid(c);
  if (pid === null || processState(pid) !== "alive") return;
  await capture("sh", ["db/cluster.sh", "stop"], c.env).catch(() => process.kill(pid, "SIGKILL"));
}

export function isListening(port: number): Promise<boolean> {
  return new Promise((resolve) => {
    const socket = net.connect({ host: "127.0.0.1", port });
    socket.once("connect", () => (socket.destroy(), resolve(true)));
    socket.once("error", () => resolve(false));
  });
}

/** Creates the data folder afresh (a previous run's cluster, if still running, is stopped first). */
export async function freshCluster(c: Cluster): Promise<void> {
  await stopCluster(c);
  // cluster.sh reuses whatever answers on the port: that must not be somebody else's server.
  if (await isListening(Number(c.port)))
    throw new Error(
      `crash: port ${c.port} is taken by a server this suite did not start; set SWARD_CRASH_PG_PORT`,
    );
  rmSync(c.data, { recursive: true, force: true });
  await startCluster(c);
}

/**
 * SIGKILL to the postmaster, then waits until no process of the old server is left: the backends
 * and helper processes notice the postmaster's death and exit by themselves, which detaches them
 * from the System V interlock segment that PostgreSQL itself checks before starting again.
 */
export async function kill9(c: Cluster): Promise<{ pid: number; settledMs: number }> {
  const held = lock(c);
  if (!held || processState(held.pid) !== "alive")
    throw new Error("crash: the PostgreSQL postmaster is not running");
  process.kill(held.pid, "SIGKILL");
  const started = Date.now();
  for (;;) {
    const postmaster = processState(held.pid);
    if (postmaster !== "alive" && (held.shmId === null || attachedTo(held.shmId) === 0)) {
      // Reaping orphans can lag by a second or two on some machines; PostgreSQL reads a zombie as a
      // running postmaster (kill(pid, 0) succeeds) and would refuse its lock files (the data
      // folder's and the socket's). Every process of the old server is dead at this point, so
      // both are stale and may go.
      if (postmaster === "zombie") {
        rmSync(lockFile(c), { force: true });
        rmSync(path.join(c.data, `.s.PGSQL.${c.port}.lock`), { force: true });
      }
      return { pid: held.pid, settledMs: Date.now() - started };
    }
    if (Date.now() - started > 30_000)
      throw new Error(
        `crash: processes of the killed PostgreSQL server (postmaster ${held.pid}) are still running after 30 s`,
      );
    await new Promise((r) => setTimeout(r, 25));
  }
}

/** Starts the cluster after a crash and returns what its log says about the recovery. */
export async function restartAfterCrash(c: Cluster): Promise<string> {
  const from = existsSync(serverLog(c)) ? statSync(serverLog(c)).size : 0;
  await startCluster(c);
  const log = readFileSync(serverLog(c)).subarray(from).toString("utf8");
  const redo = /redo done at ([0-9A-F]+\/[0-9A-F]+)/.exec(log);
  const wasCrash = /not properly shut down|was interrupted/.test(log);
  return wasCrash
    ? `crash recovery${redo ? `, redo done at ${redo[1]}` : " (no WAL to replay)"}`
    : "no crash recovery in the log";
}
