// The phone's outbox (lib/offline): what a server answer means, the back-off, the order of
// replay, the waiting count, the photo size — and the Dexie store itself on fake-indexeddb (an
// implementation of the W3C Indexed Database API in memory): operations survive a new connection
// (a reload), go out in order exactly once, wait out failures, and a refused one waits for a
// person without holding up other visits.
import "fake-indexeddb/auto";

import { afterEach, beforeEach, describe, expect, it } from "vitest";

import { draftKey, openOfflineDb, type OfflineDb } from "@/lib/offline/db";
import { Outbox, requestOf, type Transport, type WireAnswer } from "@/lib/offline/outbox";
import { visitStatus, zonesLeft, zoneStatuses } from "@/lib/offline/overlay";
import {
  backoffMs,
  fitWithin,
  nextToSend,
  nextWake,
  QUEUED_PHOTO_LONG_SIDE,
  summarize,
  verdictOf,
} from "@/lib/offline/rules";
import { PHOTO_LIMITS } from "@/lib/photos/process";

const VISIT = "aaaaaaaa-aaaa-4aaa-8aaa-aaaaaaaaaaaa";
const OTHER_VISIT = "bbbbbbbb-bbbb-4bbb-8bbb-bbbbbbbbbbbb";
const ZONE = "11111111-1111-4111-8111-111111111111";
const CHECK = "22222222-2222-4222-8222-222222222222";

describe("verdictOf: what an answer means (status codes as RFC 9110 §15 defines them)", () => {
  it("2xx is applied; a photo's 200 is the stored photo of a replay", () => {
    expect(verdictOf("zone-check", 200, { id: CHECK }).kind).toBe("applied");
    expect(verdictOf("photo", 201, {}).kind).toBe("applied");
    expect(verdictOf("photo", 200, {}).kind).toBe("already-applied");
  });

  it("no answer, 408 Request Timeout, 425 Too Early (RFC 8470), 429 Too Many Requests (RFC 6585 §4), 5xx and a lapsed session (401): try again later", () => {
    for (const status of [0, 401, 408, 425, 429, 500, 502, 503, 504])
      expect(verdictOf("application", status, null).kind, String(status)).toBe("retry");
  });

  it("409 with the server's copy is a conflict a person settles, the copy kept", () => {
    const current = { id: CHECK, version: 3 };
    const v = verdictOf("zone-check", 409, {
      error: { message: "Changed elsewhere.", details: { current } },
    });
    expect(v).toEqual({
      kind: "held",
      held: { reason: "conflict", message: "Changed elsewhere.", current },
    });
  });

  it("403 or a bare 409 (finished elsewhere), 404 (out of reach), 413 and 422 (refused as sent) wait for a person", () => {
    expect(verdictOf("photo", 403, null)).toMatchObject({
      kind: "held",
      held: { reason: "closed" },
    });
    expect(verdictOf("application", 409, null)).toMatchObject({ held: { reason: "closed" } });
    expect(verdictOf("zone-check", 404, null)).toMatchObject({ held: { reason: "gone" } });
    expect(verdictOf("photo", 413, null)).toMatchObject({ held: { reason: "refused" } });
    const refused = verdictOf("application", 422, {
      error: { message: "Over the rule set's limit.", fieldErrors: { rateAmount: ["Too high."] } },
    });
    expect(refused).toEqual({
      kind: "held",
      held: {
        reason: "refused",
        message: "Over the rule set's limit.",
        fieldErrors: { rateAmount: ["Too high."] },
      },
    });
  });
});

describe("backoffMs: exponential back-off with a cap", () => {
  // Doubling after each failure, as TCP's retransmission timer does (RFC 6298 §5.5, which also
  // allows an upper bound); 2 s first and 5 min at most are Sward's choices (common practice).
  it("waits 2 s after the first failure, doubles, and never more than 5 minutes", () => {
    expect([0, 1, 2, 3, 4, 5].map(backoffMs)).toEqual([0, 2_000, 4_000, 8_000, 16_000, 32_000]);
    expect(backoffMs(9)).toBe(300_000);
    expect(backoffMs(1000)).toBe(300_000);
  });
});

describe("nextToSend: per visit, in the order queued", () => {
  const op = (seq: number, visitId: string, state: "queued" | "sending" | "held", at = 0) => ({
    seq,
    kind: "zone-check" as const,
    visitId,
    state,
    nextAttemptAt: at,
  });

  it("sends each visit's oldest operation, visits side by side", () => {
    const ops = [op(3, VISIT, "queued"), op(1, VISIT, "queued"), op(2, OTHER_VISIT, "queued")];
    expect(nextToSend(ops, 0).map((o) => o.seq)).toEqual([1, 2]);
  });

  it("a held or in-flight operation holds back its visit only; a back-off holds its visit until due", () => {
    const ops = [op(1, VISIT, "held"), op(2, VISIT, "queued"), op(3, OTHER_VISIT, "queued")];
    expect(nextToSend(ops, 0).map((o) => o.seq)).toEqual([3]);
    expect(nextToSend([op(1, VISIT, "sending"), op(2, VISIT, "queued")], 0)).toEqual([]);
    const waiting = [op(1, VISIT, "queued", 5_000), op(2, VISIT, "queued")];
    expect(nextToSend(waiting, 4_999)).toEqual([]);
    expect(nextToSend(waiting, 5_000).map((o) => o.seq)).toEqual([1]);
    expect(nextWake(waiting)).toBe(0);
    expect(nextWake([op(1, VISIT, "held")])).toBeNull();
  });
});

describe("summarize: the waiting count", () => {
  it("counts changes and photos, the held among them, and the latest try", () => {
    const s = summarize([
      { kind: "zone-check", state: "queued", lastTriedAt: "2026-06-01T14:40:00.000Z" },
      { kind: "zone-check", state: "held", lastTriedAt: "2026-06-01T14:42:00.000Z" },
      { kind: "application", state: "queued", lastTriedAt: null },
      { kind: "photo", state: "queued", lastTriedAt: null },
      { kind: "photo", state: "queued", lastTriedAt: "2026-06-01T14:41:00.000Z" },
    ]);
    expect(s).toEqual({ changes: 3, photos: 2, held: 1, lastTriedAt: "2026-06-01T14:42:00.000Z" });
  });
});

describe("fitWithin: a queued photo's size", () => {
  it("is the display size the server keeps (PHOTO_LIMITS.displayLongSide)", () => {
    expect(QUEUED_PHOTO_LONG_SIDE).toBe(PHOTO_LIMITS.displayLongSide);
  });
  it("a 12 MP phone photo (4032 × 3024) becomes 1600 × 1200, portrait too; a small one is never enlarged", () => {
    expect(fitWithin(4032, 3024)).toEqual({ width: 1600, height: 1200 });
    expect(fitWithin(3024, 4032)).toEqual({ width: 1200, height: 1600 });
    expect(fitWithin(800, 600)).toEqual({ width: 800, height: 600 });
    expect(() => fitWithin(0, 600)).toThrow();
  });
});

describe("requestOf: the request each kind makes", () => {
  const base = {
    visitId: VISIT,
    zoneId: ZONE,
    clientId: CHECK,
    createdAt: "",
    attempts: 0,
    lastTriedAt: null,
    lastError: null,
    state: "queued" as const,
    nextAttemptAt: 0,
  };
  it("zone check: PUT with its base version; photo: its capture time and the check in the address", () => {
    expect(
      requestOf({ ...base, kind: "zone-check", baseVersion: 2, payload: { status: "done" } }),
    ).toEqual({
      method: "PUT",
      url: `/api/v1/visits/${VISIT}/zone-checks/${CHECK}`,
      body: { status: "done", baseVersion: 2 },
    });
    const photo = requestOf({
      ...base,
      kind: "photo",
      baseVersion: null,
      payload: { zoneCheckId: CHECK },
      capturedAt: "2026-06-01T14:40:00.000Z",
    });
    expect(photo.url).toBe(
      `/api/v1/visits/${VISIT}/zone-checks/${CHECK}/photos?capturedAt=2026-06-01T14%3A40%3A00.000Z`,
    );
    expect(requestOf({ ...base, kind: "finish", baseVersion: null, payload: {} }).url).toBe(
      `/api/v1/visits/${VISIT}/finish`,
    );
  });
});

describe("overlay: what the screens show while operations wait", () => {
  const visit = {
    status: "scheduled" as const,
    zones: [{ id: "z1" }, { id: "z2" }, { id: "z3" }],
    checks: [{ zoneId: "z1", status: "draft" as const }],
  };
  const check = (zoneId: string, status: string) => ({
    kind: "zone-check" as const,
    zoneId,
    payload: { status },
  });
  it("a zone rated on the phone is not 'not started'; Finish counts the phone's statuses; a queued start makes the visit in progress", () => {
    const ops = [check("z1", "done"), check("z2", "skipped")];
    expect(zoneStatuses(visit as never, ops).get("z1")).toBe("done");
    expect(zoneStatuses(visit as never, ops).get("z2")).toBe("skipped");
    expect(zonesLeft(visit as never, ops)).toEqual(["z3"]);
    expect(visitStatus(visit, [{ kind: "start", zoneId: null, payload: {} }])).toBe("in_progress");
    expect(visitStatus(visit, [])).toBe("scheduled");
  });
});

// ---- the store, on fake-indexeddb ----

interface Sent {
  method: string;
  url: string;
  body: unknown;
  bytes?: number;
}

function fakeServer() {
  const sent: Sent[] = [];
  let version = 0;
  const answers: ((s: Sent) => WireAnswer | null)[] = [];
  const answer = (s: Sent): WireAnswer => {
    sent.push(s);
    const planned = answers.shift()?.(s);
    if (planned) return planned;
    if (s.method === "PUT") {
      // A check saved on version n is stored as n + 1 (or after the fake's own last version).
      version = Math.max(version, (s.body as { baseVersion: number }).baseVersion) + 1;
      return { status: 200, body: { ...(s.body as object), id: CHECK, version } };
    }
    return { status: s.url.includes("/photos") ? 201 : 200, body: { ok: true } };
  };
  const transport: Transport = {
    json: async (method, url, body) => answer({ method, url, body }),
    blob: async (url, blob) => answer({ method: "POST", url, body: null, bytes: blob.size }),
  };
  return { sent, answers, transport };
}

let db: OfflineDb;
let name: string;
let counter = 0;
beforeEach(() => {
  name = `sward-offline-test-${++counter}`;
  db = openOfflineDb(name);
});
afterEach(async () => {
  db.close();
  await openOfflineDb(name).delete();
});

const zoneCheck = (payload: Record<string, unknown>, baseVersion = 0) => ({
  kind: "zone-check" as const,
  visitId: VISIT,
  zoneId: ZONE,
  clientId: CHECK,
  baseVersion,
  payload,
});

describe("Outbox on IndexedDB", () => {
  it("a visit queued with no signal survives a new connection and then arrives in order, each once", async () => {
    const server = fakeServer();
    let online = false;
    const box = new Outbox(db, server.transport, { isOnline: () => online });
    await box.enqueue({
      kind: "start",
      visitId: VISIT,
      zoneId: null,
      clientId: VISIT,
      payload: { startedAt: "2026-06-01T14:00:00.000Z" },
    });
    await box.enqueue(zoneCheck({ status: "draft", quality: 6 }));
    await box.enqueue(zoneCheck({ status: "done", quality: 7 })); // the same check: one operation
    await box.enqueue({
      kind: "photo",
      visitId: VISIT,
      zoneId: ZONE,
      clientId: "p1",
      payload: { zoneCheckId: CHECK },
      blob: new Blob([new Uint8Array(1234)], { type: "image/jpeg" }),
      capturedAt: "2026-06-01T14:10:00.000Z",
    });
    await box.enqueue({
      kind: "finish",
      visitId: VISIT,
      zoneId: null,
      clientId: VISIT,
      payload: {},
    });
    await box.replay({ now: true });
    expect(server.sent).toEqual([]); // offline: nothing tried

    // A reload: a new connection to the same database finds everything, the photo's bytes too.
    db.close();
    db = openOfflineDb(name);
    const again = new Outbox(db, server.transport, { isOnline: () => online });
    const waiting = await again.waiting(VISIT);
    expect(waiting.map((o) => o.kind)).toEqual(["start", "zone-check", "photo", "finish"]);
    expect(waiting[2]!.blob!.size).toBe(1234);

    online = true;
    await again.replay({ now: true });
    expect(
      server.sent.map((s) => `${s.method} ${s.url.replace(`/api/v1/visits/${VISIT}`, "")}`),
    ).toEqual([
      "POST /start",
      `PUT /zone-checks/${CHECK}`,
      `POST /zone-checks/${CHECK}/photos?capturedAt=2026-06-01T14%3A10%3A00.000Z`,
      "POST /finish",
    ]);
    expect(server.sent[1]!.body).toEqual({ status: "done", quality: 7, baseVersion: 0 });
    expect(server.sent[2]!.bytes).toBe(1234);
    expect(await again.waiting()).toEqual([]);
    await again.replay({ now: true });
    expect(server.sent).toHaveLength(4); // nothing sent twice
  });

  it("a failure waits out its back-off with the visit's later operations behind it; 'now' cuts it short", async () => {
    const server = fakeServer();
    let now = 1_000_000;
    const box = new Outbox(db, server.transport, { now: () => now });
    server.answers.push(() => ({ status: 503, body: { error: { message: "Busy." } } }));
    await box.enqueue(zoneCheck({ status: "done" }));
    await box.enqueue({
      kind: "finish",
      visitId: VISIT,
      zoneId: null,
      clientId: VISIT,
      payload: {},
    });
    await box.replay();
    let [first] = await box.waiting();
    expect(first).toMatchObject({
      state: "queued",
      attempts: 1,
      lastError: "Busy.",
      nextAttemptAt: now + 2_000,
    });
    expect(server.sent).toHaveLength(1);
    now += 1_999;
    await box.replay();
    expect(server.sent).toHaveLength(1);
    now += 1;
    await box.replay();
    expect(server.sent.map((s) => s.url.split("/").pop())).toEqual([CHECK, CHECK, "finish"]);
    [first] = await box.waiting();
    expect(first).toBeUndefined();
  });

  it("a newer copy made while one is on the wire follows it on the version the server gave", async () => {
    const server = fakeServer();
    const box = new Outbox(db, server.transport);
    let release!: () => void;
    const gate = new Promise<void>((r) => (release = r));
    const slow: Transport = {
      ...server.transport,
      json: async (method, url, body) => {
        await gate;
        return server.transport.json(method, url, body);
      },
    };
    const slowBox = new Outbox(db, slow);
    await slowBox.enqueue(zoneCheck({ quality: 5 }));
    const inFlight = slowBox.replay();
    await new Promise((r) => setTimeout(r, 20));
    await box.enqueue(zoneCheck({ quality: 8 })); // typed while the first was on the wire
    expect((await box.waiting()).map((o) => o.state)).toEqual(["sending", "queued"]);
    release();
    await inFlight;
    expect(server.sent.map((s) => s.body)).toEqual([
      { quality: 5, baseVersion: 0 },
      { quality: 8, baseVersion: 1 },
    ]);
  });

  it("a conflict is held with the server's copy, holds back its visit only, and is settled by the person", async () => {
    const server = fakeServer();
    const box = new Outbox(db, server.transport);
    const theirs = { id: CHECK, version: 4, quality: 3, updatedBy: "Dana" };
    server.answers.push(() => ({
      status: 409,
      body: { error: { message: "Changed on another device.", details: { current: theirs } } },
    }));
    await db.drafts.put({
      key: draftKey(VISIT, ZONE),
      visitId: VISIT,
      zoneId: ZONE,
      id: CHECK,
      values: { quality: 8 } as never,
      baseVersion: 1,
      isDirty: true,
      savedLocallyAt: "",
    });
    await box.enqueue(zoneCheck({ quality: 8 }, 1));
    await box.enqueue({
      kind: "finish",
      visitId: VISIT,
      zoneId: null,
      clientId: VISIT,
      payload: {},
    });
    await box.enqueue({
      kind: "start",
      visitId: OTHER_VISIT,
      zoneId: null,
      clientId: OTHER_VISIT,
      payload: {},
    });
    await box.replay();
    const held = (await box.waiting(VISIT))[0]!;
    expect(held).toMatchObject({ state: "held", held: { reason: "conflict", current: theirs } });
    expect(server.sent.map((s) => s.url.split("/").pop())).toEqual([CHECK, "start"]);
    expect(await box.waiting(OTHER_VISIT)).toEqual([]);

    // Keep mine: sent again on the server's version, then the finish behind it.
    await box.keepMine(held.seq!, theirs.version);
    expect(server.sent.slice(2).map((s) => s.body)).toEqual([{ quality: 8, baseVersion: 4 }, {}]);
    expect(await box.waiting()).toEqual([]);
    const draft = await db.drafts.get(draftKey(VISIT, ZONE));
    expect(draft).toMatchObject({ isDirty: false, baseVersion: 5 }); // acknowledged on the server's 4
  });

  it("taking the server's copy drops the phone's operation and makes the draft the server's", async () => {
    const server = fakeServer();
    const box = new Outbox(db, server.transport);
    server.answers.push(() => ({
      status: 409,
      body: { error: { message: "Changed.", details: { current: { id: CHECK, version: 4 } } } },
    }));
    await db.drafts.put({
      key: draftKey(VISIT, ZONE),
      visitId: VISIT,
      zoneId: ZONE,
      id: CHECK,
      values: { quality: 8 } as never,
      baseVersion: 1,
      isDirty: true,
      savedLocallyAt: "",
    });
    await box.enqueue(zoneCheck({ quality: 8 }, 1));
    await box.replay();
    const held = (await box.waiting())[0]!;
    await box.takeTheirs(held.seq!, {
      id: CHECK,
      version: 4,
      visitId: VISIT,
      quality: 3,
      updatedAt: "",
      updatedBy: "Dana",
      swardIndex: 60,
    });
    expect(await box.waiting()).toEqual([]);
    expect(await db.drafts.get(draftKey(VISIT, ZONE))).toMatchObject({
      values: { quality: 3 },
      baseVersion: 4,
      isDirty: false,
    });
    expect(server.sent).toHaveLength(1);
  });

  it("an operation left 'sending' by a closed tab is sent again later (the server answers a replay with the stored result)", async () => {
    const server = fakeServer();
    let now = Date.parse("2026-06-01T15:00:00Z");
    const box = new Outbox(db, server.transport, { now: () => now });
    const op = await box.enqueue(zoneCheck({ quality: 6 }));
    await db.ops.update(op.seq!, { state: "sending", lastTriedAt: new Date(now).toISOString() });
    await box.replay();
    expect(server.sent).toHaveLength(0); // another tab may still be sending it
    now += 31_000;
    await box.replay();
    expect(server.sent).toHaveLength(1);
  });

  it("an operation left 'sending' by a page that has since closed (a reload) goes at once; one of a page still open waits", async () => {
    const server = fakeServer();
    const open = new Set(["other-tab"]);
    const box = new Outbox(db, server.transport, {
      pageId: "this-page",
      isClaimerAlive: async (id) => open.has(id),
    });
    const a = await box.enqueue(zoneCheck({ quality: 6 }));
    const b = await box.enqueue({
      kind: "start",
      visitId: OTHER_VISIT,
      zoneId: null,
      clientId: OTHER_VISIT,
      payload: {},
    });
    const now = new Date().toISOString();
    await db.ops.update(a.seq!, { state: "sending", lastTriedAt: now, claimedBy: "reloaded-page" });
    await db.ops.update(b.seq!, { state: "sending", lastTriedAt: now, claimedBy: "other-tab" });
    await box.replay();
    expect(server.sent.map((s) => s.url.split("/").pop())).toEqual([CHECK]);
    expect((await box.waiting()).map((o) => o.state)).toEqual(["sending"]);
  });

  it("the person's choice on a refused operation: send again or drop, nothing dropped otherwise", async () => {
    const server = fakeServer();
    const box = new Outbox(db, server.transport);
    server.answers.push(() => ({ status: 422, body: { error: { message: "Over the limit." } } }));
    await box.enqueue({
      kind: "application",
      visitId: VISIT,
      zoneId: ZONE,
      clientId: "app-1",
      payload: { id: "app-1" },
    });
    await box.replay({ now: true });
    await box.replay({ now: true });
    const [held] = await box.waiting();
    expect(held).toMatchObject({ state: "held", held: { reason: "refused" } });
    expect(server.sent).toHaveLength(1);
    await box.retry(held!.seq!);
    expect(server.sent).toHaveLength(2);
    expect(await box.waiting()).toEqual([]);
  });
});
