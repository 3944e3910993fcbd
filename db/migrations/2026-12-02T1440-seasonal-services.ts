// Rounds outside the feeding season: soil sampling and liming join the planned services (a visit
// in a no-fertilizer window or a frozen month does one of these, or an inspection). Frozen: never
// import app code.
import { sql, type Kysely } from "kysely";

const BEFORE = [
  "feeding_round",
  "weed_control",
  "insect_control",
  "aeration_overseeding",
  "fall_feeding",
  "inspection",
  "callback",
];
const AFTER = [...BEFORE, "soil_sampling", "liming"];

async function allow(db: Kysely<any>, services: string[]): Promise<void> {
  const list = sql.join(services.map((s) => sql.lit(s)));
  await sql`alter table visits drop constraint if exists visits_planned_service_check`.execute(db);
  await sql`alter table visits add constraint visits_planned_service_check check (planned_service in (${list}))`.execute(
    db,
  );
}

export async function up(db: Kysely<any>): Promise<void> {
  await allow(db, AFTER);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`update visits set planned_service = 'inspection' where planned_service in ('soil_sampling', 'liming')`.execute(
    db,
  );
  await allow(db, BEFORE);
}
