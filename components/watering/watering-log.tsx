"use client";

// The watering log of a property: add an entry (depth in inches, or run time × precipitation
// rate) for a zone or the whole lawn, and read the recent entries with their volume.
import { Droplets } from "lucide-react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch, type Resolver } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import {
  applyFieldErrors,
  Field,
  inputClass,
  nullIfEmpty,
  numberOrNull,
} from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { PagedList } from "@/components/ui/paged-list";
import { GAL_PER_INCH_1000FT2 } from "@/lib/agronomy/units";
import { wateringDepthIn } from "@/lib/agronomy/water";
import { formatDate } from "@/lib/dates";
import type { ZoneDto } from "@/lib/properties/dto";
import { sendJson } from "@/lib/query-client";
import type { WateringDto } from "@/lib/watering/dto";
import { wateringSchema } from "@/lib/watering/schemas";

/** The form's values: the entry, and which way its amount is given (not sent). */
type FormIn = z.input<typeof wateringSchema> & { mode: "depth" | "run" };
type FormOut = z.output<typeof wateringSchema>;

const baseResolver = formResolver(wateringSchema);
/** Only the chosen way of giving the amount is sent; the other keeps what was typed. */
const resolver: Resolver<FormIn, unknown, FormOut> = ({ mode, ...values }, context, options) =>
  baseResolver(
    mode === "depth"
      ? { ...values, runMinutes: null, precipitationRateInPerHour: null }
      : { ...values, depthIn: null },
    context,
    options as never,
  ) as never;

export function WateringLog({
  propertyId,
  zones,
  today,
  waterings,
  canAdd,
}: {
  propertyId: string;
  zones: ZoneDto[];
  today: string;
  waterings: WateringDto[];
  canAdd: boolean;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    reset,
    setValue,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver,
    defaultValues: {
      mode: "depth",
      id: crypto.randomUUID(),
      zoneId: null,
      wateredOn: today,
      depthIn: null,
      runMinutes: null,
      precipitationRateInPerHour: null,
      notes: "",
    },
  });
  const [mode, zoneId, depth, run, rate] = useWatch({
    control,
    name: ["mode", "zoneId", "depthIn", "runMinutes", "precipitationRateInPerHour"],
  });
  const areaOf = (zid: string | null) =>
    zid
      ? (zones.find((z) => z.id === zid)?.areaFt2 ?? 0)
      : zones.reduce((s, z) => s + z.areaFt2, 0);
  const ok = (v: number | null | undefined): v is number => typeof v === "number" && v > 0;
  const previewDepth =
    mode === "depth"
      ? ok(depth)
        ? depth
        : null
      : ok(run) && ok(rate)
        ? wateringDepthIn(run, rate)
        : null;

  async function add(values: FormOut) {
    setMessage(null);
    const result = await sendJson<WateringDto>(
      "POST",
      `/api/v1/properties/${propertyId}/waterings`,
      values,
    );
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      setMessage(result.error.message);
      return;
    }
    reset({
      ...values,
      mode,
      id: crypto.randomUUID(),
      depthIn: null,
      runMinutes: null,
      notes: "",
    });
    // The water balance and the Index charts on this page are computed on the server.
    router.refresh();
  }

  return (
    <div className="space-y-4">
      {canAdd ? (
        <form
          onSubmit={handleSubmit(add)}
          noValidate
          className="space-y-3 rounded-xl border border-line bg-card p-4"
          aria-label="Log a watering"
        >
          {message ? (
            <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
              {message}
            </p>
          ) : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field id="w-zone" label="Where">
              <select
                id="w-zone"
                {...register("zoneId", { setValueAs: nullIfEmpty })}
                className={inputClass}
              >
                <option value="">Whole lawn</option>
                {zones.map((z) => (
                  <option key={z.id} value={z.id}>
                    {z.name}
                  </option>
                ))}
              </select>
            </Field>
            <Field id="w-date" label="Date" error={errors.wateredOn?.message}>
              <input
                id="w-date"
                type="date"
                {...register("wateredOn")}
                aria-invalid={errors.wateredOn ? true : undefined}
                className={inputClass}
              />
            </Field>
          </div>
          <div
            role="radiogroup"
            aria-label="How the amount is given"
            className="grid grid-cols-2 gap-2"
          >
            {(["depth", "run"] as const).map((m) => (
              <button
                key={m}
                type="button"
                role="radio"
                aria-checked={mode === m}
                onClick={() => setValue("mode", m)}
                className={`min-h-tap rounded-lg border-2 px-2 font-semibold ${mode === m ? "border-rain bg-rain text-white" : "border-line bg-card"}`}
              >
                {m === "depth" ? "Depth (in)" : "Run time × rate"}
              </button>
            ))}
          </div>
          {mode === "depth" ? (
            <Field id="w-depth" label="Depth of water (in)" error={errors.depthIn?.message}>
              <input
                id="w-depth"
                inputMode="decimal"
                {...register("depthIn", { setValueAs: numberOrNull })}
                aria-invalid={errors.depthIn ? true : undefined}
                className={inputClass}
                placeholder="e.g. 0.5"
              />
            </Field>
          ) : (
            <div className="grid grid-cols-2 gap-2">
              <Field id="w-run" label="Run time (min)" error={errors.runMinutes?.message}>
                <input
                  id="w-run"
                  inputMode="decimal"
                  {...register("runMinutes", { setValueAs: numberOrNull })}
                  aria-invalid={errors.runMinutes ? true : undefined}
                  className={inputClass}
                />
              </Field>
              <Field
                id="w-rate"
                label="Precipitation rate (in/h)"
                error={errors.precipitationRateInPerHour?.message}
              >
                <input
                  id="w-rate"
                  inputMode="decimal"
                  {...register("precipitationRateInPerHour", { setValueAs: numberOrNull })}
                  aria-invalid={errors.precipitationRateInPerHour ? true : undefined}
                  className={inputClass}
                  placeholder="e.g. 1.5"
                />
              </Field>
            </div>
          )}
          {previewDepth ? (
            <p aria-live="polite" className="font-semibold text-rain">
              {previewDepth.toFixed(2)} in ≈{" "}
              {Math.round(
                (previewDepth * GAL_PER_INCH_1000FT2 * areaOf(zoneId ?? null)) / 1000,
              ).toLocaleString("en-US")}{" "}
              gal on {areaOf(zoneId ?? null).toLocaleString("en-US")} ft²
            </p>
          ) : null}
          <Field id="w-notes" label="Notes (optional)" error={errors.notes?.message}>
            <input id="w-notes" {...register("notes")} className={inputClass} />
          </Field>
          <Button type="submit" disabled={isSubmitting}>
            <Droplets className="size-5" aria-hidden="true" /> Log watering
          </Button>
        </form>
      ) : null}
      {waterings.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">No watering logged yet.</p>
      ) : (
        <PagedList
          label="Waterings"
          noun="waterings"
          items={waterings.map((w) => ({
            key: w.id,
            node: (
              <div className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3">
                <span>
                  <span className="font-bold">{formatDate(w.wateredOn)}</span> ·{" "}
                  {w.zoneName ?? "whole lawn"}
                  {w.runMinutes && w.precipitationRateInPerHour
                    ? ` · ${w.runMinutes} min at ${w.precipitationRateInPerHour} in/h`
                    : ""}
                  {w.notes ? ` · ${w.notes}` : ""}
                </span>
                <span className="inline-flex items-center gap-1 rounded-full bg-rain-tint px-2.5 py-1 font-semibold text-ink">
                  <Droplets className="size-4 text-rain" aria-hidden="true" />
                  {w.depthIn.toFixed(2)} in
                </span>
              </div>
            ),
          }))}
        />
      )}
    </div>
  );
}
