import type { Metadata } from "next";
import { redirect } from "next/navigation";

import { SignInForm } from "@/components/auth/sign-in-form";
import { SignInLinkForm } from "@/components/auth/sign-in-link-form";
import { SwardMark } from "@/components/ui/sward-mark";
import { landingPath } from "@/lib/auth/actor";
import { getActor } from "@/lib/auth/session";
import { SIGN_IN_LINK_MINUTES } from "@/lib/auth/sign-in-link";
import { sameOriginPath } from "@/lib/http/redirect";

export const metadata: Metadata = { title: "Sign in" };

// What Auth.js reports back (?error=…) after a sign-in link was opened, in our words.
const LINK_ERRORS: Record<string, string> = {
  Verification: `That sign-in link has expired or has already been used. A link works once, within ${SIGN_IN_LINK_MINUTES} minutes — ask for a new one below.`,
  AccessDenied:
    "That sign-in link is not for an account that can sign in here. Ask for a new one below, or ask your lawn-care company's office.",
  Configuration:
    "That sign-in link is incomplete. Open it straight from the e-mail, or ask for a new one below.",
};

export default async function SignInPage({
  searchParams,
}: {
  searchParams: Promise<{ callbackUrl?: string; error?: string }>;
}) {
  const { callbackUrl, error } = await searchParams;
  const redirectTo = sameOriginPath(callbackUrl);
  const actor = await getActor();
  if (actor) redirect(redirectTo ?? landingPath(actor.role));
  const linkNotice = error ? LINK_ERRORS[error] : undefined;
  const forHomeowner = Boolean(linkNotice) || Boolean(redirectTo?.startsWith("/my-lawn"));

  const linkSection = (
    <section
      key="link"
      className="rounded-2xl border border-line bg-card p-6 shadow-sm sm:p-8"
      aria-labelledby="link-title"
    >
      <h2 id="link-title" className="mb-1 text-xl font-bold">
        Homeowners
      </h2>
      <p className="mb-5 text-muted">
        {/^\/my-lawn\/(reports|visits)\//.test(redirectTo ?? "")
          ? "Sign in to read your visit report. "
          : ""}
        No password needed: we e-mail you a link that signs you in once, within{" "}
        {SIGN_IN_LINK_MINUTES} minutes.
      </p>
      <SignInLinkForm redirectTo={redirectTo} minutes={SIGN_IN_LINK_MINUTES} notice={linkNotice} />
    </section>
  );
  const passwordSection = (
    <section
      key="password"
      className="rounded-2xl border border-line bg-card p-6 shadow-sm sm:p-8"
      aria-labelledby="sign-in-title"
    >
      <h2 id="sign-in-title" className="mb-1 text-xl font-bold">
        Sign in with your password
      </h2>
      <p className="mb-5 text-muted">
        Technicians and managers sign in here; so can homeowners who set a password.
      </p>
      <SignInForm redirectTo={redirectTo} />
    </section>
  );

  return (
    <div className="w-full max-w-md">
      <div className="mb-8 flex items-center gap-3">
        <SwardMark size={44} />
        <div>
          <h1 className="text-2xl font-bold tracking-tight">Sign in to Sward</h1>
          <p className="text-muted">Turf health journal</p>
        </div>
      </div>
      <div className="space-y-6">
        {forHomeowner ? [linkSection, passwordSection] : [passwordSection, linkSection]}
      </div>
      <p className="mt-6 text-sm text-muted">
        Trouble signing in? Ask your lawn-care company&apos;s office to check your account.
      </p>
    </div>
  );
}
