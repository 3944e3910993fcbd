// The one-third rule needs the height of the grass before it was mowed, not the cut of an earlier
// check: a zone check records whether the zone was mowed at the visit (true), explicitly not mowed
// today (false) or not recorded (null: every check saved before this column), and, when mowed, the
// grass height before mowing. A height before mowing without "mowed today", or below the height
// of cut, is refused here as in the schema. Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table zone_checks
      add column mowed_today boolean,
      add column height_before_mowing_in numeric(4, 2)
        check (height_before_mowing_in > 0 and height_before_mowing_in <= 24),
      add constraint zone_checks_height_before_mowing_needs_mowing
        check (height_before_mowing_in is null or mowed_today is true),
      add constraint zone_checks_height_before_mowing_not_below_cut
        check (
          height_before_mowing_in is null
          or height_of_cut_in is null
          or height_before_mowing_in >= height_of_cut_in
        )`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    alter table zone_checks
      drop constraint zone_checks_height_before_mowing_not_below_cut,
      drop constraint zone_checks_height_before_mowing_needs_mowing,
      drop column height_before_mowing_in,
      drop column mowed_today`.execute(db);
}
