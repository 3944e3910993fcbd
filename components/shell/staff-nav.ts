// The staff navigation, shared by the (staff) and (office) layouts: the manager's and the
// technician's entries, labelled with the glossary's words.
import {
  Bell,
  CalendarDays,
  CalendarRange,
  ClipboardList,
  FileSpreadsheet,
  FlaskConical,
  Gavel,
  Settings,
  Trees,
  Users,
} from "lucide-react";

import type { Role } from "@/db/schema";
import { BOOK_PATH, RISK_ALERTS_PATH } from "@/lib/paths";

import type { NavItem } from "./app-shell";

export function staffNav(role: Role): NavItem[] {
  return role === "manager"
    ? [
        { href: BOOK_PATH, label: "Book", icon: Trees, also: ["/properties"] },
        { href: RISK_ALERTS_PATH, label: "Risk alerts", icon: Bell },
        { href: "/visits", label: "Visits", icon: ClipboardList },
        { href: "/programs", label: "Programs", icon: CalendarRange },
        { href: "/products", label: "Products", icon: FlaskConical },
        { href: "/rule-sets", label: "Rule sets", icon: Gavel },
        { href: "/records", label: "Records", icon: FileSpreadsheet },
        { href: "/people", label: "People", icon: Users },
        { href: "/settings", label: "Settings", icon: Settings },
      ]
    : [
        { href: "/today", label: "Today", icon: CalendarDays, also: ["/visits"] },
        { href: "/properties", label: "My properties", icon: Trees },
        { href: RISK_ALERTS_PATH, label: "Risk alerts", icon: Bell },
      ];
}
