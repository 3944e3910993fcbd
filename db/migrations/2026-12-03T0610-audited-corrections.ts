// Every correction of a finished visit is audited with its reason: an audit event names the visit
// (and the zone) it belongs to, so the visit's trail still reads a deleted application or photo,
// and carries the reason the person gave. A watering can be recorded on a visit. Existing visit
// and zone-check events are linked to their visit and zone. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table audit_events
      add column visit_id uuid references visits (id) on delete cascade,
      add column zone_id uuid references zones (id) on delete set null,
      add column reason text check (reason is null or char_length(reason) between 1 and 500)`.execute(
    db,
  );
  await sql`create index audit_events_visit_idx on audit_events (company_id, visit_id, created_at) where visit_id is not null`.execute(
    db,
  );
  await sql`update audit_events set visit_id = entity_id where entity = 'visit'`.execute(db);
  await sql`
    update audit_events e set visit_id = c.visit_id, zone_id = c.zone_id
      from zone_checks c
     where e.entity = 'zone_check' and c.id = e.entity_id`.execute(db);
  await sql`
    update audit_events e set visit_id = a.visit_id, zone_id = a.zone_id
      from applications a
     where e.entity = 'application' and a.id = e.entity_id`.execute(db);
  await sql`
    alter table waterings
      add column visit_id uuid references visits (id) on delete set null`.execute(db);
  await sql`create index waterings_visit_idx on waterings (visit_id) where visit_id is not null`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index if exists waterings_visit_idx`.execute(db);
  await sql`alter table waterings drop column visit_id`.execute(db);
  await sql`drop index if exists audit_events_visit_idx`.execute(db);
  await sql`
    alter table audit_events
      drop column reason,
      drop column zone_id,
      drop column visit_id`.execute(db);
}
