// The harness's exit code is its work's, also when the work stops what it started itself
// (npm test calls sup.stop() before its summary; a hang there ended node with code 13 —
// "unsettled top-level await" — after a green run, and CI read that as a failure).
import { spawnSync } from "node:child_process";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, describe, expect, it } from "vitest";

const supervisor = path.resolve("tests/harness/supervisor.ts");
const dir = mkdtempSync(path.join(tmpdir(), "sward-supervisor-"));
afterAll(() => rmSync(dir, { recursive: true, force: true }));

function runHarness(body: string): number | null {
  const file = path.join(dir, `harness-${Math.random().toString(36).slice(2)}.mts`);
  writeFileSync(
    file,
    `import { Supervisor } from ${JSON.stringify(supervisor)};\n` +
      `const sup = new Supervisor("exit test");\n` +
      `await sup.main(async () => {\n${body}\n});\n`,
  );
  const result = spawnSync(process.execPath, ["--import", "tsx", file], {
    encoding: "utf8",
    timeout: 30_000,
  });
  return result.status;
}

describe("Supervisor.main exit codes", () => {
  it("exits 0 when the work stops everything itself and returns 0", () => {
    expect(runHarness(`await sup.run("echo", "true", []);\nawait sup.stop();\nreturn 0;`)).toBe(0);
  });
  it("exits with the work's code after its own stop", () => {
    expect(runHarness(`await sup.stop();\nreturn 3;`)).toBe(3);
  });
  it("exits 0 without an explicit stop", () => {
    expect(runHarness(`await sup.run("echo", "true", []);`)).toBe(0);
  });
});
