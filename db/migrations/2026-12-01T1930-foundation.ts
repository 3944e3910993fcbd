// Foundation: companies, people and their roles, Auth.js tables, sign-in throttling,
// properties with their zones and homeowners. Frozen: never import app code here.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`create extension if not exists pgcrypto`.execute(db);

  await sql`
    create table companies (
      id uuid primary key default gen_random_uuid(),
      name text not null check (length(name) between 1 and 200),
      slug text not null unique check (slug ~ '^[a-z0-9-]{2,60}$'),
      unit_system text not null default 'imperial' check (unit_system in ('imperial', 'metric')),
      created_at timestamptz not null default now()
    )`.execute(db);

  await sql`
    create table users (
      id uuid primary key default gen_random_uuid(),
      email text not null check (email = lower(email) and length(email) between 3 and 320),
      name text not null default '' check (length(name) <= 200),
      password_hash text,
      email_verified timestamptz,
      image text,
      disabled_at timestamptz,
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create unique index users_email_key on users (email)`.execute(db);

  // A user belongs to exactly one company (unique user_id), with one role there.
  await sql`
    create table memberships (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null references companies (id) on delete cascade,
      user_id uuid not null unique references users (id) on delete cascade,
      role text not null check (role in ('manager', 'technician', 'homeowner')),
      created_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index memberships_company_role_idx on memberships (company_id, role)`.execute(
    db,
  );

  await sql`
    create table auth_accounts (
      id uuid primary key default gen_random_uuid(),
      user_id uuid not null references users (id) on delete cascade,
      type text not null,
      provider text not null,
      provider_account_id text not null,
      refresh_token text,
      access_token text,
      expires_at bigint,
      token_type text,
      scope text,
      id_token text,
      session_state text,
      unique (provider, provider_account_id)
    )`.execute(db);

  await sql`
    create table auth_sessions (
      id text primary key,
      user_id uuid not null references users (id) on delete cascade,
      expires_at timestamptz not null,
      created_at timestamptz not null default now(),
      last_seen_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index auth_sessions_user_idx on auth_sessions (user_id)`.execute(db);

  await sql`
    create table verification_tokens (
      identifier text not null,
      token text not null,
      expires timestamptz not null,
      primary key (identifier, token)
    )`.execute(db);

  await sql`
    create table sign_in_attempts (
      id bigint generated always as identity primary key,
      email_key text not null,
      address text not null,
      succeeded boolean not null,
      attempted_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index sign_in_attempts_email_idx on sign_in_attempts (email_key, attempted_at)`.execute(
    db,
  );
  await sql`create index sign_in_attempts_address_idx on sign_in_attempts (address, attempted_at)`.execute(
    db,
  );

  await sql`
    create table properties (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null references companies (id) on delete cascade,
      name text not null check (length(name) between 1 and 200),
      street text not null check (length(street) between 1 and 200),
      city text not null check (length(city) between 1 and 100),
      region text not null check (length(region) between 1 and 100),
      postal_code text not null check (length(postal_code) between 1 and 20),
      latitude double precision not null check (latitude between -90 and 90),
      longitude double precision not null check (longitude between -180 and 180),
      time_zone text not null,
      technician_id uuid references users (id) on delete set null,
      archived_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      unique (company_id, id)
    )`.execute(db);
  await sql`create index properties_company_name_idx on properties (company_id, name, id)`.execute(
    db,
  );
  await sql`create index properties_technician_idx on properties (company_id, technician_id)`.execute(
    db,
  );

  // company_id is repeated so every scoped query filters on it without a join, and the composite
  // foreign key keeps it equal to the property's company.
  await sql`
    create table property_homeowners (
      property_id uuid not null,
      user_id uuid not null references users (id) on delete cascade,
      company_id uuid not null,
      primary key (property_id, user_id),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index property_homeowners_user_idx on property_homeowners (user_id)`.execute(db);

  await sql`
    create table zones (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null,
      property_id uuid not null,
      name text not null check (length(name) between 1 and 120),
      area_ft2 numeric(12, 1) not null check (area_ft2 > 0 and area_ft2 <= 10000000),
      grass_species text not null,
      sun_exposure text not null check (sun_exposure in ('full_sun', 'part_shade', 'shade')),
      is_irrigated boolean not null default false,
      slope text not null default 'flat' check (slope in ('flat', 'moderate', 'steep')),
      sort_order integer not null default 0,
      archived_at timestamptz,
      created_at timestamptz not null default now(),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index zones_property_idx on zones (property_id, sort_order)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  for (const table of [
    "zones",
    "property_homeowners",
    "properties",
    "sign_in_attempts",
    "verification_tokens",
    "auth_sessions",
    "auth_accounts",
    "memberships",
    "users",
    "companies",
  ]) {
    await db.schema.dropTable(table).ifExists().execute();
  }
}
