// Manager-only pages (the book, visits of the day, products, rule sets, records, adding and editing
// properties, the development inbox): the role is checked here once, for every page of the group;
// anyone else goes to their own landing page, as from any page they may not open. Layouts render
// alongside their page, so a page that reads data still resolves its actor with the manager role,
// and the data-access layer still scopes every read.
import type { ReactNode } from "react";

import { AppShell } from "@/components/shell/app-shell";
import { staffNav } from "@/components/shell/staff-nav";
import { requireActor } from "@/lib/auth/require";

export default async function OfficeLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["manager"]);
  return (
    <AppShell actor={actor} nav={staffNav(actor.role)}>
      {children}
    </AppShell>
  );
}
