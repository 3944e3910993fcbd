// Field visits: rule-set references on properties, scheduled visits, one zone check per zone per
// visit (with versions for conflict detection), and an audit trail. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table companies add column time_zone text not null default 'America/New_York'`.execute(
    db,
  );

  // The rules themselves (limits, blackout windows) arrive with the agronomy engine; properties
  // reference a named rule set from the start.
  await sql`
    create table rule_sets (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null references companies (id) on delete cascade,
      name text not null check (length(name) between 1 and 120),
      citation text not null default '' check (length(citation) <= 1000),
      created_at timestamptz not null default now(),
      unique (company_id, name),
      unique (company_id, id)
    )`.execute(db);
  await sql`alter table properties add column rule_set_id uuid references rule_sets (id) on delete set null`.execute(
    db,
  );
  await sql`alter table properties add column notes text not null default '' check (length(notes) <= 4000)`.execute(
    db,
  );
  await sql`alter table zones add column updated_at timestamptz not null default now()`.execute(db);
  await sql`alter table zones add constraint zones_company_id_id_key unique (company_id, id)`.execute(
    db,
  );

  await sql`
    create table visits (
      id uuid primary key,
      company_id uuid not null,
      property_id uuid not null,
      technician_id uuid references users (id) on delete set null,
      scheduled_for date not null,
      stop_order integer not null default 0 check (stop_order between 0 and 1000),
      planned_service text not null check (planned_service in
        ('feeding_round', 'weed_control', 'insect_control', 'aeration_overseeding', 'fall_feeding', 'inspection', 'callback')),
      status text not null default 'scheduled' check (status in ('scheduled', 'in_progress', 'completed', 'cancelled')),
      notes text not null default '' check (length(notes) <= 4000),
      started_at timestamptz,
      started_by uuid references users (id) on delete set null,
      start_latitude double precision check (start_latitude between -90 and 90),
      start_longitude double precision check (start_longitude between -180 and 180),
      completed_at timestamptz,
      completed_by uuid references users (id) on delete set null,
      version integer not null default 1,
      created_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (company_id, id),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index visits_technician_day_idx on visits (company_id, technician_id, scheduled_for, stop_order)`.execute(
    db,
  );
  await sql`create index visits_property_idx on visits (company_id, property_id, scheduled_for desc)`.execute(
    db,
  );

  await sql`
    create table zone_checks (
      id uuid primary key,
      company_id uuid not null,
      visit_id uuid not null,
      zone_id uuid not null,
      status text not null default 'draft' check (status in ('draft', 'done', 'skipped')),
      quality smallint check (quality between 1 and 9),
      color smallint check (color between 1 and 9),
      density smallint check (density between 1 and 9),
      uniformity smallint check (uniformity between 1 and 9),
      bare_pct smallint check (bare_pct between 0 and 100 and bare_pct % 5 = 0),
      weeds_pct smallint check (weeds_pct between 0 and 100 and weeds_pct % 5 = 0),
      thatch_in numeric(4, 2) check (thatch_in between 0 and 6),
      soil_moisture text check (soil_moisture in ('dry', 'moist', 'wet')),
      soil_moisture_pct numeric(5, 1) check (soil_moisture_pct between 0 and 100),
      height_of_cut_in numeric(4, 2) check (height_of_cut_in between 0 and 12),
      mowing_direction text check (mowing_direction in ('same', 'changed', 'unknown')),
      is_matted boolean not null default false,
      is_scalped boolean not null default false,
      has_torn_tips boolean not null default false,
      has_clumped_clippings boolean not null default false,
      symptoms jsonb not null default '[]' check (jsonb_typeof(symptoms) = 'array'),
      notes text not null default '' check (length(notes) <= 4000),
      skip_reason text check (skip_reason in ('no_access', 'construction', 'dog_in_yard', 'other')),
      skip_note text not null default '' check (length(skip_note) <= 1000),
      version integer not null default 1,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      updated_by uuid references users (id) on delete set null,
      unique (visit_id, zone_id),
      check (status <> 'skipped' or skip_reason is not null),
      foreign key (company_id, visit_id) references visits (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index zone_checks_zone_idx on zone_checks (company_id, zone_id, created_at desc)`.execute(
    db,
  );

  await sql`
    create table audit_events (
      id bigint generated always as identity primary key,
      company_id uuid not null references companies (id) on delete cascade,
      actor_id uuid references users (id) on delete set null,
      entity text not null,
      entity_id uuid not null,
      action text not null,
      changes jsonb not null default '{}',
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index audit_events_entity_idx on audit_events (company_id, entity, entity_id, created_at)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("audit_events").ifExists().execute();
  await db.schema.dropTable("zone_checks").ifExists().execute();
  await db.schema.dropTable("visits").ifExists().execute();
  await sql`alter table zones drop constraint if exists zones_company_id_id_key`.execute(db);
  await sql`alter table zones drop column if exists updated_at`.execute(db);
  await sql`alter table properties drop column if exists notes`.execute(db);
  await sql`alter table properties drop column if exists rule_set_id`.execute(db);
  await db.schema.dropTable("rule_sets").ifExists().execute();
  await sql`alter table companies drop column if exists time_zone`.execute(db);
}
