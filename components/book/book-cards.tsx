// The book on a phone: one card per property with the same figures as the table's columns, and
// the table's sorts as links (the state stays in the URL, as the table's header links keep it).
import { ArrowDown, ArrowUp } from "lucide-react";
import Link from "next/link";

import { SeverityBadge } from "@/components/risk-alerts/severity-badge";
import { TrendBadge } from "@/components/sward-index/trend-badge";
import type { BookRow } from "@/lib/book/dto";
import type { BookSort } from "@/lib/book/schemas";
import { formatDate } from "@/lib/dates";

import { CheckSoonBadge } from "./check-soon-badge";

const SORT_LABEL: Record<BookSort, string> = {
  attention: "Needs attention",
  index: "Sward Index",
  slope: "Trend",
  last: "Last visit",
  next: "Next visit",
  n: "N this year",
  name: "Name",
};
const day = (d: string | null) => (d ? formatDate(d) : "—");

function Alerts({ a }: { a: BookRow["alerts"] }) {
  if (!a.high && !a.moderate && !a.low) return <span className="text-muted">None open</span>;
  return (
    <span className="flex flex-wrap gap-1">
      {(["high", "moderate", "low"] as const).map((s) =>
        a[s] ? (
          <span key={s} className="inline-flex items-center gap-1">
            <SeverityBadge severity={s} />×{a[s]}
          </span>
        ) : null,
      )}
    </span>
  );
}

export function BookCards({
  rows,
  sort,
  dir,
  hrefFor,
}: {
  rows: BookRow[];
  sort: BookSort;
  dir: "asc" | "desc";
  hrefFor: Record<string, string>;
}) {
  return (
    <div>
      <nav aria-label="Sort the book" className="mb-3 flex flex-wrap gap-2 text-sm">
        {(Object.keys(SORT_LABEL) as BookSort[])
          .filter((s) => hrefFor[s])
          .map((s) => (
            <Link
              key={s}
              href={hrefFor[s]!}
              aria-current={s === sort ? "true" : undefined}
              className={`inline-flex min-h-tap items-center gap-1 rounded-full border px-3 font-semibold no-underline ${s === sort ? "border-sward bg-sward-tint text-sward-deep" : "border-line bg-card text-ink"}`}
            >
              {SORT_LABEL[s]}
              {s === sort ? (
                dir === "asc" ? (
                  <ArrowUp className="size-4" aria-label="ascending" />
                ) : (
                  <ArrowDown className="size-4" aria-label="descending" />
                )
              ) : null}
            </Link>
          ))}
      </nav>
      <ul className="space-y-3" aria-label="Properties">
        {rows.map((r) => (
          <li
            key={r.propertyId}
            data-property={r.name}
            className="rounded-xl border border-line bg-card p-4 shadow-sm"
          >
            <div className="flex items-start justify-between gap-3">
              <div className="min-w-0">
                <Link href={`/properties/${r.propertyId}`} className="font-bold text-sward">
                  {r.name}
                </Link>
                <p className="text-sm text-muted">
                  {r.street}, {r.city}
                </p>
              </div>
              <p className="shrink-0 text-right">
                <span className="block text-2xl leading-none font-bold">
                  {r.latestIndex === null ? "—" : Math.round(r.latestIndex)}
                </span>
                <span className="text-xs text-muted">Sward Index</span>
              </p>
            </div>
            <div className="mt-2 flex flex-wrap items-center gap-2">
              {r.checkSoon ? <CheckSoonBadge /> : null}
              <TrendBadge word={r.trendWord} n={r.trendN} />
              {r.trendSlope !== null && r.trendWord ? (
                <span className="text-sm text-muted">
                  {r.trendSlope >= 0 ? "+" : "−"}
                  {Math.abs(r.trendSlope).toFixed(1)} / 30 d
                </span>
              ) : null}
            </div>
            {r.reasons.length ? (
              <ul className="mt-2 list-disc space-y-0.5 pl-5 text-sm" aria-label="Needs attention">
                {r.reasons.map((reason) => (
                  <li key={reason}>{reason}</li>
                ))}
              </ul>
            ) : (
              <p className="mt-2 text-sm text-muted">Nothing pressing</p>
            )}
            <dl className="mt-3 grid grid-cols-2 gap-x-3 gap-y-2 text-sm">
              <div>
                <dt className="text-muted">Open risk alerts</dt>
                <dd>
                  <Alerts a={r.alerts} />
                </dd>
              </div>
              <div>
                <dt className="text-muted">N this year</dt>
                <dd>
                  {r.nYtdLb.toFixed(2)}
                  {r.nMaxLb !== null ? ` of ${r.nMaxLb.toFixed(1)}` : ""} lb / 1,000 ft²
                </dd>
              </div>
              <div>
                <dt className="text-muted">Last visit</dt>
                <dd>{day(r.lastVisitOn)}</dd>
              </div>
              <div>
                <dt className="text-muted">Next visit</dt>
                <dd>
                  {day(r.nextVisitOn)}
                  {r.isOverdue ? <span className="block font-bold text-clay">Overdue</span> : null}
                </dd>
              </div>
              <div className="col-span-2">
                <dt className="text-muted">Technician</dt>
                <dd>{r.technician?.name ?? "Not assigned"}</dd>
              </div>
            </dl>
          </li>
        ))}
      </ul>
    </div>
  );
}
