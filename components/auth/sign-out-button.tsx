"use client";

// Sign-out as a plain form post, so it works before hydration too. Once the page has loaded, the
// phone's kept data (cached field pages, the outbox, drafts: components/pwa/device-data.ts) is
// deleted first — phones are shared. A sign-out posted before hydration leaves it, and the next
// person's first page deletes it (components/pwa/device-owner.tsx). Changes still waiting in the
// outbox are never deleted unasked: the person confirms first.
import { LogOut } from "lucide-react";
import { useTranslations } from "next-intl";
import { useRef, type FormEvent } from "react";

import { clearDeviceData } from "@/components/pwa/device-data";
import { buttonClass } from "@/components/ui/button";
import { signOutAction } from "@/lib/auth/actions";
import { offlineDb } from "@/lib/offline/db";

export function SignOutButton({ compact = false }: { compact?: boolean }) {
  const t = useTranslations("offline");
  const cleared = useRef(false);
  const onSubmit = (event: FormEvent<HTMLFormElement>) => {
    if (cleared.current) return; // the second submit: the action runs
    event.preventDefault();
    const form = event.currentTarget;
    void (async () => {
      const waiting = await offlineDb()
        .ops.count()
        .catch(() => 0);
      if (waiting > 0 && !window.confirm(t("signOutWaiting", { count: waiting }))) return;
      await clearDeviceData();
      cleared.current = true;
      form.requestSubmit();
    })();
  };
  return (
    <form action={signOutAction} onSubmit={onSubmit}>
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
