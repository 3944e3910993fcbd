// One owner for everything a harness starts — `npm run demo`, `npm test`, the crash suite, the
// benchmark and the vitest global setups — so that all of it stops again on every exit path:
// Ctrl-C, SIGTERM or SIGHUP, a step that fails, an exception, and the death of the process that
// started the harness or of the harness itself.
//
// - Every child (a step such as `next build`, a server, the worker, a fake service) runs in a
//   process group of its own, so stopping it reaches its own children too (tsx's, Next's).
//   Stopping is SIGTERM to the group, then SIGKILL after 5 s if a member is still alive.
// - A standalone harness handles SIGINT, SIGTERM and SIGHUP: it stops what it started, then exits
//   with 128 + the signal's number. Steps run asynchronously, so a signal is handled at once even
//   in the middle of a build.
// - It watches the processes that started it (up to npm when it runs under `npm run`): when one
//   of them is gone — npm killed with SIGKILL, the `sh -c` between npm and node killed — it
//   stops and exits as on SIGTERM.
// - A watchdog process (tests/harness/reaper.mjs), detached and connected by a pipe, stops what
//   is left when the harness itself ends without cleaning up (SIGKILL, a crash, process.exit).
// - PostgreSQL (db/cluster.sh) is started when it is not running and then stopped at the end;
//   a server that was already running is reused and left running.
//
// SWARD_HARNESS_FAIL_STEP=<step name> makes that step fail when it is reached (tests only).
import { spawn, type ChildProcess, type StdioOptions } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";
import type { Socket } from "node:net";
import path from "node:path";

const GRACE_MS = 5_000;
const REAPER = new URL("./reaper.mjs", import.meta.url).pathname;
const CLUSTER_SH = path.resolve(new URL("../../db/cluster.sh", import.meta.url).pathname);

type Env = Record<string, string | undefined>;

/** A step that failed, or that could not start because the harness is stopping. */
export class StepFailed extends Error {}

interface Started {
  name: string;
  child: ChildProcess;
  /** The child's PID, which is also its process group's id. */
  pid: number;
  /** Settles when the child has exited (or could not be started). */
  done: Promise<{ code: number | null; signal: NodeJS.Signals | null }>;
}

interface Deferred {
  name: string;
  run: () => Promise<void>;
  orphanCommand?: string;
}

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Live (not zombie) members of a process group. A zombie has ended; only its parent's wait() is missing. */
function groupMembers(pgid: number): number[] {
  if (process.platform !== "linux") {
    try {
      process.kill(-pgid, 0);
      return [pgid];
    } catch (err) {
      return (err as NodeJS.ErrnoException).code === "EPERM" ? [pgid] : [];
    }
  }
  const found: number[] = [];
  for (const name of readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    const stat = procStat(Number(name));
    if (stat && stat.pgrp === pgid && stat.state !== "Z") found.push(Number(name));
  }
  return found;
}

/** Fields of /proc/<pid>/stat (Linux), or null when the process does not exist. */
export function procStat(
  pid: number,
): { state: string; ppid: number; pgrp: number; startTime: string } | null {
  try {
    const stat = readFileSync(`/proc/${pid}/stat`, "utf8");
    const rest = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
    return {
      state: rest[0]!,
      ppid: Number(rest[1]),
      pgrp: Number(rest[2]),
      startTime: rest[19]!,
    };
  } catch {
    return null;
  }
}

function signalGroup(pgid: number, signal: NodeJS.Signals): void {
  try {
    process.kill(-pgid, signal);
  } catch {
    /* already gone */
  }
}

interface Ancestor {
  pid: number;
  startTime: string;
  name: string;
}

/**
 * The processes whose end should end the harness: under `npm run`, every process up to and
 * including npm (npm → sh -c → node); otherwise the parent alone. Linux only (/proc).
 */
function ancestorsToWatch(): Ancestor[] {
  const chain: Ancestor[] = [];
  let pid = process.ppid;
  for (let depth = 0; depth < 6 && pid > 1; depth++) {
    const stat = procStat(pid);
    if (!stat) break;
    let cmdline = "";
    try {
      cmdline = readFileSync(`/proc/${pid}/cmdline`, "utf8").replaceAll("\0", " ").trim();
    } catch {
      /* ended meanwhile */
    }
    chain.push({ pid, startTime: stat.startTime, name: cmdline.slice(0, 60) || String(pid) });
    if (/(^|[/\s])npm(-cli\.js)?(\s|$)/.test(cmdline)) return chain;
    pid = stat.ppid;
  }
  return chain.slice(0, 1);
}

export class Supervisor {
  private readonly running = new Map<number, Started>();
  private readonly deferred: Deferred[] = [];
  private reaper: ChildProcess | undefined;
  private stopping: Promise<void> | undefined;
  /** Set by exit(): a signal's (or a lost parent's) exit is under way and ends the process. */
  private exiting = false;
  private firstSignalAt = 0;
  /** What was running when stop() began: a second Ctrl-C kills these (never the clean-ups). */
  private stoppingChildren: Started[] = [];

  /**
   * @param label how messages name the harness ("demo", "npm test"…)
   * @param standalone the harness owns its process (signal handlers, exit); false inside a
   *   process that is not ours (a vitest global setup), where only the watchdog and the groups
   *   are used and stop() is called by the teardown.
   */
  constructor(
    readonly label: string,
    private readonly standalone = true,
  ) {
    this.startReaper();
    process.on("exit", () => this.signalAll("SIGTERM"));
    if (!standalone) return;
    for (const signal of ["SIGINT", "SIGTERM", "SIGHUP"] as const)
      process.on(signal, () => this.onSignal(signal));
    process.on("uncaughtException", (err) => {
      console.error(err);
      void this.exit(1);
    });
    process.on("unhandledRejection", (err) => {
      console.error(err);
      void this.exit(1);
    });
    this.watchAncestors();
  }

  get isStopping(): boolean {
    return this.stopping !== undefined;
  }

  /** The PIDs (= process groups) of what runs now. */
  get pids(): number[] {
    return [...this.running.keys()];
  }

  /** Starts a long-running child in a process group of its own; stop() stops it. */
  start(
    name: string,
    command: string,
    args: string[],
    options: { env?: Env; stdio?: StdioOptions } = {},
  ): Started {
    if (this.stopping) throw new StepFailed(`${this.label}: not starting ${name}: stopping`);
    return this.launch(name, command, args, options);
  }

  /** Runs a step to completion and returns its exit code (and its output where `stdio` pipes it, or with `capture`). */
  async run(
    name: string,
    command: string,
    args: string[],
    options: { env?: Env; stdio?: StdioOptions; capture?: boolean } = {},
  ): Promise<{
    code: number | null;
    signal: NodeJS.Signals | null;
    stdout: string;
    stderr: string;
  }> {
    if (process.env.SWARD_HARNESS_FAIL_STEP === name)
      throw new StepFailed(
        `${this.label}: step "${name}" failed (forced by SWARD_HARNESS_FAIL_STEP)`,
      );
    const stdio: StdioOptions = options.stdio ?? [
      "ignore",
      options.capture ? "pipe" : "inherit",
      "inherit",
    ];
    const started = this.start(name, command, args, { env: options.env, stdio });
    let stdout = "";
    let stderr = "";
    started.child.stdout?.setEncoding("utf8").on("data", (d: string) => (stdout += d));
    started.child.stderr?.setEncoding("utf8").on("data", (d: string) => (stderr += d));
    const { code, signal } = await started.done;
    if (this.stopping) throw new StepFailed(`${this.label}: ${name} stopped`);
    return { code, signal, stdout, stderr };
  }

  /** Runs a step to completion; throws StepFailed unless it exits with 0. Returns captured output. */
  async step(
    name: string,
    command: string,
    args: string[],
    options: { env?: Env; capture?: boolean } = {},
  ): Promise<string> {
    const r = await this.run(name, command, args, options);
    if (r.code !== 0)
      throw new StepFailed(
        `${this.label}: ${name} ("${command} ${args.join(" ")}") ${r.signal ? `ended by ${r.signal}` : `exited with ${r.code}`}; see the messages above.`,
      );
    return r.stdout;
  }

  /**
   * Registers a clean-up for stop(), run after every child has stopped, the last registered
   * first. `orphanCommand` is what the watchdog runs instead if the harness ends without stop().
   */
  defer(
    name: string,
    run: () => Promise<void>,
    orphanCommand?: { argv: string[]; env?: Env },
  ): void {
    const entry: Deferred = { name, run };
    if (orphanCommand) {
      entry.orphanCommand = `${name} ${this.deferred.length}`;
      this.tell({
        command: entry.orphanCommand,
        argv: orphanCommand.argv,
        env: Object.fromEntries(
          Object.entries(orphanCommand.env ?? {}).filter(([, v]) => v !== undefined),
        ),
      });
    }
    this.deferred.push(entry);
  }

  /**
   * PostgreSQL through db/cluster.sh (SWARD_PG_PORT / SWARD_PG_DATA from `env` or the process):
   * started when nothing answers on its port, and then stopped by stop(); a server that was
   * already running is reused and left running.
   */
  async cluster(env: Env = {}): Promise<{ startedHere: boolean }> {
    const status = await this.run("database status", "sh", [CLUSTER_SH, "status"], {
      env,
      stdio: "ignore",
    });
    const startedHere = status.code !== 0;
    if (startedHere) {
      const merged = { ...process.env, ...env };
      const clusterEnv = {
        SWARD_PG_PORT: merged.SWARD_PG_PORT,
        SWARD_PG_DATA: merged.SWARD_PG_DATA,
      };
      this.defer(
        "stop PostgreSQL",
        async () => {
          await this.launch("stop PostgreSQL", "sh", [CLUSTER_SH, "stop"], { env }).done;
        },
        { argv: ["sh", CLUSTER_SH, "stop"], env: clusterEnv },
      );
    }
    await this.step("database", "sh", [CLUSTER_SH, "start"], { env });
    return { startedHere };
  }

  /**
   * Stops everything: every child's process group at once (SIGTERM, or `signal`; SIGKILL after
   * 5 s), then the deferred clean-ups, last registered first. Idempotent.
   */
  stop(signal: NodeJS.Signals = "SIGTERM"): Promise<void> {
    this.stopping ??= (async () => {
      this.stoppingChildren = [...this.running.values()];
      await Promise.all(this.stoppingChildren.map((s) => this.stopGroup(s, signal)));
      for (const d of this.deferred.reverse()) {
        try {
          await d.run();
        } catch (err) {
          console.error(`${this.label}: ${d.name} failed:`, err);
        }
        if (d.orphanCommand) this.tell({ forgetCommand: d.orphanCommand });
      }
      this.reaper?.stdin?.end();
    })();
    return this.stopping;
  }

  /** Standalone: stops everything, then exits with `code`. */
  async exit(code: number, signal: NodeJS.Signals = "SIGTERM"): Promise<never> {
    this.exiting = true;
    await this.stop(signal);
    process.exit(code);
  }

  /**
   * Runs the harness's work; when it returns (its exit code) or throws (a failed step: exit 1),
   * stops everything and exits. A signal's own exit takes precedence.
   */
  async main(work: () => Promise<number | void>): Promise<never> {
    let code: number;
    try {
      code = (await work()) ?? 0;
    } catch (err) {
      if (!this.stopping) console.error(err instanceof StepFailed ? err.message : err);
      code = 1;
    }
    if (this.exiting) {
      await this.stopping;
      await new Promise(() => {}); // the signal handler's exit follows
    }
    // Also when the work stopped everything itself (sup.stop()): the exit code is the work's.
    return this.exit(code);
  }

  private launch(
    name: string,
    command: string,
    args: string[],
    options: { env?: Env; stdio?: StdioOptions },
  ): Started {
    const child = spawn(command, args, {
      detached: true, // a process group of its own (and no Ctrl-C from the terminal: we forward it)
      stdio: options.stdio ?? ["ignore", "inherit", "inherit"],
      env: { ...process.env, ...options.env },
    });
    const pid = child.pid ?? -1;
    const done = new Promise<{ code: number | null; signal: NodeJS.Signals | null }>((resolve) => {
      child.once("exit", (code, signal) => resolve({ code, signal }));
      child.once("error", (err) => {
        console.error(`${this.label}: could not start ${name} (${command}): ${err.message}`);
        resolve({ code: null, signal: null });
      });
    });
    const started: Started = { name, child, pid, done };
    if (pid > 0) {
      this.running.set(pid, started);
      this.tell({ group: pid });
      void done.then(() => {
        // Members of the group may outlive its leader; stop() still reaches them then.
        if (groupMembers(pid).length === 0 && this.running.get(pid) === started) {
          this.running.delete(pid);
          this.tell({ forget: pid });
        }
      });
    }
    return started;
  }

  private async stopGroup(s: Started, signal: NodeJS.Signals): Promise<void> {
    signalGroup(s.pid, signal);
    const deadline = Date.now() + GRACE_MS;
    while (groupMembers(s.pid).length > 0 && Date.now() < deadline) await sleep(100);
    if (groupMembers(s.pid).length > 0) {
      console.error(
        `${this.label}: ${s.name} (PID ${s.pid}) still running after ${GRACE_MS / 1000} s; SIGKILL`,
      );
      signalGroup(s.pid, "SIGKILL");
      const hard = Date.now() + 2_000;
      while (groupMembers(s.pid).length > 0 && Date.now() < hard) await sleep(50);
    }
    await Promise.race([s.done, sleep(1_000)]);
    this.running.delete(s.pid);
    this.tell({ forget: s.pid });
  }

  private signalAll(signal: NodeJS.Signals): void {
    for (const pid of this.running.keys()) signalGroup(pid, signal);
  }

  private onSignal(signal: NodeJS.Signals): void {
    if (this.firstSignalAt) {
      // Ctrl-C under npm arrives twice at once (from the terminal and forwarded by npm); a
      // second one pressed later means "now": SIGKILL to what is still stopping.
      if (Date.now() - this.firstSignalAt < 1_000) return;
      console.error(`${this.label}: ${signal} again; SIGKILL to what is still stopping`);
      for (const s of this.stoppingChildren) signalGroup(s.pid, "SIGKILL");
      return;
    }
    this.firstSignalAt = Date.now();
    console.error(`\n${this.label}: ${signal}; stopping what it started…`);
    const number = { SIGINT: 2, SIGTERM: 15, SIGHUP: 1 }[signal as string] ?? 15;
    void this.exit(128 + number, signal === "SIGINT" ? "SIGINT" : "SIGTERM");
  }

  private watchAncestors(): void {
    if (process.platform !== "linux") {
      const parent = process.ppid;
      const timer = setInterval(() => {
        if (process.ppid === parent) return;
        clearInterval(timer);
        console.error(
          `${this.label}: its parent (PID ${parent}) is gone; stopping what it started…`,
        );
        void this.exit(129);
      }, 300);
      timer.unref();
      return;
    }
    const chain = ancestorsToWatch();
    const timer = setInterval(() => {
      const gone = chain.find((a) => {
        const now = procStat(a.pid);
        return !now || now.state === "Z" || now.startTime !== a.startTime;
      });
      if (!gone) return;
      clearInterval(timer);
      console.error(
        `${this.label}: the process that started it (${gone.name}, PID ${gone.pid}) is gone; stopping what it started…`,
      );
      void this.exit(129);
    }, 300);
    timer.unref();
  }

  private startReaper(): void {
    const reaper = spawn(process.execPath, [REAPER, this.label], {
      detached: true,
      stdio: ["pipe", "ignore", "inherit"],
    });
    reaper.unref();
    reaper.on("error", () => {});
    (reaper.stdin as unknown as Socket | null)?.unref();
    reaper.stdin?.on("error", () => {}); // the watchdog gone: nothing left to tell it
    this.reaper = reaper;
  }

  private tell(message: object): void {
    if (this.reaper?.stdin?.writable) this.reaper.stdin.write(`${JSON.stringify(message)}\n`);
  }
}
