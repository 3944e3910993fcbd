"use client";
// The e-mail + password form. Errors are shown in words with an icon, and the e-mail is kept.
import { CircleAlert } from "lucide-react";
import { useActionState } from "react";
import { type SignInState, signInAction } from "@/lib/auth/actions";
import { Button } from "@/components/ui/button";

const fieldClass =
  "block w-full min-h-tap rounded-lg border border-line bg-card px-3 py-2 text-lg text-ink placeholder:text-muted focus:border-sward";

export function SignInForm({ redirectTo }: { redirectTo?: string }) {
  const [state, formAction, isPending] = useActionState<SignInState, FormData>(signInAction, { email: "" });
  const emailError = state.fieldErrors?.email?.[0];
  const passwordError = state.fieldErrors?.password?.[0];

  return (
    <form action={formAction} className="space-y-5" noValidate>
      {state.error && !emailError && !passwordError ? (
        <p role="alert" className="flex items-start gap-2 rounded-lg border border-clay bg-clay-tint p-3 text-clay">
          <CircleAlert className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
          <span>{state.error}</span>
        </p>
      ) : null}
      {redirectTo ? <input type="hidden" name="redirectTo" value={redirectTo} /> : null}
      <div className="space-y-1.5">
        <label htmlFor="email" className="block font-semibold">
          E-mail
        </label>
        <input
          id="email"
          name="email"
          type="email"
          autoComplete="username"
          inputMode="email"
          required
          defaultValue={state.email}
          aria-invalid={emailError ? true : undefined}
          aria-describedby={emailError ? "email-error" : undefined}
          className={fieldClass}
        />
        {emailError ? (
          <p id="email-error" className="text-clay">
            {emailError}
          </p>
        ) : null}
      </div>
      <div className="space-y-1.5">
        <label htmlFor="password" className="block font-semibold">
          Password
        </label>
        <input
          id="password"
          name="password"
          type="password"
          autoComplete="current-password"
          required
          aria-invalid={passwordError ? true : undefined}
          aria-describedby={passwordError ? "password-error" : undefined}
          className={fieldClass}
        />
        {passwordError ? (
          <p id="password-error" className="text-clay">
            {passwordError}
          </p>
        ) : null}
      </div>
      <Button type="submit" className="w-full text-lg" disabled={isPending}>
        {isPending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
