// The layer check of `npm run lint` (tests/harness/layers.mjs with .dependency-cruiser.cjs): the
// real tree has no violation besides the known list, and a tree with planted violations (a
// cycle between two lib/ folders, a migration importing lib/, pure cores reaching the database
// and server-only, db/ and fixtures/ importing each other) fails with each one reported, also
// through the command `npm run lint:deps` runs.
import { execFile } from "node:child_process";
import { mkdirSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { promisify } from "node:util";
import { afterAll, beforeAll, describe, expect, it } from "vitest";

// @ts-expect-error -- a plain .mjs module (the lint runs it with node), no type declarations
import { checkLayers, describe as describeViolation } from "@/tests/harness/layers.mjs";

interface Violation {
  rule: { name: string };
  from: string;
  to: string;
  cycle?: { name: string }[];
}
interface Check {
  fresh: Violation[];
  known: number;
  stale: Violation[];
  modules: number;
}
const check = checkLayers as (o?: {
  baseDir?: string;
  dirs?: string[];
  knownFile?: string | null;
}) => Promise<Check>;

const root = path.resolve(import.meta.dirname, "../..");
const CRUISE_TIMEOUT = 120_000; // the whole tree on a busy machine

describe("the real tree", () => {
  it(
    "has no violation besides the known list",
    async () => {
      const result = await check();
      for (const v of result.fresh)
        console.error(await (describeViolation as (v: Violation) => Promise<string>)(v));
      console.log(
        `layers: ${result.modules} modules, ${result.known} known violation(s), ${result.fresh.length} new, ${result.stale.length} stale`,
      );
      expect(result.modules).toBeGreaterThan(300); // it did cruise the app
      expect(result.fresh).toEqual([]);
    },
    CRUISE_TIMEOUT,
  );
});

describe("a tree with planted violations", () => {
  let tree = "";
  const write = (file: string, text: string) => {
    mkdirSync(path.dirname(path.join(tree, file)), { recursive: true });
    writeFileSync(path.join(tree, file), text);
  };

  beforeAll(() => {
    tree = mkdtempSync(path.join(tmpdir(), "sward-layers-"));
    // (relative imports: the rules judge resolved paths, however an import is spelled)
    // lib/alpha ↔ lib/beta: a module cycle and a folder cycle
    write(
      "lib/alpha/one.ts",
      'import { two } from "../beta/two";\nexport const one = () => two() + 1;\n',
    );
    write(
      "lib/beta/two.ts",
      'import { one } from "../alpha/one";\nexport const two = () => (one ? 2 : 0);\n',
    );
    // a migration importing app code; a pure core importing the database
    write("db/index.ts", "export const db = () => null;\n");
    write(
      "db/migrations/2026-01-01T0000-x.ts",
      'import { one } from "../../lib/alpha/one";\nexport const up = one;\n',
    );
    write("lib/scoring/weights.ts", 'import { db } from "../../db";\nexport const w = db;\n');
    write("lib/agronomy/units.ts", 'import "server-only";\nexport const u = 1;\n');
    // db/ ↔ fixtures/: a folder cycle outside lib/ (a database script reaching for the demo)
    write(
      "db/seed.ts",
      'import { company } from "../fixtures/demo/scenario";\nexport const s = company;\n',
    );
    write(
      "fixtures/demo/scenario.ts",
      'import { db } from "../../db";\nexport const company = db;\n',
    );
  });
  afterAll(() => rmSync(tree, { recursive: true, force: true }));

  it(
    "reports each planted violation, through the API and through the lint's command",
    async () => {
      const result = await check({ baseDir: tree, dirs: ["db", "fixtures", "lib"] });
      const found = result.fresh.map((v) => `${v.rule.name}: ${v.from} → ${v.to}`).sort();
      expect(found).toEqual([
        "db-imports-no-feature: db/migrations/2026-01-01T0000-x.ts → lib/alpha/one.ts",
        "db-imports-no-feature: db/seed.ts → fixtures/demo/scenario.ts",
        "migrations-import-no-app-code: db/migrations/2026-01-01T0000-x.ts → lib/alpha/one.ts",
        "no-circular: lib/alpha/one.ts → lib/beta/two.ts", // one report per module cycle
        "no-folder-cycle: db → fixtures/demo",
        "no-folder-cycle: fixtures/demo → db",
        "no-lib-folder-cycle: lib/alpha → lib/beta",
        "no-lib-folder-cycle: lib/beta → lib/alpha",
        "pure-core-no-server-only: lib/agronomy/units.ts → server-only",
        "pure-core-stays-pure: lib/agronomy/units.ts → server-only",
        "pure-core-stays-pure: lib/scoring/weights.ts → db/index.ts",
      ]);
      // the real known list does not hide them
      expect(result.known).toBe(0);

      // the command of `npm run lint:deps`, run in the planted tree's place, fails and says why
      const run = promisify(execFile);
      const failed = await run(process.execPath, [path.join(root, "tests/harness/layers.mjs")], {
        env: { ...process.env, SWARD_LAYERS_BASE_DIR: tree },
      }).then(
        () => null,
        (err: { code: number; stderr: string }) => err,
      );
      expect(failed?.code).toBe(1);
      expect(failed?.stderr).toContain("no-lib-folder-cycle: lib/alpha → lib/beta");
      expect(failed?.stderr).toContain("cycle: lib/alpha → lib/beta → lib/alpha");
      expect(failed?.stderr).toMatch(/11 new violation\(s\)/);
    },
    CRUISE_TIMEOUT,
  );
});
