// Record-keeping per rule set: how long application records are kept and which fields an
// application must carry before it is complete. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table rule_sets
      add column record_retention_years integer not null default 3 check (record_retention_years between 1 and 30),
      add column record_required_fields text[] not null default '{applicator_name,applicator_licence}',
      add column record_fields_apply_to text not null default 'pesticides' check (record_fields_apply_to in ('pesticides', 'all'))`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table rule_sets drop column if exists record_retention_years, drop column if exists record_required_fields, drop column if exists record_fields_apply_to`.execute(
    db,
  );
}
