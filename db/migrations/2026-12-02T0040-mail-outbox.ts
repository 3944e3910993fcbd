// The mail outbox: every message Sward sends is first a row here, sent by the worker and retried
// until the SMTP service accepts it, so an outage delays mail but never loses it. Frozen: never
// import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table mail_outbox (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null references companies (id) on delete cascade,
      kind text not null check (kind ~ '^[a-z_]{2,40}$'),
      dedupe_key text not null unique check (length(dedupe_key) <= 300),
      to_address text not null check (length(to_address) <= 320),
      subject text not null check (length(subject) <= 300),
      text_body text not null,
      html_body text not null,
      status text not null default 'pending' check (status in ('pending', 'sent')),
      attempts integer not null default 0,
      last_error text,
      created_at timestamptz not null default now(),
      sent_at timestamptz
    )`.execute(db);
  await sql`create index mail_outbox_pending_idx on mail_outbox (created_at) where status = 'pending'`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("mail_outbox").ifExists().execute();
}
