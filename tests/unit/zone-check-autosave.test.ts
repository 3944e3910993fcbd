// The autosave store behind the zone-check form: nothing typed is dropped, saves are debounced,
// failures retried with back-off, stale versions become conflicts, drafts survive a reload.
import { describe, expect, it } from "vitest";

import type { DeviceDraft } from "@/components/visits/draft-store";
import {
  DEBOUNCE_MS,
  ZoneCheckAutosave,
  type AutosaveDeps,
} from "@/components/visits/zone-check-autosave";
import type { SendResult } from "@/lib/query-client";
import type { ZoneCheckDto } from "@/lib/visits/dto";
import { emptyZoneCheck, zoneCheckSchema } from "@/lib/visits/schemas";

const ZONE = "11111111-1111-4111-8111-111111111111";

function harness(
  responses: ((body: Record<string, unknown>) => SendResult<ZoneCheckDto>)[],
  stored: DeviceDraft | null = null,
) {
  const timers: { fn: () => void; ms: number }[] = [];
  const sent: Record<string, unknown>[] = [];
  let storage = stored;
  const saved: ZoneCheckDto[] = [];
  let version = 0;
  const deps: AutosaveDeps = {
    send: async (_url, body) => {
      sent.push(body as Record<string, unknown>);
      const next = responses.shift();
      return next ? next(body as Record<string, unknown>) : ok(body as Record<string, unknown>);
    },
    storage: { read: () => storage, write: (d) => void (storage = structuredClone(d)) },
    newId: () => "22222222-2222-4222-8222-222222222222",
    setTimer: (fn, ms) => timers.push({ fn, ms }),
    clearTimer: () => timers.splice(0),
    onSaved: (c) => saved.push(c),
  };
  function ok(body: Record<string, unknown>): SendResult<ZoneCheckDto> {
    version++;
    const { baseVersion: _b, ...values } = body;
    return {
      ok: true,
      status: 200,
      data: {
        ...(values as object),
        id: "22222222-2222-4222-8222-222222222222",
        visitId: "v",
        version,
        updatedAt: "2026-06-01T10:00:00Z",
        updatedBy: "Luis",
      } as ZoneCheckDto,
    };
  }
  const runTimers = async () => {
    while (timers.length) {
      const t = timers.shift()!;
      t.fn();
      await new Promise((r) => setTimeout(r, 0));
    }
  };
  return { deps, sent, saved, timers, runTimers, storage: () => storage, ok };
}

const dataOf = (r: SendResult<ZoneCheckDto>) => (r as { data: ZoneCheckDto }).data;

describe("ZoneCheckAutosave", () => {
  it("a draft kept on the phone before the mowing fields existed loads, shows, and saves", async () => {
    // Exactly what an earlier form wrote to localStorage: every field of that day, none since.
    const {
      mowedToday: _m,
      heightBeforeMowingIn: _h,
      ...oldShape
    } = {
      ...emptyZoneCheck(ZONE),
      quality: 6,
      heightOfCutIn: 3.25,
      notes: "typed offline",
    };
    const { baseVersion: _b, ...oldValues } = oldShape;
    const old = {
      id: "22222222-2222-4222-8222-222222222222",
      values: oldValues,
      baseVersion: 0,
      isDirty: true,
      savedLocallyAt: "2026-06-01T09:00:00Z",
    } as unknown as DeviceDraft;
    expect("mowedToday" in old.values).toBe(false);
    const h = harness([], old);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    const snap = store.getSnapshot();
    expect(snap.isRestored).toBe(true);
    expect(snap.values).toMatchObject({ notes: "typed offline", mowedToday: null });
    expect(snap.values.heightBeforeMowingIn).toBeNull();
    await h.runTimers();
    expect(h.sent).toHaveLength(1);
    // The body the server gets passes the server's schema.
    expect(zoneCheckSchema.safeParse(h.sent[0]).success).toBe(true);
    expect(h.sent[0]).toMatchObject({ quality: 6, heightOfCutIn: 3.25, mowedToday: null });
  });

  it("keeps every change on the device at once and sends once after the pause", async () => {
    const h = harness([]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 7 }));
    store.update((v) => ({ ...v, color: 8 }));
    expect(h.storage()?.values).toMatchObject({ quality: 7, color: 8 });
    expect(h.storage()?.isDirty).toBe(true);
    expect(h.timers.at(-1)?.ms).toBe(DEBOUNCE_MS);
    expect(h.sent).toHaveLength(0);
    await h.runTimers();
    expect(h.sent).toHaveLength(1);
    expect(h.sent[0]).toMatchObject({ quality: 7, color: 8, baseVersion: 0 });
    expect(store.getSnapshot().saveState.kind).toBe("saved");
    expect(h.storage()).toMatchObject({ isDirty: false, baseVersion: 1 }); // acknowledged, kept with its version
  });

  it("a page rendered from older server data than the phone's last acknowledged save shows the phone's copy", () => {
    const acknowledged: DeviceDraft = {
      id: "22222222-2222-4222-8222-222222222222",
      values: {
        zoneId: ZONE,
        status: "draft",
        quality: 6,
        notes: "saved while reloading",
      } as DeviceDraft["values"],
      baseVersion: 3,
      isDirty: false,
      savedLocallyAt: "x",
    };
    const stale = {
      id: acknowledged.id,
      visitId: "v",
      version: 2,
      updatedAt: "x",
      updatedBy: null,
      zoneId: ZONE,
      status: "draft",
      quality: 6,
      notes: "",
    } as unknown as ZoneCheckDto;
    const h = harness([], acknowledged);
    const store = new ZoneCheckAutosave("v", ZONE, stale, true, h.deps);
    store.start();
    expect(store.getSnapshot().values.notes).toBe("saved while reloading");
    store.update((v) => ({ ...v, quality: 7 }));
    return h
      .runTimers()
      .then(() =>
        expect(h.sent[0]).toMatchObject({ baseVersion: 3, notes: "saved while reloading" }),
      );
  });

  it("what is typed while a save is in flight is sent next, with the new base version", async () => {
    const h = harness([]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 6 }));
    const first = store.save();
    store.update((v) => ({ ...v, notes: "typed during the save" }));
    await first;
    await h.runTimers();
    await new Promise((r) => setTimeout(r, 0));
    expect(h.sent.map((b) => [b.baseVersion, b.notes])).toEqual([
      [0, ""],
      [1, "typed during the save"],
    ]);
    expect(store.hasUnsavedChanges).toBe(false);
  });

  it("a failed save is visible, kept on the device, and retried with back-off", async () => {
    const offline = (): SendResult<ZoneCheckDto> => ({
      ok: false,
      status: 0,
      error: { code: "offline", message: "No connection to Sward right now." },
    });
    const h = harness([offline, offline]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, weedsPct: 10 }));
    await h.runTimers();
    expect(h.sent.length).toBe(3); // two failures, then success
    expect(store.getSnapshot().saveState.kind).toBe("saved");
    expect(h.sent.every((b) => b.weedsPct === 10)).toBe(true);
  });

  it("back-off waits grow: 2 s, then 5 s", async () => {
    const fail = (): SendResult<ZoneCheckDto> => ({
      ok: false,
      status: 503,
      error: { code: "internal", message: "Busy" },
    });
    const h = harness([fail, fail, fail]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 5 }));
    h.timers.shift()!.fn();
    await new Promise((r) => setTimeout(r, 0));
    expect(store.getSnapshot().saveState).toMatchObject({ kind: "retrying", inSeconds: 2 });
    h.timers.shift()!.fn();
    await new Promise((r) => setTimeout(r, 0));
    expect(store.getSnapshot().saveState).toMatchObject({ kind: "retrying", inSeconds: 5 });
    expect(h.storage()?.values.quality).toBe(5);
  });

  it("a conflict stops autosave and offers both versions", async () => {
    const theirs = {
      id: "22222222-2222-4222-8222-222222222222",
      visitId: "v",
      version: 3,
      updatedAt: "x",
      updatedBy: "Dana",
      zoneId: ZONE,
      quality: 4,
    } as unknown as ZoneCheckDto;
    const h = harness([
      () => ({
        ok: false,
        status: 409,
        error: {
          code: "conflict",
          message: "Changed on another device",
          details: { current: theirs },
        },
      }),
    ]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 8 }));
    await h.runTimers();
    expect(store.getSnapshot().saveState.kind).toBe("conflict");
    store.update((v) => ({ ...v, notes: "still typing" }));
    await h.runTimers();
    expect(h.sent).toHaveLength(1); // no silent overwrite
    store.resolveConflict("mine");
    await new Promise((r) => setTimeout(r, 0));
    expect(h.sent[1]).toMatchObject({ quality: 8, notes: "still typing", baseVersion: 3 });
  });

  it("after a reload, unsaved device changes are restored and sent", async () => {
    const stored: DeviceDraft = {
      id: "22222222-2222-4222-8222-222222222222",
      values: {
        zoneId: ZONE,
        status: "draft",
        quality: 6,
        notes: "before the reload",
      } as DeviceDraft["values"],
      baseVersion: 0,
      isDirty: true,
      savedLocallyAt: "x",
    };
    const h = harness([], stored);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    expect(store.getSnapshot()).toMatchObject({
      isRestored: true,
      values: { notes: "before the reload" },
    });
    await new Promise((r) => setTimeout(r, 0));
    expect(h.sent[0]).toMatchObject({ notes: "before the reload", baseVersion: 0 });
  });

  it("a locked visit stops saving and says why", async () => {
    const h = harness([
      () => ({
        ok: false,
        status: 403,
        error: { code: "forbidden", message: "This visit is finished and locked." },
      }),
    ]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 2 }));
    await h.runTimers();
    expect(store.getSnapshot().saveState).toEqual({
      kind: "locked",
      message: "This visit is finished and locked.",
    });
    expect(h.storage()?.values.quality).toBe(2); // still on the device
  });

  it("with no signal the change waits in the outbox (queued with the save after the pause, not at each tap), and the form says so", async () => {
    const h = harness([
      () => ({ ok: false, status: 0, error: { code: "waiting", message: "No connection." } }),
    ]);
    const queued: unknown[] = [];
    h.deps.queue = async (_url, body) => void queued.push(body);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 4 }));
    store.update((v) => ({ ...v, color: 5 }));
    // Each tap is the draft on the device, nothing more: the outbox is not written per tap.
    expect(h.storage()).toMatchObject({ values: { quality: 4, color: 5 }, isDirty: true });
    expect(queued).toEqual([]);
    expect(h.sent).toEqual([]);
    h.timers.shift()!.fn(); // the pause after the last change: one save, through the outbox
    await new Promise((r) => setTimeout(r, 0));
    expect(h.sent).toEqual([expect.objectContaining({ quality: 4, color: 5, baseVersion: 0 })]);
    expect(store.getSnapshot().saveState).toEqual({ kind: "waiting" });
    expect(h.timers.at(-1)?.ms).toBe(2000); // looks again (the outbox also sends when online)
    await h.runTimers();
    expect(store.getSnapshot().saveState.kind).toBe("saved");
  });

  it("a page hidden or closing mid-pause sends what is pending at once; with a save on the wire it queues the newer copy behind it", async () => {
    let answer!: (r: SendResult<ZoneCheckDto>) => void;
    const h = harness([]);
    const queued: Record<string, unknown>[] = [];
    h.deps.queue = async (_url, body) => void queued.push(body as Record<string, unknown>);
    const send = h.deps.send;
    h.deps.send = (url, body, keepalive) =>
      h.sent.length === 0
        ? new Promise((resolve) => {
            h.sent.push(body as Record<string, unknown>);
            answer = resolve;
          })
        : send(url, body, keepalive);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 4 }));
    store.flush(); // hidden before the pause ended: sent now, the timer dropped
    expect(h.timers).toEqual([]);
    expect(h.sent).toEqual([expect.objectContaining({ quality: 4 })]);
    store.update((v) => ({ ...v, quality: 5 }));
    store.flush(); // closing while the first save is on the wire: the newer copy is queued
    await new Promise((r) => setTimeout(r, 0));
    expect(queued).toEqual([expect.objectContaining({ quality: 5, baseVersion: 0 })]);
    answer(h.ok(h.sent[0]!));
    await new Promise((r) => setTimeout(r, 0));
    await h.runTimers();
    // The page stayed open after all: the newer copy went too, on the version the first got.
    expect(h.sent.at(-1)).toMatchObject({ quality: 5, baseVersion: 1 });
    expect(store.getSnapshot().saveState.kind).toBe("saved");
    expect(store.hasUnsavedChanges).toBe(false);
  });

  it("a page hidden during a conflict queues nothing: the phone's copy stays as the draft until the person chooses", async () => {
    const h = harness([
      () => ({
        ok: false,
        status: 409,
        error: {
          code: "conflict",
          message: "Changed on another device.",
          details: { current: dataOf(h.ok({ ...emptyZoneCheck(ZONE), quality: 2 })) },
        },
      }),
    ]);
    const queued: unknown[] = [];
    h.deps.queue = async (_url, body) => void queued.push(body);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 8 }));
    await h.runTimers();
    expect(store.getSnapshot().saveState.kind).toBe("conflict");
    store.update((v) => ({ ...v, quality: 9 }));
    store.flush();
    await new Promise((r) => setTimeout(r, 0));
    expect(queued).toEqual([]);
    expect(h.sent).toHaveLength(1);
    expect(h.storage()).toMatchObject({ values: { quality: 9 }, isDirty: true });
  });

  it("sent later by the outbox (from another page or tab): the form takes its version and says Saved", async () => {
    const h = harness([
      () => ({ ok: false, status: 0, error: { code: "waiting", message: "No connection." } }),
    ]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 4 }));
    h.timers.at(-1)!.fn();
    await new Promise((r) => setTimeout(r, 0));
    const sentLater = dataOf(h.ok({ ...store.getSnapshot().values, baseVersion: 0 }));
    store.acknowledge(sentLater);
    expect(store.getSnapshot().saveState).toEqual({ kind: "saved", at: sentLater.updatedAt });
    expect(h.storage()).toMatchObject({ isDirty: false, baseVersion: 1 });
    expect(h.saved).toEqual([sentLater]);
    store.acknowledge(sentLater); // told twice (this tab and another): once is enough
    expect(h.saved).toHaveLength(1);
  });

  it("refused later by the outbox as a conflict: both copies kept, the person chooses", () => {
    const h = harness([]);
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    store.update((v) => ({ ...v, quality: 5 }));
    const theirs = dataOf(h.ok({ ...store.getSnapshot().values, quality: 9, baseVersion: 0 }));
    store.refused({ reason: "conflict", message: "Changed elsewhere.", current: theirs });
    expect(store.getSnapshot()).toMatchObject({
      values: { quality: 5 },
      saveState: { kind: "conflict", current: { quality: 9 } },
    });
  });

  it("reads a device copy kept in IndexedDB (asynchronously) before the form opens", async () => {
    const h = harness([]);
    const draft: DeviceDraft = {
      id: "22222222-2222-4222-8222-222222222222",
      values: { ...emptyZoneCheck(ZONE), quality: 3 } as DeviceDraft["values"],
      baseVersion: 0,
      isDirty: true,
      savedLocallyAt: "x",
    };
    h.deps.storage = { read: async () => draft, write: () => undefined };
    const store = new ZoneCheckAutosave("v", ZONE, undefined, true, h.deps);
    store.start();
    expect(store.getSnapshot().isReady).toBe(false);
    await new Promise((r) => setTimeout(r, 0));
    expect(store.getSnapshot()).toMatchObject({ isReady: true, values: { quality: 3 } });
  });
});
