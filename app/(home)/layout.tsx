import { Sprout } from "lucide-react";
import { redirect } from "next/navigation";
import type { ReactNode } from "react";

import { AppShell } from "@/components/shell/app-shell";
import { landingPath } from "@/lib/auth/actor";
import { getActor } from "@/lib/auth/session";

// Signed out, each page sends the visitor to sign in and back to that page (a layout cannot know
// the path), so the layout renders nothing of its own for them.
export default async function HomeownerLayout({ children }: { children: ReactNode }) {
  const actor = await getActor();
  if (!actor) return children;
  if (actor.role !== "homeowner") redirect(landingPath(actor.role));
  return (
    <AppShell actor={actor} nav={[{ href: "/my-lawn", label: "My lawn", icon: Sprout }]}>
      {children}
    </AppShell>
  );
}
