// The page's outbox: IndexedDB, fetch, the other tabs (BroadcastChannel), Background Sync and
// persistent storage. Client only (browser APIs); the engine is ./outbox.ts.
import { OUTBOX_SYNC_TAG } from "@/lib/pwa/field-routes";

import { offlineDb } from "./db";
import { Outbox, type Transport, type WireAnswer } from "./outbox";

const JSON_TIMEOUT_MS = 25_000;
const PHOTO_TIMEOUT_MS = 120_000;

async function answerOf(response: Response): Promise<WireAnswer> {
  const body: unknown = await response.json().catch(() => null);
  return { status: response.status, body };
}

async function withTimeout(ms: number, run: (signal: AbortSignal) => Promise<Response>) {
  const controller = new AbortController();
  const timer = setTimeout(() => controller.abort(), ms);
  try {
    return await answerOf(await run(controller.signal));
  } catch {
    return { status: 0, body: null };
  } finally {
    clearTimeout(timer);
  }
}

const fetchTransport: Transport = {
  json: (method, url, body) =>
    withTimeout(JSON_TIMEOUT_MS, (signal) =>
      fetch(url, {
        method,
        headers: { "Content-Type": "application/json", Accept: "application/json" },
        credentials: "same-origin",
        body: JSON.stringify(body),
        signal,
      }),
    ),
  blob: (url, blob) =>
    withTimeout(PHOTO_TIMEOUT_MS, (signal) =>
      fetch(url, {
        method: "POST",
        headers: { "Content-Type": blob.type || "image/jpeg", Accept: "application/json" },
        credentials: "same-origin",
        body: blob,
        signal,
      }),
    ),
};

/** This page's id; it holds a Web Lock of that name while it is open. */
const PAGE_LOCK = "sward-outbox-page:";
let pageId: string | null = null;

function holdPageLock(): string {
  const id = crypto.randomUUID();
  // Held until the page goes away (the promise never settles); the browser then releases it.
  void navigator.locks
    ?.request(`${PAGE_LOCK}${id}`, () => new Promise<never>(() => undefined))
    .catch(() => undefined);
  return id;
}

async function isPageOpen(id: string): Promise<boolean> {
  if (!navigator.locks?.query) return true; // cannot tell: the outbox waits out SENDING_STALE_MS
  const { held = [] } = await navigator.locks.query();
  return held.some((lock) => lock.name === `${PAGE_LOCK}${id}`);
}

let shared: Outbox | null = null;

/** The page's one outbox (created on first use, in the browser only). */
export function outbox(): Outbox {
  if (shared) return shared;
  pageId ??= holdPageLock();
  const box = new Outbox(offlineDb(), fetchTransport, {
    isOnline: () => navigator.onLine,
    pageId,
    isClaimerAlive: isPageOpen,
  });
  shared = box;
  // What another tab sent reaches this one's screens too.
  if ("BroadcastChannel" in window) {
    const channel = new BroadcastChannel("sward-outbox");
    let relaying = false;
    box.subscribe((event) => {
      if (relaying || event.type !== "applied") return;
      const { blob: _b, ...op } = event.op;
      channel.postMessage({ op, data: event.data });
    });
    channel.onmessage = (message: MessageEvent<{ op: never; data: unknown }>) => {
      relaying = true;
      try {
        box.emit({ type: "applied", op: message.data.op, data: message.data.data });
      } finally {
        relaying = false;
      }
    };
  }
  return box;
}

/** Asks the browser to keep the phone's store through storage pressure (once per page). */
let persistAsked = false;
export function askForPersistentStorage(): void {
  if (persistAsked || !navigator.storage?.persist) return;
  persistAsked = true;
  void navigator.storage.persist().catch(() => undefined);
}

/** Asks the service worker to wake the pages when the network is back (where the browser can). */
export function requestBackgroundSync(): void {
  if (!("serviceWorker" in navigator)) return;
  void navigator.serviceWorker.ready
    // Chromium has Background Sync; elsewhere `sync` is missing and the page's own triggers do.
    .then((r) => ("sync" in r ? r.sync.register(OUTBOX_SYNC_TAG) : undefined))
    .catch(() => undefined);
}
