// Reads of homeowner invitations: the manager's list of a property's pending invitations, and what
// the holder of an invitation link sees on opening it.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { hashedToken } from "@/lib/auth/tokens";
import { serverEnv } from "@/lib/env";
import { AppError, notFound } from "@/lib/http/app-error";

import type { InvitationDto, InvitationView } from "./dto";
import { INVITATION_COLUMNS, toInvitationDto } from "./map";

/** Pending invitations of a property (not accepted, not withdrawn; expired ones included, marked), newest first. Managers only. */
export async function listPendingInvitations(
  actor: Actor,
  propertyId: string,
): Promise<InvitationDto[]> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can see invitations.");
  const property = await db()
    .selectFrom("properties")
    .select("id")
    .where("company_id", "=", actor.companyId)
    .where("id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  const rows = await db()
    .selectFrom("homeowner_invitations")
    .select([...INVITATION_COLUMNS])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", propertyId)
    .where("role", "=", "homeowner")
    .where("accepted_at", "is", null)
    .where("revoked_at", "is", null)
    .orderBy("sent_at", "desc")
    .orderBy("id")
    .execute();
  return rows.map((r) => toInvitationDto(r));
}

/**
 * What the holder of an invitation link sees. Whether the address has an account — and whether it
 * can be linked here — is looked at only now, for the person who holds the link sent to that
 * address; the manager who invited never learns it.
 */
export async function viewInvitation(token: string): Promise<InvitationView> {
  if (!/^[0-9a-f]{64}$/.test(token)) return { state: "unknown" };
  const row = await db()
    .selectFrom("homeowner_invitations as i")
    .leftJoin("properties as p", "p.id", "i.property_id")
    .innerJoin("companies as c", "c.id", "i.company_id")
    .select([
      "i.company_id",
      "i.email",
      "i.name",
      "i.role",
      "i.expires_at",
      "i.accepted_at",
      "i.revoked_at",
      "p.street",
      "p.city",
      "c.name as company_name",
      "c.time_zone",
    ])
    .where("i.token_hash", "=", hashedToken(token, serverEnv().AUTH_SECRET))
    .executeTakeFirst();
  if (!row) return { state: "unknown" };
  const companyName = row.company_name;
  if (row.accepted_at) return { state: "accepted", companyName };
  if (row.revoked_at) return { state: "revoked", companyName };
  if (row.expires_at.getTime() <= Date.now()) return { state: "expired", companyName };
  const user = await db()
    .selectFrom("users")
    .leftJoin("memberships", "memberships.user_id", "users.id")
    .select(["users.disabled_at", "memberships.company_id", "memberships.role"])
    .where("users.email", "=", row.email)
    .executeTakeFirst();
  // A staff invitation always makes a new account; a homeowner's may join an existing one.
  const account = !user
    ? "new"
    : row.role === "homeowner" &&
        user.company_id === row.company_id &&
        user.role === "homeowner" &&
        !user.disabled_at
      ? "homeowner"
      : "unavailable";
  return {
    state: "pending",
    companyName,
    email: row.email,
    name: row.name,
    role: row.role,
    street: row.street ?? "",
    city: row.city ?? "",
    expiresAt: row.expires_at.toISOString(),
    timeZone: row.time_zone,
    account,
  };
}

/** Every address the actor's company has invited (any state): the development inbox shows them this company's invitation e-mails. */
export async function listInvitedAddresses(actor: Actor): Promise<Set<string>> {
  if (actor.role !== "manager") return new Set();
  const rows = await db()
    .selectFrom("homeowner_invitations")
    .select("email")
    .distinct()
    .where("company_id", "=", actor.companyId)
    .execute();
  return new Set(rows.map((r) => r.email));
}
