"use client";

// Installs the service worker (app/sw.ts, production builds only: `next dev` registers none) and
// offers a new version when one is waiting: "A new version of Sward is ready" with a Reload
// button, which lets the new worker take over and then reloads the page. Nothing reloads by
// itself, so a zone being rated is never interrupted.
import { RefreshCw } from "lucide-react";
import { useEffect, useRef, useState } from "react";

import { Button } from "@/components/ui/button";

const SW_URL = "/serwist/sw.js";

export function AppUpdates() {
  const [waiting, setWaiting] = useState<ServiceWorker | null>(null);
  const reloading = useRef(false);

  useEffect(() => {
    if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
    let cancelled = false;
    const sw = navigator.serviceWorker;
    const offer = (worker: ServiceWorker | null) => {
      // A worker waiting while another controls the page is a new version; the first install
      // takes over on its own (nothing to reload).
      if (worker && sw.controller && !cancelled) setWaiting(worker);
    };
    const onControllerChange = () => {
      if (reloading.current) window.location.reload();
    };
    sw.addEventListener("controllerchange", onControllerChange);
    void sw
      .register(SW_URL, { scope: "/" })
      .then((reg) => {
        offer(reg.waiting);
        reg.addEventListener("updatefound", () => {
          const installing = reg.installing;
          installing?.addEventListener("statechange", () => {
            if (installing.state === "installed") offer(reg.waiting ?? installing);
          });
        });
      })
      .catch(() => undefined); // no worker: the app still works online
    return () => {
      cancelled = true;
      sw.removeEventListener("controllerchange", onControllerChange);
    };
  }, []);

  if (!waiting) return null;
  return (
    <div
      role="status"
      className="no-print fixed inset-x-0 top-0 z-50 flex flex-wrap items-center justify-center gap-3 border-b border-line bg-sward-tint px-4 py-2 text-ink shadow-sm"
    >
      <p className="font-semibold">A new version of Sward is ready</p>
      <Button
        onClick={() => {
          reloading.current = true;
          waiting.postMessage({ type: "SKIP_WAITING" });
        }}
      >
        <RefreshCw className="size-5" aria-hidden="true" />
        Reload
      </Button>
    </div>
  );
}
