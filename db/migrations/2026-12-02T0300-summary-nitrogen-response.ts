// The book's "zones that respond to nitrogen" per property, kept with the rest of the property's
// summary (computed on write and by the sweep), so the book never reads every zone check to
// count them. Rows written before this migration count 0 until their next refresh; the worker's
// sweep at start refreshes every property. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table property_summaries
      add column zones_total integer not null default 0,
      add column zones_enough_checks integer not null default 0,
      add column zones_responding_n integer not null default 0`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table property_summaries drop column zones_responding_n, drop column zones_enough_checks, drop column zones_total`.execute(
    db,
  );
}
