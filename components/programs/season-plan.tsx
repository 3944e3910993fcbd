"use client";

// A property's season program on its page: the program it follows (a manager chooses), and for
// each zone this season's rounds — the window, the planned lb N per 1,000 ft² and the product to
// load for the zone's area — with the usual cautions. A manager sets a zone's method (granular or
// liquid) or leaves it out for the season with a reason.
import { CalendarRange, TriangleAlert } from "lucide-react";
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { inputClass } from "@/components/ui/field";
import { formatMonthDay } from "@/lib/dates";
import type { ProgramPlanDto, ZonePlan, ZoneRoundPlan } from "@/lib/programs/dto";
import { sendJson } from "@/lib/query-client";

const lb2 = (x: number) => x.toFixed(2);

function loadWords(r: ZoneRoundPlan): string {
  if (!r.load || !r.rate || !r.product) return "—";
  if (r.load.gal !== null)
    return `${r.load.gal.toFixed(2)} gal of ${r.product.name} (${r.rate.amount.toFixed(1)} fl oz / 1,000 ft²)`;
  return `${r.load.lb.toFixed(1)} lb of ${r.product.name} (${r.rate.amount.toFixed(2)} lb / 1,000 ft²)`;
}

export function SeasonPlan({
  plan,
  programs,
  canManage,
}: {
  plan: ProgramPlanDto;
  programs: { id: string; name: string }[];
  canManage: boolean;
}) {
  const t = useTranslations("terms");
  const router = useRouter();
  const [programId, setProgramId] = useState(plan.program?.id ?? "");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function choose() {
    setBusy(true);
    setError(null);
    const result = await sendJson("PUT", `/api/v1/properties/${plan.propertyId}/program`, {
      programId: programId || null,
    });
    setBusy(false);
    if (!result.ok) setError(result.error.message);
    else router.refresh();
  }

  const windowOf = (position: number) => {
    const r = plan.rounds.find((x) => x.position === position);
    if (!r?.start || !r.end) return "Not reached";
    return `${r.estimated ? "about " : ""}${formatMonthDay(r.start)} – ${formatMonthDay(r.end)}`;
  };

  return (
    <div className="space-y-4">
      {canManage ? (
        <div className="flex flex-wrap items-end gap-2">
          <label htmlFor="plan-program" className="block w-full font-semibold sm:w-auto">
            Program this property follows
          </label>
          <select
            id="plan-program"
            value={programId}
            onChange={(e) => setProgramId(e.target.value)}
            className={`${inputClass} max-w-sm`}
          >
            <option value="">No program</option>
            {programs.map((p) => (
              <option key={p.id} value={p.id}>
                {p.name}
              </option>
            ))}
          </select>
          <Button
            type="button"
            variant="secondary"
            disabled={busy || programId === (plan.program?.id ?? "")}
            onClick={choose}
          >
            Use this program
          </Button>
        </div>
      ) : null}
      {error ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {error}
        </p>
      ) : null}
      {!plan.program ? (
        <p className="rounded-lg border border-line bg-card p-4">
          This property follows no season program.
        </p>
      ) : (
        <>
          <p className="flex items-center gap-2 text-lg">
            <CalendarRange className="size-5 text-sward" aria-hidden="true" />
            <span>
              <strong>{plan.program.name}</strong>, {plan.year}
              {plan.ruleSetName ? ` · checked against ${plan.ruleSetName}` : ""}
            </span>
          </p>
          {plan.weatherProblem ? (
            <p role="status" className="flex gap-2 rounded-lg bg-sun-tint p-3">
              <TriangleAlert className="size-5 shrink-0 text-sun" aria-hidden="true" />
              {plan.weatherProblem} Rounds planned from growth potential wait for it; fixed targets
              stand.
            </p>
          ) : plan.normalsYears ? (
            <p className="text-sm text-muted">
              Growth potential from the monthly mean temperatures of {plan.normalsYears[0]}–
              {plan.normalsYears[1]} at this property. Windows marked &ldquo;about&rdquo; come from
              a trigger read on those normals; confirm it on site.
            </p>
          ) : null}
          <ul className="space-y-4" aria-label="Planned nitrogen by zone">
            {plan.zones.map((zone) => (
              <ZonePlanCard
                key={zone.zoneId}
                zone={zone}
                plan={plan}
                windowOf={windowOf}
                canManage={canManage}
                t={t}
              />
            ))}
          </ul>
          <p className="rounded-lg border border-line bg-card p-3 text-sm">
            Read and follow the product label: the label is the law. Wear the protective equipment
            it names, keep children and pets off treated areas until dry or as the label says, sweep
            granules off hard surfaces back onto the lawn and keep product out of water; do not
            apply before heavy rain or on frozen ground. Local fertilizer ordinances, applicator
            licensing and the label take precedence over these planned amounts.
          </p>
        </>
      )}
    </div>
  );
}

function ZonePlanCard({
  zone,
  plan,
  windowOf,
  canManage,
  t,
}: {
  zone: ZonePlan;
  plan: ProgramPlanDto;
  windowOf: (position: number) => string;
  canManage: boolean;
  t: ReturnType<typeof useTranslations<"terms">>;
}) {
  const router = useRouter();
  const [method, setMethod] = useState(zone.method);
  const [leaveOut, setLeaveOut] = useState(zone.excluded !== null);
  const [reason, setReason] = useState(zone.excluded?.reason ?? "");
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const id = `zp-${zone.zoneId.slice(0, 8)}`;

  async function save() {
    setBusy(true);
    setError(null);
    const result = await sendJson("PUT", `/api/v1/zones/${zone.zoneId}/program`, {
      method,
      excludedYear: leaveOut ? plan.year : null,
      excludedReason: leaveOut ? reason : null,
    });
    setBusy(false);
    if (!result.ok)
      setError(Object.values(result.error.fieldErrors ?? {})[0]?.[0] ?? result.error.message);
    else router.refresh();
  }

  return (
    <li className="rounded-xl border border-line bg-card p-4">
      <h3 className="text-xl font-bold">{zone.zoneName}</h3>
      <p className="text-sm text-muted">
        {zone.areaFt2.toLocaleString("en-US")} ft² · {t(`programMethods.${zone.method}`)} ·{" "}
        {zone.excluded
          ? `left out in ${zone.excluded.year}: ${zone.excluded.reason}`
          : `yearly target ${lb2(zone.yearlyTargetLb)} lb N / 1,000 ft², planned ${lb2(zone.totalLb)}`}
        {zone.capLb !== null && !zone.excluded
          ? ` · at most ${lb2(zone.capLb)} lb N per application`
          : ""}
      </p>
      {zone.unplacedLb > 0.005 ? (
        <p className="mt-1 font-semibold text-sun">
          {lb2(zone.unplacedLb)} lb N of the yearly target fits in no round within the limits.
        </p>
      ) : null}
      <div className="mt-3 overflow-x-auto">
        <table className="w-full min-w-[20rem] text-left tabular-nums">
          <caption className="sr-only">Planned nitrogen for {zone.zoneName}</caption>
          <thead>
            <tr className="border-b border-line text-sm">
              <th scope="col" className="py-1 pr-2">
                Round
              </th>
              <th scope="col" className="py-1 pr-2">
                Window
              </th>
              <th scope="col" className="py-1 pr-2 text-right">
                lb N / 1,000 ft²
              </th>
              <th scope="col" className="py-1">
                Product to load
              </th>
            </tr>
          </thead>
          <tbody>
            {zone.rounds.map((r) => {
              const kind = plan.rounds.find((x) => x.position === r.position)?.kind;
              return (
                <tr key={r.position} className="border-b border-line align-top">
                  <th scope="row" className="py-2 pr-2 font-semibold">
                    {r.position}. {kind ? t(`programRoundKinds.${kind}`) : ""}
                  </th>
                  <td className="py-2 pr-2">
                    {windowOf(r.position)}
                    {r.allowed &&
                    r.allowed.to !== plan.rounds.find((x) => x.position === r.position)?.end ? (
                      <span className="block text-sm">
                        nitrogen by {formatMonthDay(r.allowed.to)}
                      </span>
                    ) : null}
                  </td>
                  <td className="py-2 pr-2 text-right">
                    <span className="font-semibold">{r.nLb > 0 ? lb2(r.nLb) : "0"}</span>
                    <span className="block text-xs text-muted">{t(`planReasons.${r.reason}`)}</span>
                  </td>
                  <td className="py-2">{loadWords(r)}</td>
                </tr>
              );
            })}
          </tbody>
        </table>
      </div>
      {canManage ? (
        <details className="mt-3">
          <summary className="min-h-tap cursor-pointer py-2 font-semibold text-sward">
            Method or leave out
          </summary>
          <div className="mt-2 space-y-2">
            <div className="flex flex-wrap gap-4">
              {(["granular", "liquid"] as const).map((m) => (
                <label key={m} className="flex min-h-tap items-center gap-2">
                  <input
                    type="radio"
                    name={`${id}-method`}
                    checked={method === m}
                    onChange={() => setMethod(m)}
                    className="size-5"
                  />
                  {t(`programMethods.${m}`)}
                </label>
              ))}
            </div>
            <label className="flex min-h-tap items-center gap-2">
              <input
                type="checkbox"
                checked={leaveOut}
                onChange={(e) => setLeaveOut(e.target.checked)}
                className="size-5"
              />
              Leave this zone out in {plan.year}
            </label>
            {leaveOut ? (
              <div>
                <label htmlFor={`${id}-reason`} className="block font-semibold">
                  Reason
                </label>
                <input
                  id={`${id}-reason`}
                  value={reason}
                  onChange={(e) => setReason(e.target.value)}
                  placeholder="New sod, construction…"
                  className={inputClass}
                />
              </div>
            ) : null}
            {error ? (
              <p role="alert" className="font-semibold text-clay">
                {error}
              </p>
            ) : null}
            <Button type="button" variant="secondary" disabled={busy} onClick={save}>
              Save zone
            </Button>
          </div>
        </details>
      ) : null}
    </li>
  );
}
