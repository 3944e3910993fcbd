"use client";

// A long list shown a page at a time: the first `pageSize` items, then "Show more" adds the next
// page in place (the items are already rendered by the server; nothing is fetched). The count
// says how many there are, so nothing is silently cut off.
import { useState, type ReactNode } from "react";

import { Button } from "./button";

export function PagedList({
  items,
  pageSize = 10,
  label,
  noun,
  className = "space-y-2",
}: {
  items: { key: string; node: ReactNode }[];
  pageSize?: number;
  /** The list's accessible name. */
  label: string;
  /** What an item is, plural ("visits"), for the button and the count. */
  noun: string;
  className?: string;
}) {
  const [shown, setShown] = useState(pageSize);
  const rest = items.length - shown;
  return (
    <div className="space-y-3">
      <ul className={className} aria-label={label}>
        {items.slice(0, shown).map((item) => (
          <li key={item.key}>{item.node}</li>
        ))}
      </ul>
      {items.length > pageSize ? (
        <div className="flex flex-wrap items-center gap-3">
          <p className="text-sm text-muted" role="status">
            Showing {Math.min(shown, items.length)} of {items.length} {noun}.
          </p>
          {rest > 0 ? (
            <Button type="button" variant="secondary" onClick={() => setShown(shown + pageSize)}>
              Show {Math.min(rest, pageSize)} more
            </Button>
          ) : null}
        </div>
      ) : null}
    </div>
  );
}
