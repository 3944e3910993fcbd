// People of the actor's company (for choosing a technician or linking a homeowner). Managers see
// everyone of their company; technicians only the homeowners of the properties in their scope
// (lib/auth/scope.ts) and themselves; homeowners nobody.
import "server-only";

import { db } from "@/db";
import type { Role } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";

import type { PersonDto } from "./dto";

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

/** The applicator's name and license number the actor last recorded (empty until the first). */
export async function getRememberedApplicator(
  actor: Actor,
): Promise<{ name: string; license: string }> {
  const row = await db()
    .selectFrom("users")
    .select(["applicator_name", "applicator_license"])
    .where("id", "=", actor.userId)
    .executeTakeFirst();
  return { name: row?.applicator_name ?? "", license: row?.applicator_license ?? "" };
}
