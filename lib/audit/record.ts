// Writes an audit event inside the caller's transaction (who, when, what changed: old → new).
import type { Kysely, Transaction } from "kysely";

import type { AuditEventsTable, Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";

export async function recordAudit(
  trx: Transaction<Database> | Kysely<Database>,
  /** Who did it: the signed-in actor, or (for an invited person confirming) the account's ids. */
  actor: Pick<Actor, "companyId" | "userId">,
  event: {
    entity: AuditEventsTable["entity"];
    entityId: string;
    action: string;
    changes?: Record<string, { from: unknown; to: unknown }>;
  },
): Promise<void> {
  await trx
    .insertInto("audit_events")
    .values({
      company_id: actor.companyId,
      actor_id: actor.userId,
      entity: event.entity,
      entity_id: event.entityId,
      action: event.action,
      changes: JSON.stringify(event.changes ?? {}),
    })
    .execute();
}
