// Rule sets as the statutes word them, label limits on products, and the record's new fields.
// - Blackout windows become "no fertilizer after MM-DD / before MM-DD", both days excluded, as
//   N.J.S.A. 58:10A-62 words them ("before March 1st or after December 1st"). The old columns held
//   inclusive first/last days: a company's own window keeps the days it covered (first − 1,
//   last + 1); the shipped New Jersey set, whose inclusive 12-01…03-01 refused the two days the
//   law allows, keeps its strings, which now read as the statute does.
// - Each limit carries the section that states it; phosphorus exemptions for first establishment
//   and for repair are separate (Minnesota 18C.60 allows only the first); soil tests get an age.
// - Products gain the label's maximum rate per application, yearly maximum, minimum interval and
//   how their N is released; applications gain a repair flag and an override category.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

const NJ = "New Jersey turf fertiliser law";
const MN = "Minnesota phosphorus law";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table rule_sets
      rename column pro_blackout_start to pro_no_fertilizer_after`.execute(db);
  await sql`alter table rule_sets rename column pro_blackout_end to pro_no_fertilizer_before`.execute(
    db,
  );
  await sql`alter table rule_sets rename column homeowner_blackout_start to homeowner_no_fertilizer_after`.execute(
    db,
  );
  await sql`alter table rule_sets rename column homeowner_blackout_end to homeowner_no_fertilizer_before`.execute(
    db,
  );
  // Inclusive days → excluded bounds (a leap year as the calendar, so 02-29 survives).
  const shift = (col: string, days: number) =>
    sql.raw(`to_char(('2000-' || ${col})::date + ${days}, 'MM-DD')`);
  await sql`
    update rule_sets set
      pro_no_fertilizer_after = ${shift("pro_no_fertilizer_after", -1)},
      pro_no_fertilizer_before = ${shift("pro_no_fertilizer_before", 1)},
      homeowner_no_fertilizer_after = ${shift("homeowner_no_fertilizer_after", -1)},
      homeowner_no_fertilizer_before = ${shift("homeowner_no_fertilizer_before", 1)}
    where not (name = ${NJ} and coalesce(pro_no_fertilizer_after, '') = '12-01'
               and coalesce(pro_no_fertilizer_before, '') = '03-01')`.execute(db);
  await sql`
    alter table rule_sets
      add column n_limits_source text not null default '',
      add column blackout_source text not null default '',
      add column phosphorus_source text not null default '',
      add column conditions_source text not null default '',
      add column phosphorus_exempt_establishment boolean not null default true,
      add column phosphorus_exempt_repair boolean not null default true`.execute(db);
  await sql`
    update rule_sets set
      soil_test_max_age_years = coalesce(soil_test_max_age_years, 3),
      n_limits_source = 'P.L.2010, c.112, s.11a (specialty fertilizer for turf: no more than 0.7 lb water-soluble N or 0.9 lb total N per 1,000 ft² per application, at least 20 % slow-release N); for professional application the same limits are, from memory, in N.J.S.A. 58:10A-63 — that text was not read',
      blackout_source = 'N.J.S.A. 58:10A-62b (professionals: not "before March 1st or after December 1st in any calendar year"); 58:10A-62a(3) (any person: not "before March 1st or after November 15th")',
      phosphorus_source = 'P.L.2010, c.112, s.11b: a soil test "performed no more than three years before the application", "the establishment of turf for the first time", or "the reestablishment or repair of a turf area"',
      conditions_source = 'N.J.S.A. 58:10A-62a(1) and b: not when heavy rainfall "is occurring or predicted", when soils are saturated, or "when the ground is frozen"'
    where name = ${NJ}`.execute(db);
  await sql`
    update rule_sets set
      phosphorus_exempt_repair = false,
      phosphorus_source = 'Minn. Stat. 18C.60 subd. 2(b): a soil test "performed within the last three years", or "first establishing turf via seed or sod procedures, and only during the first growing season"'
    where name = ${MN}`.execute(db);

  await sql`
    alter table products
      add column label_max_rate numeric,
      add column label_rate_unit text,
      add column label_max_yearly numeric,
      add column label_min_interval_days integer,
      add column n_release text not null default 'quick',
      add constraint products_n_release check (n_release in ('quick', 'slow_release', 'organic')),
      add constraint products_label_unit check (
        (label_max_rate is null and label_max_yearly is null) or label_rate_unit is not null),
      add constraint products_label_positive check (
        coalesce(label_max_rate, 1) > 0 and coalesce(label_max_yearly, 1) > 0
        and coalesce(label_min_interval_days, 1) > 0)`.execute(db);
  await sql`update products set n_release = 'slow_release' where slow_release_pct_of_n > 0`.execute(
    db,
  );

  await sql`
    alter table applications
      add column is_repairing boolean not null default false,
      add column override_category text,
      add constraint applications_override_category check (override_category in
        ('documented_exemption', 'research_plot', 'regulator_permission', 'other'))`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table applications drop column override_category, drop column is_repairing`.execute(
    db,
  );
  await sql`
    alter table products
      drop column n_release, drop column label_min_interval_days, drop column label_max_yearly,
      drop column label_rate_unit, drop column label_max_rate`.execute(db);
  await sql`
    alter table rule_sets
      drop column phosphorus_exempt_repair, drop column phosphorus_exempt_establishment,
      drop column conditions_source, drop column phosphorus_source, drop column blackout_source,
      drop column n_limits_source`.execute(db);
  const shift = (col: string, days: number) =>
    sql.raw(`to_char(('2000-' || ${col})::date + ${days}, 'MM-DD')`);
  await sql`
    update rule_sets set
      pro_no_fertilizer_after = ${shift("pro_no_fertilizer_after", 1)},
      pro_no_fertilizer_before = ${shift("pro_no_fertilizer_before", -1)},
      homeowner_no_fertilizer_after = ${shift("homeowner_no_fertilizer_after", 1)},
      homeowner_no_fertilizer_before = ${shift("homeowner_no_fertilizer_before", -1)}
    where not (name = ${NJ} and coalesce(pro_no_fertilizer_after, '') = '12-01'
               and coalesce(pro_no_fertilizer_before, '') = '03-01')`.execute(db);
  await sql`alter table rule_sets rename column pro_no_fertilizer_after to pro_blackout_start`.execute(
    db,
  );
  await sql`alter table rule_sets rename column pro_no_fertilizer_before to pro_blackout_end`.execute(
    db,
  );
  await sql`alter table rule_sets rename column homeowner_no_fertilizer_after to homeowner_blackout_start`.execute(
    db,
  );
  await sql`alter table rule_sets rename column homeowner_no_fertilizer_before to homeowner_blackout_end`.execute(
    db,
  );
}
