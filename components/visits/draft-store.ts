// The device copy of zone-check drafts, in the phone's IndexedDB store (lib/offline/db.ts), so a
// reload, a closed tab or a dead battery loses nothing. IndexedDB writes are asynchronous and a
// page being unloaded can cut the last one short, so when the page goes away with changes not yet
// acknowledged the draft is also handed over synchronously to localStorage (`handOverDraft`);
// the next read moves it into IndexedDB when it is the newer copy — as it does, once, with the
// drafts earlier versions kept in localStorage.
import { draftKey, offlineDb } from "@/lib/offline/db";
import type { ZoneCheckValues } from "@/lib/visits/dto";

export interface DeviceDraft {
  id: string;
  values: ZoneCheckValues;
  baseVersion: number;
  /** Changes not yet acknowledged by the server. */
  isDirty: boolean;
  savedLocallyAt: string;
}

const legacyKey = (visitId: string, zoneId: string) => `sward:zone-check:${visitId}:${zoneId}`;

function takeLegacyDraft(visitId: string, zoneId: string): DeviceDraft | null {
  try {
    const raw = window.localStorage.getItem(legacyKey(visitId, zoneId));
    return raw ? (JSON.parse(raw) as DeviceDraft) : null;
  } catch {
    return null;
  }
}

export async function readDraft(visitId: string, zoneId: string): Promise<DeviceDraft | null> {
  const key = draftKey(visitId, zoneId);
  const row = await offlineDb().drafts.get(key);
  const legacy = takeLegacyDraft(visitId, zoneId);
  if (legacy && (!row || legacy.savedLocallyAt > row.savedLocallyAt)) {
    // Moved once: written to IndexedDB first, then removed from localStorage.
    await offlineDb().drafts.put({ ...legacy, key, visitId, zoneId });
    try {
      window.localStorage.removeItem(legacyKey(visitId, zoneId));
    } catch {
      /* kept there too; the newer copy wins next time */
    }
    return legacy;
  }
  if (legacy) {
    try {
      window.localStorage.removeItem(legacyKey(visitId, zoneId));
    } catch {
      /* nothing to remove */
    }
  }
  if (!row) return null;
  const { key: _k, visitId: _v, zoneId: _z, ...draft } = row;
  return draft;
}

export function writeDraft(visitId: string, zoneId: string, draft: DeviceDraft): void {
  void offlineDb()
    .drafts.put({ ...draft, key: draftKey(visitId, zoneId), visitId, zoneId })
    .catch(() => undefined); // storage full or disabled: the outbox and the server copy still save
}

/** At pagehide: a synchronous copy of a draft with unacknowledged changes (moved back on read). */
export function handOverDraft(visitId: string, zoneId: string, draft: DeviceDraft | null): void {
  if (!draft?.isDirty) return;
  try {
    window.localStorage.setItem(legacyKey(visitId, zoneId), JSON.stringify(draft));
  } catch {
    /* storage full or disabled: the IndexedDB copy is all there is */
  }
}

/** Forgets every device copy of a visit's zone checks (after the visit is finished). */
export function clearVisitDrafts(visitId: string): void {
  void offlineDb()
    .drafts.where("visitId")
    .equals(visitId)
    .delete()
    .catch(() => undefined);
  try {
    const prefix = `sward:zone-check:${visitId}:`;
    const keys = Array.from({ length: window.localStorage.length }, (_, i) =>
      window.localStorage.key(i),
    ).filter((k): k is string => k?.startsWith(prefix) ?? false);
    for (const k of keys) window.localStorage.removeItem(k);
  } catch {
    /* nothing to clear */
  }
}
