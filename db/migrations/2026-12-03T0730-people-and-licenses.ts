// People: managers invite technicians and managers the way homeowners are invited (the same
// invitations table: a staff invitation names a role and no property), and each technician's
// applicator license (number, category, expiry) is kept on their account.
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

export async function up(db: Kysely<any>): Promise<void> {
  await sql`
    alter table homeowner_invitations
      add column role text not null default 'homeowner'
        constraint homeowner_invitations_role_known
          check (role in ('homeowner', 'technician', 'manager')),
      alter column property_id drop not null,
      add constraint homeowner_invitations_property_for_homeowners
        check ((role = 'homeowner') = (property_id is not null))`.execute(db);
  await sql`
    create unique index homeowner_invitations_pending_staff_key
      on homeowner_invitations (company_id, email)
      where property_id is null and accepted_at is null and revoked_at is null`.execute(db);
  await sql`
    alter table users
      add column license_number text not null default ''
        constraint users_license_number_length check (char_length(license_number) <= 80),
      add column license_category text not null default ''
        constraint users_license_category_length check (char_length(license_category) <= 120),
      add column license_expires_on date,
      add constraint users_license_complete
        check (license_number = '' or license_expires_on is not null)`.execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await sql`
    alter table users
      drop constraint users_license_complete,
      drop column license_expires_on,
      drop column license_category,
      drop column license_number`.execute(db);
  await sql`drop index if exists homeowner_invitations_pending_staff_key`.execute(db);
  await sql`delete from homeowner_invitations where property_id is null`.execute(db);
  await sql`
    alter table homeowner_invitations
      drop constraint homeowner_invitations_property_for_homeowners,
      alter column property_id set not null,
      drop column role`.execute(db);
}
