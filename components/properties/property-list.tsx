"use client";

// The staff list of properties in scope, read through React Query (prefetched on the server).
import { CircleAlert, MapPin, UserRound } from "lucide-react";
import Link from "next/link";

import { formatAreaFt2, formatCount } from "@/components/ui/format";

import { useProperties } from "./use-properties";

export function PropertyList({ showTechnician }: { showTechnician: boolean }) {
  const { data, error, isPending, refetch } = useProperties();

  if (isPending) return <p className="text-muted">Loading properties…</p>;
  if (error)
    return (
      <div
        role="alert"
        className="flex items-start gap-2 rounded-lg border border-clay bg-clay-tint p-3 text-clay"
      >
        <CircleAlert className="mt-0.5 size-5 shrink-0" aria-hidden="true" />
        <p>
          Properties could not be loaded: {error.message}{" "}
          <button type="button" className="font-semibold underline" onClick={() => void refetch()}>
            Try again
          </button>
        </p>
      </div>
    );
  if (data.length === 0)
    return (
      <p className="rounded-lg border border-line bg-card p-4">
        {showTechnician
          ? "No properties in the book yet."
          : "No properties are assigned to you yet. Your manager assigns them."}
      </p>
    );

  return (
    <ul className="grid gap-3 sm:grid-cols-2" aria-label="Properties">
      {data.map((p) => (
        <li key={p.id}>
          <Link
            href={`/properties/${p.id}`}
            className="block rounded-xl border border-line bg-card p-4 no-underline shadow-sm hover:border-sward focus-visible:border-sward"
          >
            <p className="text-lg font-bold text-ink">{p.name}</p>
            <p className="mt-1 flex items-center gap-1.5 text-muted">
              <MapPin className="size-4 shrink-0" aria-hidden="true" />
              {p.address.street}, {p.address.city}
            </p>
            <p className="mt-3 flex flex-wrap gap-x-4 gap-y-1 text-ink">
              <span>{formatCount(p.zoneCount, "zone", "zones")}</span>
              <span>{formatAreaFt2(p.lawnAreaFt2)} of lawn</span>
            </p>
            {showTechnician ? (
              <p className="mt-1 flex items-center gap-1.5 text-sm text-muted">
                <UserRound className="size-4" aria-hidden="true" />
                {p.technician ? p.technician.name : "No technician assigned"}
              </p>
            ) : null}
          </Link>
        </li>
      ))}
    </ul>
  );
}
