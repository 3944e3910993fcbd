// A stop called off as a whole: rained out or canceled, with the reason the person gave, who and
// when, and the visit that replaced it when it was rescheduled. The visit's status stays
// "cancelled" (every read that leaves canceled visits out keeps doing so); the outcome says which
// kind. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table visits
      add column cancel_kind text
        constraint visits_cancel_kind_known check (cancel_kind in ('cancelled', 'rained_out')),
      add column cancel_reason text not null default ''
        constraint visits_cancel_reason_length check (char_length(cancel_reason) <= 500),
      add column cancelled_at timestamptz,
      add column cancelled_by uuid references users (id) on delete set null,
      add column rescheduled_visit_id uuid references visits (id) on delete set null,
      add constraint visits_cancel_kind_only_when_cancelled
        check (cancel_kind is null or status = 'cancelled')`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    alter table visits
      drop constraint visits_cancel_kind_only_when_cancelled,
      drop column rescheduled_visit_id,
      drop column cancelled_by,
      drop column cancelled_at,
      drop column cancel_reason,
      drop column cancel_kind`.execute(db);
}
