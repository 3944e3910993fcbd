"use client";

// React binding of ZoneCheckAutosave: one store per zone check, browser storage and fetch.
import { useEffect, useRef, useState, useSyncExternalStore } from "react";

import { sendJson } from "@/lib/query-client";
import type { ZoneCheckDto } from "@/lib/visits/dto";

import { readDraft, writeDraft } from "./draft-store";
import { ZoneCheckAutosave } from "./zone-check-autosave";

export function useZoneCheckAutosave(
  visitId: string,
  zoneId: string,
  serverCheck: ZoneCheckDto | undefined,
  canEdit: boolean,
  onSaved: (check: ZoneCheckDto) => void,
  /** A finished visit's correction: its reason goes with every save (the server requires it). */
  correctionReason: string | null = null,
) {
  const onSavedRef = useRef(onSaved);
  const reasonRef = useRef(correctionReason);
  useEffect(() => {
    onSavedRef.current = onSaved;
    reasonRef.current = correctionReason;
  }, [onSaved, correctionReason]);
  const [store] = useState(
    () =>
      new ZoneCheckAutosave(visitId, zoneId, serverCheck, canEdit, {
        send: (url, body, keepalive) =>
          sendJson<ZoneCheckDto>(
            "PUT",
            url,
            reasonRef.current ? { ...(body as object), correctionReason: reasonRef.current } : body,
            { keepalive },
          ),
        storage: {
          read: () => readDraft(visitId, zoneId),
          write: (d) => writeDraft(visitId, zoneId, d),
        },
        newId: () => crypto.randomUUID(),
        setTimer: (fn, ms) => setTimeout(fn, ms),
        clearTimer: (handle) => clearTimeout(handle as ReturnType<typeof setTimeout>),
        onSaved: (check) => onSavedRef.current(check),
      }),
  );

  // Subscribe first, so the snapshot that start() publishes is seen.
  const snapshot = useSyncExternalStore(store.subscribe, store.getSnapshot, store.getSnapshot);

  // A correction changed before its reason was given was refused (422, kept on the device): send
  // it as soon as the reason is there, without waiting for another change.
  // (save() sends nothing when no change waits.)
  useEffect(() => {
    if (correctionReason) store.retryNow();
  }, [correctionReason, store]);

  useEffect(() => {
    store.start();
    const flushIfHidden = () => document.visibilityState === "hidden" && store.flush();
    const flush = () => store.flush();
    document.addEventListener("visibilitychange", flushIfHidden);
    window.addEventListener("pagehide", flush);
    return () => {
      document.removeEventListener("visibilitychange", flushIfHidden);
      window.removeEventListener("pagehide", flush);
      store.flush();
      store.dispose();
    };
  }, [store]);

  return { ...snapshot, store };
}
