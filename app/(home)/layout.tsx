import { Sprout } from "lucide-react";
import type { ReactNode } from "react";
import { AppShell } from "@/components/shell/app-shell";
import { requireActor } from "@/lib/auth/require";

export default async function HomeownerLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["homeowner"]);
  return (
    <AppShell actor={actor} nav={[{ href: "/my-lawn", label: "My lawn", icon: Sprout }]}>
      {children}
    </AppShell>
  );
}
