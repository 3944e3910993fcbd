// The outbox: every change made on a visit is first an operation in IndexedDB, then sent to
// the server in the order it was made (per visit), again and again until the server answers.
// Client only; the decisions are the pure rules of ./rules.ts, the wire is a Transport (fetch in
// the app, a fake in tests). lib/offline/README.md explains the whole.
import { draftKey, type DraftRow, type OfflineDb, type OutboxOp } from "./db";
import { backoffMs, nextToSend, verdictOf, type OpKind, type Verdict } from "./rules";

export interface WireAnswer {
  status: number;
  body: unknown;
}

export interface Transport {
  json(method: "POST" | "PUT", url: string, body: unknown): Promise<WireAnswer>;
  /** A photo's bytes as the request body. */
  blob(url: string, blob: Blob): Promise<WireAnswer>;
}

export type NewOp = Pick<OutboxOp, "kind" | "visitId" | "zoneId" | "clientId" | "payload"> &
  Partial<Pick<OutboxOp, "baseVersion" | "blob" | "capturedAt">>;

export type OutboxEvent =
  | { type: "applied"; op: OutboxOp; data: unknown }
  | { type: "held"; op: OutboxOp }
  | { type: "changed" };

/** What became of one submitted operation by the end of a replay. */
export type Outcome = Verdict | { kind: "waiting"; message: string | null };

/**
 * An operation on the wire longer than this is taken to be lost with its page (tab closed), when
 * the browser cannot say whether that page is still open (`isClaimerAlive`).
 */
const SENDING_STALE_MS: Record<OpKind, number> = {
  start: 30_000,
  "zone-check": 30_000,
  application: 30_000,
  finish: 60_000,
  photo: 150_000,
};

/** The request an operation makes (pure). */
export function requestOf(op: OutboxOp): {
  method: "POST" | "PUT";
  url: string;
  body?: unknown;
  blob?: Blob;
} {
  const visit = `/api/v1/visits/${op.visitId}`;
  switch (op.kind) {
    case "start":
      return { method: "POST", url: `${visit}/start`, body: op.payload };
    case "zone-check":
      return {
        method: "PUT",
        url: `${visit}/zone-checks/${op.clientId}`,
        body: { ...op.payload, baseVersion: op.baseVersion ?? 0 },
      };
    case "application":
      return { method: "POST", url: `${visit}/applications`, body: op.payload };
    case "finish":
      return { method: "POST", url: `${visit}/finish`, body: {} };
    case "photo": {
      const query = new URLSearchParams();
      if (op.capturedAt) query.set("capturedAt", op.capturedAt);
      const reason = op.payload["correctionReason"];
      if (typeof reason === "string" && reason) query.set("correctionReason", reason);
      const checkId = String(op.payload["zoneCheckId"]);
      return {
        method: "POST",
        url: `${visit}/zone-checks/${checkId}/photos${query.size ? `?${query}` : ""}`,
        blob: op.blob,
      };
    }
  }
}

const valuesOfPayload = (payload: Record<string, unknown>) => {
  const { correctionReason: _c, baseVersion: _b, ...values } = payload;
  return values;
};
const same = (a: unknown, b: unknown) => JSON.stringify(a) === JSON.stringify(b);

export class Outbox {
  private listeners = new Set<(event: OutboxEvent) => void>();
  private running: Promise<void> | null = null;
  private again = false;
  private cutShort = false;
  private outcomes = new Map<number, Verdict>();

  constructor(
    readonly db: OfflineDb,
    private readonly transport: Transport,
    private readonly deps: {
      now?: () => number;
      isOnline?: () => boolean;
      /** This page's id, written on what it puts on the wire. */
      pageId?: string;
      /** Whether the page that put an operation on the wire is still open (Web Locks). */
      isClaimerAlive?: (pageId: string) => Promise<boolean>;
    } = {},
  ) {}

  private now(): number {
    return this.deps.now?.() ?? Date.now();
  }

  subscribe(listener: (event: OutboxEvent) => void): () => void {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  }

  /** Tells this page's listeners about an operation applied elsewhere (another tab). */
  emit(event: OutboxEvent): void {
    for (const l of this.listeners) l(event);
  }

  /**
   * Queues an operation. A zone check is one operation per check while it waits: a newer copy
   * replaces the one not yet on the wire (and a held one: the person changed it again, which is
   * their answer); one already on the wire is followed by a new operation.
   */
  async enqueue(input: NewOp): Promise<OutboxOp> {
    const op = await this.db.transaction("rw", this.db.ops, async () => {
      if (input.kind === "zone-check") {
        const waiting = (await this.db.ops.where("clientId").equals(input.clientId).sortBy("seq"))
          .filter((o) => o.kind === "zone-check" && o.state !== "sending")
          .at(-1);
        if (waiting) {
          const changes: Partial<OutboxOp> = {
            payload: input.payload,
            baseVersion: Math.max(input.baseVersion ?? 0, waiting.baseVersion ?? 0),
            state: "queued",
            held: undefined,
            attempts: waiting.state === "held" ? 0 : waiting.attempts,
            nextAttemptAt: waiting.state === "held" ? 0 : waiting.nextAttemptAt,
          };
          await this.db.ops.update(waiting.seq!, changes);
          return { ...waiting, ...changes };
        }
      }
      const row: OutboxOp = {
        kind: input.kind,
        visitId: input.visitId,
        zoneId: input.zoneId,
        clientId: input.clientId,
        baseVersion: input.baseVersion ?? null,
        payload: input.payload,
        blob: input.blob,
        capturedAt: input.capturedAt,
        createdAt: new Date(this.now()).toISOString(),
        attempts: 0,
        lastTriedAt: null,
        lastError: null,
        state: "queued",
        nextAttemptAt: 0,
      };
      const seq = await this.db.ops.add(row);
      return { ...row, seq };
    });
    this.emit({ type: "changed" });
    return op;
  }

  /** Queues, sends what can go now, and says what became of this operation. */
  async submit(input: NewOp): Promise<Outcome> {
    const op = await this.enqueue(input);
    await this.replay();
    const outcome = this.outcomes.get(op.seq!);
    if (outcome) {
      this.outcomes.delete(op.seq!);
      return outcome;
    }
    const row = await this.db.ops.get(op.seq!);
    if (row?.state === "held") return { kind: "held", held: row.held! };
    return { kind: "waiting", message: row?.lastError ?? null };
  }

  /**
   * Sends every operation whose turn it is, until none is left for now. `now`: the network is
   * back or a person asked — waiting back-offs are cut short. One replay at a time per page; a
   * call during one makes it look again when done.
   */
  replay(options: { now?: boolean } = {}): Promise<void> {
    if (options.now) this.cutShort = true;
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      try {
        do {
          const cutShort = this.cutShort;
          this.again = false;
          this.cutShort = false;
          await this.drain(cutShort);
        } while (this.again);
      } finally {
        this.running = null;
      }
    })();
    return this.running;
  }

  private async drain(cutShort: boolean): Promise<void> {
    if (this.deps.isOnline && !this.deps.isOnline()) return;
    const now = this.now();
    // A page that closed (or reloaded) while sending left its operation `sending`: taken back at
    // once when the browser says that page is gone, else after a while.
    const orphans = new Set<number>();
    for (const op of await this.db.ops.toArray()) {
      if (op.state !== "sending") continue;
      const claimer = op.claimedBy;
      if (claimer && claimer !== this.deps.pageId && this.deps.isClaimerAlive)
        if (!(await this.deps.isClaimerAlive(claimer))) orphans.add(op.seq!);
    }
    await this.db.transaction("rw", this.db.ops, async () => {
      for (const op of await this.db.ops.toArray()) {
        const stale =
          op.state === "sending" &&
          (orphans.has(op.seq!) ||
            !op.lastTriedAt ||
            Date.parse(op.lastTriedAt) < now - SENDING_STALE_MS[op.kind]);
        if (stale || (cutShort && op.state === "queued" && op.nextAttemptAt > now))
          await this.db.ops.update(op.seq!, { state: "queued", nextAttemptAt: 0 });
      }
    });
    for (;;) {
      const batch = nextToSend(
        (await this.db.ops.toArray()).map((o) => ({ ...o, seq: o.seq! })),
        this.now(),
      );
      if (!batch.length) return;
      // Visits are independent: their next operations go side by side.
      const results = await Promise.all(batch.map((op) => this.sendOne(op)));
      if (results.every((r) => r === "stop")) return;
    }
  }

  /** Claims, sends and settles one operation. "stop": nothing more can go for its visit now. */
  private async sendOne(op: OutboxOp): Promise<"next" | "stop"> {
    const triedAt = new Date(this.now()).toISOString();
    const claimed = await this.db.transaction("rw", this.db.ops, async () => {
      const row = await this.db.ops.get(op.seq!);
      if (!row || row.state !== "queued") return null;
      await this.db.ops.update(op.seq!, {
        state: "sending",
        lastTriedAt: triedAt,
        claimedBy: this.deps.pageId,
      });
      return row;
    });
    if (!claimed) return "next";
    const request = requestOf(claimed);
    let answer: WireAnswer;
    try {
      answer =
        request.blob !== undefined
          ? await this.transport.blob(request.url, request.blob)
          : await this.transport.json(request.method, request.url, request.body);
    } catch {
      answer = { status: 0, body: null };
    }
    const verdict = verdictOf(claimed.kind, answer.status, answer.body);
    this.outcomes.set(claimed.seq!, verdict);
    if (verdict.kind === "applied" || verdict.kind === "already-applied") {
      await this.acknowledge(claimed, verdict.data);
      this.emit({ type: "applied", op: claimed, data: verdict.data });
      return "next";
    }
    if (verdict.kind === "retry") {
      const attempts = claimed.attempts + 1;
      await this.db.ops.update(claimed.seq!, {
        state: "queued",
        attempts,
        lastError: verdict.message,
        nextAttemptAt: this.now() + backoffMs(attempts),
      });
      this.emit({ type: "changed" });
      return "stop";
    }
    const held = { ...claimed, state: "held" as const, held: verdict.held };
    await this.db.ops.update(claimed.seq!, {
      state: "held",
      held: verdict.held,
      attempts: claimed.attempts + 1,
      lastError: verdict.held.message,
    });
    this.emit({ type: "held", op: held });
    return "stop";
  }

  /** The server has it: the operation leaves the outbox; a zone check's newer copies build on it. */
  private async acknowledge(op: OutboxOp, data: unknown): Promise<void> {
    await this.db.transaction("rw", this.db.ops, this.db.drafts, async () => {
      await this.db.ops.delete(op.seq!);
      if (op.kind !== "zone-check") return;
      const version = (data as { version?: number } | null)?.version;
      if (typeof version !== "number") return;
      const later = await this.db.ops.where("clientId").equals(op.clientId).toArray();
      for (const o of later)
        if (o.kind === "zone-check" && (o.baseVersion ?? 0) < version)
          await this.db.ops.update(o.seq!, { baseVersion: version });
      if (op.zoneId) {
        const draft = await this.db.drafts.get(draftKey(op.visitId, op.zoneId));
        if (draft && draft.id === op.clientId && draft.baseVersion < version) {
          const acknowledged = same(draft.values, valuesOfPayload(op.payload));
          await this.db.drafts.update(draft.key, {
            baseVersion: version,
            isDirty: acknowledged ? false : draft.isDirty,
          });
        }
      }
    });
  }

  /** A held zone check: send the phone's copy again on the server's current version. */
  async keepMine(seq: number, currentVersion: number): Promise<void> {
    await this.db.ops.update(seq, {
      state: "queued",
      held: undefined,
      baseVersion: currentVersion,
      attempts: 0,
      nextAttemptAt: 0,
    });
    this.emit({ type: "changed" });
    await this.replay();
  }

  /**
   * A held zone check: the server's copy wins; the phone's draft becomes the server's (the
   * phone's values are replaced only by this choice of the person).
   */
  async takeTheirs(seq: number, theirs: { id: string; version: number } & Record<string, unknown>) {
    await this.db.transaction("rw", this.db.ops, this.db.drafts, async () => {
      const op = await this.db.ops.get(seq);
      if (!op) return;
      await this.db.ops.delete(seq);
      if (op.zoneId) {
        const key = draftKey(op.visitId, op.zoneId);
        const draft = await this.db.drafts.get(key);
        if (draft) {
          const {
            id,
            version,
            visitId: _v,
            updatedAt: _u,
            updatedBy: _b,
            swardIndex: _s,
            ...v
          } = theirs;
          await this.db.drafts.put({
            ...draft,
            id,
            values: v as unknown as DraftRow["values"],
            baseVersion: version,
            isDirty: false,
          });
        }
      }
    });
    this.emit({ type: "changed" });
    await this.replay();
  }

  /** A held operation the person chose to send again as it is (after fixing what refused it). */
  async retry(seq: number): Promise<void> {
    await this.db.ops.update(seq, { state: "queued", held: undefined, nextAttemptAt: 0 });
    this.emit({ type: "changed" });
    await this.replay();
  }

  /** A held operation the person chose to drop (the screen asks first). */
  async discard(seq: number): Promise<void> {
    await this.db.ops.delete(seq);
    this.emit({ type: "changed" });
    await this.replay();
  }

  /** Everything waiting, oldest first (a visit's when given). */
  async waiting(visitId?: string): Promise<OutboxOp[]> {
    const rows = visitId
      ? await this.db.ops.where("visitId").equals(visitId).toArray()
      : await this.db.ops.toArray();
    return rows.sort((a, b) => a.seq! - b.seq!);
  }
}
