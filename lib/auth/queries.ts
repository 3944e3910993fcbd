// Reads for sign-in and sessions (writes in mutations.ts): with mutations.ts, the only auth code
// that touches the database.
import "server-only";

import { sql, type ExpressionBuilder } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";

import type { Actor } from "./actor";
import type { Homeowner, LinkUser, SignInCandidate } from "./dto";
import { KNOWN_ADDRESS_DAYS, type RecentFailures } from "./throttle";

/**
 * Staff, or a homeowner still linked to at least one property of their company: a homeowner
 * removed from every property has nothing to see and can no longer sign in (nor keep a session).
 */
const mayUseSward = (eb: ExpressionBuilder<Database, "memberships">) =>
  eb.or([
    eb("memberships.role", "!=", "homeowner"),
    eb.exists(
      eb
        .selectFrom("property_homeowners as ph")
        .select("ph.property_id")
        .whereRef("ph.user_id", "=", "memberships.user_id")
        .whereRef("ph.company_id", "=", "memberships.company_id"),
    ),
  ]);

export async function findSignInCandidate(email: string): Promise<SignInCandidate | undefined> {
  const row = await db()
    .selectFrom("users")
    .leftJoin("memberships", "memberships.user_id", "users.id")
    .select((eb) => [
      "users.id",
      "users.password_hash",
      "users.disabled_at",
      "memberships.role",
      mayUseSward(eb as unknown as ExpressionBuilder<Database, "memberships">).as("may_use"),
    ])
    .where("users.email", "=", email)
    .executeTakeFirst();
  if (!row) return undefined;
  return {
    userId: row.id,
    passwordHash: row.password_hash,
    isDisabled: row.disabled_at !== null,
    role: row.may_use ? row.role : null,
  };
}

export async function countRecentFailures(
  emailKey: string,
  address: string,
  windowMinutes: number,
): Promise<RecentFailures> {
  const since = sql<Date>`now() - make_interval(mins => ${windowMinutes})`;
  const row = await db()
    .selectNoFrom((eb) => [
      eb
        .selectFrom("sign_in_attempts")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("email_key", "=", emailKey)
        .where("succeeded", "=", false)
        .where("attempted_at", ">", since)
        .as("for_account"),
      eb
        .selectFrom("sign_in_attempts")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("email_key", "=", emailKey)
        .where("address", "=", address)
        .where("succeeded", "=", false)
        .where("attempted_at", ">", since)
        .as("for_pair"),
      eb
        .selectFrom("sign_in_attempts")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("address", "=", address)
        .where("succeeded", "=", false)
        .where("attempted_at", ">", since)
        .as("from_address"),
      eb
        .selectFrom("sign_in_attempts")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("email_key", "=", emailKey)
        .where("address", "=", address)
        .where("succeeded", "=", true)
        .where("attempted_at", ">", sql<Date>`now() - make_interval(days => ${KNOWN_ADDRESS_DAYS})`)
        .as("known"),
    ])
    .executeTakeFirstOrThrow();
  return {
    forAccount: Number(row.for_account ?? 0),
    forAccountFromAddress: Number(row.for_pair ?? 0),
    fromAddress: Number(row.from_address ?? 0),
    isKnownAddress: Number(row.known ?? 0) > 0,
  };
}

/** The actor behind a session id, or undefined when the session, user or membership is gone or disabled. */
export async function findActorBySession(sessionId: string): Promise<Actor | undefined> {
  const row = await db()
    .selectFrom("auth_sessions")
    .innerJoin("users", "users.id", "auth_sessions.user_id")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .innerJoin("companies", "companies.id", "memberships.company_id")
    .select([
      "users.id as user_id",
      "users.email",
      "users.name",
      "memberships.company_id",
      "companies.name as company_name",
      "companies.time_zone as company_time_zone",
      "companies.locale as company_locale",
      "memberships.role",
      "auth_sessions.id as session_id",
    ])
    .where("auth_sessions.id", "=", sessionId)
    .where("auth_sessions.expires_at", ">", sql<Date>`now()`)
    .where("users.disabled_at", "is", null)
    .where(mayUseSward)
    .executeTakeFirst();
  if (!row) return undefined;
  return {
    userId: row.user_id,
    email: row.email,
    name: row.name,
    companyId: row.company_id,
    companyName: row.company_name,
    companyTimeZone: row.company_time_zone,
    companyLocale: row.company_locale,
    role: row.role,
    sessionId: row.session_id,
  };
}

// ── Sign-in links (lib/auth/sign-in-link.ts) ──────────────────────────────────────────────────

/** An active homeowner account with this (normalised) e-mail, or undefined (staff, disabled, unknown). */
export async function findHomeowner(emailKey: string): Promise<Homeowner | undefined> {
  const row = await db()
    .selectFrom("users")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .innerJoin("companies", "companies.id", "memberships.company_id")
    .select([
      "users.id",
      "users.email",
      "users.name",
      "users.email_verified",
      "memberships.company_id",
      "companies.name as company_name",
      "companies.locale as company_locale",
    ])
    .where("users.email", "=", emailKey)
    .where("users.disabled_at", "is", null)
    .where("memberships.role", "=", "homeowner")
    .where(mayUseSward)
    .executeTakeFirst();
  return (
    row && {
      userId: row.id,
      email: row.email,
      name: row.name,
      emailVerified: row.email_verified,
      companyId: row.company_id,
      companyName: row.company_name,
      companyLocale: row.company_locale,
    }
  );
}

export async function findUserById(id: string): Promise<LinkUser | undefined> {
  const row = await db()
    .selectFrom("users")
    .select(["id", "email", "name", "email_verified"])
    .where("id", "=", id)
    .executeTakeFirst();
  return row && { id: row.id, email: row.email, name: row.name, emailVerified: row.email_verified };
}

export async function countRecentLinkRequests(
  emailKey: string,
  address: string,
  windowMinutes: number,
): Promise<{ forEmail: number; fromAddress: number }> {
  const since = sql<Date>`now() - make_interval(mins => ${windowMinutes})`;
  const row = await db()
    .selectNoFrom((eb) => [
      eb
        .selectFrom("sign_in_link_requests")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("email_key", "=", emailKey)
        .where("requested_at", ">", since)
        .as("for_email"),
      eb
        .selectFrom("sign_in_link_requests")
        .select((e) => e.fn.countAll<number>().as("n"))
        .where("address", "=", address)
        .where("requested_at", ">", since)
        .as("from_address"),
    ])
    .executeTakeFirstOrThrow();
  return { forEmail: Number(row.for_email ?? 0), fromAddress: Number(row.from_address ?? 0) };
}
