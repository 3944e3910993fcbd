// Per-table row counts and content checksums of every table in the public schema, for tests that
// must prove data survived (a migration's round trip, a backup and its restore). The checksum is
// the md5 of every row as text in a stable order, so equal checksums mean equal contents.
import { sql, type Kysely } from "kysely";

export type TableData = Record<string, { rows: number; checksum: string }>;

export async function tableData(db: Kysely<unknown>): Promise<TableData> {
  const { rows: tables } = await sql<{ name: string }>`
    select c.relname as name from pg_class c join pg_namespace n on n.oid = c.relnamespace
     where n.nspname = 'public' and c.relkind in ('r', 'p') order by 1`.execute(db);
  const data: TableData = {};
  for (const { name } of tables) {
    const t = sql.id(name);
    const { rows } = await sql<{ rows: number; checksum: string | null }>`
      select count(*)::int as rows, md5(coalesce(string_agg(t::text, '|' order by t::text), '')) as checksum
        from ${t} as t`.execute(db);
    data[name] = { rows: rows[0]?.rows ?? 0, checksum: rows[0]?.checksum ?? "" };
  }
  return data;
}

/**
 * Gives a row to each table the demo scenario leaves empty, and one property awkward text (quotes,
 * backslashes, tabs, new lines, non-ASCII), so every table has contents to keep or to lose.
 */
export async function fillEmptyTables(db: Kysely<unknown>): Promise<void> {
  await sql`insert into audit_events (company_id, entity, entity_id, action, changes)
            select id, 'company', id, 'checked', ${JSON.stringify({ note: 'a "quoted" value' })}::jsonb from companies`.execute(
    db,
  );
  await sql`insert into mail_outbox (company_id, kind, dedupe_key, to_address, subject, text_body, html_body)
            select id, 'check', 'check:' || id, 'check@example.test', 'Check', 'text', '<p>html</p>' from companies`.execute(
    db,
  );
  await sql`insert into sign_in_attempts (email_key, address, succeeded) values ('check@example.test', '127.0.0.1', false)`.execute(
    db,
  );
  await sql`insert into sign_in_link_requests (email_key, address) values ('check@example.test', '127.0.0.1')`.execute(
    db,
  );
  await sql`insert into auth_sessions (id, user_id, expires_at) select 'check-' || id, id, now() + interval '1 day' from users`.execute(
    db,
  );
  await sql`insert into auth_accounts (user_id, type, provider, provider_account_id) select id, 'email', 'check', id::text from users order by email limit 1`.execute(
    db,
  );
  await sql`insert into verification_tokens (identifier, token, expires) values ('check@example.test', 'check-token', now() + interval '15 minutes')`.execute(
    db,
  );
  await sql`insert into homeowner_invitations (company_id, property_id, email, name, token_hash, expires_at)
            select company_id, id, 'invited-' || id || '@example.test', 'Invited Check', encode(sha256(id::text::bytea), 'hex'), now() + interval '7 days'
            from properties order by name limit 1`.execute(db);
  await sql`insert into weather_days (cell, day, tmax_c, tmin_c, precip_mm) values ('40.7:-74.0', date '2026-06-01', 27.5, 16.0, 3.2)`.execute(
    db,
  );
  await sql`insert into pressure_area_notices (company_id, area_key, kind, noticed_on)
            select id, 'check-area', 'dollar_spot_weather', date '2026-06-01' from companies`.execute(
    db,
  );
  // Season programs: the demo seeds two per company; a company without any gets one here.
  await sql`insert into programs (id, company_id, name, grass_season)
            select gen_random_uuid(), id, 'Check program', 'cool' from companies c
             where not exists (select 1 from programs p where p.company_id = c.id)`.execute(db);
  await sql`insert into program_rounds (id, company_id, program_id, position, kind, window_kind,
              start_md, end_md, granular_target, liquid_target)
            select gen_random_uuid(), company_id, id, 1, 'lime', 'dates', '03-01', '03-31', 'none', 'none'
              from programs p where not exists (select 1 from program_rounds r where r.program_id = p.id)`.execute(
    db,
  );
  await sql`update properties set notes = ${'Gate code "4471"; dog\'s name: Ôscar\tback\\slash\nsecond line — 🌱'}
             where id = (select id from properties order by name limit 1)`.execute(db);
}

/** Where every sequence of the public schema stands (identity and serial columns): a restore must
 *  bring these back too, or the next insert collides with a restored row. */
export async function sequenceValues(db: Kysely<unknown>): Promise<Record<string, string>> {
  const { rows } = await sql<{ name: string; value: string | null }>`
    select sequencename as name, last_value::text as value from pg_sequences where schemaname = 'public' order by 1`.execute(
    db,
  );
  return Object.fromEntries(rows.map((r) => [r.name, r.value ?? "never used"]));
}
