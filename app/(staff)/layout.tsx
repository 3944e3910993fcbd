import {
  Bell,
  CalendarDays,
  ClipboardList,
  FileSpreadsheet,
  FlaskConical,
  Gavel,
  Trees,
} from "lucide-react";
import type { ReactNode } from "react";

import { AppShell, type NavItem } from "@/components/shell/app-shell";
import { requireActor } from "@/lib/auth/require";

export default async function StaffLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["manager", "technician"]);
  const nav: NavItem[] =
    actor.role === "manager"
      ? [
          { href: "/properties", label: "Properties", icon: Trees },
          { href: "/alerts", label: "Alerts", icon: Bell },
          { href: "/visits", label: "Visits", icon: ClipboardList },
          { href: "/products", label: "Products", icon: FlaskConical },
          { href: "/rule-sets", label: "Rule sets", icon: Gavel },
          { href: "/records", label: "Records", icon: FileSpreadsheet },
        ]
      : [
          { href: "/today", label: "Today", icon: CalendarDays },
          { href: "/properties", label: "My properties", icon: Trees },
          { href: "/alerts", label: "Alerts", icon: Bell },
        ];
  return (
    <AppShell actor={actor} nav={nav}>
      {children}
    </AppShell>
  );
}
