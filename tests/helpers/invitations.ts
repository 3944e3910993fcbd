// Invitations (homeowners' and staff's) in tests: the token of the latest invitation e-mail queued for an address
// (read from the outbox, as the person would read it from the e-mail), and accepting it.
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";

/** The invitation link of the newest invitation e-mail to `email` in the outbox. */
export async function invitationLinkFor(
  db: Kysely<Database>,
  email: string,
  kind: "homeowner_invitation" | "staff_invitation" = "homeowner_invitation",
): Promise<URL> {
  const mail = await db
    .selectFrom("mail_outbox")
    .select(["text_body"])
    .where("kind", "=", kind)
    .where("to_address", "=", email)
    .orderBy("created_at", "desc")
    .orderBy("id", "desc")
    .limit(1)
    .executeTakeFirstOrThrow();
  const link = mail.text_body.match(/https?:\/\/\S+\/invitation\?token=[0-9a-f]{64}/)?.[0];
  if (!link) throw new Error(`no invitation link in the e-mail to ${email}`);
  return new URL(link);
}

export async function invitationTokenFor(
  db: Kysely<Database>,
  email: string,
  kind: "homeowner_invitation" | "staff_invitation" = "homeowner_invitation",
): Promise<string> {
  return (await invitationLinkFor(db, email, kind)).searchParams.get("token")!;
}
