// Pages for managers and technicians alike (the day's stops, a visit, a property, risk alerts).
// Manager-only pages live in app/(office). Not the security boundary: every read is scoped again in
// the data-access layer.
import { NextIntlClientProvider } from "next-intl";
import { getMessages } from "next-intl/server";
import type { ReactNode } from "react";

import { AppShell } from "@/components/shell/app-shell";
import { staffNav } from "@/components/shell/staff-nav";
import { OutboxSync } from "@/components/visits/outbox-sync";
import { requireActor } from "@/lib/auth/require";
import { staffClientMessages } from "@/lib/i18n/staff-messages";

export default async function StaffLayout({ children }: { children: ReactNode }) {
  const actor = await requireActor(["manager", "technician"]);
  const messages = await getMessages();
  return (
    // The words of what waits on the phone (lib/offline) and of a conflict's fields, on every
    // staff page: the outbox works from any of them.
    <NextIntlClientProvider messages={staffClientMessages(messages)}>
      <AppShell actor={actor} nav={staffNav(actor.role)}>
        <OutboxSync />
        {children}
      </AppShell>
    </NextIntlClientProvider>
  );
}
