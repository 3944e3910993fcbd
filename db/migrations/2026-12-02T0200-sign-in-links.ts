// Sign-in links for homeowners: every request for a link is counted here (whether or not the
// address has an account, so the throttle reveals nothing), per e-mail and per client address.
// The links themselves live in verification_tokens (foundation). Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table sign_in_link_requests (
      id bigint generated always as identity primary key,
      email_key text not null check (length(email_key) <= 320),
      address text not null check (length(address) <= 100),
      requested_at timestamptz not null default now()
    )`.execute(db);
  await sql`create index sign_in_link_requests_email_idx on sign_in_link_requests (email_key, requested_at)`.execute(
    db,
  );
  await sql`create index sign_in_link_requests_address_idx on sign_in_link_requests (address, requested_at)`.execute(
    db,
  );
  await sql`create index verification_tokens_expires_idx on verification_tokens (expires)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists verification_tokens_expires_idx`.execute(db);
  await db.schema.dropTable("sign_in_link_requests").ifExists().execute();
}
