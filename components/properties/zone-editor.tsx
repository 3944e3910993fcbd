"use client";

// Add or edit a zone (manager): area in ft² or m² (stored as ft²), species from the reference table.
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { SLOPE_LABEL, SUN_EXPOSURE_LABEL, type ZoneDto } from "@/lib/properties/dto";
import { zoneSchema } from "@/lib/properties/schemas";
import { sendJson } from "@/lib/query-client";
import { grassSpecies } from "@/lib/reference/grass-species";

type FormIn = z.input<typeof zoneSchema>;
type FormOut = z.output<typeof zoneSchema>;

export function ZoneEditor({
  propertyId,
  zone,
  onDone,
}: {
  propertyId: string;
  zone?: ZoneDto;
  onDone: () => void;
}) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver: formResolver(zoneSchema),
    defaultValues: zone
      ? {
          name: zone.name,
          area: zone.areaFt2,
          areaUnit: "ft2",
          grassSpecies: zone.grassSpecies.key,
          sunExposure: zone.sunExposure,
          isIrrigated: zone.isIrrigated,
          slope: zone.slope,
        }
      : {
          areaUnit: "ft2",
          grassSpecies: "tall_fescue",
          sunExposure: "full_sun",
          isIrrigated: false,
          slope: "flat",
        },
  });
  const prefix = zone ? `zone-${zone.id}` : "zone-new";

  async function onSubmit(values: FormOut) {
    setMessage(null);
    const result = zone
      ? await sendJson<ZoneDto>("PUT", `/api/v1/zones/${zone.id}`, values)
      : await sendJson<ZoneDto>("POST", `/api/v1/properties/${propertyId}/zones`, values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      setMessage(result.error.message);
      return;
    }
    router.refresh();
    onDone();
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      className="space-y-4 rounded-xl border-2 border-sward bg-card p-4"
      noValidate
      aria-label={zone ? `Edit ${zone.name}` : "New zone"}
    >
      {message ? (
        <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <Field
        id={`${prefix}-name`}
        label="Zone name"
        hint="e.g. Front slope, Back yard"
        error={errors.name?.message}
      >
        <input
          id={`${prefix}-name`}
          {...register("name")}
          aria-invalid={errors.name ? true : undefined}
          className={inputClass}
        />
      </Field>
      <div className="grid grid-cols-[1fr_auto] gap-2">
        <Field id={`${prefix}-area`} label="Area" error={errors.area?.message}>
          <input
            id={`${prefix}-area`}
            inputMode="decimal"
            {...register("area", { valueAsNumber: true })}
            aria-invalid={errors.area ? true : undefined}
            className={inputClass}
          />
        </Field>
        <Field id={`${prefix}-unit`} label="Unit">
          <select id={`${prefix}-unit`} {...register("areaUnit")} className={inputClass}>
            <option value="ft2">ft²</option>
            <option value="m2">m²</option>
          </select>
        </Field>
      </div>
      <Field id={`${prefix}-species`} label="Grass species" error={errors.grassSpecies?.message}>
        <select id={`${prefix}-species`} {...register("grassSpecies")} className={inputClass}>
          {(["cool", "warm"] as const).map((season) => (
            <optgroup key={season} label={season === "cool" ? "Cool-season" : "Warm-season"}>
              {grassSpecies
                .filter((s) => s.season === season)
                .map((s) => (
                  <option key={s.key} value={s.key}>
                    {s.name} (cut {s.heightOfCutIn.min}–{s.heightOfCutIn.max} in)
                  </option>
                ))}
            </optgroup>
          ))}
        </select>
      </Field>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field id={`${prefix}-sun`} label="Sun exposure">
          <select id={`${prefix}-sun`} {...register("sunExposure")} className={inputClass}>
            {Object.entries(SUN_EXPOSURE_LABEL).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </Field>
        <Field id={`${prefix}-slope`} label="Slope">
          <select id={`${prefix}-slope`} {...register("slope")} className={inputClass}>
            {Object.entries(SLOPE_LABEL).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </Field>
        <label className="flex min-h-tap items-center gap-2 self-end font-semibold">
          <input type="checkbox" {...register("isIrrigated")} className="size-6" />
          Irrigated
        </label>
      </div>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : zone ? "Save zone" : "Add zone"}
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
