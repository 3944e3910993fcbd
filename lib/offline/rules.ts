// The outbox's decisions, pure (no IndexedDB, no fetch, no clock of its own): which queued
// operation goes next, how long a failed one waits, what a server answer means, and what waits.
// lib/offline/README.md explains the whole; tests/unit/offline-outbox.test.ts checks each part.

/** What a visit can queue on the phone. Skipping a zone is a zone check whose status is "skipped". */
export type OpKind = "start" | "zone-check" | "photo" | "application" | "finish";

/**
 * queued: waits for its turn (or for `nextAttemptAt`); sending: on the wire now; held: the server
 * refused it and a person decides (nothing is dropped without that choice).
 */
export type OpState = "queued" | "sending" | "held";

/** Why a held operation waits for a person. */
type HeldReason =
  /** 409 with the server's copy: another device saved the same zone check. */
  | "conflict"
  /** The visit was finished (or called off) by someone else: 403/409 without a copy. */
  | "closed"
  /** 422: the rule set or the label refuses it now, or a field is out of bounds. */
  | "refused"
  /** 404: the visit or zone check is no longer reachable by this person. */
  | "gone";

export interface Held {
  reason: HeldReason;
  message: string;
  /** The server's copy when it sent one (a zone check's 409). */
  current?: unknown;
  fieldErrors?: Record<string, string[]>;
}

/** One queued operation (the fields the rules read; lib/offline/db.ts stores the rest). */
export interface OpLike {
  seq: number;
  kind: OpKind;
  visitId: string;
  state: OpState;
  /** Epoch milliseconds before which a retry is not tried. */
  nextAttemptAt: number;
}

/** What the server's answer to one operation means for the outbox. */
export type Verdict =
  | { kind: "applied"; data: unknown }
  /** A replay of something the server already has: it answered the stored result. */
  | { kind: "already-applied"; data: unknown }
  | { kind: "retry"; message: string }
  | { kind: "held"; held: Held };

interface ErrorBody {
  error?: {
    message?: string;
    fieldErrors?: Record<string, string[]>;
    details?: { current?: unknown };
  };
}

/**
 * Reads one answer. Status 0 is no answer at all (no network, a timeout).
 * - 2xx: applied. A photo's replay answers 200 with the stored photo (201 the first time); every
 *   other queued write answers a replay with the stored row, indistinguishable from the first.
 * - 408, 425, 429, 5xx, no answer: try again later (the server kept nothing, or will answer the
 *   stored result next time — every queued write is idempotent by its client id).
 * - 401: the session ended; kept until the person signs in again (then retried).
 * - 409 with the server's copy: a conflict a person settles; 403 or 409 without one: the visit
 *   is finished or called off; 404: out of reach; 413 and 422: refused as sent.
 */
export function verdictOf(kind: OpKind, status: number, body: unknown): Verdict {
  const error = (body as ErrorBody | null)?.error;
  const message = error?.message ?? (status === 0 ? "No connection." : `Answer ${status}.`);
  if (status >= 200 && status < 300)
    return kind === "photo" && status === 200
      ? { kind: "already-applied", data: body }
      : { kind: "applied", data: body };
  if (status === 0 || status === 401 || status === 408 || status === 425 || status === 429)
    return { kind: "retry", message };
  if (status >= 500) return { kind: "retry", message };
  if (status === 409 && error?.details?.current !== undefined)
    return { kind: "held", held: { reason: "conflict", message, current: error.details.current } };
  if (status === 403 || status === 409)
    return { kind: "held", held: { reason: "closed", message } };
  if (status === 404) return { kind: "held", held: { reason: "gone", message } };
  return {
    kind: "held",
    held: { reason: "refused", message, fieldErrors: error?.fieldErrors ?? {} },
  };
}

/** Waits after the n-th failed try: 2 s, doubling, at most 5 minutes. */
const BACKOFF = { firstMs: 2_000, maxMs: 5 * 60_000 } as const;
export function backoffMs(attempts: number): number {
  if (attempts <= 0) return 0;
  return Math.min(BACKOFF.maxMs, BACKOFF.firstMs * 2 ** Math.min(attempts - 1, 20));
}

/**
 * The operations to send now: per visit, the oldest one not yet applied, in the order they were
 * queued (a zone check before its photos, start before everything, finish after). A visit whose
 * oldest operation is held or on the wire sends nothing more until that one is settled; one whose
 * oldest waits out its back-off waits as a whole.
 */
export function nextToSend<T extends OpLike>(ops: readonly T[], now: number): T[] {
  const firstOf = new Map<string, T>();
  for (const op of [...ops].sort((a, b) => a.seq - b.seq))
    if (!firstOf.has(op.visitId)) firstOf.set(op.visitId, op);
  return [...firstOf.values()].filter((op) => op.state === "queued" && op.nextAttemptAt <= now);
}

/** When the next retry is due (epoch ms), or null when nothing waits on a timer. */
export function nextWake(ops: readonly Pick<OpLike, "state" | "nextAttemptAt">[]): number | null {
  const due = ops.filter((o) => o.state === "queued").map((o) => o.nextAttemptAt);
  return due.length ? Math.min(...due) : null;
}

export interface WaitingSummary {
  /** Queued or held operations that are not photos. */
  changes: number;
  photos: number;
  /** Of those, the ones a person must settle. */
  held: number;
  /** The latest try (ISO), null when none was tried yet. */
  lastTriedAt: string | null;
}

/** What waits on the phone, for a set of operations (a visit's, a zone's, the day's). */
export function summarize(
  ops: readonly (Pick<OpLike, "kind" | "state"> & { lastTriedAt: string | null })[],
): WaitingSummary {
  let changes = 0;
  let photos = 0;
  let held = 0;
  let lastTriedAt: string | null = null;
  for (const op of ops) {
    if (op.kind === "photo") photos += 1;
    else changes += 1;
    if (op.state === "held") held += 1;
    if (op.lastTriedAt && (!lastTriedAt || op.lastTriedAt > lastTriedAt))
      lastTriedAt = op.lastTriedAt;
  }
  return { changes, photos, held, lastTriedAt };
}

/** Longest side of a photo kept on the phone: the display size the server keeps (PHOTO_LIMITS). */
export const QUEUED_PHOTO_LONG_SIDE = 1600;

/** The size a photo is drawn at before it is queued: within `max` on its longest side, never enlarged. */
export function fitWithin(
  width: number,
  height: number,
  max: number = QUEUED_PHOTO_LONG_SIDE,
): { width: number; height: number } {
  if (!(width > 0) || !(height > 0)) throw new Error("A photo has a width and a height.");
  const scale = Math.min(1, max / Math.max(width, height));
  return {
    width: Math.max(1, Math.round(width * scale)),
    height: Math.max(1, Math.round(height * scale)),
  };
}
