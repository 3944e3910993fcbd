// Risk alerts with their evidence in plain words, the rule's source, the lifecycle so far and the
// actions the viewer may take. Rendered on the server (property page, visit page, risk alerts page).
import Link from "next/link";

import { formatDate, formatDateTime } from "@/lib/dates";
import type { AlertDto } from "@/lib/risk-alerts/dto";
import { ALERT_STATUSES, evidenceEntry } from "@/lib/risk/labels";

import { RiskAlertActions } from "./risk-alert-actions";
import { SeverityBadge } from "./severity-badge";

const ACTIONS: Record<string, string> = {
  raised: "Raised",
  reopened: "Raised again (a new episode)",
  updated: "Updated",
  returned: "Condition back",
  cleared: "Condition clear",
  acknowledged: "Acknowledged",
  resolved: "Resolved",
  auto_resolved: "Resolved automatically (clear for a week)",
};

export function RiskAlertList({
  alerts,
  canResolve,
  timeZone,
  showProperty = false,
  empty,
}: {
  alerts: AlertDto[];
  canResolve: boolean;
  timeZone: string;
  showProperty?: boolean;
  empty: string;
}) {
  if (!alerts.length) return <p className="rounded-lg border border-line bg-card p-4">{empty}</p>;
  return (
    <ul className="space-y-3" aria-label="Risk alerts">
      {alerts.map((a) => (
        <li
          key={a.id}
          className={`rounded-xl border bg-card p-4 ${a.status === "resolved" ? "border-line opacity-90" : a.severity === "high" ? "border-clay" : "border-line"}`}
        >
          <div className="flex flex-wrap items-center gap-2">
            <SeverityBadge severity={a.severity} />
            <h3 className="text-lg font-bold">{a.kindLabel}</h3>
            <span className="text-sm font-semibold text-muted">· {ALERT_STATUSES[a.status]}</span>
          </div>
          <p className="mt-1 text-sm text-muted">
            {showProperty ? (
              <>
                <Link href={`/properties/${a.property.id}`} className="font-semibold text-sward">
                  {a.property.name}
                </Link>
                {" · "}
                {a.property.city}
                {" · "}
              </>
            ) : null}
            {a.zone ? a.zone.name : "Whole property"} · raised {formatDate(a.raisedOn)}
            {a.lastSeenOn !== a.raisedOn ? `, last seen ${formatDate(a.lastSeenOn)}` : ""}
            {a.clearSince && a.status !== "resolved"
              ? ` · clear since ${formatDate(a.clearSince)}`
              : ""}
            {showProperty && a.technicianName ? ` · ${a.technicianName}` : ""}
          </p>
          <p className="mt-2">{a.summary}</p>
          <details className="mt-2">
            <summary className="min-h-tap cursor-pointer py-2 font-semibold text-sward">
              Evidence and source
            </summary>
            <dl className="grid gap-x-4 gap-y-1 text-sm sm:grid-cols-[auto_1fr]">
              {Object.entries(a.evidence.values).map(([k, v]) => {
                const entry = evidenceEntry(k, v);
                return (
                  <div key={k} className="contents">
                    <dt className="text-muted">{entry.label}</dt>
                    <dd className="font-semibold">{entry.value}</dd>
                  </div>
                );
              })}
              <dt className="text-muted">Threshold</dt>
              <dd>{a.evidence.threshold}</dd>
              <dt className="text-muted">Window</dt>
              <dd>{a.evidence.window}</dd>
              <dt className="text-muted">Source</dt>
              <dd>{a.source}</dd>
            </dl>
            {a.events.length ? (
              <ol
                className="mt-3 space-y-1 border-l-2 border-line pl-3 text-sm"
                aria-label="History of this alert"
              >
                {a.events.map((e, i) => (
                  <li key={i}>
                    <span className="font-semibold">{ACTIONS[e.action] ?? e.action}</span> ·{" "}
                    {formatDateTime(e.at, timeZone)}
                    {e.actor ? ` · ${e.actor}` : ""}
                    {e.note ? <span className="block text-ink">“{e.note}”</span> : null}
                  </li>
                ))}
              </ol>
            ) : null}
          </details>
          {a.status !== "resolved" ? (
            <div className="mt-3">
              <RiskAlertActions alertId={a.id} status={a.status} canResolve={canResolve} />
            </div>
          ) : null}
        </li>
      ))}
    </ul>
  );
}
