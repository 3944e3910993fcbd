"use client";

// The e-mail + password form. Errors are shown in words with an icon, and the e-mail is kept.
import { useActionState } from "react";

import { Button } from "@/components/ui/button";
import { signInAction, type SignInState } from "@/lib/auth/actions";

import { AuthAlert, AuthField } from "./auth-field";

export function SignInForm({ redirectTo }: { redirectTo?: string }) {
  const [state, formAction, isPending] = useActionState<SignInState, FormData>(signInAction, {
    email: "",
  });
  const emailError = state.fieldErrors?.email?.[0];
  const passwordError = state.fieldErrors?.password?.[0];

  return (
    <form action={formAction} className="space-y-5" noValidate>
      {state.error && !emailError && !passwordError ? <AuthAlert>{state.error}</AuthAlert> : null}
      {redirectTo ? <input type="hidden" name="redirectTo" value={redirectTo} /> : null}
      <AuthField
        id="email"
        name="email"
        label="E-mail"
        type="email"
        autoComplete="username"
        inputMode="email"
        defaultValue={state.email}
        error={emailError}
      />
      <AuthField
        id="password"
        name="password"
        label="Password"
        type="password"
        autoComplete="current-password"
        error={passwordError}
      />
      <Button type="submit" className="w-full text-lg" disabled={isPending}>
        {isPending ? "Signing in…" : "Sign in"}
      </Button>
    </form>
  );
}
