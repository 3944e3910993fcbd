// The homeowner's next scheduled visit on My lawn: its day and its purpose (the planned service
// in the catalogue's words); nothing when none is scheduled.
import { CalendarClock } from "lucide-react";

import { formatDate } from "@/lib/dates";
import { words } from "@/lib/i18n/translate";
import type { NextVisit } from "@/lib/reports/dto";

export function NextVisitNote({ visit, locale }: { visit: NextVisit | null; locale: string }) {
  if (!visit) return null;
  const service = words(locale, "terms.plannedServices")(visit.service);
  return (
    <p className="mb-4 flex items-center gap-2 rounded-lg border border-line bg-card p-3">
      <CalendarClock className="size-5 shrink-0 text-sward" aria-hidden="true" />
      <span>
        {words(locale, "report.mail")("nextVisit", {
          service,
          date: formatDate(visit.date, locale),
        })}
      </span>
    </p>
  );
}
