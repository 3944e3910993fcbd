// Autosave for one zone check, as a small store outside React (unit-tested on its own):
// every change is kept on the device at once as the draft (one IndexedDB write, nothing else), and
// becomes the zone check's operation in the outbox (lib/offline) after a short pause — when it is
// sent — or at once when the page is hidden or closing (`flush`); a tap never writes the outbox,
// whose every write re-reads the waiting counts on screen. Failed saves are retried with back-off;
// a stale version becomes a visible conflict; an acknowledged save never drops what was typed
// while it was in flight. With no signal the change waits in the outbox, which sends it when the
// network is back even if this form is gone (`acknowledge` hears of it).
import type { SendResult } from "@/lib/query-client";
import type { ZoneCheckDto, ZoneCheckValues } from "@/lib/visits/dto";
import { emptyZoneCheck } from "@/lib/visits/zone-check-rules";

import type { DeviceDraft } from "./draft-store";

export type SaveState =
  | { kind: "idle" }
  | { kind: "pending" }
  | { kind: "saving" }
  | { kind: "saved"; at: string }
  | { kind: "retrying"; message: string; inSeconds: number }
  /** No signal: kept in the phone's outbox, sent when the network is back. */
  | { kind: "waiting" }
  | { kind: "invalid"; message: string; fieldErrors: Record<string, string[]> }
  | { kind: "conflict"; message: string; current: ZoneCheckDto }
  | { kind: "locked"; message: string };

export interface AutosaveSnapshot {
  values: ZoneCheckValues;
  saveState: SaveState;
  isRestored: boolean;
  /** False until the device copy has been read: the form stays disabled until then. */
  isReady: boolean;
}

export interface AutosaveDeps {
  send: (url: string, body: unknown, keepalive: boolean) => Promise<SendResult<ZoneCheckDto>>;
  storage: {
    read(): DeviceDraft | null | Promise<DeviceDraft | null>;
    write(draft: DeviceDraft): void;
  };
  /**
   * Keeps the change in the outbox without waiting for the server: when the page goes away with a
   * save on the wire, and before a photo is queued behind the check (optional in tests).
   */
  queue?: (url: string, body: unknown) => Promise<void>;
  /** The person took the server's copy of a conflict: the phone's queued copy goes. */
  onTookTheirs?: (theirs: ZoneCheckDto) => void;
  newId: () => string;
  setTimer: (fn: () => void, ms: number) => unknown;
  clearTimer: (handle: unknown) => void;
  onSaved: (check: ZoneCheckDto) => void;
}

export const DEBOUNCE_MS = 700;
const RETRY_SECONDS = [2, 5, 10, 30, 60] as const;

function valuesFrom(check: ZoneCheckDto): ZoneCheckValues {
  const {
    id: _id,
    visitId: _v,
    version: _ver,
    updatedAt: _u,
    updatedBy: _b,
    swardIndex: _s,
    ...values
  } = check;
  return values;
}

/**
 * A device copy as this version of the form reads it: fields added since the copy was written
 * (a draft kept on a phone across an update) take their empty value, so an old draft still loads
 * and saves.
 */
function withCurrentFields(draft: DeviceDraft, zoneId: string): DeviceDraft {
  const { baseVersion: _b, ...empty } = emptyZoneCheck(zoneId);
  return { ...draft, values: { ...empty, ...draft.values } };
}

const sameValues = (a: ZoneCheckValues, b: ZoneCheckValues) =>
  JSON.stringify(a) === JSON.stringify(b);

export class ZoneCheckAutosave {
  private draft: DeviceDraft;
  private snapshot: AutosaveSnapshot;
  private listeners = new Set<() => void>();
  private timer: unknown;
  private isInFlight = false;
  private attempt = 0;

  constructor(
    private readonly visitId: string,
    private readonly zoneId: string,
    private readonly serverCheck: ZoneCheckDto | undefined,
    private readonly canEdit: boolean,
    private readonly deps: AutosaveDeps,
  ) {
    const values = serverCheck ? valuesFrom(serverCheck) : { ...emptyZoneCheck(zoneId) };
    const { baseVersion: _b, ...initial } = values as ZoneCheckValues & { baseVersion?: number };
    this.draft = {
      id: serverCheck?.id ?? "",
      values: initial,
      baseVersion: serverCheck?.version ?? 0,
      isDirty: false,
      savedLocallyAt: "",
    };
    this.snapshot = {
      values: initial,
      saveState: { kind: "idle" },
      isRestored: false,
      isReady: false,
    };
  }

  /** Reads the device copy (call once mounted, in the browser). */
  start(): void {
    const stored = this.deps.storage.read();
    if (stored instanceof Promise)
      void stored.then(
        (draft) => this.load(draft),
        () => this.load(null),
      );
    else this.load(stored);
  }

  private load(stored: DeviceDraft | null): void {
    const local = stored ? withCurrentFields(stored, this.zoneId) : null;
    const serverVersion = this.serverCheck?.version ?? 0;
    if (local && !local.isDirty && local.baseVersion > serverVersion) {
      // The page was rendered from data older than this phone's last acknowledged save (a save
      // sent while the page was reloading can land after the reload read the server).
      this.draft = { ...local };
      this.set({ values: local.values, isReady: true });
      return;
    }
    if (local?.isDirty && this.canEdit) {
      this.draft = { ...local };
      const server = this.serverCheck;
      if (
        server &&
        server.version > local.baseVersion &&
        !sameValues(valuesFrom(server), local.values)
      ) {
        this.set({
          values: local.values,
          isRestored: true,
          isReady: true,
          saveState: {
            kind: "conflict",
            message:
              "This zone check was changed on another device while this one had unsaved changes.",
            current: server,
          },
        });
      } else {
        this.set({
          values: local.values,
          isRestored: true,
          isReady: true,
          saveState: { kind: "pending" },
        });
        void this.save();
      }
      return;
    }
    if (!this.draft.id) this.draft.id = local?.id ?? this.deps.newId();
    this.set({ isReady: true });
  }

  subscribe = (listener: () => void): (() => void) => {
    this.listeners.add(listener);
    return () => this.listeners.delete(listener);
  };

  getSnapshot = (): AutosaveSnapshot => this.snapshot;

  /** The device copy as it stands (handed over synchronously when the page goes away). */
  get deviceDraft(): DeviceDraft {
    return { ...this.draft, savedLocallyAt: new Date().toISOString() };
  }

  get hasUnsavedChanges(): boolean {
    return this.draft.isDirty;
  }

  update(change: (previous: ZoneCheckValues) => ZoneCheckValues): void {
    if (!this.canEdit) return;
    if (!this.draft.id) this.draft.id = this.deps.newId();
    this.draft.values = change(this.draft.values);
    this.draft.isDirty = true;
    // The draft only: the outbox gets the change with the save after the pause (or at `flush`).
    this.persist();
    const keep =
      this.snapshot.saveState.kind === "conflict" || this.snapshot.saveState.kind === "locked";
    this.set({
      values: this.draft.values,
      saveState: keep ? this.snapshot.saveState : { kind: "pending" },
    });
    this.schedule(DEBOUNCE_MS);
  }

  resolveConflict(keep: "mine" | "theirs"): void {
    const state = this.snapshot.saveState;
    if (state.kind !== "conflict") return;
    const theirs = state.current;
    this.draft.id = theirs.id;
    this.draft.baseVersion = theirs.version;
    if (keep === "theirs") {
      this.draft.values = valuesFrom(theirs);
      this.draft.isDirty = false;
      this.persist();
      this.deps.onTookTheirs?.(theirs);
      this.deps.onSaved(theirs);
      this.set({ values: this.draft.values, saveState: { kind: "saved", at: theirs.updatedAt } });
    } else {
      this.draft.isDirty = true;
      this.persist();
      this.set({ saveState: { kind: "pending" } });
      void this.save();
    }
  }

  /**
   * Resolves with the check's id once the server has it (photos attach to a saved check).
   * Sends the check now if it was never saved.
   */
  async ensureSaved(): Promise<string> {
    for (let attempt = 0; attempt < 40; attempt++) {
      if (this.draft.baseVersion > 0 && this.draft.id) return this.draft.id;
      const kind = this.snapshot.saveState.kind;
      if (kind === "conflict" || kind === "locked" || kind === "invalid")
        throw new Error("Save the zone check first (see the message above).");
      if (!this.isInFlight) {
        if (!this.draft.id) this.draft.id = this.deps.newId();
        this.draft.isDirty = true;
        this.deps.clearTimer(this.timer);
        await this.save();
      } else await new Promise((r) => setTimeout(r, 250));
    }
    throw new Error("The zone check could not be saved yet; try again in a moment.");
  }

  /**
   * Resolves with the check's id once its operation waits in the outbox (or the server has it):
   * a photo taken with no signal is queued behind it.
   */
  async ensureQueued(): Promise<string> {
    if (!this.draft.id) this.draft.id = this.deps.newId();
    if (this.draft.baseVersion > 0 && !this.draft.isDirty) return this.draft.id;
    this.draft.isDirty = true;
    this.persist();
    await this.queue();
    return this.draft.id;
  }

  /**
   * The outbox sent this check (from this form or later, from any page or tab): take its version;
   * the form shows "Saved" when nothing newer waits.
   */
  acknowledge(check: ZoneCheckDto): void {
    if (check.id !== this.draft.id || check.version <= this.draft.baseVersion) return;
    this.draft.baseVersion = check.version;
    if (sameValues(this.draft.values, valuesFrom(check))) this.draft.isDirty = false;
    this.persist();
    this.deps.onSaved(check);
    const kind = this.snapshot.saveState.kind;
    if (this.isInFlight || kind === "conflict" || kind === "locked") return;
    if (this.draft.isDirty) {
      this.set({ saveState: { kind: "pending" } });
      this.schedule(DEBOUNCE_MS);
    } else {
      this.attempt = 0;
      this.deps.clearTimer(this.timer);
      this.set({ saveState: { kind: "saved", at: check.updatedAt } });
    }
  }

  /**
   * The outbox's replay of this check was refused (sent later, from any page): the same states a
   * refusal of this form's own save shows — a conflict with both copies, a fix, or a lock.
   */
  refused(held: {
    reason: string;
    message: string;
    current?: unknown;
    fieldErrors?: Record<string, string[]>;
  }): void {
    if (this.isInFlight) return; // this form's own save reports it
    this.deps.clearTimer(this.timer);
    if (held.reason === "conflict" && held.current)
      this.set({
        saveState: {
          kind: "conflict",
          message: held.message,
          current: held.current as ZoneCheckDto,
        },
      });
    else if (held.reason === "refused")
      this.set({
        saveState: {
          kind: "invalid",
          message: held.message,
          fieldErrors: held.fieldErrors ?? {},
        },
      });
    else this.set({ saveState: { kind: "locked", message: held.message } });
  }

  retryNow(): void {
    this.attempt = 0;
    this.deps.clearTimer(this.timer);
    void this.save();
  }

  /**
   * Page hidden or closing: what is pending goes into the outbox now and is sent when it can be.
   * With a save already on the wire the newer copy is queued behind it (that save's answer may
   * never reach this page). A conflict or a lock keeps the draft as it is: the person settles it.
   */
  flush(): void {
    if (!this.draft.isDirty || !this.canEdit) return;
    const kind = this.snapshot.saveState.kind;
    if (kind === "conflict" || kind === "locked") return;
    this.deps.clearTimer(this.timer);
    if (this.isInFlight) void this.queue();
    else void this.save(true);
  }

  dispose(): void {
    this.deps.clearTimer(this.timer);
    this.listeners.clear();
  }

  async save(keepalive = false): Promise<void> {
    const kind = this.snapshot.saveState.kind;
    if (
      !this.draft.isDirty ||
      !this.canEdit ||
      kind === "conflict" ||
      kind === "locked" ||
      this.isInFlight
    )
      return;
    this.isInFlight = true;
    this.set({ saveState: { kind: "saving" } });
    const sent = this.draft.values;
    const result = await this.deps.send(
      `/api/v1/visits/${this.visitId}/zone-checks/${this.draft.id}`,
      { ...sent, baseVersion: this.draft.baseVersion },
      keepalive,
    );
    this.isInFlight = false;

    if (result.ok) {
      this.attempt = 0;
      this.draft.baseVersion = result.data.version;
      if (sameValues(this.draft.values, sent)) this.draft.isDirty = false;
      this.persist();
      this.deps.onSaved(result.data);
      if (this.draft.isDirty) {
        // Typed while the save was in flight: send that too.
        this.set({ saveState: { kind: "pending" } });
        void this.save();
      } else this.set({ saveState: { kind: "saved", at: result.data.updatedAt } });
      return;
    }
    if (result.status === 409 && result.error.details?.current) {
      this.set({
        saveState: {
          kind: "conflict",
          message: result.error.message,
          current: result.error.details.current as ZoneCheckDto,
        },
      });
    } else if (result.status === 403 || result.status === 404) {
      this.set({ saveState: { kind: "locked", message: result.error.message } });
    } else if (result.status === 422) {
      this.set({
        saveState: {
          kind: "invalid",
          message: result.error.message,
          fieldErrors: result.error.fieldErrors ?? {},
        },
      });
    } else {
      const wait = RETRY_SECONDS[Math.min(this.attempt, RETRY_SECONDS.length - 1)]!;
      this.attempt++;
      if (result.status === 0 && result.error.code === "waiting") {
        // In the outbox: it goes when the network is back; the timer only looks again.
        this.set({ saveState: { kind: "waiting" } });
        this.schedule(wait * 1000);
        return;
      }
      this.set({
        saveState: {
          kind: "retrying",
          message: result.status === 0 ? "No connection." : result.error.message,
          inSeconds: wait,
        },
      });
      this.schedule(wait * 1000);
    }
  }

  private async queue(): Promise<void> {
    if (!this.deps.queue || !this.canEdit || !this.draft.id) return;
    await this.deps
      .queue(`/api/v1/visits/${this.visitId}/zone-checks/${this.draft.id}`, {
        ...this.draft.values,
        baseVersion: this.draft.baseVersion,
      })
      .catch(() => undefined); // the draft is kept; the next save queues it again
  }

  private schedule(ms: number): void {
    this.deps.clearTimer(this.timer);
    this.timer = this.deps.setTimer(() => void this.save(), ms);
  }

  /** The device keeps the last state, acknowledged or not, with the version it is based on. */
  private persist(): void {
    this.deps.storage.write({ ...this.draft, savedLocallyAt: new Date().toISOString() });
  }

  private set(patch: Partial<AutosaveSnapshot>): void {
    this.snapshot = { ...this.snapshot, ...patch };
    for (const listener of this.listeners) listener();
  }
}
