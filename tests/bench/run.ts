// `npm run bench`: against the book that `npm run bench:seed` built (sward_bench), builds and starts
// the production server on 127.0.0.1 and prints a table of figures (also written as JSON under
// tests/.artifacts/bench/): API latencies under autocannon, a zone-check save, the daily risk
// sweep, compressed JavaScript per page measured in Chromium, the offline field app's open time
// and storage (tests/bench/offline.ts), Lighthouse scores, and EXPLAIN of
// the book query. Budgets are printed beside each figure; this is a benchmark, not a test.
// Everything it starts (PostgreSQL when it was not running, the build, the server, the sweep and
// Lighthouse runs) stops on Ctrl-C, SIGTERM, a failure or the end of npm (tests/harness/supervisor.ts).
import { randomBytes, randomUUID } from "node:crypto";
import { mkdirSync, writeFileSync } from "node:fs";
import path from "node:path";
import { gzipSync } from "node:zlib";
import autocannon from "autocannon";
import { sql } from "kysely";

import { createDb } from "@/db/client";
import { todayIn } from "@/lib/dates";

import { StepFailed, Supervisor } from "../harness/supervisor";
import { launchBrowser } from "../helpers/browser";
import { passwordSignIn } from "../helpers/password-sign-in";
import { waitForUrl } from "../helpers/processes";
import { doneCheck } from "../helpers/zone-checks";
import { measureOffline } from "./offline";
import { drawDays, printRoutingFigures, routingFigures } from "./routing.bench";
import { BENCH_MANAGER, benchDatabaseUrl, benchHomeowner, benchTechnician } from "./seed";

const PORT = Number(process.env.SWARD_BENCH_PORT ?? 3200);
const BASE = `http://localhost:${PORT}`;
const DURATION = Number(process.env.BENCH_SECONDS ?? 20);
const OUT_DIR = "tests/.artifacts/bench";
const PASSWORD = "meadow-demo-2026";

type Row = { measure: string; figure: string; budget: string; ok: boolean | null };
const rows: Row[] = [];
const json: Record<string, unknown> = { at: new Date().toISOString(), durationSeconds: DURATION };
const record = (measure: string, figure: string, budget = "", ok: boolean | null = null) => {
  rows.push({ measure, figure, budget, ok });
  console.log(
    `  ${ok === null ? "·" : ok ? "✓" : "✗"} ${measure}: ${figure}${budget ? `  (budget ${budget})` : ""}`,
  );
};

const sup = new Supervisor("bench");

/** A helper script's last line of output, as JSON (its messages are shown when it fails). */
async function lastJsonLine<T>(name: string, args: string[], env: Record<string, string>) {
  const r = await sup.run(name, args[0]!, args.slice(1), {
    env,
    stdio: ["ignore", "pipe", "pipe"],
  });
  if (r.code !== 0)
    throw new StepFailed(`bench: ${name} failed (exit ${r.code}): ${r.stderr.slice(-2000)}`);
  return JSON.parse(r.stdout.trim().split("\n").at(-1)!) as T;
}

/** Signs in through Auth.js's credentials callback, as the form does, and returns the cookie header. */
async function signIn(email: string): Promise<string> {
  const result = await passwordSignIn(BASE, email, PASSWORD);
  if (!result.sessionToken)
    throw new Error(`bench: could not sign in as ${email} (status ${result.status})`);
  return result.cookie;
}

interface Cannon {
  latency: { p50: number; p90: number; p97_5: number; p99: number; average: number };
  requests: { average: number };
  errors: number;
  non2xx: number;
  timeouts: number;
}

async function cannon(
  name: string,
  url: string,
  cookie: string,
  options: Record<string, unknown> = {},
): Promise<Cannon> {
  const result = (await autocannon({
    url,
    connections: 10,
    duration: DURATION,
    headers: { cookie },
    ...options,
  })) as Cannon;
  json[name] = {
    p50: result.latency.p50,
    p90: result.latency.p90,
    p97_5: result.latency.p97_5,
    p99: result.latency.p99,
    requestsPerSecond: result.requests.average,
    errors: result.errors + result.timeouts,
    non2xx: result.non2xx,
  };
  return result;
}

const ms = (v: number) => `${v.toFixed(v < 10 ? 1 : 0)} ms`;

async function main(): Promise<number> {
  await sup.cluster(); // stopped again at the end when this run started it
  const db = createDb(benchDatabaseUrl(), { max: 2 });
  const company = await db
    .selectFrom("companies")
    .select(["id", "time_zone"])
    .where("slug", "=", "bench-fieldstone")
    .executeTakeFirst();
  if (!company) {
    console.error("bench: no benchmark book yet. Run `npm run bench:seed` first.");
    await db.destroy();
    return 1;
  }
  const counts = await sql<{
    properties: string;
    checks: string;
  }>`select (select count(*) from properties) properties, (select count(*) from zone_checks) checks`.execute(
    db,
  );
  console.log(
    `bench: book of ${counts.rows[0]!.properties} properties, ${Number(counts.rows[0]!.checks).toLocaleString("en-US")} zone checks`,
  );

  // The day's route (lib/routing/order.ts) on days drawn from the book's own properties (a yard
  // and 25 stops; a yard and 9 stops for the exhaustive comparison), before the server starts.
  const pool = await db
    .selectFrom("properties")
    .select(["latitude", "longitude"])
    .where("company_id", "=", company.id)
    .execute();
  const routing = routingFigures(drawDays(200, 25, 25, pool), drawDays(30, 9, 9, pool));
  json["routing"] = routing;
  const [orderingLine, gapLine] = printRoutingFigures(routing);
  record(
    "route ordering, 25 stops",
    orderingLine!.replace(/^route ordering, 25 stops: /, "").replace(/ \(budget.*$/, ""),
    "p50 < 50 ms",
    routing.ordering25.p50Ms < 50,
  );
  record(
    "route vs exhaustive best, 9 stops",
    gapLine!.replace(/^route vs exhaustive best, 9 stops: /, "").replace(/ \(budget.*$/, ""),
    "within 10 %",
    routing.gap9.maxPct <= 10,
  );

  if (!process.argv.includes("--no-build"))
    await sup.step("build", "node", ["node_modules/next/dist/bin/next", "build"], {
      env: { NEXT_TELEMETRY_DISABLED: "1" },
    });
  sup.start(
    "server",
    "node",
    [
      "--import",
      "./lib/http/edge-address.mjs",
      "node_modules/next/dist/bin/next",
      "start",
      "-H",
      "127.0.0.1",
      "-p",
      String(PORT),
    ],
    {
      stdio: ["ignore", "ignore", "inherit"],
      env: {
        NODE_ENV: "production",
        NEXT_TELEMETRY_DISABLED: "1",
        DATABASE_URL: benchDatabaseUrl(),
        AUTH_SECRET: randomBytes(32).toString("base64url"),
        AUTH_URL: BASE,
        LOG_LEVEL: "warn",
        PHOTO_DIR: "tests/.artifacts/photos-bench",
      },
    },
  );
  try {
    await waitForUrl(`${BASE}/sign-in`, 60_000);
    const manager = await signIn(BENCH_MANAGER);
    const tech = await signIn(benchTechnician(0));
    const owner = await signIn(benchHomeowner(0));
    // Warm up: compile nothing at runtime, but fill pools and caches as a running server has them.
    for (let i = 0; i < 20; i++)
      await fetch(`${BASE}/api/v1/book`, { headers: { cookie: manager } });

    console.log("\nBook API (10 connections, %d s each)", DURATION);
    let after: string | null = null;
    for (let page = 1; page < 100; page++) {
      const body = (await (
        await fetch(`${BASE}/api/v1/book?limit=20${after ? `&after=${after}` : ""}`, {
          headers: { cookie: manager },
        })
      ).json()) as { nextCursor: string | null };
      after = body.nextCursor;
      if (!after) throw new Error(`bench: the book ended at page ${page}; seed 2,000 properties`);
    }
    const views: [string, string][] = [
      ["book: first page", "/api/v1/book?limit=20"],
      ["book: page 100 (keyset)", `/api/v1/book?limit=20&after=${after}`],
      [
        "book: filtered (declining, high alerts)",
        "/api/v1/book?limit=20&trend=declining&severity=high",
      ],
      ["book: text search", "/api/v1/book?limit=20&q=Cinder"],
    ];
    const book: Record<string, Cannon> = {};
    for (const [name, url] of views) {
      const r = (book[name] = await cannon(name, `${BASE}${url}`, manager));
      const ok =
        r.latency.p50 < 50 &&
        r.latency.p97_5 < 200 &&
        r.errors + r.timeouts === 0 &&
        r.non2xx === 0;
      record(
        name,
        `p50 ${ms(r.latency.p50)}, p90 ${ms(r.latency.p90)}, p97.5 ${ms(r.latency.p97_5)}, p99 ${ms(r.latency.p99)}, ${r.requests.average.toFixed(0)} req/s, errors ${r.errors + r.timeouts}, non-2xx ${r.non2xx}`,
        "p50 < 50 ms, p97.5 < 200 ms, 0 errors",
        ok,
      );
    }
    // The book's map: every property at once, and how many bytes it is compressed.
    console.log("\nBook map API (the whole book)");
    const mapBody = await fetch(`${BASE}/api/v1/book/map`, {
      headers: { cookie: manager, "accept-encoding": "gzip" },
    });
    const mapJson = (await mapBody.clone().json()) as { points: unknown[] };
    const mapRaw = Buffer.from(await mapBody.arrayBuffer()).byteLength;
    const mapGzip = gzipSync(JSON.stringify(mapJson)).byteLength;
    const map = await cannon("book map", `${BASE}/api/v1/book/map`, manager);
    json["book map"] = {
      ...map,
      points: mapJson.points.length,
      jsonBytes: mapRaw,
      gzipBytes: mapGzip,
    };
    record(
      `book map: all ${mapJson.points.length} properties`,
      `p50 ${ms(map.latency.p50)}, p97.5 ${ms(map.latency.p97_5)}, ${map.requests.average.toFixed(0)} req/s, errors ${map.errors + map.timeouts}, non-2xx ${map.non2xx}; ${(mapRaw / 1000).toFixed(1)} kB JSON, ${(mapGzip / 1000).toFixed(1)} kB gzip`,
      "p50 < 100 ms, < 200 kB gzip",
      map.latency.p50 < 100 && mapGzip < 200_000 && map.non2xx === 0,
    );

    const ratio =
      book["book: page 100 (keyset)"]!.latency.p50 / book["book: first page"]!.latency.p50;
    json["page100ToPage1"] = ratio;
    record("book: page 100 ÷ page 1 (p50)", `${ratio.toFixed(2)}×`, "≤ 2×", ratio <= 2);

    const property = await db
      .selectFrom("properties")
      .select("id")
      .where(
        "technician_id",
        "=",
        db.selectFrom("users").select("id").where("email", "=", benchTechnician(0)),
      )
      .orderBy("id")
      .executeTakeFirstOrThrow();
    const zone = await db
      .selectFrom("zones")
      .select("id")
      .where("property_id", "=", property.id)
      .orderBy("sort_order")
      .executeTakeFirstOrThrow();
    console.log("\nProperty and zone APIs");
    for (const [name, url] of [
      ["property API", `/api/v1/properties/${property.id}`],
      ["zone history API", `/api/v1/zones/${zone.id}/checks`],
    ] as const) {
      const r = await cannon(name, `${BASE}${url}`, manager);
      record(
        name,
        `p50 ${ms(r.latency.p50)}, p97.5 ${ms(r.latency.p97_5)}, p99 ${ms(r.latency.p99)}, ${r.requests.average.toFixed(0)} req/s, errors ${r.errors + r.timeouts}, non-2xx ${r.non2xx}`,
      );
    }

    // Saving zone checks: tech01's stops of today, each zone saved new, then saved again changed.
    console.log("\nSaving zone checks");
    const today = todayIn(company.time_zone);
    const techId = (
      await db
        .selectFrom("users")
        .select("id")
        .where("email", "=", benchTechnician(0))
        .executeTakeFirstOrThrow()
    ).id;
    const stops = await db
      .selectFrom("visits")
      .select(["id", "property_id", "status"])
      .where("technician_id", "=", techId)
      .where("scheduled_for", "=", today)
      .execute();
    // A second run starts from the same place: the checks an earlier run saved on these stops go.
    await db
      .deleteFrom("zone_checks")
      .where(
        "visit_id",
        "in",
        stops.map((s) => s.id),
      )
      .execute();
    for (const s of stops.filter((v) => v.status === "scheduled")) {
      const res = await fetch(`${BASE}/api/v1/visits/${s.id}/start`, {
        method: "POST",
        headers: { cookie: tech, "content-type": "application/json", origin: BASE },
        body: JSON.stringify({ latitude: null, longitude: null }),
      });
      if (!res.ok)
        throw new Error(`bench: could not start visit ${s.id}: ${res.status} ${await res.text()}`);
    }
    const stopZones = await db
      .selectFrom("zones")
      .select(["id", "property_id"])
      .where(
        "property_id",
        "in",
        stops.map((s) => s.property_id),
      )
      .execute();
    const saves = stopZones.flatMap((z) => {
      const visitId = stops.find((s) => s.property_id === z.property_id)!.id;
      const id = randomUUID();
      return [
        { visitId, id, body: doneCheck(z.id, { baseVersion: 0, quality: 6 }) },
        {
          visitId,
          id,
          body: doneCheck(z.id, { baseVersion: 1, quality: 7, notes: "Second save, changed." }),
        },
      ];
    });
    // First all new checks, then all second saves (each on the version the first one made).
    const ordered = [
      ...saves.filter((_, i) => i % 2 === 0),
      ...saves.filter((_, i) => i % 2 === 1),
    ];
    let next = 0;
    const save = (await autocannon({
      url: BASE,
      connections: 4,
      amount: ordered.length,
      headers: { cookie: tech, "content-type": "application/json", origin: BASE },
      requests: [
        {
          method: "PUT",
          setupRequest: (req: Record<string, unknown>) => {
            const s = ordered[next++ % ordered.length]!;
            return {
              ...req,
              path: `/api/v1/visits/${s.visitId}/zone-checks/${s.id}`,
              body: JSON.stringify(s.body),
            };
          },
        },
      ],
    })) as Cannon;
    json["zone check save"] = {
      saves: ordered.length,
      p50: save.latency.p50,
      p97_5: save.latency.p97_5,
      p99: save.latency.p99,
      errors: save.errors + save.timeouts,
      non2xx: save.non2xx,
    };
    record(
      `zone-check save (${ordered.length} saves, 4 connections)`,
      `p50 ${ms(save.latency.p50)}, p97.5 ${ms(save.latency.p97_5)}, errors ${save.errors + save.timeouts}, non-2xx ${save.non2xx}`,
      "p97.5 < 150 ms",
      save.latency.p97_5 < 150 && save.non2xx === 0,
    );

    // The daily risk sweep over the whole book, in a worker process of its own.
    console.log("\nDaily risk sweep");
    const sweep = await lastJsonLine<{ ms: number; properties: number; maxRssMb: number }>(
      "sweep",
      ["node_modules/.bin/tsx", "tests/bench/sweep.ts"],
      { DATABASE_URL: benchDatabaseUrl() },
    );
    json["risk sweep"] = sweep;
    record(
      `risk sweep (${sweep.properties} properties)`,
      `${(sweep.ms / 1000).toFixed(1)} s, peak memory ${sweep.maxRssMb.toFixed(0)} MB`,
      "< 60 s",
      sweep.ms < 60_000,
    );

    // Pressure areas over a season's alerts (the pure core) and as the pages read them.
    console.log("\nPressure areas");
    const pressure = await lastJsonLine<{
      properties: number;
      seasonAlerts: number;
      seasonAreas: number;
      coreMs: number;
      coreCpuMs: number;
      liveAreas: number;
      readMedianMs: number;
    }>("pressure areas", ["node_modules/.bin/tsx", "tests/bench/pressure-areas.ts"], {
      DATABASE_URL: benchDatabaseUrl(),
    });
    json["pressure areas"] = pressure;
    record(
      `pressure areas: a season's alerts (${pressure.seasonAlerts.toLocaleString("en-US")} for ${pressure.properties} properties)`,
      `${(pressure.coreMs / 1000).toFixed(2)} s (CPU ${(pressure.coreCpuMs / 1000).toFixed(2)} s), ${pressure.seasonAreas} areas`,
      "< 2 s",
      pressure.coreMs < 2000,
    );
    record(
      "pressure areas: the pages' read (live alerts)",
      `median ${ms(pressure.readMedianMs)}, ${pressure.liveAreas} areas`,
    );

    // Compressed JavaScript on a cold load, as Chromium received it.
    console.log("\nJavaScript transferred (cold load, compressed)");
    const ownerProperty = await db
      .selectFrom("property_homeowners")
      .innerJoin("users", "users.id", "property_homeowners.user_id")
      .select("property_id")
      .where("users.email", "=", benchHomeowner(0))
      .executeTakeFirstOrThrow();
    const report = await db
      .selectFrom("visits")
      .select("id")
      .where("property_id", "=", ownerProperty.property_id)
      .where("status", "=", "completed")
      .orderBy("scheduled_for", "desc")
      .executeTakeFirstOrThrow();
    const pages: { name: string; path: string; cookie: string; budget?: number }[] = [
      { name: "sign-in", path: "/sign-in", cookie: "" },
      {
        name: "technician's visit page",
        path: `/visits/${stops[0]!.id}`,
        cookie: tech,
        budget: 130,
      },
      { name: "the book", path: "/book", cookie: manager },
      { name: "homeowner report", path: `/my-lawn/reports/${report.id}`, cookie: owner },
    ];
    const browser = await launchBrowser();
    const jsKb: Record<string, number> = {};
    for (const p of pages) {
      const context = await browser.newContext({ viewport: { width: 390, height: 844 } });
      if (p.cookie)
        await context.addCookies(
          p.cookie.split("; ").map((c) => ({
            name: c.split("=")[0]!,
            value: c.slice(c.indexOf("=") + 1),
            url: BASE,
          })),
        );
      const page = await context.newPage();
      const cdp = await context.newCDPSession(page);
      await cdp.send("Network.enable");
      await cdp.send("Network.setCacheDisabled", { cacheDisabled: true });
      const scripts = new Map<string, number>();
      const types = new Map<string, string>();
      const urls = new Map<string, string>();
      cdp.on("Network.responseReceived", (e) => {
        types.set(e.requestId, e.type);
        urls.set(e.requestId, e.response.url);
      });
      cdp.on("Network.loadingFinished", (e) => {
        if (types.get(e.requestId) === "Script") scripts.set(e.requestId, e.encodedDataLength);
      });
      await page.goto(`${BASE}${p.path}`, { waitUntil: "networkidle" });
      const kb = [...scripts.values()].reduce((a, b) => a + b, 0) / 1024;
      jsKb[p.name] = kb;
      json[`javascriptFiles: ${p.name}`] = Object.fromEntries(
        [...scripts].map(([id, bytes]) => [
          urls.get(id)?.replace(BASE, "") ?? id,
          Math.round(bytes / 102.4) / 10,
        ]),
      );
      record(
        `JS: ${p.name}`,
        `${kb.toFixed(1)} kB in ${scripts.size} files`,
        p.budget ? `< ${p.budget} kB` : "",
        p.budget ? kb < p.budget : null,
      );
      await context.close();
    }
    json["javascriptKb"] = jsKb;

    // The field app with no signal (tests/bench/offline.ts): storage after Today saved the day,
    // and the visit page's offline open time with the CPU slowed four times.
    console.log("\nOffline field app (phone size, CPU ×4, no network)");
    const offline = await measureOffline(browser, BASE, tech);
    await browser.close();
    json["offline"] = offline;
    const median = (v: number[]) => [...v].sort((a, b) => a - b)[v.length >> 1]!;
    record(
      `offline: visit page shown, DOMContentLoaded (median of ${offline.openMs.length})`,
      `${ms(median(offline.openMs))} (${offline.openMs.map((v) => v.toFixed(0)).join(", ")} ms)`,
      "< 1 s",
      median(offline.openMs) < 1000,
    );
    record(
      `offline: visit page loaded, load event (median of ${offline.loadMs.length})`,
      `${ms(median(offline.loadMs))}`,
    );
    console.log(`  Today said: ${offline.status}`);
    record(
      `offline: the day saved ahead on Today (${offline.stops} stops, with a signal)`,
      `${ms(offline.saveMs)}`,
      "< 60 s (SAVE_AHEAD_LIMITS)",
      offline.saveMs < 60_000 && /^Ready offline/.test(offline.status),
    );
    record(
      `offline: storage used after saving the day (${offline.stops} stops, app shell included)`,
      `${offline.storageMb.toFixed(1)} MB`,
      "< 25 MB",
      offline.storageMb < 25,
    );

    // Lighthouse 12 (mobile emulation), median of 3 runs per page.
    console.log("\nLighthouse (mobile, median of 3)");
    const lighthouseScores: Record<string, { performance: number; accessibility: number }> = {};
    for (const p of pages.filter((pp) => pp.name !== "the book")) {
      const runs: { performance: number; accessibility: number }[] = [];
      for (let i = 0; i < 3; i++) {
        runs.push(
          await lastJsonLine<{ performance: number; accessibility: number }>(
            `lighthouse ${p.path}`,
            ["node", "tests/bench/lighthouse.mjs", `${BASE}${p.path}`, p.cookie],
            { CHROME_PATH: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium" },
          ),
        );
      }
      const median = (k: "performance" | "accessibility") =>
        runs.map((r) => r[k]).sort((a, b) => a - b)[1]!;
      lighthouseScores[p.name] = {
        performance: median("performance"),
        accessibility: median("accessibility"),
      };
      record(
        `Lighthouse: ${p.name}`,
        `performance ${median("performance")}, accessibility ${median("accessibility")}`,
        "≥ 90 and ≥ 95",
        median("performance") >= 90 && median("accessibility") >= 95,
      );
    }
    json["lighthouse"] = lighthouseScores;

    // EXPLAIN of the book query as the manager runs it.
    console.log("\nEXPLAIN (ANALYZE, BUFFERS) of the book query");
    const plans = await lastJsonLine<Record<string, string>>(
      "explain",
      [
        "node_modules/.bin/tsx",
        "--conditions=react-server",
        "tests/bench/explain.ts",
        BENCH_MANAGER,
      ],
      {
        DATABASE_URL: benchDatabaseUrl(),
        AUTH_SECRET: "bench-explain-only-secret-0123456789abcdef",
      },
    );
    const all = Object.values(plans).join("\n");
    const seqOnChecks = /Seq Scan on zone_checks/.test(all);
    const time = (p: string) => Number(/Execution Time: ([\d.]+) ms/.exec(p)?.[1] ?? NaN);
    json["explain"] = plans;
    record(
      "book query plan",
      `${Object.entries(plans)
        .map(([k, p]) => `${k} ${time(p).toFixed(2)} ms`)
        .join(", ")}; sequential scan on zone_checks: ${seqOnChecks ? "yes" : "no"}`,
      "no seq scan on zone_checks",
      !seqOnChecks,
    );
    console.log(plans["first page"]!.replace(/^/gm, "    "));
    await db.destroy();
  } finally {
    await sup.stop(); // the server (and PostgreSQL when this run started it)
  }

  mkdirSync(OUT_DIR, { recursive: true });
  const file = path.join(OUT_DIR, `bench-${new Date().toISOString().replace(/[:.]/g, "-")}.json`);
  writeFileSync(file, JSON.stringify({ ...json, rows }, null, 2));
  writeFileSync(path.join(OUT_DIR, "latest.json"), JSON.stringify({ ...json, rows }, null, 2));
  console.log("\n| measure | figure | budget | met |\n| --- | --- | --- | --- |");
  for (const r of rows)
    console.log(
      `| ${r.measure} | ${r.figure} | ${r.budget} | ${r.ok === null ? "" : r.ok ? "yes" : "**no**"} |`,
    );
  console.log(`\nwritten: ${file}`);
  return 0;
}

await sup.main(main);
