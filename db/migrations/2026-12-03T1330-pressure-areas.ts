// Pressure areas (lib/risk/pressure-areas.ts): each company's three settings (the distance in
// miles, the window in days and the fewest properties that make an area; Sward's defaults of
// 1 mi, 7 days and 3 properties are common practice, not published values), the areas the
// managers' digest has already named (so each new area is named once), and an index that reads a
// company's alerts of one kind by the day they were raised. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table companies
      add column pressure_distance_mi numeric(4,2) not null default 1
        constraint companies_pressure_distance_range check (pressure_distance_mi between 0.1 and 25),
      add column pressure_days smallint not null default 7
        constraint companies_pressure_days_range check (pressure_days between 1 and 30),
      add column pressure_min_properties smallint not null default 3
        constraint companies_pressure_min_properties_range check (pressure_min_properties between 2 and 20)`.execute(
    db,
  );
  await sql`
    create table pressure_area_notices (
      company_id uuid not null references companies (id) on delete cascade,
      area_key text not null check (length(area_key) between 1 and 100),
      kind text not null,
      noticed_on date not null,
      created_at timestamptz not null default now(),
      primary key (company_id, area_key)
    )`.execute(db);
  await sql`create index risk_alerts_kind_raised_idx on risk_alerts (company_id, kind, raised_on)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists risk_alerts_kind_raised_idx`.execute(db);
  await db.schema.dropTable("pressure_area_notices").ifExists().execute();
  await sql`
    alter table companies
      drop column pressure_distance_mi,
      drop column pressure_days,
      drop column pressure_min_properties`.execute(db);
}
