// The Sward Index stored with each zone check (computed when the check is saved, recomputed by
// `npm run db:recompute-index` when the weights change). Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`alter table zone_checks add column sward_index real check (sward_index between 0 and 100), add column index_parts jsonb`.execute(
    db,
  );
  await sql`create index zone_checks_index_idx on zone_checks (company_id, zone_id) where sward_index is not null`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists zone_checks_index_idx`.execute(db);
  await sql`alter table zone_checks drop column if exists sward_index, drop column if exists index_parts`.execute(
    db,
  );
}
