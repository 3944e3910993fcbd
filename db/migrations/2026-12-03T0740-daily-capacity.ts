// How many stops a day a technician can do in the company (the manager's setting on the week's
// schedule): the capacity bar and the warning when a move or a rain delay fills a day past it.
// Ten stops is the starting value a manager changes (an invented default, not a published figure).
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table memberships
      add column daily_stop_capacity smallint not null default 10
        constraint memberships_daily_stop_capacity_range check (daily_stop_capacity between 1 and 40)`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table memberships drop column daily_stop_capacity`.execute(db);
}
