// A property's applications of the year as a table (staff property page).
import Link from "next/link";

import type { listPropertyApplications } from "@/lib/applications/queries";
import { formatDate } from "@/lib/dates";

type Row = Awaited<ReturnType<typeof listPropertyApplications>>[number];

export function PropertyApplications({ rows, year }: { rows: Row[]; year: string }) {
  if (!rows.length)
    return (
      <p className="rounded-lg border border-line bg-card p-4">
        No applications recorded in {year}.
      </p>
    );
  return (
    <div
      className="overflow-x-auto rounded-xl border border-line bg-card"
      role="region"
      aria-label={`Applications in ${year} (scrolls sideways)`}
      tabIndex={0}
    >
      <table className="w-full min-w-[40rem] text-left text-sm">
        <caption className="sr-only">Applications in {year}</caption>
        <thead className="border-b border-line bg-paper">
          <tr>
            <th scope="col" className="p-2">
              Date
            </th>
            <th scope="col" className="p-2">
              Zone
            </th>
            <th scope="col" className="p-2">
              Product
            </th>
            <th scope="col" className="p-2">
              Rate
            </th>
            <th scope="col" className="p-2">
              N / P₂O₅ / K₂O (lb per 1,000 ft²)
            </th>
          </tr>
        </thead>
        <tbody>
          {rows.map((r) => (
            <tr key={r.id} className="border-b border-line last:border-0">
              <td className="p-2 whitespace-nowrap">
                <Link href={`/visits/${r.visitId}`} className="font-semibold text-sward">
                  {formatDate(r.appliedOn)}
                </Link>
              </td>
              <td className="p-2">{r.zoneName}</td>
              <td className="p-2">
                {r.productName}
                {r.isPesticide ? <span className="text-muted"> · pesticide</span> : null}
                {r.overridden ? (
                  <span className="font-semibold text-clay">
                    {" "}
                    · over a limit (manager override)
                  </span>
                ) : null}
              </td>
              <td className="p-2 whitespace-nowrap">{r.rate}</td>
              <td className="p-2 whitespace-nowrap">
                {r.nLb.toFixed(2)} / {r.p2o5Lb.toFixed(2)} / {r.k2oLb.toFixed(2)}
              </td>
            </tr>
          ))}
        </tbody>
      </table>
    </div>
  );
}
