// The manager's book: filters (a GET form, so every view is a URL), the table (cards on a phone),
// keyset paging and the CSV of the same view.
import { Download } from "lucide-react";
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";
import type { BookRow } from "@/lib/book/dto";
import { BOOK_SORTS, type BookQuery } from "@/lib/book/schemas";
import { BOOK_PATH } from "@/lib/paths";

import { BookCards } from "./book-cards";
import { BookFilters, bookFilterValues } from "./book-filters";
import { BookTable } from "./book-table";

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
  const filters = bookFilterValues(query);
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
      <BookFilters
        query={query}
        technicians={technicians}
        action={BOOK_PATH}
        keepSort
        isFiltered={isFiltered}
      />
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
