import { Trees } from "lucide-react";
import type { ReactNode } from "react";
import { AppShell, type NavItem } from "@/components/shell/app-shell";
import { requireActor } from "@/lib/auth/require";

export default async function StaffLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["manager", "technician"]);
  const nav: NavItem[] = [
    { href: "/properties", label: actor.role === "manager" ? "Properties" : "My properties", icon: Trees },
  ];
  return (
    <AppShell actor={actor} nav={nav}>
      {children}
    </AppShell>
  );
}
