// The book reads property_summaries first, in the order of the chosen sort, and stops after a page
// (tests/bench: the default view joined and sorted the whole book on every request). For that:
// every property has its summary row from the moment it is inserted (a trigger; rows missing
// today are filled), and each sort of the book has an index on exactly its sort expression with
// the property id as tie-breaker (ascending: PostgreSQL reads it backwards for descending
// sorts). The expressions must stay identical to the SORTS of lib/book/queries.ts. The book's text
// search reads one lower-cased column (name, street, city, postal code) with a trigram index
// instead of four case-insensitive patterns. pg_trgm is a trusted extension: the database's
// owner may create it.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

const SORT_INDEXES: [string, string][] = [
  ["property_summaries_book_attention_idx", "attention_score"],
  ["property_summaries_book_index_idx", "coalesce(latest_index, -1)"],
  ["property_summaries_book_slope_idx", "coalesce(trend_slope, 1000000)"],
  ["property_summaries_book_last_idx", "coalesce(last_visit_on, date '0001-01-01')"],
  ["property_summaries_book_next_idx", "coalesce(next_visit_on, date '9999-12-31')"],
  ["property_summaries_book_n_idx", "n_ytd_lb"],
];

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    insert into property_summaries (property_id, company_id)
    select id, company_id from properties
    on conflict (property_id) do nothing`.execute(db);
  await sql`
    create function property_summary_on_insert() returns trigger language plpgsql as $$
    begin
      insert into property_summaries (property_id, company_id) values (new.id, new.company_id)
      on conflict (property_id) do nothing;
      return new;
    end $$`.execute(db);
  await sql`create trigger properties_summary_row after insert on properties for each row execute function property_summary_on_insert()`.execute(
    db,
  );
  for (const [name, expr] of SORT_INDEXES)
    await sql`create index ${sql.id(name)} on property_summaries (company_id, (${sql.raw(expr)}), property_id)`.execute(
      db,
    );
  await sql`create index properties_company_lower_name_idx on properties (company_id, lower(name), id)`.execute(
    db,
  );
  await sql`drop index property_summaries_attention_idx`.execute(db);
  await sql`create extension if not exists pg_trgm`.execute(db);
  await sql`alter table properties add column search_text text generated always as (lower(name || ' ' || street || ' ' || city || ' ' || postal_code)) stored`.execute(
    db,
  );
  await sql`create index properties_search_text_trgm_idx on properties using gin (search_text gin_trgm_ops)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table properties drop column search_text`.execute(db);
  await sql`create index property_summaries_attention_idx on property_summaries (company_id, attention_score desc, property_id)`.execute(
    db,
  );
  await sql`drop index properties_company_lower_name_idx`.execute(db);
  for (const [name] of SORT_INDEXES) await sql`drop index ${sql.id(name)}`.execute(db);
  await sql`drop trigger properties_summary_row on properties`.execute(db);
  await sql`drop function property_summary_on_insert()`.execute(db);
}
