// The layer check of `npm run lint` (`npm run lint:deps`): dependency-cruiser with
// .dependency-cruiser.cjs over the app's folders, minus the known violations listed in
// .dependency-cruiser-known-violations.json. Prints each new violation and exits 1 when any.
//
// Why a wrapper and not `depcruise --ignore-known` alone: dependency-cruiser 17.3.9 ignores known
// module and dependency violations but not folder-level ones (scope: "folder"), so the folder
// cycles are matched here by rule, from-folder and to-folder (one violation per folder-to-folder
// import that lies on a cycle: a new import between lib/ folders that closes a cycle is new, the
// same tangle reported along another path is not).
//
// Used by tests/unit/layers.test.ts on the real tree and on a planted cycle in a temporary tree.
import { existsSync, readFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { fileURLToPath } from "node:url";
import { cruise } from "dependency-cruiser";
import extractDepcruiseOptions from "dependency-cruiser/config-utl/extract-depcruise-options";
import extractTSConfig from "dependency-cruiser/config-utl/extract-ts-config";

const ROOT = resolve(fileURLToPath(new URL("../..", import.meta.url)));
const CONFIG_FILE = join(ROOT, ".dependency-cruiser.cjs");
const KNOWN_FILE = join(ROOT, ".dependency-cruiser-known-violations.json");
/** The folders of the app (what `npm run lint:deps:baseline` cruises too). */
const APP_DIRS = ["app", "components", "db", "fixtures", "jobs", "lib", "tests", "proxy.ts"];

const sameViolation = (a, b) => a.rule.name === b.rule.name && a.from === b.from && a.to === b.to;

/**
 * Cruises `dirs` under `baseDir` with the config; returns the violations the baseline does not
 * list (`fresh`), those it does (`known`), and baseline entries no longer found (`stale`).
 */
export async function checkLayers({
  baseDir = ROOT,
  dirs = APP_DIRS,
  configFile = CONFIG_FILE,
  knownFile = KNOWN_FILE,
} = {}) {
  const options = await extractDepcruiseOptions(configFile);
  const known =
    knownFile && existsSync(knownFile) ? JSON.parse(readFileSync(knownFile, "utf8")) : [];
  // the tree's own tsconfig (its "@/…" paths), or none: never the current directory's
  const tsConfigFile = join(baseDir, "tsconfig.json");
  const { tsConfig: _cwdTsConfig, ...ruleOptions } = options.ruleSet.options ?? {};
  const hasTsConfig = existsSync(tsConfigFile);
  const { output } = await cruise(
    dirs.filter((d) => existsSync(join(baseDir, d))),
    {
      ...options,
      baseDir,
      ruleSet: {
        ...options.ruleSet,
        options: {
          ...ruleOptions,
          knownViolations: known,
          ...(hasTsConfig ? { tsConfig: { fileName: tsConfigFile } } : {}),
        },
      },
      outputType: "json",
    },
    {},
    hasTsConfig ? { tsConfig: extractTSConfig(tsConfigFile) } : {},
  );
  const result = typeof output === "string" ? JSON.parse(output) : output;
  const all = result.summary.violations.filter((v) => v.rule.severity !== "ignore");
  const fresh = all.filter((v) => !known.some((k) => sameViolation(k, v)));
  const stillThere = (k) =>
    result.summary.violations.some((v) => sameViolation(k, v)) ||
    // dependency-level known violations come back with severity "ignore"
    result.modules.some(
      (m) =>
        m.source === k.from &&
        m.dependencies.some(
          (d) => d.resolved === k.to && d.rules?.some((r) => r.name === k.rule.name),
        ),
    );
  const stale = known.filter((k) => !stillThere(k));
  return {
    fresh,
    known: known.length - stale.length,
    stale,
    modules: result.summary.totalCruised,
    dependencies: result.summary.totalDependenciesCruised,
  };
}

const COMMENTS = new Map();
async function ruleComment(name) {
  if (!COMMENTS.size) {
    const options = await extractDepcruiseOptions(CONFIG_FILE);
    for (const r of options.ruleSet.forbidden ?? []) COMMENTS.set(r.name, r.comment ?? "");
  }
  return COMMENTS.get(name) ?? "";
}

/** One readable paragraph per violation: the rule, the import, the cycle, why the rule exists. */
export async function describe(violation) {
  const path = violation.cycle?.length
    ? `\n    cycle: ${[violation.from, ...violation.cycle.map((c) => c.name)].join(" → ")}`
    : "";
  return `  ✗ ${violation.rule.name}: ${violation.from} → ${violation.to}${path}\n    ${await ruleComment(violation.rule.name)}`;
}

if (process.argv[1] && resolve(process.argv[1]) === fileURLToPath(import.meta.url)) {
  const started = Date.now();
  // SWARD_LAYERS_BASE_DIR: check another tree with this config (tests/unit/layers.test.ts)
  const baseDir = process.env.SWARD_LAYERS_BASE_DIR || ROOT;
  const { fresh, known, stale, modules, dependencies } = await checkLayers({ baseDir });
  for (const v of fresh) console.error(await describe(v));
  const seconds = ((Date.now() - started) / 1000).toFixed(1);
  if (stale.length)
    console.log(
      `layers: ${stale.length} known violation(s) no longer occur; shrink the list: npm run lint:deps:baseline`,
    );
  if (fresh.length) {
    console.error(
      `layers: ${fresh.length} new violation(s) of .dependency-cruiser.cjs (${known} known ones ignored). ` +
        "Fix the import (each rule says why above). The known list is for tangles being removed, not for new ones.",
    );
    process.exitCode = 1;
  } else {
    console.log(
      `layers: no new violation (${modules} modules, ${dependencies} imports, ${known} known violation(s) ignored, ${seconds} s)`,
    );
  }
}
