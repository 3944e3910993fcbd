"use client";

// The book as a table (TanStack Table, headless): the rows come sorted, filtered and paged by the
// server; a column header is a link to the same view sorted by it (state lives in the URL).
import { createColumnHelper, flexRender, tableFeatures, useTable } from "@tanstack/react-table";
import { ArrowDown, ArrowUp } from "lucide-react";
import Link from "next/link";

import { SeverityBadge } from "@/components/risk-alerts/severity-badge";
import { TrendBadge } from "@/components/sward-index/trend-badge";
import type { BookRow } from "@/lib/book/dto";
import type { BookSort } from "@/lib/book/schemas";
import { formatDate } from "@/lib/dates";

import { CheckSoonBadge } from "./check-soon-badge";

const features = tableFeatures({});
const helper = createColumnHelper<typeof features, BookRow>();
const short = (d: string | null) => (d ? formatDate(d).replace(/^\w+, /, "") : "—");

const columns = helper.columns([
  helper.accessor("name", {
    id: "name",
    header: "Property",
    cell: (info) => (
      <div>
        <Link href={`/properties/${info.row.original.propertyId}`} className="font-bold text-sward">
          {info.getValue()}
        </Link>
        <div className="text-sm text-muted">
          {info.row.original.street}, {info.row.original.city}
        </div>
        {info.row.original.checkSoon ? (
          <div className="mt-1">
            <CheckSoonBadge />
          </div>
        ) : null}
      </div>
    ),
  }),
  helper.accessor("reasons", {
    id: "attention",
    header: "Needs attention",
    cell: (info) =>
      info.getValue().length ? (
        <ul className="space-y-0.5 text-sm">
          {info.getValue().map((r) => (
            <li key={r}>{r}</li>
          ))}
        </ul>
      ) : (
        <span className="text-sm text-muted">Nothing pressing</span>
      ),
  }),
  helper.accessor("latestIndex", {
    id: "index",
    header: "Sward Index",
    cell: (info) => (
      <span className="text-lg font-bold">
        {info.getValue() === null ? "—" : Math.round(info.getValue()!)}
      </span>
    ),
  }),
  helper.accessor("trendSlope", {
    id: "slope",
    header: "Trend",
    cell: (info) => (
      <div className="space-y-1">
        <TrendBadge word={info.row.original.trendWord} n={info.row.original.trendN} />
        {info.getValue() !== null && info.row.original.trendWord ? (
          <div className="text-sm text-muted">
            {info.getValue()! >= 0 ? "+" : "−"}
            {Math.abs(info.getValue()!).toFixed(1)} / 30 d
          </div>
        ) : null}
      </div>
    ),
  }),
  helper.accessor("alerts", {
    id: "alerts",
    header: "Open risk alerts",
    cell: (info) => {
      const a = info.getValue();
      if (!a.high && !a.moderate && !a.low) return <span className="text-sm text-muted">None</span>;
      return (
        <div className="flex flex-wrap gap-1">
          {a.high ? (
            <span className="inline-flex items-center gap-1">
              <SeverityBadge severity="high" />×{a.high}
            </span>
          ) : null}
          {a.moderate ? (
            <span className="inline-flex items-center gap-1">
              <SeverityBadge severity="moderate" />×{a.moderate}
            </span>
          ) : null}
          {a.low ? (
            <span className="inline-flex items-center gap-1">
              <SeverityBadge severity="low" />×{a.low}
            </span>
          ) : null}
        </div>
      );
    },
  }),
  helper.accessor("lastVisitOn", {
    id: "last",
    header: "Last visit",
    cell: (info) => short(info.getValue()),
  }),
  helper.accessor("nextVisitOn", {
    id: "next",
    header: "Next visit",
    cell: (info) => (
      <div>
        {short(info.getValue())}
        {info.row.original.isOverdue ? (
          <div className="text-sm font-bold text-clay">Overdue</div>
        ) : null}
      </div>
    ),
  }),
  helper.accessor("nYtdLb", {
    id: "n",
    header: "N this year",
    cell: (info) => (
      <span className="text-sm">
        {info.getValue().toFixed(2)}
        {info.row.original.nMaxLb !== null ? ` of ${info.row.original.nMaxLb.toFixed(1)}` : ""} lb
      </span>
    ),
  }),
  helper.accessor((r) => r.technician?.name ?? "", {
    id: "technician",
    header: "Technician",
    cell: (info) => info.getValue() || <span className="text-muted">Not assigned</span>,
  }),
]);

const SORTABLE = new Set<string>(["name", "attention", "index", "slope", "last", "next", "n"]);

export function BookTable({
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
  const table = useTable({ features, columns, data: rows });
  return (
    <div
      className="overflow-x-auto rounded-xl border border-line bg-card"
      role="region"
      aria-label="The book (scrolls sideways)"
      tabIndex={0}
    >
      <table className="w-full min-w-[60rem] text-left">
        <caption className="sr-only">
          Every property,{" "}
          {sort === "attention" ? "those needing attention first" : `sorted by ${sort}`}
        </caption>
        <thead className="border-b border-line bg-paper text-sm">
          {table.getHeaderGroups().map((group) => (
            <tr key={group.id}>
              {group.headers.map((header) => {
                const id = header.column.id;
                const isSorted = id === sort;
                return (
                  <th
                    key={header.id}
                    scope="col"
                    className="p-3 align-bottom"
                    aria-sort={isSorted ? (dir === "asc" ? "ascending" : "descending") : undefined}
                  >
                    {SORTABLE.has(id) && hrefFor[id] ? (
                      <Link
                        href={hrefFor[id]}
                        className="inline-flex items-center gap-1 font-bold text-ink no-underline hover:text-sward"
                      >
                        {flexRender(header.column.columnDef.header, header.getContext())}
                        {isSorted ? (
                          dir === "asc" ? (
                            <ArrowUp className="size-4" aria-label="ascending" />
                          ) : (
                            <ArrowDown className="size-4" aria-label="descending" />
                          )
                        ) : null}
                      </Link>
                    ) : (
                      flexRender(header.column.columnDef.header, header.getContext())
                    )}
                  </th>
                );
              })}
            </tr>
          ))}
        </thead>
        <tbody>
          {table.getRowModel().rows.map((row) => (
            <tr
              key={row.id}
              className="border-b border-line align-top last:border-0"
              data-property={row.original.name}
            >
              {row.getAllCells().map((cell) => (
                <td key={cell.id} className="p-3">
                  {flexRender(cell.column.columnDef.cell, cell.getContext())}
                </td>
              ))}
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
