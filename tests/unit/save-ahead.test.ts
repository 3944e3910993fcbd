// Today's save-ahead, bounded (lib/pwa/save-ahead.ts): limited concurrency, a time limit per
// request and a budget for the whole day, one failed or hanging answer costing only its own stop.
// The fetches are fakes driven by the test; the limits are the module's own (shortened where a
// test waits on them). In a browser: tests/e2e/offline-shell.test.ts.
import { afterEach, beforeEach, describe, expect, it, vi } from "vitest";

import { SHARED_URLS } from "@/lib/pwa/day-urls";
import {
  daySavedText,
  isFresh,
  offlineText,
  saveAhead,
  summarize,
  withKept,
  type DaySaved,
  type Fetched,
  type SaveAheadIO,
  type SaveAheadLimits,
} from "@/lib/pwa/save-ahead";

const id = (n: number) => `00000000-0000-4000-8000-${String(n).padStart(12, "0")}`;
const PHOTO = "6f1e2d3c-4b5a-4978-8a6b-5c4d3e2f1a0b";

/** A visit's detail as the API gives it (the parts the save reads). */
const detail = (visitId: string, thumbs = 1) => ({
  id: visitId,
  status: "scheduled",
  photos: [],
  lastChecks: Array.from({ length: thumbs }, (_, i) => ({
    photo: { thumbUrl: `/api/v1/photos/${PHOTO.slice(0, -2)}${String(i).padStart(2, "0")}/thumb` },
  })),
});

type Answer = "ok" | "404" | "hang" | "throw";

/** A fake network on fake time: each address answers after `delayMs` the way `answer` says;
 * counts requests in flight and remembers the most at once. */
function fakeNet(answer: (url: string) => Answer = () => "ok", delayMs = 100) {
  let inFlight = 0;
  const seen = { most: 0, urls: [] as string[], aborted: 0, open: () => inFlight };
  const io: SaveAheadIO = {
    now: () => Date.now(),
    get: (url, { json, signal }) =>
      new Promise<Fetched>((resolve, reject) => {
        seen.urls.push(url);
        inFlight += 1;
        seen.most = Math.max(seen.most, inFlight);
        const a = answer(url);
        const done = (f: () => void) => {
          inFlight -= 1;
          f();
        };
        const timer =
          a === "hang"
            ? null
            : setTimeout(
                () =>
                  done(() => {
                    if (a === "throw") reject(new TypeError("Failed to fetch"));
                    else if (a === "404") resolve({ ok: false, miss: "failed" });
                    else {
                      const m = /^\/api\/v1\/visits\/([0-9a-f-]+)$/.exec(url);
                      resolve({ ok: true, body: json && m ? detail(m[1]!) : undefined });
                    }
                  }),
                delayMs,
              );
        signal.addEventListener("abort", () => {
          if (timer) clearTimeout(timer);
          seen.aborted += 1;
          done(() => reject(new DOMException("aborted", "AbortError")));
        });
      }),
  };
  return { io, seen };
}

const LIMITS: SaveAheadLimits = { concurrency: 3, requestMs: 15_000, totalMs: 60_000 };

beforeEach(() => {
  vi.useFakeTimers();
});
afterEach(() => {
  vi.useRealTimers();
});

async function run<T>(p: Promise<T>): Promise<T> {
  await vi.runAllTimersAsync();
  return p;
}

describe("saving a day ahead (lib/pwa/save-ahead.ts)", () => {
  it("saves every stop's page, detail and thumbnails and the shared reads", async () => {
    const { io, seen } = fakeNet();
    const stops = [1, 2, 3].map((n) => ({ id: id(n) }));
    const report = await run(saveAhead(stops, io, LIMITS));
    expect(summarize(report)).toEqual({
      total: 3,
      ready: 3,
      notReady: [],
      sharedOk: true,
      outOfTime: false,
    });
    for (const s of stops) {
      expect(seen.urls).toContain(`/visits/${s.id}`);
      expect(seen.urls).toContain(`/api/v1/visits/${s.id}`);
    }
    for (const u of SHARED_URLS) expect(seen.urls).toContain(u);
    // page + detail + one thumbnail per stop, the shared reads once.
    expect(seen.urls).toHaveLength(3 * 3 + SHARED_URLS.length);
  });

  it("never has more requests in flight than its concurrency, for a day of 40 stops", async () => {
    const { io, seen } = fakeNet();
    const stops = Array.from({ length: 40 }, (_, n) => ({ id: id(n + 1) }));
    const report = await run(saveAhead(stops, io, LIMITS));
    expect(seen.most).toBe(LIMITS.concurrency);
    expect(summarize(report).ready).toBe(40);
  });

  it("a stop whose page fails costs that stop only, and says which address", async () => {
    const bad = id(2);
    const { io } = fakeNet((u) => (u === `/visits/${bad}` ? "404" : "ok"));
    const stops = [1, 2, 3, 4, 5].map((n) => ({ id: id(n) }));
    const report = await run(saveAhead(stops, io, LIMITS));
    const sum = summarize(report);
    expect(sum).toMatchObject({ total: 5, ready: 4, notReady: [bad], sharedOk: true });
    expect(report.stops.find((s) => s.id === bad)!.missed).toEqual([
      { url: `/visits/${bad}`, miss: "failed" },
    ]);
  });

  it("a network error is a miss, not a rejection", async () => {
    const { io } = fakeNet((u) => (u.endsWith("/thumb") ? "throw" : "ok"));
    const report = await run(saveAhead([{ id: id(1) }], io, LIMITS));
    expect(report.stops[0]!.missed).toEqual([
      { url: expect.stringMatching(/\/thumb$/), miss: "failed" },
    ]);
  });

  it("a request that never answers is given up after the request limit, and the rest go on", async () => {
    const slow = id(3);
    const { io, seen } = fakeNet((u) => (u === `/api/v1/visits/${slow}` ? "hang" : "ok"));
    const stops = [1, 2, 3, 4, 5, 6].map((n) => ({ id: id(n) }));
    const t0 = Date.now();
    const report = await run(saveAhead(stops, io, LIMITS));
    expect(Date.now() - t0).toBeLessThan(LIMITS.requestMs + 1_000);
    expect(summarize(report)).toMatchObject({ ready: 5, notReady: [slow], outOfTime: false });
    expect(report.stops.find((s) => s.id === slow)!.missed).toEqual([
      { url: `/api/v1/visits/${slow}`, miss: "timed-out" },
    ]);
    expect(seen.aborted).toBe(1);
    expect(seen.open()).toBe(0);
  });

  it("a get that ignores its abort still cannot hold the save past the limit", async () => {
    const io: SaveAheadIO = { now: () => Date.now(), get: () => new Promise(() => undefined) };
    const report = await run(saveAhead([{ id: id(1) }], io, LIMITS));
    expect(report.stops[0]!.missed.map((m) => m.miss)).toEqual(["timed-out", "timed-out"]);
  });

  it("stops at the budget: what was not answered by then is out of time, nothing left open", async () => {
    // Every answer takes 10 s: three at a time, 60 s hold about 18 of 3 + 4 × 40 requests.
    const { io, seen } = fakeNet(() => "ok", 10_000);
    const stops = Array.from({ length: 40 }, (_, n) => ({ id: id(n + 1) }));
    const t0 = Date.now();
    const report = await run(saveAhead(stops, io, LIMITS));
    expect(Date.now() - t0).toBeLessThanOrEqual(LIMITS.totalMs);
    const sum = summarize(report);
    expect(sum.outOfTime).toBe(true);
    expect(sum.ready).toBeLessThan(40);
    expect(sum.ready + sum.notReady.length).toBe(40);
    expect(report.stops.flatMap((s) => s.missed.map((m) => m.miss))).not.toContain("failed");
    // Whole stops first, in the day's order: the ones saved are the first stops, not a scatter
    // of half-saved ones (each stop's thumbnail goes ahead of later stops' pages).
    expect(sum.ready).toBeGreaterThanOrEqual(3);
    expect(sum.notReady).toEqual(stops.slice(sum.ready).map((s) => s.id));
    expect(seen.open()).toBe(0);
    expect(seen.urls.length).toBeLessThanOrEqual((LIMITS.totalMs / 10_000 + 1) * 3);
  });

  it("cancelled (the person left Today): aborts what is in flight and starts nothing more", async () => {
    const { io, seen } = fakeNet(() => "ok", 1_000);
    const stops = Array.from({ length: 10 }, (_, n) => ({ id: id(n + 1) }));
    const cancel = new AbortController();
    const p = saveAhead(stops, io, LIMITS, cancel.signal);
    await vi.advanceTimersByTimeAsync(1_500);
    cancel.abort();
    const report = await run(p);
    expect(seen.open()).toBe(0);
    expect(seen.urls.length).toBeLessThanOrEqual(6);
    expect(summarize(report).ready).toBe(0);
  });

  it("products and rule sets that fail are reported apart from the stops", async () => {
    const { io } = fakeNet((u) => (u === "/api/v1/products" ? "404" : "ok"));
    const report = await run(saveAhead([{ id: id(1) }], io, LIMITS));
    expect(summarize(report)).toMatchObject({ ready: 1, sharedOk: false });
  });

  it("an address answered but not kept by the worker makes its stop not ready", async () => {
    const { io } = fakeNet();
    const report = await run(saveAhead([{ id: id(1) }, { id: id(2) }], io, LIMITS));
    const kept = withKept(report, new Set([`/visits/${id(2)}`]));
    expect(summarize(kept)).toMatchObject({ ready: 1, notReady: [id(2)] });
  });

  it("a detail that is not a visit makes its stop not ready rather than throwing", async () => {
    const io: SaveAheadIO = {
      now: () => Date.now(),
      get: async (u, { json }) => ({ ok: true, body: json ? { nope: u } : undefined }),
    };
    const report = await run(saveAhead([{ id: id(1) }], io, LIMITS));
    expect(summarize(report)).toMatchObject({ ready: 0, notReady: [id(1)] });
  });
});

describe("what Today says after saving (daySavedText, offlineText, isFresh)", () => {
  const saved = (over: Partial<DaySaved> = {}): DaySaved => ({
    stops: 5,
    ready: 5,
    readyIds: [1, 2, 3, 4, 5].map(id),
    notReady: [],
    sharedOk: true,
    outOfTime: false,
    savedAt: "2026-12-03T15:42:00.000Z",
    ...over,
  });

  it("every stop kept: Ready offline, how many, when", () => {
    expect(daySavedText(saved(), "10:42 AM")).toBe("Ready offline — 5 stops, saved 10:42 AM");
    expect(daySavedText(saved({ stops: 1, ready: 1 }), "10:42 AM")).toBe(
      "Ready offline — 1 stop, saved 10:42 AM",
    );
  });

  it("some stops not kept: how many of how many, and which", () => {
    const partial = saved({
      ready: 4,
      readyIds: [1, 2, 3, 4].map(id),
      notReady: ["Okafor residence"],
    });
    expect(daySavedText(partial, "10:42 AM")).toBe(
      "4 of 5 stops ready offline, saved 10:42 AM — 1 could not be saved: Okafor residence.",
    );
    const many = saved({ ready: 0, notReady: ["A", "B", "C", "D", "E"], outOfTime: true });
    expect(daySavedText(many, "10:42 AM")).toBe(
      "0 of 5 stops ready offline, saved 10:42 AM — 5 could not be saved in time (weak signal): A, B, C and 2 more.",
    );
    expect(offlineText(partial, "10:42 AM")).toBe(
      "No signal — working from the copy saved at 10:42 AM (4 of 5 stops)",
    );
  });

  it("products or rule sets not kept: said, with what it means in the field", () => {
    expect(daySavedText(saved({ sharedOk: false }), "10:42 AM")).toMatch(
      /^All 5 stops ready offline, saved 10:42 AM\. .*recording an application needs a signal\.$/,
    );
  });

  it("a full save of the same stops in the last minutes is not fetched again", () => {
    const now = Date.parse("2026-12-03T15:50:00.000Z");
    const ids = [1, 2, 3, 4, 5].map(id);
    const tenMin = 10 * 60_000;
    expect(isFresh(saved(), ids, now, tenMin)).toBe(true);
    expect(isFresh(saved(), ids, now + 3 * 60_000, tenMin)).toBe(false); // 11 minutes old
    expect(isFresh(saved(), [...ids, id(6)], now, tenMin)).toBe(false); // a stop was added
    expect(isFresh(saved(), ids.slice(1), now, tenMin)).toBe(false); // one was taken off
    expect(isFresh(saved({ ready: 4 }), ids, now, tenMin)).toBe(false); // the last save had gaps
    expect(isFresh(saved({ sharedOk: false }), ids, now, tenMin)).toBe(false);
    expect(isFresh(saved({ savedAt: "2026-12-03T16:00:00.000Z" }), ids, now, tenMin)).toBe(false); // ahead of the clock
    expect(isFresh(null, ids, now, tenMin)).toBe(false);
  });
});
