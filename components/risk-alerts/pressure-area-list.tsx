// Pressure areas on the Alerts page (managers): each area's kind, properties, first and latest
// dates, and the weather evidence of its alerts; the properties inside it without a visit in the
// window are marked "Check soon".
import { MapPinned } from "lucide-react";
import Link from "next/link";

import { formatDate, formatShortDate } from "@/lib/dates";
import { BOOK_MAP_PATH } from "@/lib/paths";
import type { PressureAreasView } from "@/lib/pressure-areas/dto";
import { evidenceEntry } from "@/lib/risk/labels";

import { SeverityBadge } from "./severity-badge";

const miles = (x: number) => `${x.toLocaleString("en-US", { maximumFractionDigits: 2 })} mi`;

export function PressureAreaList({ view }: { view: PressureAreasView }) {
  const { settings, areas } = view;
  return (
    <section id="pressure-areas" aria-labelledby="pressure-areas-title" className="mb-8">
      <div className="flex flex-wrap items-center justify-between gap-2">
        <h2 id="pressure-areas-title" className="text-2xl font-bold">
          Pressure areas
        </h2>
        <Link
          href={BOOK_MAP_PATH}
          className="inline-flex min-h-tap items-center gap-1 font-semibold text-sward"
        >
          <MapPinned className="size-5" aria-hidden="true" />
          See them on the map
        </Link>
      </div>
      <p className="mt-1 mb-3 text-sm text-muted">
        Open alerts of one kind on at least {settings.minProperties} properties within{" "}
        {miles(settings.distanceMi)} of each other and {settings.days}{" "}
        {settings.days === 1 ? "day" : "days"} of each other, raised since {formatDate(view.since)}.
        Change these on the{" "}
        <Link href="/settings#pressure-settings" className="font-semibold text-sward underline">
          settings page
        </Link>
        .
      </p>
      {areas.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No pressure area: no kind of alert is grouped in one neighborhood right now.
        </p>
      ) : (
        <ul className="space-y-3">
          {areas.map((a) => {
            const members = a.properties.filter((p) => p.isMember);
            const nearby = a.properties.filter((p) => !p.isMember);
            const soon = a.properties.filter((p) => p.checkSoon);
            return (
              <li
                key={a.key}
                className="rounded-xl border border-clay bg-card p-4"
                data-pressure-area={a.key}
              >
                <h3 className="text-lg font-bold">
                  {a.kindLabel}: {members.length} properties
                </h3>
                <p className="text-sm text-muted">
                  First raised {formatDate(a.firstOn)}, latest {formatDate(a.latestOn)} · within{" "}
                  {miles(a.radiusMi)} of the area&apos;s center
                </p>
                <ul className="mt-2 space-y-1">
                  {members.map((p) => (
                    <li key={p.id}>
                      <Link href={`/properties/${p.id}`} className="font-semibold text-sward">
                        {p.name}
                      </Link>{" "}
                      <span className="text-sm text-muted">
                        {p.street}, {p.city} · last visit{" "}
                        {p.lastVisitOn ? formatShortDate(p.lastVisitOn) : "none yet"}
                      </span>
                      {p.checkSoon ? (
                        <span className="ml-2 rounded-full bg-rain-tint px-2 py-0.5 text-sm font-bold text-rain">
                          Check soon
                        </span>
                      ) : null}
                    </li>
                  ))}
                </ul>
                {nearby.length ? (
                  <p className="mt-2 text-sm">
                    <span className="font-semibold">
                      Also inside the area, without this alert:{" "}
                    </span>
                    {nearby.map((p, i) => (
                      <span key={p.id}>
                        {i ? ", " : ""}
                        <Link href={`/properties/${p.id}`} className="text-sward underline">
                          {p.name}
                        </Link>
                        {p.checkSoon ? " (check soon)" : ""}
                      </span>
                    ))}
                  </p>
                ) : null}
                {soon.length ? (
                  <p className="mt-2 text-sm font-semibold text-rain">
                    {soon.length} {soon.length === 1 ? "property has" : "properties have"} had no
                    visit in the last {settings.days} days: check soon.
                  </p>
                ) : null}
                <details className="mt-2">
                  <summary className="min-h-tap cursor-pointer py-2 font-semibold text-sward">
                    Weather evidence of its {a.alerts.length} alerts
                  </summary>
                  <ul className="space-y-2 text-sm">
                    {a.alerts.map((al) => (
                      <li key={al.id} className="border-l-2 border-line pl-3">
                        <p className="flex flex-wrap items-center gap-2">
                          <SeverityBadge severity={al.severity} />
                          <span className="font-semibold">{al.propertyName}</span> · raised{" "}
                          {formatShortDate(al.raisedOn)}
                        </p>
                        <p className="mt-1">{al.summary}</p>
                        <dl className="mt-1 grid gap-x-4 sm:grid-cols-[auto_1fr]">
                          {Object.entries(al.evidence.values).map(([k, v]) => {
                            const entry = evidenceEntry(k, v);
                            return (
                              <div key={k} className="contents">
                                <dt className="text-muted">{entry.label}</dt>
                                <dd className="font-semibold">{entry.value}</dd>
                              </div>
                            );
                          })}
                          <dt className="text-muted">Window</dt>
                          <dd>{al.evidence.window}</dd>
                        </dl>
                      </li>
                    ))}
                  </ul>
                </details>
              </li>
            );
          })}
        </ul>
      )}
    </section>
  );
}
