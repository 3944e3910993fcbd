// The after-write step: called inside the writing transaction by every mutation that changes what
// a property's Sward Index, book summary row or risk alerts are computed from, it brings all three
// up to date before the transaction commits, so the book and the alerts show a change at once.
import type { Transaction } from "kysely";

import type { Database } from "@/db/schema";
import { todayIn } from "@/lib/dates";

import { evaluateAlerts, type EvaluationSummary } from "./alerts";
import { refreshCheckIndex } from "./check-index";
import { refreshPropertySummary } from "./summary";

export type { EvaluationSummary } from "./alerts";

export interface PropertyChange {
  companyId: string;
  propertyId: string;
  /** Zone checks whose stored Index must be computed again from their rows (a photo added or removed). */
  recheckIndexOf?: string[];
  /**
   * "evaluate": run the risk rules (weather from the cache) and apply the alert lifecycle.
   * "keep": leave the alerts as they are — a visit still in progress (its checks are evaluated
   * when it is finished), or a manager's acknowledgement or resolution (re-evaluating would
   * reopen what was just resolved).
   */
  alerts: "evaluate" | "keep";
  /** The visit whose finish raises the alerts (kept on the alert). */
  visitId?: string | null;
  /** The day to evaluate (default: the property's local today). */
  at?: string;
}

/**
 * Recomputes, in `trx`, the Index of the checks named, the property's alerts (when asked) and its
 * summary row. Takes the property row's lock first: one evaluation of a property at a time. FOR
 * NO KEY UPDATE, not FOR UPDATE: the writing transaction may already hold the KEY SHARE lock that
 * inserting a row referencing the property takes (a new visit), and two such writers upgrading to
 * FOR UPDATE deadlock; NO KEY UPDATE does not conflict with KEY SHARE and still excludes itself.
 */
export async function afterWrite(
  trx: Transaction<Database>,
  change: PropertyChange,
): Promise<EvaluationSummary | null> {
  if (!trx.isTransaction) throw new Error("afterWrite runs inside the writing transaction");
  const property = await trx
    .selectFrom("properties")
    .select("time_zone")
    .where("company_id", "=", change.companyId)
    .where("id", "=", change.propertyId)
    .forNoKeyUpdate()
    .executeTakeFirst();
  if (!property) return null;
  if (change.recheckIndexOf?.length) await refreshCheckIndex(trx, change.recheckIndexOf);
  const evaluation =
    change.alerts === "evaluate"
      ? await evaluateAlerts(trx, change.companyId, change.propertyId, {
          at: change.at ?? todayIn(property.time_zone),
          visitId: change.visitId ?? null,
        })
      : null;
  await refreshPropertySummary(trx, change.companyId, change.propertyId, property.time_zone);
  return evaluation;
}
