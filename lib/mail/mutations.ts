// Mail from the web process: the rows are written by the writes that cause them (in their own
// transaction, lib/mail/outbox.ts); deliverMailAfterResponse
// delivers what is waiting in the outbox right after the response is sent,
// so a sign-in link or a report e-mail arrives in seconds. If SMTP fails the row stays pending and
// the worker's minute-by-minute run retries it; row claims keep the two from sending it twice.
import "server-only";

import { after } from "next/server";

import { db } from "@/db";
import { log } from "@/lib/log";
import { services } from "@/lib/services";

import { deliverPendingMail } from "./outbox";

export function deliverMailAfterResponse(kind?: string): void {
  const m = services().mailer;
  if (!m) return; // no SMTP here: the worker delivers when it has one
  after(async () => {
    try {
      await deliverPendingMail(db(), m, 20, kind ? { kind } : undefined);
    } catch (err) {
      log.warn(
        { err: err instanceof Error ? err.message : String(err), kind },
        "mail delivery failed; the worker will retry",
      );
    }
  });
}
