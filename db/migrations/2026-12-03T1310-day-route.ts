// The day's route: a property's customer phone (E.164, a US number: +1 and ten digits whose area
// code and exchange start with 2–9, the North American Numbering Plan's NPA-NXX-XXXX) and its
// access notes (gate code, dog in the yard) shown on the technician's stop; the company's yard,
// where a day's route starts and ends; a technician's own start point, which takes its place.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table properties
      add column customer_phone text
        constraint properties_customer_phone_e164 check (customer_phone ~ '^\\+1[2-9][0-9]{2}[2-9][0-9]{6}$'),
      add column access_notes text not null default ''
        constraint properties_access_notes_length check (char_length(access_notes) <= 500)`.execute(
    db,
  );
  await sql`
    alter table companies
      add column yard_address text not null default ''
        constraint companies_yard_address_length check (char_length(yard_address) <= 200),
      add column yard_latitude double precision
        constraint companies_yard_latitude_range check (yard_latitude between -90 and 90),
      add column yard_longitude double precision
        constraint companies_yard_longitude_range check (yard_longitude between -180 and 180),
      add constraint companies_yard_both check ((yard_latitude is null) = (yard_longitude is null))`.execute(
    db,
  );
  await sql`
    alter table memberships
      add column start_label text not null default ''
        constraint memberships_start_label_length check (char_length(start_label) <= 200),
      add column start_latitude double precision
        constraint memberships_start_latitude_range check (start_latitude between -90 and 90),
      add column start_longitude double precision
        constraint memberships_start_longitude_range check (start_longitude between -180 and 180),
      add constraint memberships_start_both check ((start_latitude is null) = (start_longitude is null))`.execute(
    db,
  );
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`alter table memberships drop column start_label, drop column start_latitude, drop column start_longitude`.execute(
    db,
  );
  await sql`alter table companies drop column yard_address, drop column yard_latitude, drop column yard_longitude`.execute(
    db,
  );
  await sql`alter table properties drop column customer_phone, drop column access_notes`.execute(
    db,
  );
}
