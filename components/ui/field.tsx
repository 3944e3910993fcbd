// A labelled form field with its hint and error, and the input styles every form uses.
import type { ReactNode } from "react";

export const inputClass =
  "block w-full min-h-tap rounded-lg border border-line bg-card px-3 py-2 text-base text-ink aria-[invalid=true]:border-clay";

export function Field({
  id,
  label,
  hint,
  error,
  children,
}: {
  id: string;
  label: string;
  hint?: string;
  error?: string;
  children: ReactNode;
}) {
  return (
    <div className="space-y-1">
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      {hint ? (
        <p id={`${id}-hint`} className="text-sm text-muted">
          {hint}
        </p>
      ) : null}
      {children}
      {error ? (
        <p id={`${id}-error`} className="font-semibold text-clay">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** Applies a route's 422 field errors to a react-hook-form form. */
export function applyFieldErrors(
  fieldErrors: Record<string, string[]> | undefined,
  setError: (name: never, error: { message: string }) => void,
): void {
  for (const [name, messages] of Object.entries(fieldErrors ?? {}))
    if (messages[0]) setError(name as never, { message: messages[0] });
}

/** For react-hook-form selects whose empty choice means "none": "" becomes null. */
export const nullIfEmpty = (value: unknown) => (value === "" ? null : value);

/**
 * For react-hook-form number fields typed as text (inputMode="decimal"): empty is null; anything
 * else becomes a number, so "abc" arrives as NaN and the schema refuses it in words.
 */
export const numberOrNull = (value: unknown) =>
  value === null || value === undefined || (typeof value === "string" && value.trim() === "")
    ? null
    : Number(value);
