// Risk alerts with their lifecycle (open → acknowledged → resolved), one live alert per
// property, zone and kind, episodes linked when a resolved alert recurs, and every change kept.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table risk_alerts (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null,
      property_id uuid not null,
      zone_id uuid,
      kind text not null check (kind ~ '^[a-z_]{2,40}$'),
      status text not null default 'open' check (status in ('open', 'acknowledged', 'resolved')),
      severity text not null check (severity in ('low', 'moderate', 'high')),
      summary text not null check (length(summary) <= 2000),
      evidence jsonb not null,
      source text not null check (length(source) <= 2000),
      raised_on date not null,
      last_seen_on date not null,
      clear_since date,
      raised_by_visit_id uuid,
      previous_alert_id uuid references risk_alerts (id) on delete set null,
      acknowledged_at timestamptz,
      acknowledged_by uuid references users (id) on delete set null,
      resolved_at timestamptz,
      resolved_by uuid references users (id) on delete set null,
      resolution text check (resolution in ('manual', 'auto')),
      notified_at timestamptz,
      created_at timestamptz not null default now(),
      updated_at timestamptz not null default now(),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade,
      check ((status = 'resolved') = (resolved_at is not null))
    )`.execute(db);
  // The same condition updates its one live alert: never two open for one property, zone and kind.
  await sql`create unique index risk_alerts_live_key on risk_alerts (company_id, property_id, coalesce(zone_id, '00000000-0000-0000-0000-000000000000'::uuid), kind) where status <> 'resolved'`.execute(
    db,
  );
  await sql`create index risk_alerts_company_idx on risk_alerts (company_id, status, severity, raised_on desc)`.execute(
    db,
  );
  await sql`create index risk_alerts_property_idx on risk_alerts (company_id, property_id, status)`.execute(
    db,
  );

  await sql`
    create table risk_alert_events (
      id bigserial primary key,
      alert_id uuid not null references risk_alerts (id) on delete cascade,
      company_id uuid not null,
      at timestamptz not null default now(),
      actor_id uuid references users (id) on delete set null,
      action text not null check (action in ('raised', 'reopened', 'updated', 'acknowledged', 'resolved', 'auto_resolved', 'cleared', 'returned')),
      from_status text,
      to_status text,
      note text not null default '' check (length(note) <= 2000),
      details jsonb not null default '{}'
    )`.execute(db);
  await sql`create index risk_alert_events_alert_idx on risk_alert_events (alert_id, at)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("risk_alert_events").ifExists().execute();
  await db.schema.dropTable("risk_alerts").ifExists().execute();
}
