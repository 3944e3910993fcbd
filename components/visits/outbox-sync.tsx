"use client";

// Sends what the phone's outbox holds whenever it can: at once, when the network comes back, when
// the app comes to the front, on a timer that backs off (lib/offline/rules.ts), and when the
// service worker relays a Background Sync. What the server accepted goes into the screens' data
// (React Query) at once. Mounted once for staff pages (app/(staff)/layout.tsx).
import { useQueryClient } from "@tanstack/react-query";
import { useEffect } from "react";

import type { ApplicationDto } from "@/lib/applications/dto";
import { askForPersistentStorage, outbox } from "@/lib/offline/client";
import { nextWake } from "@/lib/offline/rules";
import type { PhotoDto } from "@/lib/photos/dto";
import { SW_MESSAGES } from "@/lib/pwa/field-routes";
import type { VisitDetailDto, ZoneCheckDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";

import { clearVisitDrafts } from "./draft-store";
import { withApplication, withCheck, withPhoto } from "./use-visit";

/** Looks at least this often while something waits (a timer the back-off cannot outgrow). */
const LOOK_EVERY_MS = 60_000;

export function OutboxSync() {
  const queryClient = useQueryClient();
  useEffect(() => {
    const box = outbox();
    askForPersistentStorage();
    const detail = (visitId: string, change: (v: VisitDetailDto) => VisitDetailDto) =>
      queryClient.setQueryData<VisitDetailDto>(visitKeys.detail(visitId), (v) =>
        v ? change(v) : v,
      );
    const stop = box.subscribe((event) => {
      if (event.type !== "applied") return;
      const { op, data } = event;
      switch (op.kind) {
        case "zone-check":
          detail(op.visitId, (v) => withCheck(v, data as ZoneCheckDto));
          break;
        case "photo":
          detail(op.visitId, (v) => withPhoto(v, data as PhotoDto));
          break;
        case "application":
          detail(op.visitId, (v) => withApplication(v, data as ApplicationDto));
          break;
        case "finish":
          clearVisitDrafts(op.visitId);
          queryClient.setQueryData(visitKeys.detail(op.visitId), data as VisitDetailDto);
          void queryClient.invalidateQueries({ queryKey: visitKeys.all });
          break;
        case "start":
          queryClient.setQueryData(visitKeys.detail(op.visitId), data as VisitDetailDto);
          void queryClient.invalidateQueries({ queryKey: visitKeys.all });
          break;
      }
    });

    let timer: ReturnType<typeof setTimeout> | undefined;
    const replay = async (now = false) => {
      await box.replay({ now });
      const ops = await box.waiting();
      clearTimeout(timer);
      if (!ops.length) return;
      const wake = nextWake(ops);
      const wait = wake === null ? LOOK_EVERY_MS : Math.max(1000, wake - Date.now());
      timer = setTimeout(() => void replay(), Math.min(wait, LOOK_EVERY_MS));
    };
    const onOnline = () => void replay(true);
    const onFocus = () => void replay(true);
    const onVisible = () => document.visibilityState === "visible" && void replay(true);
    const onWorker = (event: MessageEvent) => {
      const type = (event.data as { type?: string } | null)?.type;
      if (type === SW_MESSAGES.replay) void replay(true);
    };
    window.addEventListener("online", onOnline);
    window.addEventListener("focus", onFocus);
    document.addEventListener("visibilitychange", onVisible);
    navigator.serviceWorker?.addEventListener("message", onWorker);
    void replay(true);
    return () => {
      stop();
      clearTimeout(timer);
      window.removeEventListener("online", onOnline);
      window.removeEventListener("focus", onFocus);
      document.removeEventListener("visibilitychange", onVisible);
      navigator.serviceWorker?.removeEventListener("message", onWorker);
    };
  }, [queryClient]);
  return null;
}
