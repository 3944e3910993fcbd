"use client";

// "The day travels with the technician": on Today, with a signal, every stop of the day is
// fetched ahead — the visit page and its data, each zone's last check and thumbnail, the products,
// rule sets and label limits the application panel reads — so the service worker keeps them and
// every visit opens without a signal. Says what was saved and when, or what failed; "Refresh for
// offline" does it again.
import { CloudDownload, CloudOff, WifiOff } from "lucide-react";
import { useLocale } from "next-intl";
import { useCallback, useEffect, useState } from "react";

import { Button } from "@/components/ui/button";
import { formatTime } from "@/lib/dates";
import { dayUrls, SHARED_URLS, stopUrls, visitUrls, type VisitRef } from "@/lib/pwa/day-urls";
import { FIELD_CACHES } from "@/lib/pwa/field-routes";

import { claimDevice } from "./device-data";

interface Saved {
  stops: number;
  savedAt: string;
  failed: number;
  total: number;
}

type State =
  | { kind: "none" }
  | { kind: "working" }
  | { kind: "saved"; saved: Saved }
  | { kind: "offline"; saved: Saved | null }
  | { kind: "no-worker" }
  | { kind: "error"; message: string };

const storageKey = (date: string) => `sward:offline-day:${date}`;
const PARALLEL = 4;
const WORKER_WAIT_MS = 15_000;

const sleep = (ms: number) => new Promise((r) => setTimeout(r, ms));

/** Waits until the service worker controls this page (the first visit installs it). */
async function workerInControl(): Promise<boolean> {
  const sw = navigator.serviceWorker;
  if (sw.controller) return true;
  const changed = new Promise((r) => sw.addEventListener("controllerchange", r, { once: true }));
  await Promise.race([
    sw.ready.then(() => (sw.controller ? undefined : changed)),
    sleep(WORKER_WAIT_MS),
  ]);
  return !!sw.controller;
}

async function fetchOk(url: string): Promise<Response | null> {
  try {
    const accept = url.startsWith("/api/") ? "application/json" : "text/html";
    const res = await fetch(url, { headers: { Accept: accept }, credentials: "same-origin" });
    return res.ok ? res : null;
  } catch {
    return null;
  }
}

/** Whether the worker has a copy of every address (it stores them just after answering). */
async function keptCount(urls: string[]): Promise<number> {
  const names = Object.values(FIELD_CACHES);
  let kept = 0;
  for (const url of urls) {
    for (const name of names) {
      const cache = await caches.open(name);
      const hit = await cache.match(url, { ignoreVary: true });
      if (hit) {
        kept += 1;
        break;
      }
    }
  }
  return kept;
}

async function pool<T>(items: T[], run: (item: T) => Promise<void>): Promise<void> {
  const queue = [...items];
  await Promise.all(
    Array.from({ length: Math.min(PARALLEL, queue.length) }, async () => {
      for (let item = queue.shift(); item !== undefined; item = queue.shift()) await run(item);
    }),
  );
}

async function saveDay(date: string, today: string): Promise<Saved> {
  const urls = new Set<string>();
  let failed = 0;
  const get = async (url: string) => {
    urls.add(url);
    const res = await fetchOk(url);
    if (!res) failed += 1;
    return res;
  };
  const [page, list] = dayUrls(date, today) as [string, string];
  const listRes = await get(list);
  if (!listRes) throw new Error("The day's stops could not be fetched.");
  const { items } = (await listRes.json()) as { items: { id: string }[] };
  await get(page);
  const tasks: (() => Promise<void>)[] = SHARED_URLS.map((u) => async () => void (await get(u)));
  for (const stop of items) {
    const [visitPage, detail] = stopUrls(stop) as [string, string];
    tasks.push(async () => void (await get(visitPage)));
    tasks.push(async () => {
      const res = await get(detail);
      if (!res) return;
      const visit = (await res.json()) as VisitRef;
      await pool(visitUrls(visit), async (u) => void (await get(u)));
    });
  }
  await pool(tasks, (t) => t());
  // Count what the worker really kept, giving it a moment to finish writing.
  const all = [...urls];
  let kept = 0;
  for (let attempt = 0; attempt < 5; attempt += 1) {
    kept = await keptCount(all);
    if (kept >= all.length - failed) break;
    await sleep(300);
  }
  return {
    stops: items.length,
    savedAt: new Date().toISOString(),
    failed: all.length - kept,
    total: all.length,
  };
}

function readSaved(date: string): Saved | null {
  try {
    const raw = localStorage.getItem(storageKey(date));
    return raw ? (JSON.parse(raw) as Saved) : null;
  } catch {
    return null;
  }
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

  const run = useCallback(async () => {
    if (process.env.NODE_ENV !== "production" || !("serviceWorker" in navigator)) return;
    if (!navigator.onLine) {
      setState({ kind: "offline", saved: readSaved(date) });
      return;
    }
    setState({ kind: "working" });
    await claimDevice(userId);
    if (!(await workerInControl())) {
      setState({ kind: "no-worker" });
      return;
    }
    try {
      const saved = await saveDay(date, today);
      try {
        localStorage.setItem(storageKey(date), JSON.stringify(saved));
      } catch {
        // storage full: the status below still says what was saved
      }
      setState({ kind: "saved", saved });
    } catch (err) {
      setState(
        navigator.onLine
          ? {
              kind: "error",
              message: err instanceof Error ? err.message : "The day could not be saved.",
            }
          : { kind: "offline", saved: readSaved(date) },
      );
    }
  }, [date, today, userId]);

  useEffect(() => {
    // After the first paint: the stops show first, the saving follows.
    const timer = setTimeout(() => void run(), 0);
    return () => clearTimeout(timer);
  }, [run]);

  if (state.kind === "none") return null;
  const stops = (n: number) => (n === 1 ? "1 stop" : `${n} stops`);
  const at = (iso: string) => formatTime(iso, timeZone, locale);
  let icon = <CloudDownload className="size-5 shrink-0" aria-hidden="true" />;
  let text: string;
  switch (state.kind) {
    case "working":
      text = "Saving the day for offline use…";
      break;
    case "saved":
      text =
        state.saved.failed === 0
          ? `Ready offline — ${stops(state.saved.stops)}, saved ${at(state.saved.savedAt)}`
          : `Saved for offline use with gaps — ${state.saved.failed} of ${state.saved.total} items could not be saved at ${at(state.saved.savedAt)}. Try again with a better signal.`;
      if (state.saved.failed) icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
      break;
    case "offline":
      icon = <WifiOff className="size-5 shrink-0" aria-hidden="true" />;
      text = state.saved
        ? `No signal — working from the copy saved at ${at(state.saved.savedAt)} (${stops(state.saved.stops)})`
        : "No signal — this day was not saved for offline use on this phone.";
      break;
    case "no-worker":
      icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
      text = "Not saved for offline use: the app is still installing. Try again in a moment.";
      break;
    case "error":
      icon = <CloudOff className="size-5 shrink-0" aria-hidden="true" />;
      text = `Not saved for offline use: ${state.message}`;
      break;
  }
  return (
    <div
      role="status"
      className="mb-4 flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
    >
      <p className="flex items-center gap-2 font-semibold">
        {icon}
        {text}
      </p>
      {state.kind !== "working" && state.kind !== "offline" ? (
        <Button variant="secondary" onClick={() => void run()}>
          Refresh for offline
        </Button>
      ) : null}
    </div>
  );
}
