// The harness watchdog: a small detached process that outlives the harness that started it, and
// stops what that harness left behind if it ended without cleaning up (killed with SIGKILL, its
// terminal gone, a crash). Started by tests/harness/supervisor.ts; plain Node, no dependencies.
//
// It reads JSON lines on stdin, written by the harness as it starts and stops things:
//   {"group": 123}                    a process group the harness leads (a server, a worker, a step)
//   {"forget": 123}                   that group ended and was reaped
//   {"command": "pg", "argv": [...], "env": {...}}   run this when the harness is gone (PostgreSQL stop)
//   {"forgetCommand": "pg"}           the harness ran it itself
// The pipe closes when the harness process ends, however it ends. Then every group still
// registered gets SIGTERM, SIGKILL 5 s later if any member is left, and every registered command
// runs once. With nothing registered it exits at once (the usual case: the harness cleaned up).
import { spawnSync } from "node:child_process";
import { readdirSync, readFileSync } from "node:fs";

const GRACE_MS = 5_000;
const groups = new Set();
const commands = new Map();
const label = process.argv[2] ?? "harness";

// Ctrl-C and a closing terminal are the harness's to handle; the watchdog keeps watching.
process.on("SIGINT", () => {});
process.on("SIGHUP", () => {});

/** Live (not zombie) members of a process group; null where /proc cannot tell. */
function members(pgid) {
  if (process.platform !== "linux") {
    try {
      process.kill(-pgid, 0);
      return [pgid];
    } catch (err) {
      return err.code === "EPERM" ? [pgid] : [];
    }
  }
  const found = [];
  for (const name of readdirSync("/proc")) {
    if (!/^\d+$/.test(name)) continue;
    try {
      const stat = readFileSync(`/proc/${name}/stat`, "utf8");
      const rest = stat.slice(stat.lastIndexOf(")") + 2).split(" ");
      if (Number(rest[2]) === pgid && rest[0] !== "Z") found.push(Number(name));
    } catch {
      /* ended meanwhile */
    }
  }
  return found;
}

function say(line) {
  try {
    process.stderr.write(`${label} watchdog: ${line}\n`);
  } catch {
    /* nobody is reading any more */
  }
}

function signalGroup(pgid, signal) {
  try {
    process.kill(-pgid, signal);
  } catch {
    /* already gone */
  }
}

let cleaning = false;
async function cleanUp() {
  if (cleaning) return;
  cleaning = true;
  const left = [...groups].filter((g) => members(g).length > 0);
  if (left.length) {
    say(`the ${label} ended without stopping process group(s) ${left.join(", ")}; stopping them`);
    for (const g of left) signalGroup(g, "SIGTERM");
    const deadline = Date.now() + GRACE_MS;
    while (Date.now() < deadline && left.some((g) => members(g).length > 0))
      await new Promise((r) => setTimeout(r, 100));
    for (const g of left) if (members(g).length > 0) signalGroup(g, "SIGKILL");
  }
  for (const [id, { argv, env }] of commands) {
    say(`the ${label} ended without running "${argv.join(" ")}" (${id}); running it`);
    spawnSync(argv[0], argv.slice(1), {
      stdio: ["ignore", "ignore", "inherit"],
      env: { ...process.env, ...env },
      timeout: 60_000,
    });
  }
  process.exit(0);
}

let buffered = "";
process.stdin.setEncoding("utf8");
process.stdin.on("data", (chunk) => {
  buffered += chunk;
  let newline;
  while ((newline = buffered.indexOf("\n")) >= 0) {
    const line = buffered.slice(0, newline);
    buffered = buffered.slice(newline + 1);
    let message;
    try {
      message = JSON.parse(line);
    } catch {
      continue;
    }
    if (typeof message.group === "number") groups.add(message.group);
    else if (typeof message.forget === "number") groups.delete(message.forget);
    else if (typeof message.command === "string" && Array.isArray(message.argv))
      commands.set(message.command, { argv: message.argv, env: message.env ?? {} });
    else if (typeof message.forgetCommand === "string") commands.delete(message.forgetCommand);
  }
});
process.stdin.on("close", () => void cleanUp());
process.stdin.on("end", () => void cleanUp());
process.stdin.on("error", () => void cleanUp());
