import { Map as MapIcon, Plus } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";

import { bookFilterSearch } from "@/components/book/book-filters";
import { BookIndexSummary } from "@/components/book/book-index-summary";
import { BookView } from "@/components/book/book-view";
import { buttonClass } from "@/components/ui/button";
import { requireActor } from "@/lib/auth/require";
import { listBook } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";
import { AppError } from "@/lib/http/app-error";
import { BOOK_MAP_PATH } from "@/lib/paths";
import { listPeople } from "@/lib/people/queries";
import { getBookScoring } from "@/lib/scoring/queries";

export const metadata: Metadata = { title: "Book" };

export default async function BookPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const actor = await requireActor(["manager"]);
  const raw = await searchParams;
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
  const query = bookQuery.parse(
    Object.fromEntries(Object.keys(bookQuery.shape).map((k) => [k, first(raw[k])])),
  );
  const [page, technicians, book] = await Promise.all([
    listBook(actor, query).catch((err: unknown) => {
      if (err instanceof AppError && err.code === "invalid_input")
        return listBook(actor, { ...query, after: undefined });
      throw err;
    }),
    listPeople(actor, "technician"),
    getBookScoring(actor),
  ]);
  return (
    <>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-3xl font-bold">Book</h1>
        <div className="flex flex-wrap gap-2">
          <Link
            href={`${BOOK_MAP_PATH}${bookFilterSearch(query)}`}
            className={buttonClass("secondary", "no-underline")}
          >
            <MapIcon className="size-5" aria-hidden="true" />
            Show on a map
          </Link>
          <Link href="/properties/new" className={buttonClass("primary", "no-underline")}>
            <Plus className="size-5" aria-hidden="true" />
            Add property
          </Link>
        </div>
      </div>
      <p className="mt-1 mb-6 text-muted">Every property {actor.companyName} serves.</p>
      <BookView
        query={query}
        rows={page.rows}
        nextCursor={page.nextCursor}
        total={page.total}
        technicians={technicians.map((t) => ({ id: t.id, name: t.name }))}
      />
      <div className="mt-10">
        <BookIndexSummary book={book} />
      </div>
    </>
  );
}
