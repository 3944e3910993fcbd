"use client";

// The invited person's confirmation: for an address without an account, a name and a new password
// (the policy of lib/auth/password.ts, said before they type); otherwise one button. Errors in
// words with an icon; the form works before its script loads (a server action).
import { useActionState } from "react";

import { AuthAlert, AuthField } from "@/components/auth/auth-field";
import { Button } from "@/components/ui/button";
import { acceptInvitationAction, type AcceptInvitationState } from "@/lib/invitations/actions";

export function AcceptInvitationForm({
  token,
  name,
  isNewAccount,
  minPasswordLength,
}: {
  token: string;
  name: string;
  isNewAccount: boolean;
  minPasswordLength: number;
}) {
  const [state, formAction, isPending] = useActionState<AcceptInvitationState, FormData>(
    acceptInvitationAction,
    { name },
  );
  const nameError = state.fieldErrors?.name?.[0];
  const passwordError = state.fieldErrors?.password?.[0];

  return (
    <form action={formAction} className="space-y-5" noValidate>
      {state.error && !nameError && !passwordError ? <AuthAlert>{state.error}</AuthAlert> : null}
      <input type="hidden" name="token" value={token} />
      {isNewAccount ? (
        <>
          <AuthField
            id="name"
            name="name"
            label="Your name"
            autoComplete="name"
            defaultValue={state.name}
            error={nameError}
          />
          <AuthField
            id="password"
            name="password"
            label="Choose a password"
            type="password"
            autoComplete="new-password"
            minLength={minPasswordLength}
            aria-describedby={passwordError ? "password-error password-hint" : "password-hint"}
            error={passwordError}
          />
          <p id="password-hint" className="-mt-3 text-sm text-muted">
            At least {minPasswordLength} characters. A few unrelated words make a good one.
          </p>
        </>
      ) : null}
      <Button type="submit" className="w-full text-lg" disabled={isPending}>
        {isPending
          ? "Accepting…"
          : isNewAccount
            ? "Accept and create my account"
            : "Accept the invitation"}
      </Button>
    </form>
  );
}
