// Sward's layers, checked by dependency-cruiser in `npm run lint` (`npm run lint:deps` alone).
//
//   app/ components/        pages and UI: call lib/, never the database directly
//   jobs/ fixtures/ tests/  processes, the demo scenario with its loaders, tests: may use anything
//   lib/<feature>/          data access and write steps of one feature (queries.ts, mutations.ts …)
//   lib/ pure cores         computations with no I/O (PURE below): import only each other,
//                           lib/reference, lib/dates.ts and packages
//   lib/reference/          the tables the product runs on, with their sources: pure data
//   lib/env.ts lib/log.ts   infrastructure: configuration and the logger; import nothing of the app
//   db/                     the pool, the schema types, migrations and database tools: imports of
//                           lib/ only lib/env.ts and lib/log.ts; migrations import nothing of the app
//
// No cycle: between modules anywhere, between lib/ folders, between the app's other folders.
//
// Known violations that are being removed (the write-side folder cycles) are listed in
// .dependency-cruiser-known-violations.json and ignored (tests/harness/layers.mjs: the module and
// dependency ones as `--ignore-known` does, the folder ones by rule, from and to, which
// dependency-cruiser 17.3.9 does not do); any new one fails. After removing one, shrink the list:
// `npm run lint:deps:baseline`.
// tests/unit/layers.test.ts plants a cycle in a temporary tree and checks this config reports it.

/** Pure cores: computations with no database, no network, no server-only code. */
const PURE = [
  "^lib/agronomy/[^/]+\\.ts$",
  "^lib/scoring/(bands|weights|sward-index|trend|student-t|available-nitrogen|from-check|history|words)\\.ts$",
  "^lib/risk/(rules|models|lifecycle|labels|pressure-areas)\\.ts$",
  "^lib/photo-analysis/(color|analyze)\\.ts$",
  "^lib/weather/derived\\.ts$",
  "^lib/reports/(care-notes|words)\\.ts$",
  "^lib/i18n/(locales|translate|messages/[^/]+)\\.ts$",
  "^lib/routing/[^/]+\\.ts$",
  "^lib/day-route/(plan|dto|links)\\.ts$",
];
/** What a pure core may import besides packages: other pure cores and pure data. */
const PURE_MAY_IMPORT = [
  ...PURE,
  "^lib/reference/",
  "^lib/dates\\.ts$",
  "^lib/services/weather/contract\\.ts$", // the weather service's zod contract: types and checks
];
const APP_CODE = "^(app|components|db|fixtures|jobs|lib|tests)/|^proxy\\.ts$";

/** @type {import('dependency-cruiser').IConfiguration} */
module.exports = {
  forbidden: [
    {
      name: "no-circular",
      comment: "A module cycle: two modules that import each other, directly or through others.",
      severity: "error",
      from: {},
      to: { circular: true },
    },
    {
      name: "no-lib-folder-cycle",
      comment:
        "Two lib/ folders that import each other (directly or through other folders). Move the " +
        "shared piece to the folder that owns it, or make the lower one not know the upper one.",
      severity: "error",
      scope: "folder",
      from: { path: "^lib/" },
      to: { path: "^lib/", circular: true },
    },
    {
      name: "no-folder-cycle",
      comment:
        "Two of the app's folders outside lib/ (app, components, db, fixtures, jobs) that import each " +
        "other, directly or through others (e.g. db/ and fixtures/: the demo seed lives in " +
        "fixtures/demo/, above db/).",
      severity: "error",
      scope: "folder",
      // "lib" as a whole (the folder with all its subfolders) is left out: db/ → lib/env.ts and
      // lib/log.ts is the one allowed way down (db-imports-no-feature), and every other way back
      // from lib/ is refused by a rule below (lib-imports-no-ui, lib-imports-no-demo-or-tests).
      // tests/ is left out too: test tooling (harness ↔ helpers) may share both ways.
      from: { path: "^(app|components|db|fixtures|jobs)(/|$)" },
      to: { circular: true, pathNot: "^lib$" },
    },
    {
      name: "pure-core-stays-pure",
      comment:
        "Pure cores (scoring, agronomy, risk rules, photo analysis …) import only other pure " +
        "cores, lib/reference, lib/dates.ts and packages: no feature folder, no database, no " +
        "server-only.",
      severity: "error",
      from: { path: PURE },
      to: {
        pathNot: [...PURE_MAY_IMPORT, "^node_modules/"],
        dependencyTypesNot: ["core"],
      },
    },
    {
      name: "pure-core-no-server-only",
      comment: "Pure cores run anywhere (browser, tests, scripts): no server-only.",
      severity: "error",
      from: { path: PURE },
      to: { path: "^(node_modules/)?server-only(/|$)" },
    },
    {
      name: "reference-is-pure-data",
      comment:
        "lib/reference holds tables the product runs on: it imports only pure cores and types.",
      severity: "error",
      from: { path: "^lib/reference/" },
      to: { pathNot: [...PURE_MAY_IMPORT, "^db/schema\\.ts$"] },
    },
    {
      name: "migrations-import-no-app-code",
      comment: "Migrations are frozen in time: they import packages only, never the app's code.",
      severity: "error",
      from: { path: "^db/migrations/" },
      to: { path: APP_CODE },
    },
    {
      name: "db-imports-no-feature",
      comment:
        "db/ (pool, schema, migrations, database tools) imports from lib/ only lib/env.ts and " +
        "lib/log.ts, and nothing from the app's other folders. Scripts that need features live in " +
        "jobs/ or, for the demo, in fixtures/demo/.",
      severity: "error",
      from: { path: "^db/" },
      to: {
        path: "^(app|components|fixtures|jobs|lib|tests)/|^proxy\\.ts$",
        pathNot: "^lib/(env|log)\\.ts$",
      },
    },
    {
      name: "infrastructure-imports-no-app-code",
      comment: "lib/env.ts and lib/log.ts sit under db/: they import packages only.",
      severity: "error",
      from: { path: "^lib/(env|log)\\.ts$" },
      to: { path: APP_CODE },
    },
    {
      name: "lib-imports-no-ui",
      comment: "lib/ never imports pages or components: the UI depends on lib/, not the reverse.",
      severity: "error",
      from: { path: "^lib/" },
      to: { path: "^(app|components)/" },
    },
    {
      name: "lib-imports-no-demo-or-tests",
      comment:
        "lib/ never imports fixtures/ (demo data, golden cases, fakes' data), tests/ or jobs/: " +
        "what the product runs on lives in lib/reference.",
      severity: "error",
      from: { path: "^lib/" },
      to: { path: "^(fixtures|tests|jobs)/" },
    },
    {
      name: "components-no-database",
      comment:
        "Components never reach the database (@/db, db/client.ts …); the schema's types " +
        "(db/schema.ts, type-only imports) are allowed.",
      severity: "error",
      from: { path: "^components/" },
      to: { path: "^db/", pathNot: "^db/schema\\.ts$" },
    },
    {
      name: "components-schema-types-only",
      comment: "Components import db/schema.ts for its types only (import type).",
      severity: "error",
      from: { path: "^components/" },
      to: { path: "^db/schema\\.ts$", dependencyTypesNot: ["type-only"] },
    },
  ],
  options: {
    doNotFollow: { path: "node_modules" },
    exclude: { path: "^(node_modules|\\.next|\\.data|tests/\\.artifacts)/" },
    // Type-only imports count: a cycle through types is still two modules that know each other.
    tsPreCompilationDeps: true,
    tsConfig: { fileName: "tsconfig.json" },
    enhancedResolveOptions: {
      exportsFields: ["exports"],
      conditionNames: ["import", "require", "node", "default", "types"],
      extensions: [".ts", ".tsx", ".d.ts", ".js", ".mjs", ".cjs", ".json"],
    },
    reporterOptions: { text: { highlightFocused: true } },
  },
};
