// The applicator's name and certification (license) number a person last recorded on a pesticide
// application, remembered on their account so the next application starts with them filled in.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table users
      add column applicator_name text not null default ''
        constraint users_applicator_name_length check (char_length(applicator_name) <= 200),
      add column applicator_license text not null default ''
        constraint users_applicator_license_length check (char_length(applicator_license) <= 80)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table users drop column applicator_license, drop column applicator_name`.execute(
    db,
  );
}
