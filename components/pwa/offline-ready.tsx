"use client";

// "The day travels with the technician": on Today, with a signal, every stop of the day is
// fetched ahead — the visit page and its data, each zone's last check and thumbnail, the products,
// rule sets and label limits the application panel reads — so the service worker keeps them and
// every visit opens without a signal. The fetching is bounded (lib/pwa/save-ahead.ts: a few
// requests at a time, a time limit each and a budget for the day) and stops when the person
// leaves Today. The status says what was saved and when, stop by stop what could not be, and
// offers to try again. A day saved in full a few minutes ago is not fetched again on every return
// to Today, unless the person asks.
import { CloudDownload, CloudOff, WifiOff } from "lucide-react";
import { useLocale } from "next-intl";
import { useCallback, useEffect, useRef, useState } from "react";

import { Button } from "@/components/ui/button";
import { formatTime } from "@/lib/dates";
import { dayUrls, SHARED_URLS } from "@/lib/pwa/day-urls";
import { FIELD_CACHES } from "@/lib/pwa/field-routes";
import {
  daySavedText,
  isFresh,
  offlineText,
  SAVE_AHEAD_LIMITS,
  saveAhead,
  summarize,
  withKept,
  type DaySaved,
  type Fetched,
  type SaveAheadIO,
} from "@/lib/pwa/save-ahead";

import { claimDevice } from "./device-data";

type Saved = DaySaved;

type State =
  | { kind: "none" }
  | { kind: "working" }
  | { kind: "saved"; saved: Saved }
  | { kind: "offline"; saved: Saved | null }
  | { kind: "no-worker" }
  | { kind: "error"; message: string };

const storageKey = (date: string) => `sward:offline-day:${date}`;
const WORKER_WAIT_MS = 15_000;
/** A day saved in full this recently is not fetched again on a plain return to Today. */
const FRESH_MS = 10 * 60_000;
/** How long the worker gets to finish writing what it answered before the copies are checked. */
const KEEP_WAIT_MS = 1_500;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Waits until the service worker controls this page (the first visit installs it). */
async function workerInControl(signal: AbortSignal): Promise<boolean> {
  const sw = navigator.serviceWorker;
  if (sw.controller) return true;
  const changed = new Promise((r) => sw.addEventListener("controllerchange", r, { once: true }));
  const left = new Promise((r) => signal.addEventListener("abort", r, { once: true }));
  await Promise.race([
    sw.ready.then(() => (sw.controller ? undefined : changed)),
    sleep(WORKER_WAIT_MS),
    left,
  ]);
  return !!sw.controller && !signal.aborted;
}

/** One address through the worker: 200 or not, the body read in full (within the signal). */
const io: SaveAheadIO = {
  now: () => performance.now(),
  async get(url, { json, signal }): Promise<Fetched> {
    const accept = url.startsWith("/api/") ? "application/json" : "text/html";
    const res = await fetch(url, {
      headers: { Accept: accept },
      credentials: "same-origin",
      signal,
    });
    if (!res.ok) {
      await res.body?.cancel();
      return { ok: false, miss: "failed" };
    }
    if (json) return { ok: true, body: await res.json() };
    await res.arrayBuffer();
    return { ok: true };
  },
};

/** The addresses of `urls` the worker has no copy of, after giving it a moment to write. */
async function notKept(urls: string[]): Promise<Set<string>> {
  const caches_ = await Promise.all(Object.values(FIELD_CACHES).map((n) => caches.open(n)));
  let missing = urls;
  const until = performance.now() + KEEP_WAIT_MS;
  for (;;) {
    const found = await Promise.all(
      missing.map(async (u) => {
        for (const c of caches_) if (await c.match(u, { ignoreVary: true })) return true;
        return false;
      }),
    );
    missing = missing.filter((_, i) => !found[i]);
    if (missing.length === 0 || performance.now() >= until) return new Set(missing);
    await sleep(250);
  }
}

type StopItem = { id: string; propertyName: string };

async function fetchStops(url: string, signal: AbortSignal): Promise<StopItem[]> {
  const ctrl = new AbortController();
  const abort = () => ctrl.abort();
  signal.addEventListener("abort", abort, { once: true });
  const timer = setTimeout(abort, SAVE_AHEAD_LIMITS.requestMs);
  try {
    const got = await io.get(url, { json: true, signal: ctrl.signal }).catch(() => null);
    const body = got?.ok ? got.body : null;
    const items = typeof body === "object" && body !== null && "items" in body ? body.items : null;
    if (!Array.isArray(items)) throw new Error("The day's stops could not be fetched.");
    return items as StopItem[];
  } finally {
    clearTimeout(timer);
    signal.removeEventListener("abort", abort);
  }
}

async function saveDay(
  page: string,
  items: StopItem[],
  signal: AbortSignal,
): Promise<Saved | null> {
  const report = await saveAhead(items, io, SAVE_AHEAD_LIMITS, signal, [page, ...SHARED_URLS]);
  if (signal.aborted) return null;
  const answered = [
    ...report.stops.flatMap((s) => s.urls.filter((u) => !s.missed.some((m) => m.url === u))),
    ...report.shared.filter((s) => s.ok).map((s) => s.url),
  ];
  const sum = summarize(withKept(report, await notKept(answered)));
  const names = new Map(items.map((s) => [s.id, s.propertyName]));
  return {
    stops: sum.total,
    ready: sum.ready,
    readyIds: items.map((s) => s.id).filter((id) => !sum.notReady.includes(id)),
    notReady: sum.notReady.map((id) => names.get(id) ?? id),
    sharedOk: sum.sharedOk,
    outOfTime: sum.outOfTime,
    savedAt: new Date().toISOString(),
  };
}

function readSaved(date: string): Saved | null {
  try {
    const raw = localStorage.getItem(storageKey(date));
    const saved = raw ? (JSON.parse(raw) as Partial<Saved>) : null;
    return saved && Array.isArray(saved.readyIds) && Array.isArray(saved.notReady)
      ? (saved as Saved)
      : null;
  } catch {
    return null;
  }
}

/** A full save of this day, recent, that already holds every stop now on it. */
function freshCopy(date: string, stopIds: string[]): Saved | null {
  const saved = readSaved(date);
  return isFresh(saved, stopIds, Date.now(), FRESH_MS) ? saved : null;
}

export function OfflineReady({
  date,
  today,
  userId,
  timeZone,
}: {
  date: string;
  today: string;
  userId: string;
  timeZone: string;
}) {
  const locale = useLocale();
  const [state, setState] = useState<State>({ kind: "none" });
  const running = useRef<AbortController | null>(null);

  const run = useCallback(
    async (force: boolean) => {
      if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
      running.current?.abort();
      const ctrl = new AbortController();
      running.current = ctrl;
      const { signal } = ctrl;
      if (!navigator.onLine) {
        setState({ kind: "offline", saved: readSaved(date) });
        return;
      }
      setState({ kind: "working" });
      await claimDevice(userId);
      if (!(await workerInControl(signal))) {
        if (!signal.aborted) setState({ kind: "no-worker" });
        return;
      }
      try {
        const [page, list] = dayUrls(date, today) as [string, string];
        const items = await fetchStops(list, signal);
        const fresh = force
          ? null
          : freshCopy(
              date,
              items.map((s) => s.id),
            );
        if (fresh) {
          setState({ kind: "saved", saved: fresh });
          return;
        }
        const saved = await saveDay(page, items, signal);
        if (!saved) return;
        try {
          localStorage.setItem(storageKey(date), JSON.stringify(saved));
        } catch {
          // storage full: the status below still says what was saved
        }
        setState({ kind: "saved", saved });
      } catch (err) {
        if (signal.aborted) return;
        setState(
          navigator.onLine
            ? {
                kind: "error",
                message: err instanceof Error ? err.message : "The day could not be saved.",
              }
            : { kind: "offline", saved: readSaved(date) },
        );
      } finally {
        if (running.current === ctrl) running.current = null;
      }
    },
    [date, today, userId],
  );

  useEffect(() => {
    // After the first paint: the stops show first, the saving follows; leaving Today stops it.
    const timer = setTimeout(() => void run(false), 0);
    return () => {
      clearTimeout(timer);
      running.current?.abort();
    };
  }, [run]);

  if (state.kind === "none") return null;
  const at = (iso: string) => formatTime(iso, timeZone, locale);
  let icon = <CloudDownload className="size-5 shrink-0" aria-hidden="true" />;
  let text: string;
  let action = "Refresh for offline";
  switch (state.kind) {
    case "working":
      text = "Saving the day for offline use…";
      break;
    case "saved": {
      const s = state.saved;
      text = daySavedText(s, at(s.savedAt));
      if (s.ready < s.stops || !s.sharedOk) {
        icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
        action = "Retry";
      }
      break;
    }
    case "offline":
      icon = <WifiOff className="size-5 shrink-0" aria-hidden="true" />;
      text = offlineText(state.saved, state.saved ? at(state.saved.savedAt) : "");
      break;
    case "no-worker":
      icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
      text = "Not saved for offline use: the app is still installing. Try again in a moment.";
      action = "Retry";
      break;
    case "error":
      icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
      text = `Not saved for offline use: ${state.message}`;
      action = "Retry";
      break;
  }
  return (
    <div
      role="status"
      data-offline-status={state.kind}
      className="mb-4 flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
    >
      <p className="flex items-center gap-2 font-semibold">
        {icon}
        {text}
      </p>
      {state.kind !== "working" && state.kind !== "offline" ? (
        <Button variant="secondary" onClick={() => void run(true)}>
          {action}
        </Button>
      ) : null}
    </div>
  );
}
