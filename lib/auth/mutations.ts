// Writes for sign-in and sessions: attempts, session rows, verification tokens, link requests.
import "server-only";

import { randomBytes } from "node:crypto";
import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { enqueueMail, type OutgoingMail } from "@/lib/mail/outbox";

import type { LinkUser } from "./dto";

export async function recordSignInAttempt(
  emailKey: string,
  address: string,
  succeeded: boolean,
): Promise<void> {
  await db()
    .insertInto("sign_in_attempts")
    .values({ email_key: emailKey, address, succeeded })
    .execute();
  if (succeeded) {
    // A successful sign-in clears that account's failure count.
    await db()
      .deleteFrom("sign_in_attempts")
      .where("email_key", "=", emailKey)
      .where("succeeded", "=", false)
      .execute();
  }
}

export async function createAuthSession(userId: string, maxAgeSeconds: number): Promise<string> {
  const id = randomBytes(32).toString("base64url");
  await db()
    .insertInto("auth_sessions")
    .values({ id, user_id: userId, expires_at: new Date(Date.now() + maxAgeSeconds * 1000) })
    .execute();
  return id;
}

export async function deleteAuthSession(sessionId: string): Promise<void> {
  await db().deleteFrom("auth_sessions").where("id", "=", sessionId).execute();
}

export async function markEmailVerified(
  id: string,
  at: Date | null | undefined,
): Promise<LinkUser> {
  const row = await db()
    .updateTable("users")
    .set({ email_verified: at ?? undefined })
    .where("id", "=", id)
    .returning(["id", "email", "name", "email_verified"])
    .executeTakeFirstOrThrow();
  return { id: row.id, email: row.email, name: row.name, emailVerified: row.email_verified };
}

/** A sign-in link: the token row (its hash) and the link's e-mail commit together. */
export async function storeSignInLink(
  token: { identifier: string; token: string; expires: Date },
  mail: OutgoingMail,
): Promise<void> {
  await db()
    .transaction()
    .execute(async (trx) => {
      await trx
        .deleteFrom("verification_tokens")
        .where("expires", "<", sql<Date>`now() - interval '1 day'`)
        .execute();
      await trx.insertInto("verification_tokens").values(token).execute();
      await enqueueMail(trx, mail);
    });
}

/** A link's token (hashed) in the caller's transaction: the one that queues its e-mail. */
export async function storeLinkToken(
  trx: Transaction<Database>,
  token: { identifier: string; token: string; expires: Date },
): Promise<void> {
  await trx.insertInto("verification_tokens").values(token).execute();
}

/** Deleting as it is read makes a link single-use, even when opened twice at once. */
export async function takeVerificationToken(
  identifier: string,
  token: string,
): Promise<{ identifier: string; token: string; expires: Date } | undefined> {
  return db()
    .deleteFrom("verification_tokens")
    .where("identifier", "=", identifier)
    .where("token", "=", token)
    .returningAll()
    .executeTakeFirst();
}

export async function recordLinkRequest(emailKey: string, address: string): Promise<void> {
  await db()
    .insertInto("sign_in_link_requests")
    .values({ email_key: emailKey, address: address.slice(0, 100) })
    .execute();
}
