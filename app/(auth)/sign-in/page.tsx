import type { Metadata } from "next";
import { redirect } from "next/navigation";
import { SignInForm } from "@/components/auth/sign-in-form";
import { SwardMark } from "@/components/ui/sward-mark";
import { landingPath } from "@/lib/auth/actor";
import { getActor } from "@/lib/auth/session";

export const metadata: Metadata = { title: "Sign in" };

export default async function SignInPage({ searchParams }: { searchParams: Promise<{ callbackUrl?: string }> }) {
  const actor = await getActor();
  if (actor) redirect(landingPath(actor.role));
  const { callbackUrl } = await searchParams;
  const redirectTo = callbackUrl?.startsWith("/") && !callbackUrl.startsWith("//") ? callbackUrl : undefined;

  return (
    <div className="w-full max-w-md">
      <div className="mb-8 flex items-center gap-3">
        <SwardMark size={44} />
        <div>
          <p className="text-2xl font-bold tracking-tight">Sward</p>
          <p className="text-muted">Turf health journal</p>
        </div>
      </div>
      <section className="rounded-2xl border border-line bg-card p-6 shadow-sm sm:p-8" aria-labelledby="sign-in-title">
        <h1 id="sign-in-title" className="mb-1 text-2xl font-bold">
          Sign in
        </h1>
        <p className="mb-6 text-muted">Technicians, managers and homeowners sign in here.</p>
        <SignInForm redirectTo={redirectTo} />
      </section>
      <p className="mt-6 text-sm text-muted">Trouble signing in? Ask your lawn-care company&apos;s office to check your account.</p>
    </div>
  );
}
