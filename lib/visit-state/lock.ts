// The visit's state, held for a write: every write to a visit (zone checks, applications, photos,
// finish, cancel) locks the visit row in its transaction first and decides on the status it sees
// there, so a finish and a write that race are ordered by the lock — never both on stale reads.
// A folder of its own: visits, applications, photos and reports all use it.
import type { Transaction } from "kysely";

import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";
import { AppError, notFound } from "@/lib/http/app-error";

/** The visit row, locked for the rest of the transaction; not found outside the actor's scope. */
export async function lockVisit(trx: Transaction<Database>, actor: Actor, visitId: string) {
  const visit = await trx
    .selectFrom("visits")
    .selectAll()
    .where(visitInScope(actor))
    .where("visits.id", "=", visitId)
    .forUpdate()
    .executeTakeFirst();
  if (!visit) throw notFound("That visit");
  return visit;
}

/** Cancelled visits never change; finished ones only by a manager (audited). */
export function assertEditable(actor: Actor, visit: { status: string }) {
  if (visit.status === "cancelled")
    throw new AppError("conflict", "This visit was canceled; it can no longer be changed.");
  if (visit.status === "completed" && actor.role !== "manager")
    throw new AppError(
      "forbidden",
      "This visit is finished and locked. Ask your manager to correct it.",
    );
}
