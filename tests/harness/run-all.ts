// `npm test`: typecheck, lint, unit, integration (real PostgreSQL) and e2e (Chromium against a
// production build), in that order. Starts the database server when it is not running and stops
// it again afterwards. Prints a summary with timings and a closing "N passed, N failed" line.
// Each step runs in a process group of its own under tests/harness/supervisor.ts: Ctrl-C, SIGTERM
// (to this process or to npm) or the end of npm stop the running step and the database server.
import { mkdirSync, readFileSync, rmSync } from "node:fs";

import { ensureChromium } from "./chromium";
import { Supervisor } from "./supervisor";

process.chdir(new URL("../..", import.meta.url).pathname);
const env = { NEXT_TELEMETRY_DISABLED: "1" };
const artifacts = "tests/.artifacts";
mkdirSync(artifacts, { recursive: true });

interface Counts {
  passed: number;
  failed: number;
  skipped: number;
}
const steps: { name: string; ok: boolean; seconds: number; counts: Counts | undefined }[] = [];
const sup = new Supervisor("npm test");

async function step(
  name: string,
  command: string,
  args: string[],
  { parse }: { parse?: () => Counts | undefined } = {},
): Promise<boolean> {
  console.log(`\n▶ ${name}: ${command} ${args.join(" ")}`);
  const started = Date.now();
  const result = await sup.run(name, command, args, { env });
  const seconds = (Date.now() - started) / 1000;
  const ok = result.code === 0;
  steps.push({ name, ok, seconds, counts: parse?.() });
  return ok;
}

function vitestCounts(file: string): Counts | undefined {
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

function vitest(project: string): Promise<boolean> {
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

await sup.main(async () => {
  ensureChromium();
  let ok = true;
  console.log("\n▶ database: sh db/cluster.sh start");
  const database = Date.now();
  try {
    await sup.cluster(); // stopped again by the supervisor when this run started it
  } catch (err) {
    console.error(err instanceof Error ? err.message : err);
    ok = false;
  }
  steps.push({ name: "database", ok, seconds: (Date.now() - database) / 1000, counts: undefined });
  ok &&= await step("typecheck", "sh", [
    "-c",
    "node_modules/.bin/next typegen >/dev/null && node_modules/.bin/tsc --noEmit",
  ]);
  ok &&= await step("lint", "npm", ["run", "--silent", "lint"]);
  ok &&= await vitest("unit");
  ok &&= await vitest("integration");
  ok &&= await step("build", "node", ["node_modules/next/dist/bin/next", "build"]);
  ok &&= await vitest("e2e");
  await sup.stop();
  summary(ok);
  return ok ? 0 : 1;
});

function summary(ok: boolean): void {
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
}
