// Product catalogue, rule-set limits, and applications with their computed nutrients, rule
// findings and override. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table rule_sets
      add column limits_are_law boolean not null default false,
      add column max_n_lb_per_1000 numeric(5, 2) check (max_n_lb_per_1000 > 0),
      add column max_wsn_lb_per_1000 numeric(5, 2) check (max_wsn_lb_per_1000 > 0),
      add column min_slow_release_pct numeric(5, 1) check (min_slow_release_pct between 0 and 100),
      add column pro_blackout_start text check (pro_blackout_start ~ '^\\d{2}-\\d{2}$'),
      add column pro_blackout_end text check (pro_blackout_end ~ '^\\d{2}-\\d{2}$'),
      add column homeowner_blackout_start text check (homeowner_blackout_start ~ '^\\d{2}-\\d{2}$'),
      add column homeowner_blackout_end text check (homeowner_blackout_end ~ '^\\d{2}-\\d{2}$'),
      add column phosphorus_rule text not null default 'allowed' check (phosphorus_rule in ('allowed', 'soil_test_or_establishment')),
      add column soil_test_max_age_years integer check (soil_test_max_age_years between 1 and 20),
      add column updated_at timestamptz not null default now()`.execute(db);

  await sql`alter table properties add column p_soil_test_on date`.execute(db);

  await sql`
    create table products (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null references companies (id) on delete cascade,
      name text not null check (length(name) between 1 and 160),
      form text not null check (form in ('granular', 'liquid', 'soluble')),
      n_pct numeric(5, 2) not null check (n_pct between 0 and 100),
      p2o5_pct numeric(5, 2) not null check (p2o5_pct between 0 and 100),
      k2o_pct numeric(5, 2) not null check (k2o_pct between 0 and 100),
      slow_release_pct_of_n numeric(5, 1) not null default 0 check (slow_release_pct_of_n between 0 and 100),
      density_lb_per_gal numeric(6, 3) check (density_lb_per_gal > 0 and density_lb_per_gal < 30),
      is_pesticide boolean not null default false,
      registration_number text not null default '' check (length(registration_number) <= 60),
      label_cautions text not null default '' check (length(label_cautions) <= 4000),
      reentry_guidance text not null default '' check (length(reentry_guidance) <= 1000),
      archived_at timestamptz,
      created_at timestamptz not null default now(),
      unique (company_id, name),
      unique (company_id, id),
      check (n_pct + p2o5_pct + k2o_pct <= 100),
      check (form <> 'liquid' or density_lb_per_gal is not null)
    )`.execute(db);

  await sql`
    create table applications (
      id uuid primary key,
      company_id uuid not null,
      visit_id uuid not null,
      zone_id uuid not null,
      product_id uuid not null,
      rate_amount numeric(10, 3) not null check (rate_amount > 0),
      rate_unit text not null check (rate_unit in ('lb/1000ft2', 'oz/1000ft2', 'floz/1000ft2', 'gal/1000ft2', 'kg/ha', 'g/m2', 'lb/acre', 'L/ha')),
      area_ft2 numeric(12, 1) not null check (area_ft2 > 0),
      product_total_lb numeric(12, 3) not null,
      product_total_gal numeric(12, 3),
      n_lb_per_1000 numeric(8, 4) not null,
      p2o5_lb_per_1000 numeric(8, 4) not null,
      k2o_lb_per_1000 numeric(8, 4) not null,
      wsn_lb_per_1000 numeric(8, 4) not null,
      applied_on date not null,
      applied_at timestamptz not null,
      wind_mph numeric(5, 1) check (wind_mph between 0 and 150),
      temperature_f numeric(5, 1) check (temperature_f between -60 and 140),
      is_establishing boolean not null default false,
      applicator_name text not null default '' check (length(applicator_name) <= 200),
      applicator_licence text not null default '' check (length(applicator_licence) <= 80),
      findings jsonb not null default '[]',
      override_reason text check (length(override_reason) <= 1000),
      override_by uuid references users (id) on delete set null,
      created_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      foreign key (company_id, visit_id) references visits (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade,
      foreign key (company_id, product_id) references products (company_id, id)
    )`.execute(db);
  await sql`create index applications_zone_idx on applications (company_id, zone_id, applied_on)`.execute(
    db,
  );
  await sql`create index applications_visit_idx on applications (company_id, visit_id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("applications").ifExists().execute();
  await db.schema.dropTable("products").ifExists().execute();
  await sql`alter table properties drop column if exists p_soil_test_on`.execute(db);
  await sql`
    alter table rule_sets
      drop column if exists limits_are_law, drop column if exists max_n_lb_per_1000, drop column if exists max_wsn_lb_per_1000,
      drop column if exists min_slow_release_pct, drop column if exists pro_blackout_start, drop column if exists pro_blackout_end,
      drop column if exists homeowner_blackout_start, drop column if exists homeowner_blackout_end, drop column if exists phosphorus_rule,
      drop column if exists soil_test_max_age_years, drop column if exists updated_at`.execute(db);
}
