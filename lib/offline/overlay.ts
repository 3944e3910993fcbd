// What the screens show while operations wait on the phone (pure): the visit as the server last
// sent it, with the phone's queued start and zone checks laid over it, so a zone rated offline
// reads "Done" (not "Not started") and Finish counts it. The form itself still starts from the
// server's copy and the phone's draft (components/visits/zone-check-autosave.ts).
import type { ZoneCheckStatus } from "@/db/schema";
import type { VisitDetailDto } from "@/lib/visits/dto";

import type { OpKind } from "./rules";

interface QueuedOp {
  kind: OpKind;
  zoneId: string | null;
  payload: Record<string, unknown>;
}

/** Each zone's status as the phone has it: its newest queued zone check, else the server's. */
export function zoneStatuses(
  visit: Pick<VisitDetailDto, "checks">,
  ops: readonly QueuedOp[],
): Map<string, ZoneCheckStatus> {
  const out = new Map<string, ZoneCheckStatus>(visit.checks.map((c) => [c.zoneId, c.status]));
  for (const op of ops)
    if (op.kind === "zone-check" && op.zoneId)
      out.set(op.zoneId, op.payload["status"] as ZoneCheckStatus);
  return out;
}

/** The visit's status as the phone has it: a queued start makes a scheduled visit in progress. */
export function visitStatus(
  visit: Pick<VisitDetailDto, "status">,
  ops: readonly QueuedOp[],
): VisitDetailDto["status"] {
  if (visit.status === "scheduled" && ops.some((o) => o.kind !== "finish")) return "in_progress";
  return visit.status;
}

/** Zones still to be done or skipped before Finish, as the phone has them. */
export function zonesLeft(
  visit: Pick<VisitDetailDto, "checks" | "zones">,
  ops: readonly QueuedOp[],
): string[] {
  const statuses = zoneStatuses(visit, ops);
  return visit.zones
    .filter((z) => {
      const s = statuses.get(z.id);
      return s === undefined || s === "draft";
    })
    .map((z) => z.id);
}
