// Soil tests: a lab's results for a property, or one zone of it (lib/soil-tests, read by
// lib/agronomy/soil-test.ts). One row per sample: the same lab, date and zone cannot be recorded
// twice (a re-imported file adds nothing). `lab_p_needed`: what the lab's own report says of
// phosphorus, when it says (a state's phosphorus law reads the soil test's indication).
// properties.p_soil_test_on, which no screen ever wrote, is no longer read (the phosphorus rule
// reads the latest soil test); it stays in the table, out of db/schema.ts, because dropping it
// here would reorder the table's columns when this migration is reverted.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table soil_tests (
      id uuid primary key,
      company_id uuid not null references companies (id) on delete cascade,
      property_id uuid not null,
      zone_id uuid,
      sampled_on date not null,
      lab text not null check (char_length(lab) between 1 and 120),
      depth_in numeric(4, 1) not null check (depth_in > 0 and depth_in <= 12),
      extractant text not null
        check (extractant in ('mehlich3', 'bray1', 'olsen', 'ammonium_acetate', 'other')),
      ph numeric(3, 1) check (ph between 3 and 10),
      buffer_ph numeric(3, 1) check (buffer_ph between 4 and 8),
      buffer_method text check (buffer_method in ('mehlich', 'smp', 'sikora', 'adams_evans', 'other')),
      organic_matter_pct numeric(4, 1) check (organic_matter_pct between 0 and 100),
      p_ppm numeric(7, 1) check (p_ppm between 0 and 20000),
      k_ppm numeric(7, 1) check (k_ppm between 0 and 20000),
      ca_ppm numeric(7, 1) check (ca_ppm between 0 and 20000),
      mg_ppm numeric(7, 1) check (mg_ppm between 0 and 20000),
      s_ppm numeric(7, 1) check (s_ppm between 0 and 20000),
      lab_lime_lb_per_1000 numeric(5, 1) check (lab_lime_lb_per_1000 between 0 and 500),
      lab_p_needed boolean,
      notes text not null default '' check (char_length(notes) <= 1000),
      recorded_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade,
      constraint soil_tests_one_sample unique nulls not distinct (property_id, zone_id, sampled_on, lab)
    )`.execute(db);
  await sql`create index soil_tests_property_idx on soil_tests (company_id, property_id, sampled_on desc)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("soil_tests").ifExists().execute();
}
