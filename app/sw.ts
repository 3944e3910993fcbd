/// <reference lib="webworker" />
// Sward's service worker, bundled by esbuild through app/serwist/[path]/route.ts and served at
// /serwist/sw.js (scope "/"). DEVELOPERS.md, "The field app offline", explains how to change it.
//
//  - Precache: the build's static files (scripts, styles, fonts), the public icons, the manifest
//    and the offline page. Nothing in it belongs to anyone.
//  - Runtime: only the technician's field screens (lib/pwa/field-routes.ts) — Today and a visit, as
//    documents and as React Server Component payloads — and the reads behind them, network first
//    with a short timeout, then the copy kept on the phone. Only 200 answers are kept: redirects
//    (signed out), 404s and errors reach the page unchanged and are never stored.
//  - Every other page: network only; with no network, the offline page. Sign-in, other APIs and
//    every write are not intercepted at all.
//  - A message from a page ({ type: "sward:clear" }, at sign-out or when another person signs in)
//    deletes every field cache; a Background Sync with the outbox's tag asks the open pages to
//    replay their outbox ({ type: "sward:replay" }).
import {
  CacheableResponsePlugin,
  ExpirationPlugin,
  NetworkFirst,
  NetworkOnly,
  Serwist,
  type PrecacheEntry,
  type RouteMatchCallbackOptions,
  type SerwistGlobalConfig,
} from "serwist";

import {
  FIELD_CACHES,
  isFieldData,
  isFieldPage,
  isSignInPath,
  isVisitPage,
  OUTBOX_SYNC_TAG,
  SW_MESSAGES,
} from "@/lib/pwa/field-routes";

declare global {
  interface WorkerGlobalScope extends SerwistGlobalConfig {
    __SW_MANIFEST: (PrecacheEntry | string)[] | undefined;
  }
}
declare const self: ServiceWorkerGlobalScope;

/** Seconds the network has before the kept copy answers (a weak signal in a back yard). */
const NETWORK_TIMEOUT_S = 4;
/** A long day of stops (each visit one page, whatever its zone), with room: a week at most. */
const keepFor = (maxEntries: number) =>
  new ExpirationPlugin({ maxEntries, maxAgeSeconds: 7 * 24 * 60 * 60 });
/** Only complete answers are kept; a redirect or a 404 is passed on, never stored. */
const onlyOk = () => new CacheableResponsePlugin({ statuses: [200] });

const isRsc = (request: Request) => request.headers.get("rsc") === "1";
const isDocument = ({ request, sameOrigin }: RouteMatchCallbackOptions) =>
  sameOrigin &&
  !isRsc(request) &&
  (request.mode === "navigate" || request.destination === "document");

const serwist = new Serwist({
  precacheEntries: self.__SW_MANIFEST,
  precacheOptions: { cleanupOutdatedCaches: true, concurrency: 4 },
  // A new version waits until the person chooses "Reload" (components/pwa/app-updates.tsx).
  skipWaiting: false,
  clientsClaim: true,
  navigationPreload: false,
  disableDevLogs: true,
  runtimeCaching: [
    // A visit's document: one copy serves every ?zone=… of it (the runner reads the zone from the
    // address after it starts).
    {
      matcher: (o) =>
        o.sameOrigin &&
        !isRsc(o.request) &&
        isVisitPage(o.url.pathname) &&
        o.request.method === "GET",
      handler: new NetworkFirst({
        cacheName: FIELD_CACHES.pages,
        networkTimeoutSeconds: NETWORK_TIMEOUT_S,
        matchOptions: { ignoreSearch: true, ignoreVary: true },
        plugins: [onlyOk(), keepFor(150)],
      }),
    },
    // Today (each day is its own address).
    {
      matcher: (o) => o.sameOrigin && !isRsc(o.request) && isFieldPage(o.url.pathname),
      handler: new NetworkFirst({
        cacheName: FIELD_CACHES.pages,
        networkTimeoutSeconds: NETWORK_TIMEOUT_S,
        matchOptions: { ignoreVary: true },
        plugins: [onlyOk(), keepFor(150)],
      }),
    },
    // The same screens as React Server Component payloads (in-app navigation). A payload depends
    // on the screen it is fetched from, which its ?_rsc= address encodes: kept by exact address.
    // With none kept, the router falls back to loading the document, answered above.
    {
      matcher: (o) => o.sameOrigin && isRsc(o.request) && isFieldPage(o.url.pathname),
      handler: new NetworkFirst({
        cacheName: FIELD_CACHES.rsc,
        networkTimeoutSeconds: NETWORK_TIMEOUT_S,
        plugins: [onlyOk(), keepFor(120)],
      }),
    },
    // The reads behind those screens.
    {
      matcher: (o) => o.sameOrigin && isFieldData(o.url.pathname),
      method: "GET",
      handler: new NetworkFirst({
        cacheName: FIELD_CACHES.data,
        networkTimeoutSeconds: NETWORK_TIMEOUT_S,
        plugins: [onlyOk(), keepFor(400)],
      }),
    },
    // Every other page: straight to the network (answers unchanged); the offline page when there
    // is none. Sign-in and invitations are left alone.
    {
      matcher: (o) => isDocument(o) && !isSignInPath(o.url.pathname),
      handler: new NetworkOnly(),
    },
  ],
  fallbacks: {
    entries: [{ url: "/offline", matcher: ({ request }) => request.mode === "navigate" }],
  },
});

self.addEventListener("message", (event: ExtendableMessageEvent) => {
  const data: unknown = event.data;
  if (typeof data !== "object" || data === null || !("type" in data)) return;
  if (data.type === SW_MESSAGES.clear) {
    const done = Promise.all(Object.values(FIELD_CACHES).map((name) => caches.delete(name)));
    event.waitUntil(
      done.then(() => {
        // Answer on the channel the page gave, so it can wait for the deletion.
        event.ports[0]?.postMessage({ type: SW_MESSAGES.clear, done: true });
      }),
    );
  }
});

// Background Sync (where the browser has it): the outbox lives in the page, so the worker only
// wakes the pages up to replay it.
interface SyncEvent extends ExtendableEvent {
  readonly tag: string;
}
self.addEventListener("sync", (event: Event) => {
  const sync = event as SyncEvent;
  if (sync.tag !== OUTBOX_SYNC_TAG) return;
  sync.waitUntil(
    self.clients.matchAll({ type: "window", includeUncontrolled: true }).then((windows) => {
      for (const w of windows) w.postMessage({ type: SW_MESSAGES.replay });
    }),
  );
});

serwist.addEventListeners();
