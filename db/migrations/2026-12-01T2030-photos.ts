// Zone photos: derivatives in object storage (content-addressed), measured cover and DGCI,
// and EXIF capture time and GPS kept as staff-only evidence. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    create table photos (
      id uuid primary key default gen_random_uuid(),
      company_id uuid not null,
      visit_id uuid not null,
      zone_check_id uuid not null references zone_checks (id) on delete cascade,
      zone_id uuid not null,
      property_id uuid not null,
      content_hash text not null check (content_hash ~ '^[0-9a-f]{64}$'),
      original_format text not null check (original_format in ('jpeg', 'png', 'webp')),
      original_bytes integer not null check (original_bytes > 0),
      width integer not null check (width > 0),
      height integer not null check (height > 0),
      display_key text not null,
      display_width integer not null,
      display_height integer not null,
      thumb_key text not null,
      green_cover_pct real not null check (green_cover_pct between 0 and 100),
      dgci real check (dgci between 0 and 1),
      captured_local text,
      gps_latitude double precision check (gps_latitude between -90 and 90),
      gps_longitude double precision check (gps_longitude between -180 and 180),
      uploaded_by uuid references users (id) on delete set null,
      created_at timestamptz not null default now(),
      unique (zone_check_id, content_hash),
      foreign key (company_id, visit_id) references visits (company_id, id) on delete cascade,
      foreign key (company_id, zone_id) references zones (company_id, id) on delete cascade
    )`.execute(db);
  await sql`create index photos_zone_idx on photos (company_id, zone_id, created_at)`.execute(db);
  await sql`create index photos_visit_idx on photos (company_id, visit_id)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await db.schema.dropTable("photos").ifExists().execute();
}
