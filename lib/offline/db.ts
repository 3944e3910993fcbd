// The phone's own store (IndexedDB through Dexie): the outbox of queued operations and the
// zone-check drafts. Client only. Sign-out deletes it with the app's other IndexedDB databases
// (components/pwa/device-data.ts).
import { Dexie, type EntityTable } from "dexie";

import type { ZoneCheckValues } from "@/lib/visits/dto";

import type { Held, OpKind, OpState } from "./rules";

const OFFLINE_DB_NAME = "sward-offline";

export interface OutboxOp {
  /** Order of arrival (auto-increment): replay goes in this order, per visit. */
  seq?: number;
  kind: OpKind;
  visitId: string;
  zoneId: string | null;
  /** The id the server knows the thing by: zone check, application or photo (the photo's is ours only). */
  clientId: string;
  /** A zone check's version the change was made on (0: new); null for the other kinds. */
  baseVersion: number | null;
  /** The JSON body (or, for a photo, its query: the zone check's id and a correction reason). */
  payload: Record<string, unknown>;
  /** A photo's bytes, downscaled on the phone. */
  blob?: Blob;
  /** When the photo was taken (ISO), sent as ?capturedAt=. */
  capturedAt?: string;
  createdAt: string;
  attempts: number;
  lastTriedAt: string | null;
  lastError: string | null;
  state: OpState;
  /** The page that put it on the wire (while `sending`). */
  claimedBy?: string;
  nextAttemptAt: number;
  held?: Held;
}

/** A zone check as the phone last had it (the form's device copy). */
export interface DraftRow {
  /** `${visitId}:${zoneId}` */
  key: string;
  visitId: string;
  zoneId: string;
  id: string;
  values: ZoneCheckValues;
  baseVersion: number;
  isDirty: boolean;
  savedLocallyAt: string;
}

export type OfflineDb = Dexie & {
  ops: EntityTable<OutboxOp, "seq">;
  drafts: EntityTable<DraftRow, "key">;
};

export function openOfflineDb(name = OFFLINE_DB_NAME): OfflineDb {
  const db = new Dexie(name) as OfflineDb;
  db.version(1).stores({
    ops: "++seq, visitId, clientId, [visitId+zoneId]",
    drafts: "&key, visitId",
  });
  return db;
}

let shared: OfflineDb | null = null;
/** The page's one connection (opened on first use). */
export function offlineDb(): OfflineDb {
  shared ??= openOfflineDb();
  return shared;
}

export const draftKey = (visitId: string, zoneId: string) => `${visitId}:${zoneId}`;
