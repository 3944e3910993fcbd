// The map's properties as a table (keyboard and screen-reader users, and anyone who prefers a
// list): the same rows as the map, in name order.
import Link from "next/link";

import type { BookMapDto } from "@/lib/book/dto";
import { alertKindLabel } from "@/lib/risk/labels";
import { indexBand } from "@/lib/scoring/bands";

import { IndexBandMark } from "./index-band-mark";

export function BookMapTable({ data }: { data: BookMapDto }) {
  return (
    <div
      className="overflow-x-auto rounded-xl border border-line bg-card"
      tabIndex={0}
      aria-label="Properties on the map (scrolls sideways)"
    >
      <table className="w-full text-left text-sm">
        <caption className="sr-only">Properties on the map, by name</caption>
        <thead className="bg-paper">
          <tr>
            <th scope="col" className="p-2">
              Property
            </th>
            <th scope="col" className="p-2">
              Sward Index
            </th>
            <th scope="col" className="p-2">
              Open risk alerts
            </th>
            <th scope="col" className="p-2">
              Check soon
            </th>
          </tr>
        </thead>
        <tbody>
          {data.points.map(([id, name, , , index, alerts, kinds, checkSoon]) => {
            const open = alerts[0] + alerts[1] + alerts[2];
            return (
              <tr key={id} className="border-t border-line">
                <td className="p-2">
                  <Link href={`/properties/${id}`} className="font-semibold text-sward">
                    {name}
                  </Link>
                </td>
                <td className="p-2 tabular-nums">
                  <span className="inline-flex items-center gap-2">
                    <span className="w-7 text-right font-bold">{index ?? "—"}</span>
                    <IndexBandMark band={indexBand(index)} />
                  </span>
                </td>
                <td className="p-2">
                  {open
                    ? `${open}: ${kinds.map((k) => alertKindLabel(data.kinds[k] ?? "")).join(", ")}`
                    : "None"}
                </td>
                <td className="p-2">
                  {checkSoon ? <span className="font-semibold text-rain">Check soon</span> : "—"}
                </td>
              </tr>
            );
          })}
        </tbody>
      </table>
    </div>
  );
}
