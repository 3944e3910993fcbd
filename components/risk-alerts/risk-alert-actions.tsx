"use client";

// Acknowledge (technician or manager) or resolve (manager) an alert, each with a note. The alert's
// page is server-rendered (its summary and counts move with the alert), so a change refreshes it.
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { useForm, type Resolver } from "react-hook-form";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { sendJson } from "@/lib/query-client";
import { acknowledgeSchema, resolveSchema } from "@/lib/risk-alerts/schemas";

function NoteForm({
  alertId,
  mode,
  onCancel,
}: {
  alertId: string;
  mode: "acknowledge" | "resolve";
  onCancel: () => void;
}) {
  const router = useRouter();
  const id = useId();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<{ note: string }>({
    // Both schemas take { note }; acknowledging allows it empty, resolving needs it.
    resolver: formResolver(mode === "acknowledge" ? acknowledgeSchema : resolveSchema) as Resolver<{
      note: string;
    }>,
    defaultValues: { note: "" },
  });
  const error = errors.note?.message ?? message;

  async function submit(values: { note: string }) {
    setMessage(null);
    const result = await sendJson("POST", `/api/v1/alerts/${alertId}/${mode}`, values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.fieldErrors?.note ? null : result.error.message);
    }
    onCancel();
    router.refresh();
  }

  return (
    <form className="space-y-2" noValidate onSubmit={handleSubmit(submit)}>
      <label htmlFor={`${id}-note`} className="block font-semibold">
        {mode === "acknowledge" ? "Note (optional): what you will do" : "How was it resolved?"}
      </label>
      <textarea
        id={`${id}-note`}
        className={inputClass}
        rows={2}
        maxLength={2000}
        {...register("note")}
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
      />
      {error ? (
        <p id={`${id}-error`} role="alert" className="font-semibold text-clay">
          {error}
        </p>
      ) : null}
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {mode === "acknowledge" ? "Acknowledge" : "Resolve"}
        </Button>
        <Button type="button" variant="quiet" onClick={onCancel} disabled={isSubmitting}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

export function RiskAlertActions({
  alertId,
  status,
  canResolve,
}: {
  alertId: string;
  status: "open" | "acknowledged";
  canResolve: boolean;
}) {
  const [mode, setMode] = useState<"acknowledge" | "resolve" | null>(null);
  if (mode) return <NoteForm alertId={alertId} mode={mode} onCancel={() => setMode(null)} />;
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
