// The device copy of zone-check drafts (localStorage), so a reload or a dead battery loses nothing.
import type { ZoneCheckValues } from "@/lib/visits/dto";

export interface DeviceDraft {
  id: string;
  values: ZoneCheckValues;
  baseVersion: number;
  /** Changes not yet acknowledged by the server. */
  isDirty: boolean;
  savedLocallyAt: string;
}

const key = (visitId: string, zoneId: string) => `sward:zone-check:${visitId}:${zoneId}`;

export function readDraft(visitId: string, zoneId: string): DeviceDraft | null {
  try {
    const raw = window.localStorage.getItem(key(visitId, zoneId));
    return raw ? (JSON.parse(raw) as DeviceDraft) : null;
  } catch {
    return null;
  }
}

export function writeDraft(visitId: string, zoneId: string, draft: DeviceDraft): boolean {
  try {
    window.localStorage.setItem(key(visitId, zoneId), JSON.stringify(draft));
    return true;
  } catch {
    return false; // storage full or disabled: the server copy still saves
  }
}

/** Forgets every device copy of a visit's zone checks (after the visit is finished). */
export function clearVisitDrafts(visitId: string): void {
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
