// The production server (`next start`) for the crash suite, as a direct child of this process so
// the PID it holds is the server's own (in a process group of its own, started through the
// suite's supervisor, which stops it on every exit path). kill9() is a SIGKILL to that PID; an
// exit nobody asked for (a crash of its own) is recorded, and the suite fails on it.
import type { ChildProcess } from "node:child_process";
import { closeSync, openSync } from "node:fs";

import type { Supervisor } from "../harness/supervisor";
import { waitForUrl } from "../helpers/processes";

export class WebServer {
  private child: ChildProcess | undefined;
  private exitExpected = false;
  /** Exits this suite did not cause: "code 1", "signal SIGSEGV"… */
  readonly unexpectedExits: string[] = [];
  /** While true, a server that exits by itself is started again (after being recorded), so the run can finish and report it. */
  keepAlive = false;

  constructor(
    private readonly sup: Supervisor,
    private readonly port: number,
    private readonly env: Record<string, string>,
    private readonly logFile: string,
  ) {}

  get pid(): number | undefined {
    return this.child?.exitCode === null && this.child.signalCode === null
      ? this.child.pid
      : undefined;
  }

  async start(): Promise<void> {
    const log = openSync(this.logFile, "a");
    const { child } = this.sup.start(
      "web server",
      "node",
      [
        "--import",
        "./lib/http/edge-address.mjs",
        "node_modules/next/dist/bin/next",
        "start",
        "-H",
        "127.0.0.1",
        "-p",
        String(this.port),
      ],
      { stdio: ["ignore", log, log], env: this.env },
    );
    closeSync(log);
    this.child = child;
    this.exitExpected = false;
    child.on("exit", (code, signal) => {
      if (this.exitExpected || this.child !== child) return;
      this.unexpectedExits.push(signal ? `signal ${signal}` : `code ${code}`);
      if (this.keepAlive)
        this.start().catch((err) =>
          this.unexpectedExits.push(`could not start again: ${String(err)}`),
        );
    });
    const gone = this.exited(child).then(() => {
      throw new Error(`crash: the web server exited while starting (see ${this.logFile})`);
    });
    await Promise.race([waitForUrl(`http://127.0.0.1:${this.port}/sign-in`, 30_000), gone]);
    gone.catch(() => undefined); // a later exit is reported through "exit" above
  }

  private exited(child: ChildProcess): Promise<void> {
    return child.exitCode !== null || child.signalCode !== null
      ? Promise.resolve()
      : new Promise((r) => child.once("exit", () => r()));
  }

  /** SIGKILL by PID; resolves once the process is gone (reaped by us: no zombie). */
  async kill9(): Promise<number> {
    const child = this.child;
    if (!child?.pid || this.pid === undefined)
      throw new Error("crash: the web server is not running");
    this.exitExpected = true;
    process.kill(child.pid, "SIGKILL");
    await this.exited(child);
    return child.pid;
  }

  /** SIGTERM, then SIGKILL after 5 s. */
  async stop(): Promise<void> {
    const child = this.child;
    if (!child?.pid || this.pid === undefined) return;
    this.exitExpected = true;
    child.kill("SIGTERM");
    const timer = setTimeout(() => child.kill("SIGKILL"), 5_000);
    await this.exited(child);
    clearTimeout(timer);
  }
}
