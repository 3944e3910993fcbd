// The outbox (db handle from the caller): enqueue a message once per dedupe key — in the
// transaction of the change that causes it, so the two commit together; deliver the pending ones,
// marking each sent only after SMTP accepted it, each failed row waiting longer before its next
// try. Delivery is at least once: a crash between "accepted" and "marked" can repeat one message,
// never lose it.
import { sql, type Kysely } from "kysely";

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
export async function enqueueMail(
  executor: Kysely<Database>,
  mail: OutgoingMail,
): Promise<boolean> {
  const inserted = await executor
    .insertInto("mail_outbox")
    .values({
      company_id: mail.companyId,
      kind: mail.kind,
      dedupe_key: mail.dedupeKey,
      to_address: mail.to,
      subject: mail.subject,
      text_body: mail.text,
      html_body: mail.html,
    })
    .onConflict((oc) => oc.column("dedupe_key").doNothing())
    .returning("id")
    .executeTakeFirst();
  return Boolean(inserted);
}

/** Seconds before the next try after `attempts` failures: 30 s, 1, 2, 4 … minutes, at most an hour. */
export function retryDelaySeconds(attempts: number): number {
  return Math.min(3600, 30 * 2 ** Math.max(0, attempts - 1));
}

/**
 * Sends what is pending and due, oldest first, one row at a time: each row is claimed with
 * `for update skip locked`, so the worker and a web process delivering at the same moment never
 * send the same message twice. Stops at the first SMTP failure (the service is likely down) and
 * throws, so the job retries.
 */
export async function deliverPendingMail(
  executor: Kysely<Database>,
  mailer: Mailer,
  limit = 100,
  filter?: { kind?: string },
): Promise<{ sent: number; pending: number }> {
  let sent = 0;
  while (sent < limit) {
    const outcome = await executor.transaction().execute(async (trx) => {
      let query = trx
        .selectFrom("mail_outbox")
        .selectAll()
        .where("status", "=", "pending")
        .where("next_attempt_at", "<=", sql<Date>`now()`);
      if (filter?.kind) query = query.where("kind", "=", filter.kind);
      const m = await query
        .orderBy("next_attempt_at")
        .orderBy("created_at")
        .limit(1)
        .forUpdate()
        .skipLocked()
        .executeTakeFirst();
      if (!m) return "empty" as const;
      try {
        await mailer.send({
          to: m.to_address,
          subject: m.subject,
          text: m.text_body,
          html: m.html_body,
        });
      } catch (err) {
        await trx
          .updateTable("mail_outbox")
          .set((eb) => ({
            attempts: eb("attempts", "+", 1),
            last_error: String(err instanceof Error ? err.message : err).slice(0, 500),
            next_attempt_at: sql<Date>`now() + make_interval(secs => ${retryDelaySeconds(m.attempts + 1)})`,
          }))
          .where("id", "=", m.id)
          .execute();
        return { error: err };
      }
      await trx
        .updateTable("mail_outbox")
        .set((eb) => ({
          status: "sent",
          sent_at: new Date(),
          attempts: eb("attempts", "+", 1),
          last_error: null,
        }))
        .where("id", "=", m.id)
        .execute();
      return "sent" as const;
    });
    if (outcome === "empty") break;
    if (outcome !== "sent") throw outcome.error;
    sent++;
  }
  let remaining = executor
    .selectFrom("mail_outbox")
    .select((eb) => eb.fn.countAll<string>().as("n"))
    .where("status", "=", "pending");
  if (filter?.kind) remaining = remaining.where("kind", "=", filter.kind);
  const { n } = await remaining.executeTakeFirstOrThrow();
  return { sent, pending: Number(n) };
}
