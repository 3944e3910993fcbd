// Watering log per zone or property, daily weather cached per location cell, and the weather
// snapshot each visit keeps. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table waterings (
      id uuid primary key,
      company_id uuid not null,
      property_id uuid not null,
      zone_id uuid,
      watered_on date not null,
      depth_in numeric(5, 3) not null check (depth_in > 0 and depth_in <= 10),
      run_minutes numeric(6, 1) check (run_minutes > 0 and run_minutes <= 1440),
      precipitation_rate_in_per_h numeric(5, 3) check (precipitation_rate_in_per_h > 0 and precipitation_rate_in_per_h <= 10),
      entered_by_role text not null check (entered_by_role in ('manager', 'technician', 'homeowner')),
      notes text not null default '' check (length(notes) <= 1000),
      created_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index waterings_property_idx on waterings (company_id, property_id, watered_on desc)`.execute(
    db,
  );

  // One row per location cell (0.1° of latitude and longitude, about 11 km) and day.
  await sql`
    create table weather_days (
      cell text not null check (cell ~ '^-?\\d+\\.\\d:-?\\d+\\.\\d$'),
      day date not null,
      tmax_c real not null,
      tmin_c real not null,
      rh_max_pct real,
      rh_min_pct real,
      rh_mean_pct real,
      wind_ms real,
      wind_height_m real,
      sunshine_h real,
      solar_mj real,
      precip_mm real not null default 0,
      is_forecast boolean not null default false,
      fetched_at timestamptz not null default now(),
      primary key (cell, day),
      check (tmax_c >= tmin_c)
    )`.execute(db);

  await sql`alter table visits add column weather jsonb`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table visits drop column if exists weather`.execute(db);
  await db.schema.dropTable("weather_days").ifExists().execute();
  await db.schema.dropTable("waterings").ifExists().execute();
}
