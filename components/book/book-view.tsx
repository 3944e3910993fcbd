// The manager's book: filters (a GET form, so every view is a URL), the table (cards on a phone),
// keyset paging and the CSV of the same view.
import { Download } from "lucide-react";
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { FilterSelect } from "@/components/ui/filter-select";
import type { BookRow } from "@/lib/book/dto";
import { BOOK_SORTS, type BookQuery } from "@/lib/book/schemas";
import { BOOK_PATH } from "@/lib/paths";
import { ALERT_KINDS, SEVERITIES } from "@/lib/risk/labels";

import { BookCards } from "./book-cards";
import { BookTable } from "./book-table";

const TRENDS = [
  ["declining", "Declining"],
  ["steady", "Steady"],
  ["improving", "Improving"],
  ["none", "No clear trend"],
] as const;
const NATURAL: Record<string, "asc" | "desc"> = {
  attention: "desc",
  name: "asc",
  index: "asc",
  slope: "asc",
  last: "asc",
  next: "asc",
  n: "desc",
};

export function BookView({
  query,
  rows,
  nextCursor,
  total,
  technicians,
}: {
  query: BookQuery;
  rows: BookRow[];
  nextCursor: string | null;
  total: number;
  technicians: { id: string; name: string }[];
}) {
  const filters = {
    q: query.q,
    technician: query.technician,
    trend: query.trend,
    kind: query.kind,
    severity: query.severity,
    overdue: query.overdue,
  };
  const params = (extra: Record<string, string | undefined>) => {
    const p = new URLSearchParams();
    for (const [k, v] of Object.entries({
      ...filters,
      sort: query.sort === "attention" ? undefined : query.sort,
      dir: query.dir,
      ...extra,
    }))
      if (v) p.set(k, v);
    const s = p.toString();
    return s ? `?${s}` : "";
  };
  const dir = query.dir ?? NATURAL[query.sort]!;
  const hrefFor = Object.fromEntries(
    BOOK_SORTS.map((s) => [
      s,
      `${BOOK_PATH}${params({ sort: s === "attention" ? undefined : s, dir: s === query.sort ? (dir === "asc" ? "desc" : "asc") : undefined, after: undefined })}`,
    ]),
  );
  const isFiltered = Object.values(filters).some(Boolean);
  return (
    <section aria-labelledby="book-table-title">
      <h2 id="book-table-title" className="sr-only">
        Properties in the book
      </h2>
      <form
        method="get"
        action={BOOK_PATH}
        className="mb-3 grid grid-cols-2 gap-3 rounded-xl border border-line bg-card p-3 sm:p-4 lg:grid-cols-4"
        aria-label="Filter the book"
      >
        <label className="col-span-2 space-y-1 lg:col-span-1">
          <span className="block text-sm font-semibold">Search</span>
          <input
            name="q"
            defaultValue={query.q ?? ""}
            maxLength={80}
            className={inputClass}
            placeholder="Name, street, town or ZIP"
          />
        </label>
        <FilterSelect
          name="technician"
          label="Technician"
          value={query.technician}
          any="Anyone"
          options={technicians.map((t) => [t.id, t.name] as const)}
        />
        <FilterSelect
          name="trend"
          label="Trend"
          value={query.trend}
          any="Any trend"
          options={TRENDS}
        />
        <FilterSelect
          name="kind"
          label="Alert kind"
          value={query.kind}
          any="Any"
          options={Object.entries(ALERT_KINDS)}
        />
        <FilterSelect
          name="severity"
          label="Alert severity"
          value={query.severity}
          any="Any"
          options={Object.entries(SEVERITIES).map(([k, v]) => [k, `${v} open`] as const)}
        />
        <label className="flex min-h-tap items-end gap-2 pb-2">
          <input
            type="checkbox"
            name="overdue"
            value="1"
            defaultChecked={query.overdue === "1"}
            className="size-5"
          />
          <span className="font-semibold">Overdue only</span>
        </label>
        {query.sort !== "attention" ? <input type="hidden" name="sort" value={query.sort} /> : null}
        {query.dir ? <input type="hidden" name="dir" value={query.dir} /> : null}
        <div className="flex items-end gap-2">
          <button type="submit" className={buttonClass("primary", "w-full")}>
            Show
          </button>
          {isFiltered ? (
            <Link href={BOOK_PATH} className={buttonClass("quiet", "no-underline")}>
              Clear
            </Link>
          ) : null}
        </div>
      </form>
      <div className="mb-3 flex flex-wrap items-center justify-between gap-2">
        <p role="status" className="font-semibold">
          {total} {total === 1 ? "property" : "properties"}
          {query.sort === "attention" ? ", those needing attention first" : ""}.
        </p>
        <a
          href={`/api/v1/book/export${params({})}`}
          className={buttonClass("secondary", "no-underline")}
          download
        >
          <Download className="size-5" aria-hidden="true" />
          Export this view (CSV)
        </a>
      </div>
      {rows.length ? (
        <>
          {/* Cards on a phone or a narrow tablet; the table where its columns fit. */}
          <div className="lg:hidden">
            <BookCards rows={rows} sort={query.sort} dir={dir} hrefFor={hrefFor} />
          </div>
          <div className="hidden lg:block">
            <BookTable rows={rows} sort={query.sort} dir={dir} hrefFor={hrefFor} />
          </div>
        </>
      ) : (
        <p className="rounded-lg border border-line bg-card p-4">
          {isFiltered ? "No property matches these filters." : "No properties yet."}
        </p>
      )}
      <nav aria-label="Pages of the book" className="mt-3 flex gap-2">
        {query.after ? (
          <Link
            href={`${BOOK_PATH}${params({})}`}
            className={buttonClass("secondary", "no-underline")}
          >
            First page
          </Link>
        ) : null}
        {nextCursor ? (
          <Link
            href={`${BOOK_PATH}${params({ after: nextCursor })}`}
            className={buttonClass("secondary", "no-underline")}
          >
            Next page
          </Link>
        ) : null}
      </nav>
    </section>
  );
}
