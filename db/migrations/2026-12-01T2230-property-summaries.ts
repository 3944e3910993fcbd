// One summary row per property for the manager's book: latest property index and trend, visits,
// open alerts, nitrogen this year, overdue, and the "needs attention" rank with its reasons.
// Kept current by the write paths and the daily sweep (lib/book/summary.ts). Frozen: never
// import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table property_summaries (
      property_id uuid primary key,
      company_id uuid not null,
      latest_index real,
      latest_index_on date,
      trend_slope real,
      trend_r2 real,
      trend_n integer not null default 0,
      trend_word text check (trend_word in ('improving', 'steady', 'declining')),
      last_visit_on date,
      next_visit_on date,
      missed_visit_on date,
      is_overdue boolean not null default false,
      alerts_high integer not null default 0,
      alerts_moderate integer not null default 0,
      alerts_low integer not null default 0,
      alert_kinds text[] not null default '{}',
      n_ytd_lb real not null default 0,
      n_max_lb real,
      attention_score integer not null default 0,
      attention_reasons text[] not null default '{}',
      updated_at timestamptz not null default now(),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index property_summaries_attention_idx on property_summaries (company_id, attention_score desc, property_id)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("property_summaries").ifExists().execute();
}
