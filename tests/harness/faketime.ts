// A shifted clock for tests that must run on another day (the demo seeded for a date in each
// season, tests/e2e/seasons.test.ts): Debian's libfaketime, preloaded into PostgreSQL, the seed,
// the fake weather service and the web server, so that they all read the same shifted wall
// clock (now(), new Date(), todayIn()). Installs the package with apt-get as root when missing,
// as tests/harness/chromium.ts does for Chromium. Monotonic clocks are left alone (timers,
// timeouts and process watchdogs keep real time).
import { execFileSync } from "node:child_process";
import { existsSync, readdirSync } from "node:fs";
import path from "node:path";

function findLibrary(): string | null {
  const roots = ["/usr/lib", "/usr/lib64"];
  for (const root of roots) {
    const direct = path.join(root, "faketime", "libfaketime.so.1");
    if (existsSync(direct)) return direct;
    if (!existsSync(root)) continue;
    for (const dir of readdirSync(root)) {
      const candidate = path.join(root, dir, "faketime", "libfaketime.so.1");
      if (existsSync(candidate)) return candidate;
    }
  }
  return null;
}

/** The path of libfaketime.so.1, installing Debian's faketime package when it is missing. */
export function ensureFaketime(): string {
  const found = findLibrary();
  if (found) return found;
  if (process.getuid?.() !== 0)
    throw new Error(
      "libfaketime not found. Install it with: sudo apt-get install faketime (Debian's package).",
    );
  console.log("setup: installing Debian's faketime package (apt-get)…");
  execFileSync(
    "sh",
    [
      "-c",
      "apt-get update -qq && DEBIAN_FRONTEND=noninteractive apt-get install -y -qq faketime >/dev/null",
    ],
    { stdio: "inherit" },
  );
  const installed = findLibrary();
  if (!installed) throw new Error("apt-get finished but libfaketime.so.1 is still missing.");
  return installed;
}

/**
 * Environment that shifts a process's wall clock by a whole number of seconds (libfaketime's
 * relative form, "+N" or "-N" seconds): every process started with the same offset agrees.
 */
export function shiftedClock(library: string, offsetSeconds: number): Record<string, string> {
  const s = Math.round(offsetSeconds);
  return {
    LD_PRELOAD: library,
    FAKETIME: `${s < 0 ? "-" : "+"}${Math.abs(s)}`,
    FAKETIME_DONT_FAKE_MONOTONIC: "1",
  };
}
