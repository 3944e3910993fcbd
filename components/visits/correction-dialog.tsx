"use client";

// The dialog a correction or a deletion goes through: what changes (the children), and on a
// finished visit the reason, required, one line of at most 500 characters (lib/audit/correction.ts
// refuses the rest on the server too). The server's refusal is shown in the dialog, field by field.
import { useEffect, useId, useRef, useState, type ReactNode } from "react";

import { Button } from "@/components/ui/button";
import { CharacterCount } from "@/components/ui/character-count";
import { CORRECTION_REASON_MAX } from "@/lib/audit/correction";
import type { SendResult } from "@/lib/query-client";

export function CorrectionDialog({
  title,
  confirmLabel,
  needsReason,
  onClose,
  onConfirm,
  children,
}: {
  title: string;
  confirmLabel: string;
  /** The visit is finished: a reason is required and the change is audited. */
  needsReason: boolean;
  onClose: () => void;
  /** Sends the change with the reason; the dialog closes when it succeeds. */
  onConfirm: (reason: string | null) => Promise<SendResult<unknown>>;
  children?: ReactNode;
}) {
  const ref = useRef<HTMLDialogElement>(null);
  const id = useId();
  const [reason, setReason] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  useEffect(() => {
    const dialog = ref.current;
    if (dialog && !dialog.open) dialog.showModal();
    return () => dialog?.close();
  }, []);

  async function confirm() {
    const trimmed = reason.trim();
    if (needsReason && !trimmed) {
      setError("Reason for the correction: required on a finished visit — say what was wrong.");
      return;
    }
    if (trimmed.length > CORRECTION_REASON_MAX) {
      setError(`Reason for the correction: at most ${CORRECTION_REASON_MAX} characters.`);
      return;
    }
    setBusy(true);
    setError(null);
    const result = await onConfirm(trimmed || null);
    setBusy(false);
    if (result.ok) onClose();
    else {
      const fields = result.error.fieldErrors ?? {};
      setError(Object.values(fields).flat()[0] ?? result.error.message);
    }
  }

  return (
    <dialog
      ref={ref}
      aria-labelledby={`${id}-title`}
      onCancel={(e) => {
        e.preventDefault();
        onClose();
      }}
      className="w-[min(32rem,calc(100vw-2rem))] rounded-xl border border-line bg-card p-4 text-ink shadow-lg backdrop:bg-ink/40"
    >
      <h2 id={`${id}-title`} className="mb-3 text-xl font-bold">
        {title}
      </h2>
      <div className="space-y-3">
        {children}
        {needsReason ? (
          <label className="block">
            <span className="mb-1 block font-semibold">Reason for the correction (required)</span>
            <input
              type="text"
              value={reason}
              onChange={(e) => setReason(e.target.value)}
              maxLength={CORRECTION_REASON_MAX + 50}
              aria-describedby={`${id}-count`}
              className="min-h-tap w-full rounded-lg border border-line bg-paper px-3"
              placeholder="What was wrong, e.g. misread in shade"
            />
            <CharacterCount id={`${id}-count`} length={reason.length} max={CORRECTION_REASON_MAX} />
            <span className="block text-sm text-muted">
              The visit is finished: the change and its reason go into the audit trail.
            </span>
          </label>
        ) : null}
        {error ? (
          <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-2 text-clay">
            {error}
          </p>
        ) : null}
      </div>
      <div className="mt-4 flex justify-end gap-2">
        <Button type="button" variant="secondary" onClick={onClose} disabled={busy}>
          Cancel
        </Button>
        <Button type="button" onClick={confirm} disabled={busy}>
          {busy ? "Saving…" : confirmLabel}
        </Button>
      </div>
    </dialog>
  );
}
