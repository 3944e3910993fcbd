"use client";

// Homeowners: "e-mail me a sign-in link". The answer is the same whether or not the address has an
// account; the e-mail is kept on errors.
import { MailCheck } from "lucide-react";
import { useActionState, useState } from "react";

import { Button } from "@/components/ui/button";
import { requestSignInLinkAction, type SignInLinkState } from "@/lib/auth/actions";

import { AuthAlert, AuthField } from "./auth-field";

export function SignInLinkForm({
  redirectTo,
  minutes,
  notice,
}: {
  redirectTo?: string;
  minutes: number;
  notice?: string;
}) {
  const [state, formAction, isPending] = useActionState<SignInLinkState, FormData>(
    requestSignInLinkAction,
    { email: "" },
  );
  const [again, setAgain] = useState(0);
  const emailError = state.fieldErrors?.email?.[0];

  if (state.sent && again === 0) {
    return (
      <div role="status" className="space-y-3 rounded-lg border border-sward bg-sward-tint p-4">
        <p className="flex items-start gap-2 font-semibold">
          <MailCheck className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
          <span>Check your e-mail</span>
        </p>
        <p>
          If <strong className="break-words">{state.email}</strong> belongs to a homeowner account
          with us, a sign-in link is on its way. It works once, within {minutes} minutes.
        </p>
        <p className="text-muted">
          Nothing after a few minutes? Look in your spam folder, or check the address and ask again.
        </p>
        <Button type="button" variant="secondary" onClick={() => setAgain(1)}>
          Use a different address
        </Button>
      </div>
    );
  }

  const alert = state.error && !emailError ? state.error : notice;
  return (
    <form
      action={(data) => {
        setAgain(0);
        formAction(data);
      }}
      className="space-y-4"
      noValidate
    >
      {alert ? <AuthAlert>{alert}</AuthAlert> : null}
      {redirectTo ? <input type="hidden" name="redirectTo" value={redirectTo} /> : null}
      <AuthField
        id="link-email"
        name="email"
        label="Your e-mail address"
        type="email"
        autoComplete="email"
        inputMode="email"
        defaultValue={state.email}
        error={emailError}
      />
      <Button type="submit" className="w-full text-lg" disabled={isPending}>
        {isPending ? "Sending…" : "E-mail me a sign-in link"}
      </Button>
    </form>
  );
}
