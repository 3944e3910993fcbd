// `npm test`: typecheck, lint, unit, integration (real PostgreSQL) and e2e (Chromium against a
// production build), in that order. Starts the database server when it is not running and stops
// it again afterwards. Prints a summary with timings and a closing "N passed, N failed" line.
import { spawnSync } from "node:child_process";
import { mkdirSync, readFileSync, rmSync } from "node:fs";

import { ensureChromium } from "./chromium.mjs";

process.chdir(new URL("../..", import.meta.url).pathname);
const env = { ...process.env, NEXT_TELEMETRY_DISABLED: "1" };
const artifacts = "tests/.artifacts";
mkdirSync(artifacts, { recursive: true });

const steps = [];
function step(name, command, args, { parse } = {}) {
  console.log(`\n▶ ${name}: ${command} ${args.join(" ")}`);
  const started = Date.now();
  const result = spawnSync(command, args, { stdio: "inherit", env });
  const seconds = (Date.now() - started) / 1000;
  const ok = result.status === 0;
  steps.push({ name, ok, seconds, counts: parse?.() });
  return ok;
}

function vitestCounts(file) {
  try {
    const report = JSON.parse(readFileSync(file, "utf8"));
    return {
      passed: report.numPassedTests,
      failed: report.numFailedTests,
      skipped: report.numPendingTests + report.numTodoTests,
    };
  } catch {
    return undefined;
  }
}

function vitest(project) {
  const output = `${artifacts}/vitest-${project}.json`;
  rmSync(output, { force: true });
  return step(
    project,
    "node_modules/.bin/vitest",
    [
      "run",
      "--project",
      project,
      "--reporter=default",
      "--reporter=json",
      `--outputFile.json=${output}`,
    ],
    {
      parse: () => vitestCounts(output),
    },
  );
}

ensureChromium();
const wasRunning = spawnSync("sh", ["db/cluster.sh", "status"], { stdio: "ignore" }).status === 0;
let ok = step("database", "sh", ["db/cluster.sh", "start"]);
try {
  ok &&= step("typecheck", "sh", [
    "-c",
    "node_modules/.bin/next typegen >/dev/null && node_modules/.bin/tsc --noEmit",
  ]);
  ok &&= step("lint", "npm", ["run", "--silent", "lint"]);
  ok &&= vitest("unit");
  ok &&= vitest("integration");
  ok &&= step("build", "node", ["node_modules/next/dist/bin/next", "build"]);
  ok &&= vitest("e2e");
} finally {
  if (!wasRunning) spawnSync("sh", ["db/cluster.sh", "stop"], { stdio: "inherit" });
}

console.log("\n── npm test summary ──");
let passed = 0;
let failed = 0;
for (const s of steps) {
  const counts = s.counts ? `  ${s.counts.passed} passed, ${s.counts.failed} failed` : "";
  console.log(
    `${s.ok ? "✓" : "✗"} ${s.name.padEnd(12)} ${s.seconds.toFixed(1).padStart(6)} s${counts}`,
  );
  if (s.counts) {
    passed += s.counts.passed;
    failed += s.counts.failed;
  } else if (!s.ok) failed += 1;
}
if (!ok && failed === 0) failed = 1;
console.log(`${passed} passed, ${failed} failed`);
process.exit(ok ? 0 : 1);
