import type { Metadata } from "next";
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";
import { SwardMark } from "@/components/ui/sward-mark";
import { SIGN_IN_LINK_PROVIDER } from "@/lib/auth/sign-in-link";

export const metadata: Metadata = { title: "Sign in", referrer: "no-referrer" };

// Where the e-mailed link lands: one tap goes on to Auth.js, which checks and uses up the token.
// Opening this page (as mail scanners do) uses nothing up.
export default async function SignInLinkPage({
  searchParams,
}: {
  searchParams: Promise<{ token?: string; email?: string; callbackUrl?: string }>;
}) {
  const { token, email, callbackUrl } = await searchParams;
  const isComplete =
    typeof token === "string" && token.length > 0 && typeof email === "string" && email.length > 0;

  return (
    <div className="w-full max-w-md">
      <div className="mb-8 flex items-center gap-3">
        <SwardMark size={44} />
        <p className="text-2xl font-bold tracking-tight">Sward</p>
      </div>
      <section
        className="rounded-2xl border border-line bg-card p-6 shadow-sm sm:p-8"
        aria-labelledby="link-title"
      >
        <h1 id="link-title" className="mb-3 text-2xl font-bold">
          {isComplete ? "Finish signing in" : "This sign-in link is incomplete"}
        </h1>
        {isComplete ? (
          <form
            method="get"
            action={`/api/auth/callback/${SIGN_IN_LINK_PROVIDER}`}
            className="space-y-5"
          >
            <p>
              You are signing in as <strong className="break-words">{email}</strong>.
            </p>
            <input type="hidden" name="token" value={token} />
            <input type="hidden" name="email" value={email} />
            {callbackUrl ? <input type="hidden" name="callbackUrl" value={callbackUrl} /> : null}
            <button type="submit" className={buttonClass("primary", "w-full text-lg")}>
              Continue to my lawn
            </button>
          </form>
        ) : (
          <p>
            Open the link straight from the e-mail, or{" "}
            <Link href="/sign-in" className="font-semibold text-sward underline">
              ask for a new one
            </Link>
            .
          </p>
        )}
      </section>
    </div>
  );
}
