import type { Metadata } from "next";
import Link from "next/link";

import { PressureAreaList } from "@/components/risk-alerts/pressure-area-list";
import { RiskAlertList } from "@/components/risk-alerts/risk-alert-list";
import { buttonClass } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { FilterSelect } from "@/components/ui/filter-select";
import { requireActor } from "@/lib/auth/require";
import { RISK_ALERTS_PATH } from "@/lib/paths";
import { listPeople } from "@/lib/people/queries";
import { listPressureAreas } from "@/lib/pressure-areas/queries";
import { listAlerts } from "@/lib/risk-alerts/queries";
import { alertFilters } from "@/lib/risk-alerts/schemas";
import { ALERT_KINDS, SEVERITIES } from "@/lib/risk/labels";

export const metadata: Metadata = { title: "Risk alerts" };

const STATUS_OPTIONS = {
  live: "Not resolved",
  open: "Open",
  acknowledged: "Acknowledged",
  resolved: "Resolved",
  all: "All",
} as const;

export default async function RiskAlertsPage({
  searchParams,
}: {
  searchParams: Promise<Record<string, string | string[] | undefined>>;
}) {
  const actor = await requireActor(["manager", "technician"]);
  const raw = await searchParams;
  const first = (v: string | string[] | undefined) => (Array.isArray(v) ? v[0] : v) || undefined;
  const filters = alertFilters.parse({
    kind: first(raw.kind),
    severity: first(raw.severity),
    status: first(raw.status),
    technician: first(raw.technician),
    area: first(raw.area),
  });
  const [alerts, technicians, pressure] = await Promise.all([
    listAlerts(actor, filters),
    actor.role === "manager" ? listPeople(actor, "technician") : Promise.resolve([]),
    // Areas span the whole book: managers only.
    actor.role === "manager" ? listPressureAreas(actor) : Promise.resolve(null),
  ]);
  const isFiltered = Object.values(filters).some((v) => v !== undefined);
  const counts = {
    high: alerts.filter((a) => a.severity === "high").length,
    moderate: alerts.filter((a) => a.severity === "moderate").length,
    low: alerts.filter((a) => a.severity === "low").length,
  };

  return (
    <>
      <h1 className="text-3xl font-bold">Risk alerts</h1>
      <p className="mt-1 mb-4 text-muted">
        {actor.role === "manager"
          ? `Risks Sward has raised across ${actor.companyName}'s book`
          : "Risks raised on your properties"}
        , with their evidence. Checked when a visit is finished and every morning.
      </p>
      {pressure ? <PressureAreaList view={pressure} /> : null}
      {pressure ? <h2 className="mb-3 text-2xl font-bold">Every risk alert</h2> : null}
      <form
        method="get"
        className="mb-4 grid grid-cols-2 gap-3 rounded-xl border border-line bg-card p-3 sm:p-4 lg:grid-cols-3"
        aria-label="Filter risk alerts"
      >
        <FilterSelect
          name="kind"
          label="Kind"
          value={filters.kind}
          any="Any kind"
          options={Object.entries(ALERT_KINDS)}
        />
        <FilterSelect
          name="severity"
          label="Severity"
          value={filters.severity}
          any="Any severity"
          options={Object.entries(SEVERITIES)}
        />
        <FilterSelect
          name="status"
          label="Status"
          value={filters.status ?? "live"}
          options={Object.entries(STATUS_OPTIONS)}
        />
        {actor.role === "manager" ? (
          <FilterSelect
            name="technician"
            label="Technician"
            value={filters.technician}
            any="Anyone"
            options={technicians.map((t) => [t.id, t.name] as const)}
          />
        ) : null}
        <label className="space-y-1">
          <span className="block text-sm font-semibold">Area (town or ZIP)</span>
          <input
            name="area"
            defaultValue={filters.area ?? ""}
            className={inputClass}
            maxLength={80}
          />
        </label>
        <div className="flex items-end gap-2">
          <button type="submit" className={buttonClass("primary", "w-full")}>
            Show
          </button>
          {isFiltered ? (
            <Link href={RISK_ALERTS_PATH} className={buttonClass("quiet", "no-underline")}>
              Clear
            </Link>
          ) : null}
        </div>
      </form>
      <p className="mb-3 font-semibold" role="status">
        {alerts.length} {alerts.length === 1 ? "risk alert" : "risk alerts"}: {counts.high} high,{" "}
        {counts.moderate} moderate, {counts.low} low.
      </p>
      <RiskAlertList
        alerts={alerts}
        canResolve={actor.role === "manager"}
        timeZone={actor.companyTimeZone}
        showProperty
        empty={
          isFiltered
            ? "No risk alert matches these filters."
            : "No open risk alerts. Sward checks again every morning."
        }
      />
    </>
  );
}
