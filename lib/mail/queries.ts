// Reads for the mail screens (development inbox).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";

/** The e-mail addresses of everyone in the actor's company (the development inbox shows only their mail). */
export async function companyEmailAddresses(actor: Actor): Promise<Set<string>> {
  const people = await db()
    .selectFrom("users")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .select("users.email")
    .where("memberships.company_id", "=", actor.companyId)
    .execute();
  return new Set(people.map((p) => p.email));
}
