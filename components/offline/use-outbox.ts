"use client";

// What waits in the phone's outbox, live (Dexie's liveQuery sees every tab's writes).
import { liveQuery } from "dexie";
import { useEffect, useState } from "react";

import { offlineDb, type OutboxOp } from "@/lib/offline/db";

/** The operations waiting (a visit's, or all), oldest first; [] until read. */
export function useWaitingOps(visitId?: string): OutboxOp[] {
  const [ops, setOps] = useState<OutboxOp[]>([]);
  useEffect(() => {
    const subscription = liveQuery(async () => {
      const table = offlineDb().ops;
      const rows = visitId
        ? await table.where("visitId").equals(visitId).toArray()
        : await table.toArray();
      return rows.sort((a, b) => a.seq! - b.seq!);
    }).subscribe({ next: setOps, error: () => setOps([]) });
    return () => subscription.unsubscribe();
  }, [visitId]);
  return ops;
}
