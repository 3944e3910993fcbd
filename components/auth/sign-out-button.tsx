// Sign-out as a plain form post, so it works before hydration too.
import { LogOut } from "lucide-react";

import { buttonClass } from "@/components/ui/button";
import { signOutAction } from "@/lib/auth/actions";

export function SignOutButton({ compact = false }: { compact?: boolean }) {
  return (
    <form action={signOutAction}>
      <button
        type="submit"
        className={buttonClass("quiet", compact ? "px-3" : "w-full justify-start")}
      >
        <LogOut className="size-5" aria-hidden="true" />
        <span className={compact ? "sr-only sm:not-sr-only" : undefined}>Sign out</span>
      </button>
    </form>
  );
}
