// Homeowner invitations: a manager invites an e-mail address to a property; the property is linked
// only when the person opens the e-mailed link and confirms (setting a password when the address
// has no account yet). Only the token's hash is stored (sha256 of the token and AUTH_SECRET, as
// sign-in links store theirs); a token is single use and expires. One pending invitation per
// address and property: inviting the same address again sends a new link in its place.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table homeowner_invitations (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null,
      property_id uuid not null,
      email text not null check (email = lower(email) and length(email) between 3 and 320),
      name text not null check (length(name) between 1 and 200),
      token_hash text not null unique check (length(token_hash) = 64),
      expires_at timestamptz not null,
      invited_by uuid references users (id) on delete set null,
      sent_at timestamptz not null default now(),
      send_count integer not null default 1 check (send_count >= 1),
      accepted_at timestamptz,
      accepted_user_id uuid references users (id) on delete set null,
      revoked_at timestamptz,
      revoked_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      check (accepted_at is null or revoked_at is null),
      foreign key (company_id, property_id) references properties (company_id, id) on delete cascade
    )`.execute(db);
  await sql`
    create unique index homeowner_invitations_pending_key
      on homeowner_invitations (property_id, email)
      where accepted_at is null and revoked_at is null`.execute(db);
  await sql`create index homeowner_invitations_company_idx on homeowner_invitations (company_id, property_id)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("homeowner_invitations").ifExists().execute();
}
