// A company's locale (BCP 47 language and region, e.g. en-US): the language of its screens,
// e-mails and exports and the style of its dates, times and numbers. US English for every company
// until a manager chooses otherwise (the demo companies are in New Jersey and Minnesota).
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table companies
      add column locale text not null default 'en-US'
        constraint companies_locale_is_language_region check (locale ~ '^[a-z]{2}-[A-Z]{2}$')`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table companies drop column locale`.execute(db);
}
