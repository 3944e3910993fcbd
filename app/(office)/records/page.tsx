import { Download } from "lucide-react";
import type { Metadata } from "next";

import { buttonClass } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { recordsRangeQuery } from "@/lib/applications/records/schemas";
import { requireActor } from "@/lib/auth/require";
import { addDays, isIsoDate, todayIn } from "@/lib/dates";

export const metadata: Metadata = { title: "Application records" };

export default async function RecordsPage({
  searchParams,
}: {
  searchParams: Promise<{ from?: string; to?: string }>;
}) {
  const actor = await requireActor(["manager"]);
  const today = todayIn(actor.companyTimeZone);
  const q = await searchParams;
  const from = q.from && isIsoDate(q.from) ? q.from : addDays(today, -30);
  const to = q.to && isIsoDate(q.to) ? q.to : today;
  // The same rule as the export route: a reversed range is refused here too, with no download.
  const checked = recordsRangeQuery.safeParse({ from, to });
  const rangeError = checked.success ? null : (checked.error.issues[0]?.message ?? null);
  return (
    <>
      <h1 className="text-3xl font-bold">Application records</h1>
      <p className="mt-1 mb-6 max-w-2xl text-muted">
        Every application with what record-keeping rules ask for: customer and address, zone and
        area treated, date and time, product and registration number, rate and total amount,
        applicator and certification number, weather. Each rule set says how long records are kept.
      </p>
      <form
        method="get"
        className="flex max-w-2xl flex-wrap items-end gap-3 rounded-xl border border-line bg-card p-4"
      >
        <Field id="from" label="From">
          <input id="from" name="from" type="date" defaultValue={from} className={inputClass} />
        </Field>
        <Field id="to" label="To" error={rangeError ?? undefined}>
          <input
            id="to"
            name="to"
            type="date"
            defaultValue={to}
            aria-invalid={rangeError ? true : undefined}
            className={inputClass}
          />
        </Field>
        <button type="submit" className={buttonClass("secondary")}>
          Set range
        </button>
        {rangeError ? null : (
          <a
            href={`/api/v1/records/applications?from=${from}&to=${to}`}
            className={buttonClass("primary", "no-underline")}
            download
          >
            <Download className="size-5" aria-hidden="true" />
            Download CSV ({from} to {to})
          </a>
        )}
      </form>
    </>
  );
}
