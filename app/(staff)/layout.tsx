// Pages for managers and technicians alike (the day's stops, a visit, a property, risk alerts).
// Manager-only pages live in app/(office). Not the security boundary: every read is scoped again in
// the data-access layer.
import type { ReactNode } from "react";

import { AppShell } from "@/components/shell/app-shell";
import { staffNav } from "@/components/shell/staff-nav";
import { OutboxSync } from "@/components/visits/outbox-sync";
import { requireActor } from "@/lib/auth/require";

export default async function StaffLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["manager", "technician"]);
  return (
    <AppShell actor={actor} nav={staffNav(actor.role)}>
      <OutboxSync />
      {children}
    </AppShell>
  );
}
