// Saving a day ahead for offline use, bounded (pure: the fetching and the clock come in as
// arguments). Today fetches each stop's visit page, its detail and what the detail points to
// (lib/pwa/day-urls.ts) so the service worker keeps them; this module decides how:
//
//  - one queue for the whole day, at most `concurrency` requests in flight (a phone on a weak
//    signal, a server shared with the rest of the crew);
//  - every request has its own time limit, and the whole save a budget: what has not answered by
//    then is given up (its request aborted), never waited on;
//  - a failed or slow answer costs only its own stop: the report says, stop by stop, which are
//    ready and which are not, so the screen can say "4 of 5 stops ready offline — 1 could not be
//    saved" and offer to try again.
import { SHARED_URLS, stopUrls, visitUrls, type StopRef, type VisitRef } from "./day-urls";

export interface SaveAheadLimits {
  /** Requests in flight at once. */
  concurrency: number;
  /** How long one request may take, body included, before it counts as not saved. */
  requestMs: number;
  /** How long the whole save may take; requests not answered by then are given up. */
  totalMs: number;
}

/** Three at a time: enough to save a day of stops in seconds, few enough to leave the phone's
 * link and the server to the screen in use. A page that takes 15 s is failing, not slow. */
export const SAVE_AHEAD_LIMITS: SaveAheadLimits = {
  concurrency: 3,
  requestMs: 15_000,
  totalMs: 60_000,
};

/** Why one address was not saved. */
type Miss = "failed" | "timed-out" | "out-of-time";

/** One answer: `ok` with the parsed body when asked for (`json`), otherwise why not. */
export type Fetched = { ok: true; body?: unknown } | { ok: false; miss: Miss };

export interface SaveAheadIO {
  /** Fetches one address; resolves `{ ok: false, miss: "failed" }` on anything but a 200 or on a
   * network error, and stops (rejecting or resolving, either is fine) when `signal` aborts. */
  get(url: string, init: { json: boolean; signal: AbortSignal }): Promise<Fetched>;
  /** Milliseconds, monotonic. */
  now(): number;
}

interface StopSaved {
  id: string;
  /** Every address the stop needs answered 200. */
  ready: boolean;
  /** The addresses that did not, with why. */
  missed: { url: string; miss: Miss }[];
  /** Every address fetched for the stop (to check the worker's copy afterwards). */
  urls: string[];
}

interface SaveAheadReport {
  stops: StopSaved[];
  /** The day's page, products, rule sets, the applicator: what every stop needs besides its own. */
  shared: { url: string; ok: boolean }[];
  /** The budget ran out before everything answered. */
  outOfTime: boolean;
  elapsedMs: number;
}

/** A counting semaphore whose queue is served lowest `priority` first (then in order): a stop's
 * thumbnails, found only once its detail answers, go ahead of later stops' pages, so a day cut
 * short by the budget has whole stops saved rather than every stop half saved. */
function limiter(slots: number) {
  let free = Math.max(1, slots);
  let order = 0;
  const waiting: { priority: number; order: number; go: () => void }[] = [];
  return async function run<T>(priority: number, task: () => Promise<T>): Promise<T> {
    if (free > 0) free -= 1;
    else
      await new Promise<void>((go) => {
        waiting.push({ priority, order: (order += 1), go });
        waiting.sort((a, b) => a.priority - b.priority || a.order - b.order);
      });
    try {
      return await task();
    } finally {
      const next = waiting.shift();
      if (next) next.go();
      else free += 1;
    }
  };
}

/**
 * Saves the stops of a day ahead within `limits`. Never rejects: every failure is in the report.
 * `cancel` (the person left the page) aborts what is in flight and starts nothing more.
 * `sharedUrls`: what every stop needs besides its own (the day's page, products, rule sets…).
 */
export async function saveAhead(
  stops: readonly StopRef[],
  io: SaveAheadIO,
  limits: SaveAheadLimits = SAVE_AHEAD_LIMITS,
  cancel?: AbortSignal,
  sharedUrls: readonly string[] = SHARED_URLS,
): Promise<SaveAheadReport> {
  const started = io.now();
  const deadline = started + limits.totalMs;
  const slot = limiter(limits.concurrency);
  let outOfTime = false;

  /** `priority`: the stop's place in the day (shared reads first, -1). */
  const fetchOne = (url: string, json: boolean, priority: number): Promise<Fetched> =>
    slot(priority, async () => {
      const left = deadline - io.now();
      if (left <= 0 || cancel?.aborted) {
        outOfTime ||= left <= 0;
        return { ok: false, miss: "out-of-time" } as const;
      }
      const ctrl = new AbortController();
      const byBudget = left < limits.requestMs;
      const timer = setTimeout(() => ctrl.abort(), Math.min(limits.requestMs, left));
      const onCancel = () => ctrl.abort();
      cancel?.addEventListener("abort", onCancel);
      try {
        // The abort settles the race even when `get` ignores the signal.
        const aborted = new Promise<Fetched>((resolve) =>
          ctrl.signal.addEventListener("abort", () =>
            resolve({ ok: false, miss: byBudget ? "out-of-time" : "timed-out" }),
          ),
        );
        const got = await Promise.race([
          io
            .get(url, { json, signal: ctrl.signal })
            .catch((): Fetched => ({ ok: false, miss: "failed" })),
          aborted,
        ]);
        if (!got.ok && ctrl.signal.aborted) {
          if (byBudget) outOfTime = true;
          return { ok: false, miss: byBudget ? "out-of-time" : "timed-out" } as const;
        }
        return got;
      } finally {
        clearTimeout(timer);
        cancel?.removeEventListener("abort", onCancel);
      }
    });

  const shared = Promise.all(
    sharedUrls.map(async (url) => ({ url, ok: (await fetchOne(url, false, -1)).ok })),
  );

  const saveStop = async (stop: StopRef, place: number): Promise<StopSaved> => {
    const [page, detail] = stopUrls(stop) as [string, string];
    const urls = [page, detail];
    const missed: StopSaved["missed"] = [];
    const note = (url: string, got: Fetched) => {
      if (!got.ok) missed.push({ url, miss: got.miss });
    };
    const [pageGot, detailGot] = await Promise.all([
      fetchOne(page, false, place),
      fetchOne(detail, true, place),
    ]);
    note(page, pageGot);
    note(detail, detailGot);
    if (detailGot.ok && isVisitRef(detailGot.body)) {
      const more = visitUrls(detailGot.body);
      urls.push(...more);
      const got = await Promise.all(more.map((u) => fetchOne(u, false, place)));
      more.forEach((u, i) => note(u, got[i]!));
    } else if (detailGot.ok) {
      missed.push({ url: detail, miss: "failed" });
    }
    return { id: stop.id, ready: missed.length === 0, missed, urls };
  };

  const [sharedSaved, stopsSaved] = await Promise.all([
    shared,
    Promise.all(stops.map((s, i) => saveStop(s, i))),
  ]);
  return { stops: stopsSaved, shared: sharedSaved, outOfTime, elapsedMs: io.now() - started };
}

function isVisitRef(body: unknown): body is VisitRef {
  if (typeof body !== "object" || body === null) return false;
  const v = body as Partial<VisitRef>;
  return typeof v.id === "string" && Array.isArray(v.photos) && Array.isArray(v.lastChecks);
}

/** After the worker's copies were checked: marks `notKept` addresses of each stop as missed. */
export function withKept(report: SaveAheadReport, notKept: ReadonlySet<string>): SaveAheadReport {
  const stops = report.stops.map((s) => {
    const lost = s.urls.filter((u) => notKept.has(u) && !s.missed.some((m) => m.url === u));
    if (lost.length === 0) return s;
    const missed = [...s.missed, ...lost.map((url) => ({ url, miss: "failed" as const }))];
    return { ...s, ready: false, missed };
  });
  const shared = report.shared.map((x) => (x.ok && notKept.has(x.url) ? { ...x, ok: false } : x));
  return { ...report, stops, shared };
}

/** What the screen says, in numbers: stops ready of all, and whether the shared reads are. */
interface SaveAheadSummary {
  total: number;
  ready: number;
  notReady: string[];
  sharedOk: boolean;
  outOfTime: boolean;
}

export function summarize(report: SaveAheadReport): SaveAheadSummary {
  return {
    total: report.stops.length,
    ready: report.stops.filter((s) => s.ready).length,
    notReady: report.stops.filter((s) => !s.ready).map((s) => s.id),
    sharedOk: report.shared.every((s) => s.ok),
    outOfTime: report.outOfTime,
  };
}

/** What the phone remembers of a save (local storage), and the status line says. */
export interface DaySaved {
  /** Stops on the day. */
  stops: number;
  /** Of which every address was kept. */
  ready: number;
  /** Their ids: a return to Today soon after, with no new stop, fetches nothing again. */
  readyIds: string[];
  /** Names of the stops not kept. */
  notReady: string[];
  /** The day's page, products, rule sets and the applicator were kept. */
  sharedOk: boolean;
  /** The budget ran out first (a weak signal). */
  outOfTime: boolean;
  savedAt: string;
}

const stopsText = (n: number) => (n === 1 ? "1 stop" : `${n} stops`);

function listNames(names: readonly string[]): string {
  if (names.length <= 3) return names.join(", ");
  return `${names.slice(0, 3).join(", ")} and ${names.length - 3} more`;
}

/** Today's status line after a save; `at` is the time of day it was saved, formatted. */
export function daySavedText(saved: DaySaved, at: string): string {
  const missed = saved.stops - saved.ready;
  const shared = saved.sharedOk
    ? ""
    : " Products, rule sets or your license were not saved: recording an application needs a signal.";
  if (missed === 0 && saved.sharedOk)
    return `Ready offline — ${stopsText(saved.stops)}, saved ${at}`;
  if (missed === 0) return `All ${stopsText(saved.stops)} ready offline, saved ${at}.${shared}`;
  const why = saved.outOfTime ? " in time (weak signal)" : "";
  return (
    `${saved.ready} of ${stopsText(saved.stops)} ready offline, saved ${at} — ` +
    `${missed} could not be saved${why}: ${listNames(saved.notReady)}.${shared}`
  );
}

/** The offline status line: which copy the screen works from. */
export function offlineText(saved: DaySaved | null, at: string): string {
  if (!saved) return "No signal — this day was not saved for offline use on this phone.";
  const kept =
    saved.ready === saved.stops
      ? stopsText(saved.stops)
      : `${saved.ready} of ${stopsText(saved.stops)}`;
  return `No signal — working from the copy saved at ${at} (${kept})`;
}

/** A full save of the day, at most `freshMs` old, that already holds every stop now on it. */
export function isFresh(
  saved: DaySaved | null,
  stopIds: readonly string[],
  nowMs: number,
  freshMs: number,
): boolean {
  if (!saved || saved.ready !== saved.stops || !saved.sharedOk) return false;
  const age = nowMs - Date.parse(saved.savedAt);
  if (!(age >= 0 && age <= freshMs)) return false;
  return stopIds.length === saved.stops && stopIds.every((id) => saved.readyIds.includes(id));
}
