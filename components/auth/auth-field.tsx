// A labelled field of the sign-in forms: large tap target, its error in words under it.
import { CircleAlert } from "lucide-react";
import type { InputHTMLAttributes } from "react";

const fieldClass =
  "block w-full min-h-tap rounded-lg border border-line bg-card px-3 py-2 text-lg text-ink placeholder:text-muted focus:border-sward";

export function AuthField({
  id,
  label,
  error,
  ...input
}: InputHTMLAttributes<HTMLInputElement> & { id: string; label: string; error?: string }) {
  return (
    <div className="space-y-1.5">
      <label htmlFor={id} className="block font-semibold">
        {label}
      </label>
      <input
        id={id}
        required
        aria-invalid={error ? true : undefined}
        aria-describedby={error ? `${id}-error` : undefined}
        className={fieldClass}
        {...input}
      />
      {error ? (
        <p id={`${id}-error`} className="text-clay">
          {error}
        </p>
      ) : null}
    </div>
  );
}

/** A refusal at the top of a form, with an icon, announced to screen readers. */
export function AuthAlert({ children }: { children: string }) {
  return (
    <p
      role="alert"
      className="flex items-start gap-2 rounded-lg border border-clay bg-clay-tint p-3 text-clay"
    >
      <CircleAlert className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
      <span>{children}</span>
    </p>
  );
}
