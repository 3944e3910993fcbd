// Pressure areas at the benchmark book's scale; prints one JSON line. Used by `npm run bench`.
// 1. The pure core (lib/risk/pressure-areas.ts) over a season's alerts for the book's 2,000
//    properties at their real locations: each property raises each of the four kinds that make
//    areas on a seeded-random day in each fortnight of a 26-week season (an upper bound: the
//    rules raise far fewer) — ST-DBSCAN over all of them, with the default settings.
// 2. The read the pages do (lib/pressure-areas/read.ts) on the book's live alerts, in PostgreSQL.
import { createDb } from "@/db/client";
import { addDays, todayIn } from "@/lib/dates";
import { readPressureAreas, readPressureSettings } from "@/lib/pressure-areas/read";
import { findPressureAreas, PRESSURE_KINDS, type PressureAlert } from "@/lib/risk/pressure-areas";

import { seededRandom } from "../helpers/seeded-random";
import { BENCH_SLUG } from "./seed";

const db = createDb(process.env.DATABASE_URL!, { max: 2 });
const company = await db
  .selectFrom("companies")
  .select(["id", "time_zone"])
  .where("slug", "=", BENCH_SLUG)
  .executeTakeFirstOrThrow();
const properties = await db
  .selectFrom("properties")
  .select(["id", "latitude", "longitude"])
  .where("company_id", "=", company.id)
  .execute();
const today = todayIn(company.time_zone);
const start = addDays(today, -26 * 7);
const random = seededRandom(2026);
const alerts: PressureAlert[] = [];
for (const p of properties)
  for (const kind of PRESSURE_KINDS)
    for (let fortnight = 0; fortnight < 13; fortnight++)
      alerts.push({
        alertId: `${p.id}:${kind}:${fortnight}`,
        kind,
        propertyId: p.id,
        lat: p.latitude,
        lng: p.longitude,
        raisedOn: addDays(start, fortnight * 14 + Math.floor(random() * 14)),
      });
const settings = { distanceMi: 1, days: 7, minProperties: 3 };
findPressureAreas(alerts.slice(0, 1000), settings); // warm up the JIT
// Wall time, and this process's CPU time (user + system): on a machine shared with other work the
// CPU time is what the computation itself costs.
const t0 = performance.now();
const cpu0 = process.cpuUsage();
const seasonAreas = findPressureAreas(alerts, settings);
const cpu = process.cpuUsage(cpu0);
const coreMs = performance.now() - t0;
const coreCpuMs = (cpu.user + cpu.system) / 1000;

const liveSettings = await readPressureSettings(db, company.id);
const reads: number[] = [];
let liveAreas = 0;
for (let i = 0; i < 11; i++) {
  const t = performance.now();
  liveAreas = (await readPressureAreas(db, company.id, today, liveSettings)).length;
  reads.push(performance.now() - t);
}
reads.sort((a, b) => a - b);
await db.destroy();
console.log(
  JSON.stringify({
    properties: properties.length,
    seasonAlerts: alerts.length,
    seasonAreas: seasonAreas.length,
    coreMs,
    coreCpuMs,
    liveAreas,
    readMedianMs: reads[5],
  }),
);
