"use client";

// Acknowledge (technician or manager) or resolve (manager) an alert, each with a note.
import { useRouter } from "next/navigation";
import { useId, useState } from "react";

import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { sendJson } from "@/lib/query-client";

export function RiskAlertActions({
  alertId,
  status,
  canResolve,
}: {
  alertId: string;
  status: "open" | "acknowledged";
  canResolve: boolean;
}) {
  const router = useRouter();
  const id = useId();
  const [mode, setMode] = useState<"acknowledge" | "resolve" | null>(null);
  const [note, setNote] = useState("");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function submit() {
    if (!mode) return;
    setBusy(true);
    setError(null);
    const result = await sendJson("POST", `/api/v1/alerts/${alertId}/${mode}`, { note });
    setBusy(false);
    if (result.ok) {
      setMode(null);
      setNote("");
      router.refresh();
    } else setError(result.error.fieldErrors?.note?.[0] ?? result.error.message);
  }

  if (!mode) {
    return (
      <div className="flex flex-wrap gap-2">
        {status === "open" ? (
          <Button type="button" variant="secondary" onClick={() => setMode("acknowledge")}>
            Acknowledge
          </Button>
        ) : null}
        {canResolve ? (
          <Button type="button" variant="secondary" onClick={() => setMode("resolve")}>
            Resolve
          </Button>
        ) : null}
      </div>
    );
  }
  return (
    <div className="space-y-2">
      <label htmlFor={`${id}-note`} className="block font-semibold">
        {mode === "acknowledge" ? "Note (optional): what you will do" : "How was it resolved?"}
      </label>
      <textarea
        id={`${id}-note`}
        className={inputClass}
        rows={2}
        maxLength={2000}
        value={note}
        onChange={(e) => setNote(e.target.value)}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
      />
      {error ? (
        <p id={`${id}-error`} role="alert" className="font-semibold text-clay">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="button" onClick={submit} disabled={busy}>
          {mode === "acknowledge" ? "Acknowledge" : "Resolve"}
        </Button>
        <Button type="button" variant="quiet" onClick={() => setMode(null)} disabled={busy}>
          Cancel
        </Button>
      </div>
    </div>
  );
}
