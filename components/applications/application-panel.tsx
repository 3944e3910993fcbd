"use client";

// Applications on a zone: the form with live nutrient maths and rule checks, the cautions, and
// the applications already recorded here. The server recomputes everything and decides.
import { useQuery, useQueryClient } from "@tanstack/react-query";
import { CircleAlert, FlaskConical, TriangleAlert } from "lucide-react";
import { useTranslations } from "next-intl";
import { useEffect, useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import {
  nutrientsPer1000,
  productForArea,
  proposeRateForNitrogen,
  type RateUnit,
} from "@/lib/agronomy/nutrients";
import type { RuleFinding } from "@/lib/agronomy/rules";
import { seedRate, seedToLoadLb } from "@/lib/agronomy/seeding";
import { assessApplication, labelUnitLb, treatmentOf } from "@/lib/applications/assess";
import type { ApplicationDto } from "@/lib/applications/dto";
import { applicationSchema } from "@/lib/applications/schemas";
import {
  OVERRIDE_CATEGORIES,
  OVERRIDE_CATEGORY_LABEL,
  RATE_UNIT_LABEL,
  rateUnitsFor,
} from "@/lib/applications/units";
import { formatDate, todayIn } from "@/lib/dates";
import { outbox, requestBackgroundSync } from "@/lib/offline/client";
import type { OutboxOp } from "@/lib/offline/db";
import { meKeys } from "@/lib/people/query-keys";
import { analysisOf, type ProductDto } from "@/lib/products/dto";
import { productKeys } from "@/lib/products/query-keys";
import { fetchJson, sendJson } from "@/lib/query-client";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import type { RuleSetDto } from "@/lib/rule-sets/dto";
import { ruleSetKeys } from "@/lib/rule-sets/query-keys";

import { SafetyCautions } from "./safety-cautions";

const f2 = (x: number) => x.toFixed(2);
/** The schema's upper bound on a rate (lib/applications/schemas.ts): no preview beyond it. */
const MAX_RATE_AMOUNT = 100_000;

type FormIn = z.input<typeof applicationSchema>;
type FormOut = z.output<typeof applicationSchema>;

const resolver = formResolver(applicationSchema);

function computeMaths(product: ProductDto, amount: number, unit: RateUnit, areaFt2: number) {
  try {
    return {
      n: nutrientsPer1000(analysisOf(product), { amount, unit }),
      total: productForArea(analysisOf(product), { amount, unit }, areaFt2),
      error: null,
    };
  } catch (err) {
    return { n: null, total: null, error: err instanceof Error ? err.message : "Check the rate." };
  }
}

function Maths({
  product,
  amount,
  unit,
  areaFt2,
}: {
  product: ProductDto;
  amount: number;
  unit: RateUnit;
  areaFt2: number;
}) {
  const { n, total, error } = computeMaths(product, amount, unit, areaFt2);
  if (!n || !total)
    return (
      <p role="alert" className="text-clay">
        {error}
      </p>
    );
  const k = areaFt2 / 1000;
  const load = (
    <p className="mt-2 font-bold">
      Load {f2(total.lb)} lb of product{total.gal !== null ? ` (${f2(total.gal)} gal)` : ""} for
      this zone.
    </p>
  );
  // Only the nutrients the product's label guarantees: an insecticide or a straight potash has
  // rows of zeros that read like a fertilizer that failed.
  const rows = [
    { label: "N", lb: n.nLb, shown: product.nPct > 0 },
    { label: "water-soluble N", lb: n.wsnLb, shown: product.nPct > 0 },
    { label: "P₂O₅", lb: n.p2o5Lb, shown: product.p2o5Pct > 0 },
    { label: "K₂O", lb: n.k2oLb, shown: product.k2oPct > 0 },
  ].filter((r) => r.shown);
  if (!rows.length)
    return (
      <div className="rounded-xl border border-line bg-paper p-3" aria-live="polite">
        <p className="text-sm text-muted">
          This product brings no nitrogen, phosphate or potash: nothing is added to the zone&apos;s
          nutrient totals.
        </p>
        {load}
      </div>
    );
  return (
    <div className="rounded-xl border border-line bg-paper p-3" aria-live="polite">
      <table className="w-full text-left text-sm">
        <caption className="mb-1 text-left font-bold">Nutrients delivered</caption>
        <thead>
          <tr className="text-muted">
            <th scope="col" className="py-1 font-semibold">
              &nbsp;
            </th>
            <th scope="col" className="py-1 font-semibold">
              per 1,000 ft²
            </th>
            <th scope="col" className="py-1 font-semibold">
              zone ({areaFt2.toLocaleString("en-US")} ft²)
            </th>
          </tr>
        </thead>
        <tbody className="font-semibold">
          {rows.map((r) => (
            <tr key={r.label}>
              <th scope="row" className="py-0.5 font-normal">
                {r.label}
              </th>
              <td>{f2(r.lb)} lb</td>
              <td>{f2(r.lb * k)} lb</td>
            </tr>
          ))}
        </tbody>
      </table>
      {load}
    </div>
  );
}

/** The species' seed rate for this kind of seeding and the seed to load for the zone. */
function SeedRateHint({
  speciesKey,
  areaFt2,
  isEstablishing,
}: {
  speciesKey: string;
  areaFt2: number;
  isEstablishing: boolean;
}) {
  const t = useTranslations("seeding");
  const range = seedRate(speciesKey, isEstablishing ? "new" : "overseed");
  if (!range) return null;
  return (
    <p role="status" className="rounded-lg bg-sward-tint p-3 text-sm" data-seed-rate>
      {t("formHint", {
        kind: isEstablishing ? "new" : "overseed",
        species: findGrassSpecies(speciesKey)?.name ?? speciesKey,
        min: range.min,
        max: range.max,
        loadMin: seedToLoadLb(range.min, areaFt2),
        loadMax: seedToLoadLb(range.max, areaFt2),
        area: areaFt2,
      })}
    </p>
  );
}

function Findings({ findings }: { findings: RuleFinding[] }) {
  if (!findings.length) return null;
  // Each finding says what is wrong in a sentence; the rule it comes from (section and statute
  // text) is behind a "Why", once per source, however many findings share it.
  const seen = new Set<string>();
  return (
    <ul className="space-y-2" aria-label="Rule checks">
      {findings.map((f) => {
        const showSource = !seen.has(f.source);
        seen.add(f.source);
        return (
          <li
            key={f.key}
            className={`rounded-lg border p-3 text-sm ${f.severity === "refusal" ? "border-clay bg-clay-tint" : "border-sun bg-sun-tint"}`}
          >
            <p className="flex items-start gap-1.5 font-bold">
              {f.severity === "refusal" ? (
                <CircleAlert className="mt-0.5 size-4 shrink-0 text-clay" aria-hidden="true" />
              ) : (
                <TriangleAlert className="mt-0.5 size-4 shrink-0 text-sun" aria-hidden="true" />
              )}
              <span>
                {f.severity === "refusal"
                  ? f.basis === "label"
                    ? "Refused — product label (no override)"
                    : "Refused — legal limit"
                  : "Warning"}
                : {f.message}
              </span>
            </p>
            {showSource ? (
              <details className="mt-1 text-muted">
                <summary className="cursor-pointer py-1 font-semibold">Why</summary>
                <p>{f.source}</p>
              </details>
            ) : null}
          </li>
        );
      })}
    </ul>
  );
}

export function ApplicationPanel({
  visitId,
  zoneId,
  areaFt2,
  ruleSetId,
  timeZone,
  applications,
  isManager,
  disabled,
  onRecorded,
  weather,
  correctionReason = null,
  entries,
  waiting = [],
}: {
  /** The visit's operations waiting in the phone's outbox (applications recorded offline). */
  waiting?: OutboxOp[];
  /** On a finished visit, the reason the manager gave for the correction (sent with the record). */
  correctionReason?: string | null;
  /** Correct and Delete for the applications listed, for whoever may (lib: the entry's author or a manager). */
  entries?: {
    canChange: (a: ApplicationDto) => boolean;
    correct: (a: ApplicationDto) => void;
    remove: (a: ApplicationDto) => void;
  };
  visitId: string;
  zoneId: string;
  areaFt2: number;
  ruleSetId: string | null;
  timeZone: string;
  applications: ApplicationDto[];
  isManager: boolean;
  disabled: boolean;
  onRecorded: (a: ApplicationDto) => void;
  /** The visit's weather snapshot: prefills temperature and wind (editable), and feeds the checks. */
  weather: {
    tmaxF: number;
    tminF?: number;
    precipIn?: number;
    isForecast?: boolean;
    windMph: number | null;
  } | null;
}) {
  const products = useQuery({
    queryKey: productKeys.list(),
    queryFn: async () => (await fetchJson<{ items: ProductDto[] }>("/api/v1/products")).items,
  });
  const ruleSets = useQuery({
    queryKey: ruleSetKeys.list(),
    queryFn: async () => (await fetchJson<{ items: RuleSetDto[] }>("/api/v1/rule-sets")).items,
  });
  // The applicator this person last recorded, remembered on their account (GET /api/v1/me/applicator).
  const queryClient = useQueryClient();
  const remembered = useQuery({
    queryKey: meKeys.applicator(),
    queryFn: () => fetchJson<{ name: string; license: string }>("/api/v1/me/applicator"),
    staleTime: Infinity,
  });
  const tOffline = useTranslations("offline");
  const [isOpen, setIsOpen] = useState(false);
  const [targetN, setTargetN] = useState("");
  const [serverFindings, setServerFindings] = useState<RuleFinding[] | null>(null);
  const [message, setMessage] = useState<string | null>(null);
  const [proposal, setProposal] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setError,
    setValue,
    control,
    getValues,
    formState: { errors, isSubmitting: isSaving },
  } = useForm<FormIn, unknown, FormOut>({
    resolver,
    defaultValues: {
      id: crypto.randomUUID(),
      zoneId,
      productId: "",
      rateAmount: null as unknown as number, // empty until typed: "Enter the rate."
      rateUnit: "lb/1000ft2",
      temperatureF: weather ? Math.round(weather.tmaxF) : null,
      windMph: weather?.windMph ?? null,
      isEstablishing: false,
      isRepairing: false,
      applicatorName: remembered.data?.name ?? "",
      applicatorLicence: remembered.data?.license ?? "",
      overrideReason: "",
      overrideCategory: null,
    },
  });
  const [productId, rateAmount, unit, isEstablishing, isRepairing, overrideReason, category] =
    useWatch({
      control,
      name: [
        "productId",
        "rateAmount",
        "rateUnit",
        "isEstablishing",
        "isRepairing",
        "overrideReason",
        "overrideCategory",
      ],
    });
  const forgetServerFindings = () => setServerFindings(null);
  // Remembered values that arrive after the form opened fill only fields still empty.
  const rememberedName = remembered.data?.name ?? "";
  const rememberedLicense = remembered.data?.license ?? "";
  useEffect(() => {
    if (rememberedName && !getValues("applicatorName")) setValue("applicatorName", rememberedName);
    if (rememberedLicense && !getValues("applicatorLicence"))
      setValue("applicatorLicence", rememberedLicense);
  }, [rememberedName, rememberedLicense, getValues, setValue]);

  const product = products.data?.find((p) => p.id === productId);
  const ruleSet = ruleSets.data?.find((r) => r.id === ruleSetId) ?? null;
  const hasRate =
    product !== undefined &&
    typeof rateAmount === "number" &&
    rateAmount > 0 &&
    rateAmount <= MAX_RATE_AMOUNT;
  // A liquid is measured by volume only; weight units are named as such.
  const units = product
    ? rateUnitsFor(product)
    : rateUnitsFor({ form: "granular", densityLbPerGal: null });

  // A preview of the checks (the server repeats them with the zone's whole history, its
  // year-to-date N and the soil test): the rule set on today's date and the product label.
  let liveFindings: RuleFinding[] = [];
  if (product && hasRate && units.includes(unit)) {
    try {
      liveFindings = assessApplication({
        product,
        rate: { amount: rateAmount, unit },
        areaFt2,
        ruleSet,
        facts: {
          appliedOn: todayIn(timeZone),
          isEstablishing: isEstablishing ?? false,
          isRepairing: isRepairing ?? false,
          soilTestOn: null,
          yearToDateNLb: 0,
          annualNRange: null,
          weather: weather
            ? {
                tminF: weather.tminF ?? null,
                precipIn: weather.precipIn ?? null,
                isForecast: weather.isForecast ?? false,
              }
            : null,
        },
        // This visit's seed and pre-emergence products on the zone (the server adds the year's).
        zoneTreatments: applications.flatMap((a) => {
          const p = a.zoneId === zoneId ? products.data?.find((x) => x.id === a.product.id) : null;
          return p ? [treatmentOf(p, a.appliedOn)] : [];
        }),
        formatDate: (d) => formatDate(d),
        sameProductOnZone: applications
          .filter((a) => a.zoneId === zoneId && a.product.id === product.id)
          .map((a) => ({
            appliedOn: a.appliedOn,
            productLbPer1000: (a.productTotalLb / a.areaFt2) * 1000,
          })),
      }).findings;
    } catch {
      liveFindings = []; // the maths box already says what is wrong with the rate
    }
  }

  function chooseProduct(id: string) {
    forgetServerFindings();
    setProposal(null);
    const next = products.data?.find((p) => p.id === id);
    if (next && !rateUnitsFor(next).includes(unit)) setValue("rateUnit", rateUnitsFor(next)[0]!);
  }

  function proposeFromTarget(value: string) {
    setTargetN(value);
    setProposal(null);
    const target = Number(value);
    if (!product || !(target > 0)) return;
    try {
      const unitLb = labelUnitLb(product);
      const maxLb =
        unitLb !== null && product.labelMaxRate !== null ? unitLb * product.labelMaxRate : null;
      const { rate, cappedByLabel } = proposeRateForNitrogen(analysisOf(product), target, maxLb);
      // Rounded down when capped, so the proposal never exceeds the label.
      const amount = cappedByLabel
        ? Math.floor(rate.amount * 100) / 100
        : Math.round(rate.amount * 100) / 100;
      setValue("rateUnit", rate.unit);
      setValue("rateAmount", amount);
      if (cappedByLabel)
        setProposal(
          `Capped at the label's maximum of ${product.labelMaxRate} ${RATE_UNIT_LABEL[product.labelRateUnit!]} per application: ${f2(nutrientsPer1000(analysisOf(product), { amount, unit: rate.unit }).nLb)} lb N per 1,000 ft², not ${target}.`,
        );
    } catch (err) {
      setMessage(err instanceof Error ? err.message : null);
    }
  }

  const record = (withOverride: boolean) =>
    handleSubmit(async (values) => {
      setMessage(null);
      const body = {
        ...values,
        overrideReason: withOverride && values.overrideReason ? values.overrideReason : null,
        overrideCategory: withOverride ? (values.overrideCategory ?? null) : null,
        ...(correctionReason ? { correctionReason } : {}),
      };
      // With no signal the application waits in the outbox with the moment it was recorded (the
      // server binds it to the visit and runs the same checks when it arrives).
      const queue = async () => {
        await outbox().enqueue({
          kind: "application",
          visitId,
          zoneId,
          clientId: values.id,
          payload: { ...body, appliedAt: body.appliedAt ?? new Date().toISOString() },
        });
        requestBackgroundSync();
      };
      const result: Awaited<ReturnType<typeof sendJson<ApplicationDto>>> = navigator.onLine
        ? await sendJson<ApplicationDto>("POST", `/api/v1/visits/${visitId}/applications`, body)
        : { ok: false, status: 0, error: { code: "offline", message: "" } };
      if (result.ok || result.status === 0) {
        if (result.ok) onRecorded(result.data);
        else await queue();
        // The server remembered what was typed (a field left empty keeps the old value).
        queryClient.setQueryData(
          meKeys.applicator(),
          (old: { name: string; license: string } | undefined) => ({
            name: values.applicatorName || (old?.name ?? ""),
            license: values.applicatorLicence || (old?.license ?? ""),
          }),
        );
        setServerFindings(null);
        setIsOpen(false);
        setTargetN("");
        reset({
          ...values,
          id: crypto.randomUUID(),
          rateAmount: null as unknown as number,
          overrideReason: "",
          overrideCategory: null,
        });
        return;
      }
      setMessage(result.error.message);
      const findings = (result.error.details?.findings as RuleFinding[] | undefined) ?? null;
      // A refusal names its rule in the checks below the maths; the Rate field keeps only what
      // is wrong with the number itself.
      const { rateAmount: _refusals, ...fieldErrors } = result.error.fieldErrors ?? {};
      applyFieldErrors(findings ? fieldErrors : result.error.fieldErrors, setError as never);
      setServerFindings(findings);
    });

  const here = applications.filter((a) => a.zoneId === zoneId);
  const waitingHere = waiting.filter(
    (op) =>
      op.kind === "application" &&
      op.zoneId === zoneId &&
      !applications.some((a) => a.id === op.clientId),
  );
  const shownFindings = serverFindings ?? liveFindings;
  const isRefusedNow = shownFindings.some((f) => f.severity === "refusal");
  const isLabelRefusedNow = shownFindings.some(
    (f) => f.severity === "refusal" && f.basis === "label",
  );
  const canOverride = isRefusedNow && !isLabelRefusedNow && isManager;

  return (
    <div className="space-y-3">
      {waitingHere.length ? (
        <ul className="space-y-2" aria-label="Applications waiting to send">
          {waitingHere.map((op) => {
            const queued = products.data?.find((p) => p.id === op.payload["productId"]);
            const amount = Number(op.payload["rateAmount"]);
            const unit = op.payload["rateUnit"] as RateUnit;
            return (
              <li key={op.seq} className="rounded-lg border border-rain bg-rain-tint p-3 text-sm">
                <p className="font-bold">
                  {queued?.name ?? "—"}: {amount} {RATE_UNIT_LABEL[unit]}
                </p>
                {queued ? (
                  <p>
                    {f2(nutrientsPer1000(analysisOf(queued), { amount, unit }).nLb)} lb N per 1,000
                    ft²
                  </p>
                ) : null}
                <p className="font-semibold">{tOffline("applicationWaiting")}</p>
                {op.held ? <p className="text-clay">{op.held.message}</p> : null}
              </li>
            );
          })}
        </ul>
      ) : null}
      {here.length ? (
        <ul className="space-y-2" aria-label="Applications on this zone">
          {here.map((a) => (
            <li key={a.id} className="rounded-lg border border-line bg-card p-3 text-sm">
              <p className="font-bold">
                {a.product.name}: {a.rate.amount} {RATE_UNIT_LABEL[a.rate.unit]}
              </p>
              <p>
                {f2(a.per1000.nLb)} lb N ({f2(a.per1000.wsnLb)} water-soluble),{" "}
                {f2(a.per1000.p2o5Lb)} lb P₂O₅, {f2(a.per1000.k2oLb)} lb K₂O per 1,000 ft² ·{" "}
                {f2(a.productTotalLb)} lb product on {a.areaFt2.toLocaleString("en-US")} ft²
              </p>
              {a.overrideReason ? (
                <p className="mt-1 font-semibold text-clay">
                  Legal limit overridden by {a.overrideBy}
                  {a.overrideCategory
                    ? ` (${OVERRIDE_CATEGORY_LABEL[a.overrideCategory]})`
                    : ""}: {a.overrideReason}
                </p>
              ) : null}
              {a.findings
                .filter((f) => f.severity === "warning")
                .map((f) => (
                  <p key={f.key} className="mt-1 text-ink">
                    ⚠ {f.message}
                  </p>
                ))}
              {entries?.canChange(a) ? (
                <div className="mt-2 flex flex-wrap gap-2">
                  <Button
                    type="button"
                    variant="secondary"
                    onClick={() => entries.correct(a)}
                    aria-label={`Correct the application of ${a.product.name}`}
                  >
                    Correct
                  </Button>
                  <Button
                    type="button"
                    variant="secondary"
                    onClick={() => entries.remove(a)}
                    aria-label={`Delete the application of ${a.product.name}`}
                  >
                    Delete
                  </Button>
                </div>
              ) : null}
            </li>
          ))}
        </ul>
      ) : null}
      {!isOpen ? (
        <Button
          type="button"
          variant="secondary"
          disabled={disabled}
          onClick={() => setIsOpen(true)}
        >
          <FlaskConical className="size-5" aria-hidden="true" />
          Record an application
        </Button>
      ) : (
        <div className="space-y-4 rounded-xl border-2 border-sward bg-card p-4">
          <SafetyCautions
            labelCautions={product?.labelCautions}
            reentryGuidance={product?.reentryGuidance}
            isPesticide={product?.isPesticide}
          />
          <Field id={`${zoneId}-product`} label="Product" error={errors.productId?.message}>
            <select
              id={`${zoneId}-product`}
              {...register("productId", { onChange: (e) => chooseProduct(e.target.value) })}
              aria-invalid={errors.productId ? true : undefined}
              className={inputClass}
            >
              <option value="">Choose a product</option>
              {products.data?.map((p) => (
                <option key={p.id} value={p.id}>
                  {p.name} ({p.nPct}-{p.p2o5Pct}-{p.k2oPct}
                  {p.slowReleasePctOfN ? `, ${p.slowReleasePctOfN} % slow-release N` : ""})
                </option>
              ))}
            </select>
          </Field>
          {product && product.nPct > 0 ? (
            <Field
              id={`${zoneId}-target`}
              label="Target lb N per 1,000 ft² (optional — proposes the rate)"
            >
              <input
                id={`${zoneId}-target`}
                inputMode="decimal"
                value={targetN}
                onChange={(e) => proposeFromTarget(e.target.value)}
                className={inputClass}
                placeholder="e.g. 0.75"
              />
            </Field>
          ) : null}
          {proposal ? (
            <p role="status" className="rounded-lg bg-sun-tint p-3 text-sm font-semibold">
              {proposal}
            </p>
          ) : null}
          {product && product.labelMaxRate !== null && product.labelRateUnit ? (
            <p className="text-sm text-muted">
              Label: at most {product.labelMaxRate} {RATE_UNIT_LABEL[product.labelRateUnit]} per
              application
              {product.labelMaxYearly !== null
                ? `, ${product.labelMaxYearly} ${RATE_UNIT_LABEL[product.labelRateUnit]} in any 365 days`
                : ""}
              {product.labelMinIntervalDays !== null
                ? `, at least ${product.labelMinIntervalDays} days between applications`
                : ""}
              .
            </p>
          ) : null}
          <div className="grid grid-cols-[1fr_auto] gap-2">
            <Field
              id={`${zoneId}-rate`}
              label="Rate"
              error={errors.rateAmount?.message ?? errors.rateUnit?.message}
            >
              <input
                id={`${zoneId}-rate`}
                inputMode="decimal"
                {...register("rateAmount", {
                  setValueAs: numberOrNull,
                  onChange: forgetServerFindings,
                })}
                aria-invalid={errors.rateAmount ? true : undefined}
                className={inputClass}
              />
            </Field>
            <Field id={`${zoneId}-unit`} label="Unit">
              <select
                id={`${zoneId}-unit`}
                {...register("rateUnit", { onChange: forgetServerFindings })}
                className={inputClass}
              >
                {units.map((u) => (
                  <option key={u} value={u}>
                    {RATE_UNIT_LABEL[u]}
                  </option>
                ))}
              </select>
            </Field>
          </div>
          {product?.seedSpecies ? (
            <SeedRateHint
              speciesKey={product.seedSpecies}
              areaFt2={areaFt2}
              isEstablishing={isEstablishing ?? false}
            />
          ) : null}
          {product && hasRate ? (
            <Maths product={product} amount={rateAmount} unit={unit} areaFt2={areaFt2} />
          ) : null}
          <Findings findings={shownFindings} />
          <div className="grid grid-cols-2 gap-2">
            <Field
              id={`${zoneId}-temp`}
              label={weather ? "Temperature (°F, from today's weather)" : "Temperature (°F)"}
              error={errors.temperatureF?.message}
            >
              <input
                id={`${zoneId}-temp`}
                inputMode="decimal"
                {...register("temperatureF", { setValueAs: numberOrNull })}
                aria-invalid={errors.temperatureF ? true : undefined}
                className={inputClass}
              />
            </Field>
            <Field
              id={`${zoneId}-wind`}
              label={weather ? "Wind (mph, from today's weather)" : "Wind (mph)"}
              error={errors.windMph?.message}
            >
              <input
                id={`${zoneId}-wind`}
                inputMode="decimal"
                {...register("windMph", { setValueAs: numberOrNull })}
                aria-invalid={errors.windMph ? true : undefined}
                className={inputClass}
              />
            </Field>
          </div>
          <fieldset className="space-y-1">
            <legend className="font-semibold">
              Turf being established (phosphorus exemptions)
            </legend>
            <label className="flex min-h-tap items-center gap-2">
              <input
                type="checkbox"
                {...register("isEstablishing", { onChange: forgetServerFindings })}
                className="size-6"
              />
              First establishment: new seeding or sod, in its first growing season
            </label>
            <label className="flex min-h-tap items-center gap-2">
              <input
                type="checkbox"
                {...register("isRepairing", { onChange: forgetServerFindings })}
                className="size-6"
              />
              Repair or re-establishment of a turf area (overseeding thin turf)
            </label>
          </fieldset>
          {product?.isPesticide ? (
            <div className="grid gap-2 sm:grid-cols-2">
              <Field
                id={`${zoneId}-applicator`}
                label="Certified applicator"
                error={errors.applicatorName?.message}
              >
                <input
                  id={`${zoneId}-applicator`}
                  {...register("applicatorName")}
                  className={inputClass}
                />
              </Field>
              <Field
                id={`${zoneId}-licence`}
                label="Certification (license) number"
                error={errors.applicatorLicence?.message}
              >
                <input
                  id={`${zoneId}-licence`}
                  {...register("applicatorLicence")}
                  className={inputClass}
                />
              </Field>
              <p className="text-sm text-muted sm:col-span-2">
                {rememberedName || rememberedLicense
                  ? "Filled in from your last record. A change here is remembered for your next one."
                  : "Remembered for your next application once recorded."}
              </p>
            </div>
          ) : null}
          {message ? (
            <p role="alert" className="rounded-lg bg-clay-tint p-3 font-semibold text-clay">
              {message}
            </p>
          ) : null}
          {isRefusedNow && !isLabelRefusedNow && !isManager ? (
            <p className="rounded-lg bg-clay-tint p-3 font-semibold text-clay">
              This application breaks a legal limit and cannot be recorded. Change the rate or the
              product, or ask your manager if it must go ahead.
            </p>
          ) : null}
          {isLabelRefusedNow ? (
            <p className="rounded-lg bg-clay-tint p-3 font-semibold text-clay">
              The label is the law: an application above the label cannot be recorded, by anyone.
              Lower the rate or choose another product.
            </p>
          ) : null}
          {canOverride ? (
            <>
              <Field
                id={`${zoneId}-override-category`}
                label="Override category"
                error={errors.overrideCategory?.message}
              >
                <select
                  id={`${zoneId}-override-category`}
                  {...register("overrideCategory", {
                    setValueAs: (v: string | null) => (v ? v : null),
                  })}
                  className={inputClass}
                >
                  <option value="">Choose why the override applies</option>
                  {OVERRIDE_CATEGORIES.map((c) => (
                    <option key={c} value={c}>
                      {OVERRIDE_CATEGORY_LABEL[c]}
                    </option>
                  ))}
                </select>
              </Field>
              <Field
                id={`${zoneId}-override`}
                label="Override reason (managers; kept in the audit trail)"
              >
                <textarea
                  id={`${zoneId}-override`}
                  rows={2}
                  {...register("overrideReason")}
                  className={inputClass}
                />
              </Field>
            </>
          ) : null}
          <div className="flex flex-wrap gap-2">
            {canOverride ? (
              <Button
                type="button"
                disabled={isSaving || !overrideReason?.trim() || !category}
                onClick={record(true)}
              >
                Record with override
              </Button>
            ) : (
              <Button
                type="button"
                disabled={isSaving || !hasRate || isRefusedNow}
                onClick={record(false)}
              >
                {isSaving ? "Recording…" : "Record application"}
              </Button>
            )}
            <Button type="button" variant="secondary" onClick={() => setIsOpen(false)}>
              Cancel
            </Button>
          </div>
        </div>
      )}
    </div>
  );
}
