"use client";

// Add or edit a catalogue product (manager): guaranteed analysis, how its N is released (the
// slow-release or water-insoluble share from the label), density for liquids, the label's limits
// (maximum rate per application, per year, days between applications), label cautions and
// re-entry; pesticides carry their registration number.
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { PRE_EMERGENCE_ACTIVES, SEED_SPECIES_KEYS } from "@/lib/agronomy/seeding";
import { RATE_UNIT_LABEL, rateUnitsFor } from "@/lib/applications/units";
import type { ProductDto } from "@/lib/products/dto";
import { productSchema } from "@/lib/products/schemas";
import { findGrassSpecies } from "@/lib/reference/grass-species";

import { useSaveProduct } from "./use-products";

const PRE_EMERGENCE_LABEL: Record<(typeof PRE_EMERGENCE_ACTIVES)[number], string> = {
  prodiamine: "Prodiamine",
  dithiopyr: "Dithiopyr",
  pendimethalin: "Pendimethalin",
  siduron: "Siduron (labeled at seeding)",
  mesotrione: "Mesotrione (labeled at seeding)",
  other: "Another active (enter the label's days)",
};

type FormIn = z.input<typeof productSchema>;
type FormOut = z.output<typeof productSchema>;

export function ProductEditor({ product, onDone }: { product?: ProductDto; onDone: () => void }) {
  const saveProduct = useSaveProduct();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver: formResolver(productSchema),
    defaultValues: product
      ? { ...product }
      : {
          form: "granular",
          nPct: 0,
          p2o5Pct: 0,
          k2oPct: 0,
          slowReleasePctOfN: 0,
          densityLbPerGal: null,
          isPesticide: false,
          registrationNumber: "",
          labelCautions: "",
          reentryGuidance: "",
          nRelease: "quick",
          labelMaxRate: null,
          labelRateUnit: null,
          labelMaxYearly: null,
          labelMinIntervalDays: null,
          preEmergenceActive: null,
          seedingIntervalDays: null,
          seedSpecies: null,
        },
  });
  const p = product ? `product-${product.id}` : "product-new";
  const form = useWatch({ control, name: "form" });
  const isPesticide = useWatch({ control, name: "isPesticide" });
  const nRelease = useWatch({ control, name: "nRelease" });
  const density = useWatch({ control, name: "densityLbPerGal" });
  const labelUnits = rateUnitsFor({
    form: form ?? "granular",
    densityLbPerGal: typeof density === "number" ? density : null,
  });

  async function onSubmit(values: FormOut) {
    setMessage(null);
    const result = product
      ? await saveProduct.mutateAsync({ id: product.id, values })
      : await saveProduct.mutateAsync({ values });
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.message);
    }
    onDone();
  }

  const err = (k: keyof FormIn) => errors[k]?.message;
  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      noValidate
      className="space-y-4 rounded-xl border-2 border-sward bg-card p-4"
      aria-label={product ? `Edit ${product.name}` : "New product"}
    >
      {message ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <Field id={`${p}-name`} label="Product name" error={err("name")}>
        <input id={`${p}-name`} {...register("name")} className={inputClass} />
      </Field>
      <div className="grid gap-3 sm:grid-cols-4">
        <Field id={`${p}-form`} label="Form">
          <select id={`${p}-form`} {...register("form")} className={inputClass}>
            <option value="granular">Granular</option>
            <option value="liquid">Liquid</option>
            <option value="soluble">Soluble powder</option>
          </select>
        </Field>
        <Field id={`${p}-n`} label="N %" error={err("nPct")}>
          <input
            id={`${p}-n`}
            inputMode="decimal"
            {...register("nPct", { valueAsNumber: true })}
            className={inputClass}
          />
        </Field>
        <Field id={`${p}-p`} label="P₂O₅ %" error={err("p2o5Pct")}>
          <input
            id={`${p}-p`}
            inputMode="decimal"
            {...register("p2o5Pct", { valueAsNumber: true })}
            className={inputClass}
          />
        </Field>
        <Field id={`${p}-k`} label="K₂O %" error={err("k2oPct")}>
          <input
            id={`${p}-k`}
            inputMode="decimal"
            {...register("k2oPct", { valueAsNumber: true })}
            className={inputClass}
          />
        </Field>
      </div>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${p}-release`} label="How the N is released" error={err("nRelease")}>
          <select id={`${p}-release`} {...register("nRelease")} className={inputClass}>
            <option value="quick">Quick-release (soluble) N</option>
            <option value="slow_release">Slow- or controlled-release N</option>
            <option value="organic">Organic (natural) N</option>
          </select>
        </Field>
        <Field
          id={`${p}-slow`}
          label={
            nRelease === "organic"
              ? "Water-insoluble share of N (%, from the label)"
              : nRelease === "slow_release"
                ? "Slow-release share of N (%, from the label)"
                : "Slow-release share of N (%)"
          }
          error={err("slowReleasePctOfN")}
        >
          <input
            id={`${p}-slow`}
            inputMode="decimal"
            {...register("slowReleasePctOfN", { valueAsNumber: true })}
            className={inputClass}
          />
        </Field>
        {form === "liquid" ? (
          <Field
            id={`${p}-density`}
            label="Density (lb/gal, from the label)"
            error={err("densityLbPerGal")}
          >
            <input
              id={`${p}-density`}
              inputMode="decimal"
              {...register("densityLbPerGal", { setValueAs: numberOrNull })}
              className={inputClass}
            />
          </Field>
        ) : null}
      </div>
      <fieldset className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-bold">Label limits (the label is the law)</legend>
        <Field
          id={`${p}-labelmax`}
          label="Maximum rate per application"
          error={err("labelMaxRate")}
        >
          <input
            id={`${p}-labelmax`}
            inputMode="decimal"
            {...register("labelMaxRate", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
        <Field id={`${p}-labelunit`} label="Label's unit" error={err("labelRateUnit")}>
          <select
            id={`${p}-labelunit`}
            {...register("labelRateUnit", { setValueAs: (v: string | null) => (v ? v : null) })}
            className={inputClass}
          >
            <option value="">Choose the unit</option>
            {labelUnits.map((u) => (
              <option key={u} value={u}>
                {RATE_UNIT_LABEL[u]}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id={`${p}-labelyear`}
          label="Maximum per year (same unit; empty if none)"
          error={err("labelMaxYearly")}
        >
          <input
            id={`${p}-labelyear`}
            inputMode="decimal"
            {...register("labelMaxYearly", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
        <Field
          id={`${p}-labelinterval`}
          label="Days between applications (at least; empty if none)"
          error={err("labelMinIntervalDays")}
        >
          <input
            id={`${p}-labelinterval`}
            inputMode="numeric"
            {...register("labelMinIntervalDays", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
      </fieldset>
      <fieldset className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-3">
        <legend className="px-1 font-bold">Seed and pre-emergence</legend>
        <Field id={`${p}-seed`} label="Seed of (a seed product)" error={err("seedSpecies")}>
          <select
            id={`${p}-seed`}
            {...register("seedSpecies", { setValueAs: (v: string | null) => (v ? v : null) })}
            className={inputClass}
          >
            <option value="">Not seed</option>
            {SEED_SPECIES_KEYS.map((k) => (
              <option key={k} value={k}>
                {findGrassSpecies(k)?.name ?? k}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id={`${p}-pre`}
          label="Pre-emergence herbicide: active ingredient"
          error={err("preEmergenceActive")}
        >
          <select
            id={`${p}-pre`}
            {...register("preEmergenceActive", {
              setValueAs: (v: string | null) => (v ? v : null),
            })}
            className={inputClass}
          >
            <option value="">Not a pre-emergence</option>
            {PRE_EMERGENCE_ACTIVES.map((k) => (
              <option key={k} value={k}>
                {PRE_EMERGENCE_LABEL[k]}
              </option>
            ))}
          </select>
        </Field>
        <Field
          id={`${p}-seedinterval`}
          label="Days between it and seeding (from the label)"
          error={err("seedingIntervalDays")}
        >
          <input
            id={`${p}-seedinterval`}
            inputMode="numeric"
            {...register("seedingIntervalDays", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
      </fieldset>
      <label className="flex min-h-tap items-center gap-2 font-semibold">
        <input type="checkbox" {...register("isPesticide")} className="size-6" />
        This is a pesticide (records then ask for the applicator&apos;s licence)
      </label>
      {isPesticide ? (
        <Field id={`${p}-reg`} label="Registration number" error={err("registrationNumber")}>
          <input id={`${p}-reg`} {...register("registrationNumber")} className={inputClass} />
        </Field>
      ) : null}
      <Field id={`${p}-cautions`} label="Label cautions" error={err("labelCautions")}>
        <textarea
          id={`${p}-cautions`}
          rows={3}
          {...register("labelCautions")}
          className={inputClass}
        />
      </Field>
      <Field
        id={`${p}-reentry`}
        label="Re-entry / keep-off instruction (from the label)"
        error={err("reentryGuidance")}
      >
        <input id={`${p}-reentry`} {...register("reentryGuidance")} className={inputClass} />
      </Field>
      <div className="flex gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : product ? "Save product" : "Add product"}
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
