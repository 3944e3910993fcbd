// The outbox retries each message with its own back-off: a row that failed waits until
// next_attempt_at (longer after each failure), so one refused message never holds the rest up.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table mail_outbox add column next_attempt_at timestamptz not null default now()`.execute(
    db,
  );
  await sql`drop index mail_outbox_pending_idx`.execute(db);
  await sql`create index mail_outbox_pending_idx on mail_outbox (next_attempt_at, created_at) where status = 'pending'`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index mail_outbox_pending_idx`.execute(db);
  await sql`alter table mail_outbox drop column next_attempt_at`.execute(db);
  await sql`create index mail_outbox_pending_idx on mail_outbox (created_at) where status = 'pending'`.execute(
    db,
  );
}
