// Season programs (lib/programs): a company's templates of rounds, the program each property
// follows, and per zone the method (granular or liquid) or its exclusion for a season with a
// reason. A round's window is dates (month-day to month-day, every year) or a trigger: growing
// degree days on a stated base (°F) or a soil or air temperature (°F), with the days the window
// stays open after it. Per method: the default product and the target — lb N per 1,000 ft², from
// growth potential, or no nitrogen. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table programs (
      id uuid primary key,
      company_id uuid not null references companies (id) on delete cascade,
      name text not null check (char_length(name) between 1 and 80),
      grass_season text not null check (grass_season in ('cool', 'warm')),
      notes text not null default '' check (char_length(notes) <= 1000),
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (company_id, id),
      constraint programs_name_unique unique (company_id, name)
    )`.execute(db);
  await sql`
    create table program_rounds (
      id uuid primary key,
      company_id uuid not null,
      program_id uuid not null,
      position integer not null check (position between 1 and 30),
      kind text not null check (kind in ('feeding', 'pre_emergence', 'grub_control',
        'weed_control', 'aeration_overseeding', 'lime', 'soil_sampling', 'fall_feeding')),
      window_kind text not null check (window_kind in ('dates', 'gdd', 'soil_temperature', 'air_temperature')),
      start_md text check (start_md ~ '^(0[1-9]|1[0-2])-(0[1-9]|[12][0-9]|3[01])$'),
      end_md text check (end_md ~ '^(0[1-9]|1[0-2])-(0[1-9]|[12][0-9]|3[01])$'),
      trigger_base_f numeric(4, 1) check (trigger_base_f between 32 and 70),
      trigger_value numeric(6, 1) check (trigger_value between 0 and 6000),
      window_days integer check (window_days between 1 and 120),
      granular_product_id uuid,
      granular_target text not null check (granular_target in ('lb', 'growth_potential', 'none')),
      granular_n_lb numeric(4, 2) check (granular_n_lb > 0 and granular_n_lb <= 3),
      liquid_product_id uuid,
      liquid_target text not null check (liquid_target in ('lb', 'growth_potential', 'none')),
      liquid_n_lb numeric(4, 2) check (liquid_n_lb > 0 and liquid_n_lb <= 3),
      foreign key (company_id, program_id) references programs (company_id, id) on delete cascade,
      foreign key (company_id, granular_product_id) references products (company_id, id),
      foreign key (company_id, liquid_product_id) references products (company_id, id),
      constraint program_rounds_position unique (program_id, position),
      constraint program_rounds_window check (
        (window_kind = 'dates' and start_md is not null and end_md is not null
          and trigger_value is null and window_days is null)
        or (window_kind <> 'dates' and trigger_value is not null and window_days is not null
          and start_md is null and end_md is null
          and (window_kind <> 'gdd' or trigger_base_f is not null))),
      constraint program_rounds_granular_lb check ((granular_target = 'lb') = (granular_n_lb is not null)),
      constraint program_rounds_liquid_lb check ((liquid_target = 'lb') = (liquid_n_lb is not null))
    )`.execute(db);
  await sql`alter table properties add column program_id uuid`.execute(db);
  await sql`alter table properties add constraint properties_program_fk
    foreign key (company_id, program_id) references programs (company_id, id)`.execute(db);
  await sql`alter table zones add column program_method text not null default 'granular'
    check (program_method in ('granular', 'liquid'))`.execute(db);
  await sql`alter table zones add column program_excluded_year integer
    check (program_excluded_year between 2000 and 2100)`.execute(db);
  await sql`alter table zones add column program_excluded_reason text
    check (char_length(program_excluded_reason) between 1 and 200)`.execute(db);
  await sql`alter table zones add constraint zones_program_exclusion
    check ((program_excluded_year is null) = (program_excluded_reason is null))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table zones drop constraint if exists zones_program_exclusion`.execute(db);
  await sql`alter table zones drop column if exists program_excluded_reason`.execute(db);
  await sql`alter table zones drop column if exists program_excluded_year`.execute(db);
  await sql`alter table zones drop column if exists program_method`.execute(db);
  await sql`alter table properties drop constraint if exists properties_program_fk`.execute(db);
  await sql`alter table properties drop column if exists program_id`.execute(db);
  await db.schema.dropTable("program_rounds").ifExists().execute();
  await db.schema.dropTable("programs").ifExists().execute();
}
