// `npm run bench:seed`: a book at scale in its own database (sward_bench) — one invented company
// of 2,000 properties, 8,000 zones, 40 technicians and three seasons of history (about 500,000
// zone checks with their Sward Index, the applications and the watering), a year of daily weather
// for every location cell, today's stops, and the alerts the rules raise (the daily sweep). Rows
// are generated here with a seeded generator and written with multi-row `insert … select * from
// unnest(…)` in batches. Invented data for measuring only.
// Options: --properties N (default 2000), --keep (do not recreate the database).
import { spawnSync } from "node:child_process";
import { randomUUID } from "node:crypto";
import { sql, type Kysely } from "kysely";

import { createDb } from "@/db/client";
import type { Database } from "@/db/schema";
import { DEMO_PASSWORD, type ScenarioCompany } from "@/fixtures/demo/scenario";
import { seedCompany } from "@/fixtures/demo/seed-scenario";
import { sweepBook } from "@/lib/after-write/sweep";
import { addDays, todayIn } from "@/lib/dates";
import { indexInputOf } from "@/lib/scoring/from-check";
import { swardIndex } from "@/lib/scoring/sward-index";
import { cellOf } from "@/lib/weather/map";

import { seededRandom } from "../helpers/seeded-random";

export const BENCH_DB = "sward_bench";
export const BENCH_SLUG = "bench-fieldstone";
export const BENCH_MANAGER = "manager@bench.sward.test";
export const benchTechnician = (i: number) =>
  `tech${String(i + 1).padStart(2, "0")}@bench.sward.test`;
export const benchHomeowner = (i: number) =>
  `owner${String(i + 1).padStart(4, "0")}@bench.sward.test`;
export const benchDatabaseUrl = () =>
  `postgres://postgres@127.0.0.1:${process.env.SWARD_PG_PORT ?? "54329"}/${BENCH_DB}`;

const TECHNICIANS = 40;
const ZONES = [
  {
    name: "Front lawn",
    species: ["tall_fescue", "kentucky_bluegrass"],
    sun: "full_sun",
    min: 1200,
    max: 4000,
  },
  {
    name: "Back yard",
    species: ["kentucky_bluegrass", "tall_fescue", "perennial_ryegrass"],
    sun: "part_shade",
    min: 2000,
    max: 7000,
  },
  { name: "Side strip", species: ["tall_fescue"], sun: "full_sun", min: 300, max: 900 },
  { name: "Under the trees", species: ["fine_fescue"], sun: "shade", min: 500, max: 2000 },
] as const;
const STREETS = [
  "Alder Run",
  "Brackenridge Road",
  "Cinder Lane",
  "Dovecote Way",
  "Elmstead Court",
  "Fallow Drive",
  "Gristmill Road",
  "Hedgerow Lane",
  "Ironweed Path",
  "Juniper Hollow",
];
const TOWNS = [
  "Fernhill",
  "Stonebrook",
  "Millbury",
  "Ashgrove",
  "Quarry Falls",
  "Larkfield",
  "Oakhaven",
  "Wrenford",
];
const FEEDINGS = [
  // day of the season (from 1 April) and product, within New Jersey's season
  { day: 15, product: "Larkmoor Steadyfeed 24-0-8", rate: 3.1 },
  { day: 55, product: "Larkmoor Steadyfeed 24-0-8", rate: 3.1 },
  { day: 90, product: "Quickgreen 28-3-6", rate: 1.8 },
  { day: 160, product: "Autumn Anchor 20-0-10", rate: 4.0 },
  { day: 200, product: "Autumn Anchor 20-0-10", rate: 3.5 },
];

const clamp = (v: number, lo: number, hi: number) => Math.min(hi, Math.max(lo, v));

type Column = readonly [name: string, pgType: string];

/** Writes rows in batches: one `insert … select * from unnest($1::t1[], $2::t2[], …)` per batch. */
async function insertMany(
  db: Kysely<Database>,
  table: string,
  columns: readonly Column[],
  rows: unknown[][],
  batch = 10_000,
): Promise<void> {
  for (let start = 0; start < rows.length; start += batch) {
    const slice = rows.slice(start, start + batch);
    const arrays = columns.map((_, i) => slice.map((r) => r[i] ?? null));
    await sql`insert into ${sql.table(table)} (${sql.join(columns.map(([name]) => sql.ref(name)))}) select * from unnest(${sql.join(arrays.map((a, i) => sql`${a}::${sql.raw(columns[i]![1])}[]`))})`.execute(
      db,
    );
  }
}

function run(cmd: string, args: string[], env: Record<string, string> = {}) {
  const r = spawnSync(cmd, args, { stdio: "inherit", env: { ...process.env, ...env } });
  if (r.status !== 0) throw new Error(`${cmd} ${args.join(" ")} exited with ${r.status}`);
}

export async function seedBench(options: {
  properties: number;
  fresh: boolean;
}): Promise<Record<string, number>> {
  const timings: Record<string, number> = {};
  let mark = Date.now();
  const lap = (name: string) => {
    timings[name] = (Date.now() - mark) / 1000;
    mark = Date.now();
  };
  run("sh", ["db/cluster.sh", "start"]);
  run("node_modules/.bin/tsx", [
    "db/ensure-database.ts",
    BENCH_DB,
    ...(options.fresh ? ["--fresh"] : []),
  ]);
  run("node_modules/.bin/tsx", ["db/migrate.ts"], { DATABASE_URL: benchDatabaseUrl() });
  const db = createDb(benchDatabaseUrl(), { max: 4 });
  try {
    const timeZone = "America/New_York";
    const today = todayIn(timeZone);
    const scenario: ScenarioCompany = {
      slug: BENCH_SLUG,
      name: "Fieldstone Turf Co. (benchmark)",
      unitSystem: "imperial",
      people: [
        { key: "manager", email: BENCH_MANAGER, name: "Morgan Ashdown", role: "manager" },
        ...Array.from({ length: TECHNICIANS }, (_, i) => ({
          key: `tech${i}`,
          email: benchTechnician(i),
          name: `Technician ${i + 1}`,
          role: "technician" as const,
        })),
      ],
      properties: [],
    };
    const seeded = await seedCompany(db, scenario, DEMO_PASSWORD);
    const companyId = seeded.companyId;
    const techIds = Array.from({ length: TECHNICIANS }, (_, i) => seeded.userIds[`tech${i}`]!);
    const ruleSet = await db
      .selectFrom("rule_sets")
      .select("id")
      .where("company_id", "=", companyId)
      .where("name", "=", "New Jersey turf fertilizer law")
      .executeTakeFirstOrThrow();
    const products = new Map(
      (
        await db.selectFrom("products").selectAll().where("company_id", "=", companyId).execute()
      ).map((p) => [p.name, p]),
    );
    const passwordHash = (
      await db
        .selectFrom("users")
        .select("password_hash")
        .where("email", "=", BENCH_MANAGER)
        .executeTakeFirstOrThrow()
    ).password_hash;
    lap("company");

    const rand = seededRandom(20261202);
    const properties: unknown[][] = [];
    const zones: unknown[][] = [];
    const users: unknown[][] = [];
    const memberships: unknown[][] = [];
    const owners: unknown[][] = [];
    const plan: {
      id: string;
      tech: string;
      lat: number;
      lon: number;
      declining: boolean;
      zones: { id: string; area: number; irrigated: boolean; base: number; shade: boolean }[];
    }[] = [];
    for (let i = 0; i < options.properties; i++) {
      const id = randomUUID();
      const tech = techIds[i % TECHNICIANS]!;
      const lat = 39.9 + rand() * 0.9;
      const lon = -75.0 + rand() * 0.9;
      const surname = `Household ${String(i + 1).padStart(4, "0")}`;
      properties.push([
        id,
        companyId,
        `${surname} residence`,
        `${10 + Math.floor(rand() * 890)} ${STREETS[i % STREETS.length]}`,
        TOWNS[i % TOWNS.length],
        "NJ",
        "08500",
        lat,
        lon,
        timeZone,
        tech,
        ruleSet.id,
      ]);
      const userId = randomUUID();
      users.push([userId, benchHomeowner(i), surname, passwordHash]);
      memberships.push([companyId, userId, "homeowner"]);
      owners.push([id, userId, companyId]);
      const p = {
        id,
        tech,
        lat,
        lon,
        declining: rand() < 0.08,
        zones: [] as (typeof plan)[number]["zones"],
      };
      ZONES.forEach((z, order) => {
        const zoneId = randomUUID();
        const area = Math.round(z.min + rand() * (z.max - z.min));
        const irrigated = z.sun !== "shade" && rand() < 0.5;
        zones.push([
          zoneId,
          companyId,
          id,
          z.name,
          area,
          z.species[Math.floor(rand() * z.species.length)],
          z.sun,
          irrigated,
          "flat",
          order,
        ]);
        p.zones.push({
          id: zoneId,
          area,
          irrigated,
          base: 5.5 + rand() * 2.5,
          shade: z.sun === "shade",
        });
      });
      plan.push(p);
    }
    await insertMany(
      db,
      "properties",
      [
        ["id", "uuid"],
        ["company_id", "uuid"],
        ["name", "text"],
        ["street", "text"],
        ["city", "text"],
        ["region", "text"],
        ["postal_code", "text"],
        ["latitude", "float8"],
        ["longitude", "float8"],
        ["time_zone", "text"],
        ["technician_id", "uuid"],
        ["rule_set_id", "uuid"],
      ],
      properties,
    );
    await insertMany(
      db,
      "zones",
      [
        ["id", "uuid"],
        ["company_id", "uuid"],
        ["property_id", "uuid"],
        ["name", "text"],
        ["area_ft2", "float8"],
        ["grass_species", "text"],
        ["sun_exposure", "text"],
        ["is_irrigated", "bool"],
        ["slope", "text"],
        ["sort_order", "int4"],
      ],
      zones,
    );
    await insertMany(
      db,
      "users",
      [
        ["id", "uuid"],
        ["email", "text"],
        ["name", "text"],
        ["password_hash", "text"],
      ],
      users,
    );
    await insertMany(
      db,
      "memberships",
      [
        ["company_id", "uuid"],
        ["user_id", "uuid"],
        ["role", "text"],
      ],
      memberships,
    );
    await insertMany(
      db,
      "property_homeowners",
      [
        ["property_id", "uuid"],
        ["user_id", "uuid"],
        ["company_id", "uuid"],
      ],
      owners,
    );
    lap("properties, zones, homeowners");

    // Three seasons: a visit about every 11 days from 1 April to 15 November, and today's stops.
    const thisYear = Number(today.slice(0, 4));
    const visits: unknown[][] = [];
    const checks: unknown[][] = [];
    const applications: unknown[][] = [];
    const waterings: unknown[][] = [];
    const flushChecks = async () => {
      await insertMany(db, "visits", VISIT_COLUMNS, visits.splice(0));
      await insertMany(db, "zone_checks", CHECK_COLUMNS, checks.splice(0));
      await insertMany(db, "applications", APPLICATION_COLUMNS, applications.splice(0));
      await insertMany(db, "waterings", WATERING_COLUMNS, waterings.splice(0));
    };
    let checkCount = 0;
    for (const [n, p] of plan.entries()) {
      for (let year = thisYear - 2; year <= thisYear; year++) {
        const seasonStart = `${year}-04-01`;
        const seasonEnd = `${year}-11-15`;
        const offset = n % 11;
        const feedingsDone = new Set<number>();
        for (let d = offset, k = 0; ; d += 11, k++) {
          const date = addDays(seasonStart, d);
          if (date > seasonEnd || date >= today) break;
          const visitId = randomUUID();
          const at = `${date}T14:${String(10 + (n % 40)).padStart(2, "0")}:00Z`;
          const feeding = FEEDINGS.findIndex((f, fi) => !feedingsDone.has(fi) && d >= f.day);
          visits.push([
            visitId,
            companyId,
            p.id,
            p.tech,
            date,
            n % 12,
            feeding >= 0 ? "feeding_round" : "inspection",
            "completed",
            at,
            p.tech,
            at,
            p.tech,
            p.tech,
          ]);
          const daysToNow = (Date.parse(today) - Date.parse(date)) / 86_400_000;
          for (const z of p.zones) {
            const season = Math.sin((Math.PI * d) / 230) * 0.6 - (d > 100 && d < 150 ? 0.6 : 0); // spring lift, summer dip
            const decline = p.declining && daysToNow < 120 ? -(120 - daysToNow) / 40 : 0;
            const r = (spread: number) =>
              Math.round(clamp(z.base + season + decline + (rand() - 0.5) * spread, 1, 9));
            const symptoms =
              !z.shade && d > 90 && d < 160 && rand() < 0.03
                ? [
                    {
                      key: "dollar_spot",
                      severity: (rand() < 0.5 ? 1 : 2) as 1 | 2,
                      extentPct: 5 + Math.floor(rand() * 15),
                    },
                  ]
                : [];
            const values = {
              status: "done" as const,
              quality: r(1.5),
              color: r(1.5),
              density: r(1.2),
              uniformity: r(1),
              barePct: 5 * Math.round(clamp((6.5 - z.base - decline) * 4 + rand() * 6, 0, 60) / 5),
              weedsPct: rand() < 0.3 ? 5 : 0,
              symptoms,
            };
            const result = swardIndex(indexInputOf(values, [])!);
            checks.push([
              randomUUID(),
              companyId,
              visitId,
              z.id,
              "done",
              values.quality,
              values.color,
              values.density,
              values.uniformity,
              values.barePct,
              values.weedsPct,
              rand() < 0.5 ? "moist" : "dry",
              2.5 + Math.round(rand() * 4) * 0.25,
              rand() < 0.35 ? "same" : "changed",
              rand() < 0.04,
              rand() < 0.01,
              rand() < 0.05,
              JSON.stringify(symptoms),
              at,
              at,
              p.tech,
              result.index,
              JSON.stringify(result.parts),
            ]);
            checkCount++;
            if (feeding >= 0 && !(z.shade && (feeding === 2 || feeding === 4))) {
              // shade gets less N
              const f = FEEDINGS[feeding]!;
              const product = products.get(f.product)!;
              const nLb = (f.rate * product.n_pct) / 100;
              applications.push([
                randomUUID(),
                companyId,
                visitId,
                z.id,
                product.id,
                f.rate,
                "lb/1000ft2",
                z.area,
                (f.rate * z.area) / 1000,
                nLb,
                (f.rate * product.p2o5_pct) / 100,
                (f.rate * product.k2o_pct) / 100,
                nLb * (1 - product.slow_release_pct_of_n / 100),
                date,
                at,
                4,
                70,
                "Bench applicator",
                "NJ-0000",
                "[]",
                p.tech,
              ]);
            }
          }
          if (feeding >= 0) feedingsDone.add(feeding);
          void k;
        }
        // Irrigated zones, logged from the controller: 0.5 in every 4 days, June to mid-September.
        for (const z of p.zones.filter((zz) => zz.irrigated)) {
          for (
            let date = `${year}-06-01`;
            date <= `${year}-09-15` && date < today;
            date = addDays(date, 4)
          ) {
            waterings.push([randomUUID(), companyId, p.id, z.id, date, 0.5, "technician", p.tech]);
          }
        }
      }
      if (n % 5 === 0)
        visits.push([
          randomUUID(),
          companyId,
          p.id,
          p.tech,
          today,
          Math.floor(n / 5) % 12,
          "inspection",
          "scheduled",
          null,
          null,
          null,
          null,
          p.tech,
        ]);
      if (checks.length >= 40_000) await flushChecks();
    }
    await flushChecks();
    lap("visits, zone checks, applications, watering");

    // A year of daily weather (and a week of forecast) for every location cell of the book.
    const cells = new Map(plan.map((p) => [cellOf(p.lat, p.lon), p]));
    const weather: unknown[][] = [];
    const wr = seededRandom(7);
    for (const cell of cells.keys()) {
      for (let i = -365; i <= 7; i++) {
        const day = addDays(today, i);
        const doy = (Date.parse(day) - Date.parse(`${day.slice(0, 4)}-01-01`)) / 86_400_000;
        const warm = -Math.cos((2 * Math.PI * (doy - 15)) / 365); // −1 mid-January, +1 mid-July
        const tmax = 16 + warm * 14 + (wr() - 0.5) * 6;
        const rhMean = 62 + (wr() - 0.5) * 24;
        weather.push([
          cell,
          day,
          tmax,
          tmax - 9 - wr() * 3,
          Math.min(100, rhMean + 18),
          Math.max(10, rhMean - 22),
          rhMean,
          2 + wr() * 3,
          10,
          4 + wr() * 6,
          null,
          wr() < 0.3 ? wr() * 18 : 0,
          i > 0,
        ]);
      }
    }
    await insertMany(
      db,
      "weather_days",
      [
        ["cell", "text"],
        ["day", "date"],
        ["tmax_c", "float8"],
        ["tmin_c", "float8"],
        ["rh_max_pct", "float8"],
        ["rh_min_pct", "float8"],
        ["rh_mean_pct", "float8"],
        ["wind_ms", "float8"],
        ["wind_height_m", "float8"],
        ["sunshine_h", "float8"],
        ["solar_mj", "float8"],
        ["precip_mm", "float8"],
        ["is_forecast", "bool"],
      ],
      weather,
    );
    lap("weather");

    await sql`analyze`.execute(db);
    lap("analyze");
    const sweep = await sweepBook(db, null);
    lap("risk sweep (alerts and book summaries)");
    const counts = await sql<{ t: string; n: string }>`
      select 'properties' t, count(*)::text n from properties union all select 'zones', count(*)::text from zones
      union all select 'visits', count(*)::text from visits union all select 'zone checks', count(*)::text from zone_checks
      union all select 'applications', count(*)::text from applications union all select 'waterings', count(*)::text from waterings
      union all select 'weather days', count(*)::text from weather_days union all select 'open alerts', count(*)::text from risk_alerts where status <> 'resolved'
      union all select 'weather cells', count(distinct cell)::text from weather_days`.execute(db);
    for (const r of counts.rows) timings[`rows: ${r.t}`] = Number(r.n);
    timings["sweep raised"] = sweep.raised;
    void checkCount;
    return timings;
  } finally {
    await db.destroy();
  }
}

const VISIT_COLUMNS: readonly Column[] = [
  ["id", "uuid"],
  ["company_id", "uuid"],
  ["property_id", "uuid"],
  ["technician_id", "uuid"],
  ["scheduled_for", "date"],
  ["stop_order", "int4"],
  ["planned_service", "text"],
  ["status", "text"],
  ["started_at", "timestamptz"],
  ["started_by", "uuid"],
  ["completed_at", "timestamptz"],
  ["completed_by", "uuid"],
  ["created_by", "uuid"],
];
const CHECK_COLUMNS: readonly Column[] = [
  ["id", "uuid"],
  ["company_id", "uuid"],
  ["visit_id", "uuid"],
  ["zone_id", "uuid"],
  ["status", "text"],
  ["quality", "int4"],
  ["color", "int4"],
  ["density", "int4"],
  ["uniformity", "int4"],
  ["bare_pct", "float8"],
  ["weeds_pct", "float8"],
  ["soil_moisture", "text"],
  ["height_of_cut_in", "float8"],
  ["mowing_direction", "text"],
  ["is_matted", "bool"],
  ["is_scalped", "bool"],
  ["has_torn_tips", "bool"],
  ["symptoms", "jsonb"],
  ["created_at", "timestamptz"],
  ["updated_at", "timestamptz"],
  ["updated_by", "uuid"],
  ["sward_index", "float8"],
  ["index_parts", "jsonb"],
];
const APPLICATION_COLUMNS: readonly Column[] = [
  ["id", "uuid"],
  ["company_id", "uuid"],
  ["visit_id", "uuid"],
  ["zone_id", "uuid"],
  ["product_id", "uuid"],
  ["rate_amount", "float8"],
  ["rate_unit", "text"],
  ["area_ft2", "float8"],
  ["product_total_lb", "float8"],
  ["n_lb_per_1000", "float8"],
  ["p2o5_lb_per_1000", "float8"],
  ["k2o_lb_per_1000", "float8"],
  ["wsn_lb_per_1000", "float8"],
  ["applied_on", "date"],
  ["applied_at", "timestamptz"],
  ["wind_mph", "float8"],
  ["temperature_f", "float8"],
  ["applicator_name", "text"],
  ["applicator_licence", "text"],
  ["findings", "jsonb"],
  ["created_by", "uuid"],
];
const WATERING_COLUMNS: readonly Column[] = [
  ["id", "uuid"],
  ["company_id", "uuid"],
  ["property_id", "uuid"],
  ["zone_id", "uuid"],
  ["watered_on", "date"],
  ["depth_in", "float8"],
  ["entered_by_role", "text"],
  ["created_by", "uuid"],
];

if (process.argv[1] && process.argv[1].endsWith("seed.ts")) {
  const arg = (name: string) => process.argv.find((a, i) => process.argv[i - 1] === name);
  const started = Date.now();
  const timings = await seedBench({
    properties: Number(arg("--properties") ?? 2000),
    fresh: !process.argv.includes("--keep"),
  });
  console.log("\nbench:seed — rows and seconds");
  for (const [k, v] of Object.entries(timings))
    console.log(
      `  ${k.padEnd(44)} ${k.startsWith("rows") || k.startsWith("sweep raised") ? v.toLocaleString("en-US") : `${v.toFixed(1)} s`}`,
    );
  console.log(`  ${"total".padEnd(44)} ${((Date.now() - started) / 1000).toFixed(1)} s\n`);
}
