"use client";

// The zone's last check at an earlier finished visit, to compare today's with: one line (date and
// who checked) that opens to the ratings, height of cut, notes and photo. Closed, it takes one
// line, so on a phone the rating buttons stay on screen; each rating also shows its last value
// beside it (RatingPicker).
import { History } from "lucide-react";
import Image from "next/image";

import { formatNumericDate } from "@/lib/dates";
import { RATING_FIELDS, SKIP_REASONS } from "@/lib/reference/visit-options";
import type { LastZoneCheckDto } from "@/lib/visits/dto";

export function LastCheck({ check }: { check: LastZoneCheckDto }) {
  const when = formatNumericDate(check.visitedOn);
  return (
    <details className="group rounded-lg border border-line bg-paper" data-last-check>
      <summary className="flex min-h-tap cursor-pointer items-center gap-2 px-3 text-sm font-semibold">
        <History className="size-4 shrink-0" aria-hidden="true" />
        <span>
          Last check {when}
          {check.checkedBy ? ` · ${check.checkedBy}` : ""}
        </span>
        <span className="ml-auto text-muted group-open:hidden">Show</span>
        <span className="ml-auto hidden text-muted group-open:inline">Hide</span>
      </summary>
      <div className="space-y-2 border-t border-line p-3 text-sm">
        {check.status === "skipped" ? (
          <p>
            Zone skipped
            {check.skipReason ? `: ${SKIP_REASONS[check.skipReason].toLowerCase()}` : ""}.
          </p>
        ) : (
          <dl className="grid grid-cols-2 gap-x-4 gap-y-1">
            {(Object.entries(RATING_FIELDS) as [keyof typeof RATING_FIELDS, string][]).map(
              ([field, label]) => (
                <div key={field} className="flex justify-between gap-2">
                  <dt>{label}</dt>
                  <dd className="font-semibold">
                    {check[field] === null ? "—" : `${check[field]} of 9`}
                  </dd>
                </div>
              ),
            )}
            <div className="col-span-2 flex justify-between gap-2">
              <dt>Height of cut</dt>
              <dd className="font-semibold">
                {check.heightOfCutIn === null
                  ? "not measured"
                  : `${check.heightOfCutIn.toFixed(2)} in`}
              </dd>
            </div>
          </dl>
        )}
        {check.notes ? (
          <p>
            <span className="font-semibold">Notes:</span> {check.notes}
          </p>
        ) : null}
        {check.photo ? (
          <a href={check.photo.displayUrl} target="_blank" rel="noreferrer" className="block w-40">
            <Image
              src={check.photo.thumbUrl}
              alt={`Photo of the last check, ${when}`}
              width={320}
              height={Math.round((320 * check.photo.height) / check.photo.width)}
              unoptimized
              className="aspect-[4/3] w-40 rounded border border-line object-cover"
            />
          </a>
        ) : (
          <p className="text-muted">No photo at the last check.</p>
        )}
      </div>
    </details>
  );
}
