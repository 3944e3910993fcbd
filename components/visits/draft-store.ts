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

export function clearDraft(visitId: string, zoneId: string): void {
  try {
    window.localStorage.removeItem(key(visitId, zoneId));
  } catch {
    /* nothing to clear */
  }
}
