"use client";

// React binding of ZoneCheckAutosave: one store per zone check; the device copy in IndexedDB and
// every save through the outbox (lib/offline), which keeps it when there is no signal.
import { useEffect, useRef, useState, useSyncExternalStore } from "react";

import { outbox, requestBackgroundSync } from "@/lib/offline/client";
import type { SendResult } from "@/lib/query-client";
import type { ZoneCheckDto } from "@/lib/visits/dto";

import { handOverDraft, readDraft, writeDraft } from "./draft-store";
import { ZoneCheckAutosave } from "./zone-check-autosave";

/** The zone check's operation in the outbox, sent now when it can be. */
async function sendThroughOutbox(
  visitId: string,
  zoneId: string,
  url: string,
  body: Record<string, unknown>,
): Promise<SendResult<ZoneCheckDto>> {
  const { baseVersion, ...payload } = body;
  const clientId = url.split("/").pop()!;
  const outcome = await outbox().submit({
    kind: "zone-check",
    visitId,
    zoneId,
    clientId,
    baseVersion: typeof baseVersion === "number" ? baseVersion : 0,
    payload,
  });
  switch (outcome.kind) {
    case "applied":
    case "already-applied":
      return { ok: true, status: 200, data: outcome.data as ZoneCheckDto };
    case "held": {
      const { held } = outcome;
      const status = held.reason === "conflict" ? 409 : held.reason === "refused" ? 422 : 403;
      return {
        ok: false,
        status,
        error: {
          code: held.reason,
          message: held.message,
          fieldErrors: held.fieldErrors,
          details: held.current === undefined ? undefined : { current: held.current },
        },
      };
    }
    case "retry":
    case "waiting": {
      requestBackgroundSync();
      // Online but behind a change of this visit that Sward refused: that one is settled first.
      const blocked =
        navigator.onLine && (await outbox().waiting(visitId)).some((op) => op.state === "held");
      return {
        ok: false,
        status: 0,
        error: {
          code: navigator.onLine ? "offline" : "waiting",
          message: blocked
            ? "Waiting behind a change Sward refused (above)."
            : (outcome.message ??
              (navigator.onLine
                ? "Waiting for an earlier change of this visit to reach Sward."
                : "No connection.")),
        },
      };
    }
  }
}

/** A finished visit's correction reason goes with every save (the server requires it). */
const withReason = (reason: string | null, body: unknown) =>
  (reason ? { ...(body as object), correctionReason: reason } : body) as Record<string, unknown>;

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
        send: (url, body) =>
          sendThroughOutbox(visitId, zoneId, url, withReason(reasonRef.current, body)),
        queue: async (url, body) => {
          const { baseVersion, ...payload } = withReason(reasonRef.current, body);
          await outbox().enqueue({
            kind: "zone-check",
            visitId,
            zoneId,
            clientId: url.split("/").pop()!,
            baseVersion: typeof baseVersion === "number" ? baseVersion : 0,
            payload,
          });
        },
        onTookTheirs: (theirs) => {
          void outbox()
            .waiting(visitId)
            .then((ops) => {
              const held = ops.find((o) => o.kind === "zone-check" && o.zoneId === zoneId);
              if (held) void outbox().takeTheirs(held.seq!, theirs as never);
            });
        },
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
    // Sent later by the outbox (network back, another tab): the form hears of it.
    const stop = outbox().subscribe((event) => {
      if (event.type === "held" || event.type === "applied") {
        if (event.op.kind !== "zone-check" || event.op.zoneId !== zoneId) return;
        if (event.type === "applied") store.acknowledge(event.data as ZoneCheckDto);
        else if (event.op.held) store.refused(event.op.held);
      }
    });
    const flush = () => {
      handOverDraft(visitId, zoneId, store.deviceDraft);
      store.flush();
    };
    const flushIfHidden = () => document.visibilityState === "hidden" && flush();
    document.addEventListener("visibilitychange", flushIfHidden);
    window.addEventListener("pagehide", flush);
    return () => {
      stop();
      document.removeEventListener("visibilitychange", flushIfHidden);
      window.removeEventListener("pagehide", flush);
      store.flush();
      store.dispose();
    };
  }, [store, visitId, zoneId]);

  return { ...snapshot, store };
}
