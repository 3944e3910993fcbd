// People of the actor's company (for choosing a technician or linking a homeowner). Managers see
// everyone of their company; technicians only the homeowners of the properties in their scope
// (lib/auth/scope.ts) and themselves; homeowners nobody.
import "server-only";

import type { Kysely } from "kysely";

import { db } from "@/db";
import type { Database, Role } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";

import type {
  DirectoryPersonDto,
  LicenseDto,
  PeopleDirectoryDto,
  PersonDto,
  ReassignCountDto,
} from "./dto";
import { daysUntilExpiry, licenseStanding } from "./license";

export async function listPeople(actor: Actor, role?: Role): Promise<PersonDto[]> {
  if (actor.role === "homeowner") return [];
  let q = db()
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select(["users.id", "users.name", "users.email", "memberships.role", "users.disabled_at"])
    .where("memberships.company_id", "=", actor.companyId);
  if (role) q = q.where("memberships.role", "=", role);
  if (actor.role === "technician")
    q = q.where((eb) =>
      eb.or([
        eb("users.id", "=", actor.userId),
        eb.and([
          eb("memberships.role", "=", "homeowner"),
          eb.exists(
            eb
              .selectFrom("property_homeowners as ph")
              .innerJoin("properties", "properties.id", "ph.property_id")
              .select("ph.property_id")
              .whereRef("ph.user_id", "=", "users.id")
              .where("ph.company_id", "=", actor.companyId)
              .where(propertyInScope(actor)),
          ),
        ]),
      ]),
    );
  const rows = await q.orderBy("users.name").execute();
  return rows.map((r) => ({
    id: r.id,
    name: r.name,
    email: r.email,
    role: r.role,
    isDisabled: r.disabled_at !== null,
  }));
}

/** The e-mail addresses of everyone in the actor's company (the development inbox shows only their mail). */
export async function listCompanyEmailAddresses(actor: Actor): Promise<Set<string>> {
  const people = await db()
    .selectFrom("users")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .select("users.email")
    .where("memberships.company_id", "=", actor.companyId)
    .execute();
  return new Set(people.map((p) => p.email));
}

/**
 * The applicator a new pesticide application starts with: the license on record on the actor's
 * account (People page) when there is one, otherwise the name and license number they last
 * recorded (empty until the first).
 */
export async function getRememberedApplicator(
  actor: Actor,
): Promise<{ name: string; license: string }> {
  const row = await db()
    .selectFrom("users")
    .select(["name", "applicator_name", "applicator_license", "license_number"])
    .where("id", "=", actor.userId)
    .executeTakeFirst();
  if (row?.license_number)
    return { name: row.applicator_name || row.name, license: row.license_number };
  return { name: row?.applicator_name ?? "", license: row?.applicator_license ?? "" };
}

function toLicenseDto(
  row: { license_number: string; license_category: string; license_expires_on: string | null },
  today: string,
): LicenseDto | null {
  if (!row.license_number || !row.license_expires_on) return null;
  const license = {
    number: row.license_number,
    category: row.license_category,
    expiresOn: row.license_expires_on,
  };
  const standing = licenseStanding(license, today);
  return {
    ...license,
    standing: standing === "none" ? "valid" : standing,
    daysLeft: daysUntilExpiry(license, today),
  };
}

/** The actor's own applicator license with its standing today (technicians; null when none). */
export async function getOwnLicense(actor: Actor): Promise<LicenseDto | null> {
  if (actor.role !== "technician") return null;
  const row = await db()
    .selectFrom("users")
    .select(["license_number", "license_category", "license_expires_on"])
    .where("id", "=", actor.userId)
    .executeTakeFirst();
  return row ? toLicenseDto(row, todayIn(actor.companyTimeZone)) : null;
}

function requireManager(actor: Actor): void {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can see the company's people.");
}

/** Everyone of the actor's company with status, licenses and properties, and pending invitations (managers). */
export async function getPeopleDirectory(actor: Actor): Promise<PeopleDirectoryDto> {
  requireManager(actor);
  const today = todayIn(actor.companyTimeZone);
  const [people, homes, assigned, invitations] = await Promise.all([
    db()
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select([
        "users.id",
        "users.name",
        "users.email",
        "users.disabled_at",
        "users.license_number",
        "users.license_category",
        "users.license_expires_on",
        "memberships.role",
        "memberships.start_label",
        "memberships.start_latitude",
        "memberships.start_longitude",
      ])
      .where("memberships.company_id", "=", actor.companyId)
      .orderBy("users.name")
      .orderBy("users.id")
      .execute(),
    db()
      .selectFrom("property_homeowners as ph")
      .innerJoin("properties as p", "p.id", "ph.property_id")
      .select(["ph.user_id", "p.id", "p.name", "p.street"])
      .where("ph.company_id", "=", actor.companyId)
      .where("p.company_id", "=", actor.companyId)
      .orderBy("p.name")
      .execute(),
    db()
      .selectFrom("properties as p")
      .select(["p.technician_id as user_id", "p.id", "p.name", "p.street"])
      .where("p.company_id", "=", actor.companyId)
      .where("p.technician_id", "is not", null)
      .where("p.archived_at", "is", null)
      .orderBy("p.name")
      .execute(),
    db()
      .selectFrom("homeowner_invitations as i")
      .leftJoin("properties as p", "p.id", "i.property_id")
      .select([
        "i.id",
        "i.email",
        "i.name",
        "i.role",
        "i.sent_at",
        "i.expires_at",
        "i.send_count",
        "p.id as property_id",
        "p.name as property_name",
      ])
      .where("i.company_id", "=", actor.companyId)
      .where("i.accepted_at", "is", null)
      .where("i.revoked_at", "is", null)
      .orderBy("i.sent_at", "desc")
      .orderBy("i.id")
      .execute(),
  ]);
  const propertiesOf = new Map<string, DirectoryPersonDto["properties"]>();
  for (const r of [...homes, ...assigned]) {
    if (!r.user_id) continue;
    const list = propertiesOf.get(r.user_id) ?? [];
    list.push({ id: r.id, name: r.name, street: r.street });
    propertiesOf.set(r.user_id, list);
  }
  const now = Date.now();
  return {
    today,
    timeZone: actor.companyTimeZone,
    people: people.map((p) => ({
      id: p.id,
      name: p.name,
      email: p.email,
      role: p.role,
      isDisabled: p.disabled_at !== null,
      isYou: p.id === actor.userId,
      license: p.role === "technician" ? toLicenseDto(p, today) : null,
      properties: p.role === "manager" ? [] : (propertiesOf.get(p.id) ?? []),
      startPoint:
        p.role === "technician" && p.start_latitude !== null && p.start_longitude !== null
          ? { address: p.start_label, latitude: p.start_latitude, longitude: p.start_longitude }
          : null,
    })),
    invitations: invitations.map((i) => ({
      id: i.id,
      email: i.email,
      name: i.name,
      role: i.role,
      property:
        i.property_id && i.property_name ? { id: i.property_id, name: i.property_name } : null,
      sentAt: i.sent_at.toISOString(),
      expiresAt: i.expires_at.toISOString(),
      isExpired: i.expires_at.getTime() <= now,
      sendCount: i.send_count,
    })),
  };
}

/**
 * A technician of the actor's company, or undefined: any status, or only one who can be given
 * stops (`active`: not disabled). Runs on the caller's transaction when given one.
 */
export async function findCompanyTechnician(
  actor: Actor,
  userId: string,
  opts: { active?: boolean; trx?: Kysely<Database> } = {},
) {
  let q = (opts.trx ?? db())
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select(["users.id", "users.name", "users.disabled_at", "memberships.daily_stop_capacity"])
    .where("memberships.company_id", "=", actor.companyId)
    .where("memberships.role", "=", "technician")
    .where("users.id", "=", userId);
  if (opts.active) q = q.where("users.disabled_at", "is", null);
  return q.executeTakeFirst();
}

/** What moving a technician's properties to another would move: properties and future scheduled stops. */
export async function countReassignment(
  actor: Actor,
  fromTechnicianId: string,
): Promise<ReassignCountDto> {
  requireManager(actor);
  if (!(await findCompanyTechnician(actor, fromTechnicianId))) throw notFound("That technician");
  const today = todayIn(actor.companyTimeZone);
  const [properties, stops] = await Promise.all([
    db()
      .selectFrom("properties")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .where("company_id", "=", actor.companyId)
      .where("technician_id", "=", fromTechnicianId)
      .executeTakeFirstOrThrow(),
    db()
      .selectFrom("visits")
      .innerJoin("properties", "properties.id", "visits.property_id")
      .select((eb) => eb.fn.countAll<number>().as("n"))
      .where("visits.company_id", "=", actor.companyId)
      .where("properties.technician_id", "=", fromTechnicianId)
      .where("visits.technician_id", "=", fromTechnicianId)
      .where("visits.status", "=", "scheduled")
      .where("visits.scheduled_for", ">=", today)
      .executeTakeFirstOrThrow(),
  ]);
  return { properties: Number(properties.n), stops: Number(stops.n) };
}
