// The outbox (db handle from the caller): enqueue a message once per dedupe key; deliver the
// pending ones, marking each sent only after SMTP accepted it. Delivery is at least once: a crash
// between "accepted" and "marked" can repeat one message, never lose it.
import type { Kysely } from "kysely";
import type { Database } from "@/db/schema";
import type { Mailer } from "@/lib/services/mail";

export interface OutgoingMail {
  companyId: string;
  kind: string;
  dedupeKey: string;
  to: string;
  subject: string;
  text: string;
  html: string;
}

/** Queues a message; a second enqueue with the same key does nothing. Returns true when queued now. */
export async function enqueueMail(executor: Kysely<Database>, mail: OutgoingMail): Promise<boolean> {
  const inserted = await executor
    .insertInto("mail_outbox")
    .values({ company_id: mail.companyId, kind: mail.kind, dedupe_key: mail.dedupeKey, to_address: mail.to, subject: mail.subject, text_body: mail.text, html_body: mail.html })
    .onConflict((oc) => oc.column("dedupe_key").doNothing())
    .returning("id")
    .executeTakeFirst();
  return Boolean(inserted);
}

/** Sends what is pending, oldest first. Stops at the first SMTP failure (the service is likely down) and throws, so the job retries. */
export async function deliverPendingMail(executor: Kysely<Database>, mailer: Mailer, limit = 100): Promise<{ sent: number; pending: number }> {
  const pending = await executor.selectFrom("mail_outbox").selectAll().where("status", "=", "pending").orderBy("created_at").limit(limit).execute();
  let sent = 0;
  for (const m of pending) {
    try {
      await mailer.send({ to: m.to_address, subject: m.subject, text: m.text_body, html: m.html_body });
    } catch (err) {
      await executor.updateTable("mail_outbox").set((eb) => ({ attempts: eb("attempts", "+", 1), last_error: String(err instanceof Error ? err.message : err).slice(0, 500) })).where("id", "=", m.id).execute();
      throw err;
    }
    await executor.updateTable("mail_outbox").set((eb) => ({ status: "sent", sent_at: new Date(), attempts: eb("attempts", "+", 1), last_error: null })).where("id", "=", m.id).where("status", "=", "pending").execute();
    sent++;
  }
  return { sent, pending: pending.length - sent };
}
