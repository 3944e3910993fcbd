"use client";

// Add or edit a catalogue product (manager): guaranteed analysis, slow-release share, density for
// liquids, label cautions and re-entry; pesticides carry their registration number.
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import type { ProductDto } from "@/lib/products/dto";
import { productSchema } from "@/lib/products/schemas";

import { useSaveProduct } from "./use-products";

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
        },
  });
  const p = product ? `product-${product.id}` : "product-new";
  const form = useWatch({ control, name: "form" });
  const isPesticide = useWatch({ control, name: "isPesticide" });

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
        <Field
          id={`${p}-slow`}
          label="Slow-release share of N (%)"
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
      <Field id={`${p}-reentry`} label="Re-entry guidance" error={err("reentryGuidance")}>
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
