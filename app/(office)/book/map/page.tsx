import { List } from "lucide-react";
import type { Metadata } from "next";
import Link from "next/link";

import { BookFilters, bookFilterSearch, bookFilterValues } from "@/components/book/book-filters";
import { BookMap } from "@/components/book/book-map";
import { BookMapLegend } from "@/components/book/book-map-legend";
import { BookMapTable } from "@/components/book/book-map-table";
import { buttonClass } from "@/components/ui/button";
import { requireActor } from "@/lib/auth/require";
import { listBookMap } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";
import { formatShortDate } from "@/lib/dates";
import { mapStyleUrl } from "@/lib/env";
import { BOOK_MAP_PATH, BOOK_PATH, RISK_ALERTS_PATH } from "@/lib/paths";
import { listPeople } from "@/lib/people/queries";
import { listPressureAreas } from "@/lib/pressure-areas/queries";

export const metadata: Metadata = { title: "Book map" };

export default async function BookMapPage({
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
  const [data, technicians, pressure] = await Promise.all([
    listBookMap(actor, query),
    listPeople(actor, "technician"),
    listPressureAreas(actor),
  ]);
  const isFiltered = Object.values(bookFilterValues(query)).some(Boolean);
  const areas = pressure.areas.map((a) => ({
    key: a.key,
    kindLabel: a.kindLabel,
    centre: a.centre,
    radiusMi: a.radiusMi,
    propertyCount: a.properties.filter((p) => p.isMember).length,
  }));
  return (
    <>
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h1 className="text-3xl font-bold">Book map</h1>
        <Link
          href={`${BOOK_PATH}${bookFilterSearch(query)}`}
          className={buttonClass("secondary", "no-underline")}
        >
          <List className="size-5" aria-hidden="true" />
          Show as a list
        </Link>
      </div>
      <p className="mt-1 mb-6 text-muted">
        Every property {actor.companyName} serves, by its Sward Index, with open risk alerts and
        pressure areas.
      </p>
      <BookFilters
        query={query}
        technicians={technicians.map((t) => ({ id: t.id, name: t.name }))}
        action={BOOK_MAP_PATH}
        isFiltered={isFiltered}
      />
      <p role="status" className="mb-3 font-semibold">
        {data.points.length} {data.points.length === 1 ? "property" : "properties"} on the map
        {areas.length
          ? `; ${areas.length} pressure ${areas.length === 1 ? "area" : "areas"}`
          : "; no pressure area"}
        .
      </p>
      <div className="grid gap-4 xl:grid-cols-[1fr_20rem]">
        <BookMap data={data} areas={areas} styleUrl={mapStyleUrl()} />
        <div className="space-y-4">
          <BookMapLegend />
          {pressure.areas.length ? (
            <section
              aria-labelledby="map-areas-title"
              className="rounded-xl border border-line bg-card p-3"
            >
              <h2 id="map-areas-title" className="font-bold">
                Pressure areas
              </h2>
              <ul className="mt-2 space-y-2 text-sm">
                {pressure.areas.map((a) => (
                  <li key={a.key}>
                    <span className="font-semibold">{a.kindLabel}</span>:{" "}
                    {a.properties
                      .filter((p) => p.isMember)
                      .map((p) => p.name)
                      .join(", ")}{" "}
                    ({formatShortDate(a.firstOn)}–{formatShortDate(a.latestOn)})
                  </li>
                ))}
              </ul>
              <Link
                href={`${RISK_ALERTS_PATH}#pressure-areas`}
                className="mt-2 inline-block font-semibold text-sward"
              >
                Evidence on the Alerts page
              </Link>
            </section>
          ) : null}
        </div>
      </div>
      <section aria-labelledby="map-table-title" className="mt-6">
        <h2 id="map-table-title" className="mb-2 text-2xl font-bold">
          The same properties as a list
        </h2>
        <BookMapTable data={data} />
      </section>
    </>
  );
}
