// Writes an audit event inside the caller's transaction (who, when, what changed: old → new, and
// why): an event that is part of a change commits or rolls back with it.
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
    /** The visit whose trail shows the event (a visit's own events, its checks, applications, photos). */
    visitId?: string | null;
    /** The zone it is about, so the trail can name it. */
    zoneId?: string | null;
    /** Why (a correction of a finished visit always has one). */
    reason?: string | null;
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
      visit_id: event.visitId ?? (event.entity === "visit" ? event.entityId : null),
      zone_id: event.zoneId ?? null,
      reason: event.reason ?? null,
    })
    .execute();
}
