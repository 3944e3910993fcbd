// The book's filters as a GET form (every view is a URL), shared by the list and the map.
import Link from "next/link";

import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { FilterSelect } from "@/components/ui/filter-select";
import type { BookQuery } from "@/lib/book/schemas";
import { ALERT_KINDS, SEVERITIES } from "@/lib/risk/labels";

const TRENDS = [
  ["declining", "Declining"],
  ["steady", "Steady"],
  ["improving", "Improving"],
  ["none", "No clear trend"],
] as const;

/** The filter values of a view (sort and paging apart). */
export const bookFilterValues = (query: BookQuery) => ({
  q: query.q,
  technician: query.technician,
  trend: query.trend,
  kind: query.kind,
  severity: query.severity,
  overdue: query.overdue,
});

/** The filters of a view as a query string ("" or "?…"). */
export function bookFilterSearch(query: BookQuery): string {
  const p = new URLSearchParams();
  for (const [k, v] of Object.entries(bookFilterValues(query))) if (v) p.set(k, v);
  const s = p.toString();
  return s ? `?${s}` : "";
}

export function BookFilters({
  query,
  technicians,
  action,
  keepSort = false,
  isFiltered,
}: {
  query: BookQuery;
  technicians: { id: string; name: string }[];
  action: string;
  keepSort?: boolean;
  isFiltered: boolean;
}) {
  return (
    <form
      method="get"
      action={action}
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
      {keepSort && query.sort !== "attention" ? (
        <input type="hidden" name="sort" value={query.sort} />
      ) : null}
      {keepSort && query.dir ? <input type="hidden" name="dir" value={query.dir} /> : null}
      <div className="flex items-end gap-2">
        <button type="submit" className={buttonClass("primary", "w-full")}>
          Show
        </button>
        {isFiltered ? (
          <Link href={action} className={buttonClass("quiet", "no-underline")}>
            Clear
          </Link>
        ) : null}
      </div>
    </form>
  );
}
