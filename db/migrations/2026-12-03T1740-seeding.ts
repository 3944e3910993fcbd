// Seeding and pre-emergence on products (lib/agronomy/seeding.ts): a pre-emergence herbicide
// names its active ingredient class and, when entered, the label's interval between it and
// seeding the same turf; a seed product names the grass species it is. A product is not both
// (a seed with a pre-emergence in the bag is entered as the pre-emergence's label says).
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table products
      add column pre_emergence_active text
        check (pre_emergence_active in
          ('prodiamine', 'dithiopyr', 'pendimethalin', 'siduron', 'mesotrione', 'other')),
      add column seeding_interval_days integer
        check (seeding_interval_days between 0 and 366),
      add column seed_species text check (char_length(seed_species) between 1 and 60),
      add constraint products_seed_or_pre_emergence
        check (pre_emergence_active is null or seed_species is null),
      add constraint products_interval_of_pre_emergence
        check (seeding_interval_days is null or pre_emergence_active is not null)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    alter table products
      drop constraint products_interval_of_pre_emergence,
      drop constraint products_seed_or_pre_emergence,
      drop column seed_species,
      drop column seeding_interval_days,
      drop column pre_emergence_active`.execute(db);
}
