// Photos are measured by the green-canopy pixel rule (Patrignani & Ochsner 2015) instead of a hue
// window: each row records the method its figures came from, and the shares of pixels too dark to
// read or clipped (the lighting caution). Rows stored before are marked 'hue-window-2001'; their
// figures are measured again from the stored display image by `npm run db:remeasure-photos`
// (the demo seed runs it), which cannot happen here: the images live in object storage.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table photos
      add column measured_by text not null default 'hue-window-2001'
        check (measured_by in ('hue-window-2001', 'canopy-rule-2015')),
      add column dark_pct real not null default 0 check (dark_pct between 0 and 100),
      add column clipped_pct real not null default 0 check (clipped_pct between 0 and 100)`.execute(
    db,
  );
  // New rows say how they were measured; only the rows already there take the old method's name.
  await sql`alter table photos alter column measured_by drop default`.execute(db);
  await sql`create index photos_measured_by_idx on photos (measured_by) where measured_by <> 'canopy-rule-2015'`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`drop index photos_measured_by_idx`.execute(db);
  await sql`
    alter table photos
      drop column measured_by,
      drop column dark_pct,
      drop column clipped_pct`.execute(db);
}
