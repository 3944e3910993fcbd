"use client";

// Edit or add a fertiliser rule set (manager): limits per application, the dates with no
// fertilizer in the statute's own words ("after … or before …"), the phosphorus rule with its
// exemptions, and the section that states each limit (shown with every refusal).
import { useState } from "react";
import { useForm, type Resolver } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { RECORD_FIELDS, type RecordField } from "@/lib/reference/record-fields";
import type { RuleSetDto } from "@/lib/rule-sets/dto";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";

import { useSaveRuleSet } from "./use-rule-sets";

type Window = [string, string];
/** The form's values: the schema's input, with each blackout window as two boxes ("" = none). */
type FormIn = Omit<z.input<typeof ruleSetSchema>, "proBlackout" | "homeownerBlackout"> & {
  proBlackout: Window;
  homeownerBlackout: Window;
};
type FormOut = z.output<typeof ruleSetSchema>;

const windowOrNull = ([from, to]: Window) => (from || to ? ([from, to] as Window) : null);

const baseResolver = formResolver(ruleSetSchema);
const resolver: Resolver<FormIn, unknown, FormOut> = (values, context, options) =>
  baseResolver(
    {
      ...values,
      proBlackout: windowOrNull(values.proBlackout),
      homeownerBlackout: windowOrNull(values.homeownerBlackout),
    },
    context,
    options as never,
  ) as never;

export function RuleSetEditor({ ruleSet, onDone }: { ruleSet?: RuleSetDto; onDone: () => void }) {
  const saveRuleSet = useSaveRuleSet();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver,
    defaultValues: {
      name: ruleSet?.name ?? "",
      citation: ruleSet?.citation ?? "",
      limitsAreLaw: ruleSet?.limitsAreLaw ?? false,
      maxNLbPer1000: ruleSet?.maxNLbPer1000 ?? null,
      maxWsnLbPer1000: ruleSet?.maxWsnLbPer1000 ?? null,
      minSlowReleasePct: ruleSet?.minSlowReleasePct ?? null,
      proBlackout: ruleSet?.proBlackout ?? ["", ""],
      homeownerBlackout: ruleSet?.homeownerBlackout ?? ["", ""],
      phosphorusRule: ruleSet?.phosphorusRule ?? "allowed",
      soilTestMaxAgeYears: ruleSet?.soilTestMaxAgeYears ?? null,
      phosphorusExemptEstablishment: ruleSet?.phosphorusExemptEstablishment ?? true,
      phosphorusExemptRepair: ruleSet?.phosphorusExemptRepair ?? false,
      nLimitsSource: ruleSet?.nLimitsSource ?? "",
      blackoutSource: ruleSet?.blackoutSource ?? "",
      phosphorusSource: ruleSet?.phosphorusSource ?? "",
      conditionsSource: ruleSet?.conditionsSource ?? "",
      recordRetentionYears: ruleSet?.recordRetentionYears ?? 3,
      recordRequiredFields: ruleSet?.recordRequiredFields ?? [
        "applicator_name",
        "applicator_licence",
      ],
      recordFieldsApplyTo: ruleSet?.recordFieldsApplyTo ?? "pesticides",
    },
  });
  const p = ruleSet ? `rs-${ruleSet.id}` : "rs-new";
  const windowError = (w: "proBlackout" | "homeownerBlackout") =>
    errors[w]?.message ?? errors[w]?.[0]?.message ?? errors[w]?.[1]?.message;

  async function save(values: FormOut) {
    setMessage(null);
    const result = await saveRuleSet.mutateAsync({ id: ruleSet?.id, values });
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.message);
    }
    onDone();
  }

  return (
    <form
      onSubmit={handleSubmit(save)}
      noValidate
      className="space-y-4 rounded-xl border-2 border-sward bg-card p-4"
      aria-label={ruleSet ? `Edit ${ruleSet.name}` : "New rule set"}
    >
      {message ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <Field id={`${p}-name`} label="Name" error={errors.name?.message}>
        <input id={`${p}-name`} {...register("name")} className={inputClass} />
      </Field>
      <Field
        id={`${p}-citation`}
        label="Citation (shown with every refusal)"
        error={errors.citation?.message}
      >
        <textarea id={`${p}-citation`} rows={3} {...register("citation")} className={inputClass} />
      </Field>
      <label className="flex min-h-tap items-center gap-2 font-semibold">
        <input type="checkbox" {...register("limitsAreLaw")} className="size-6" />
        These limits are law (breaking them is refused unless a manager overrides)
      </label>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field
          id={`${p}-maxn`}
          label="Max lb N / 1,000 ft² per application"
          error={errors.maxNLbPer1000?.message}
        >
          <input
            id={`${p}-maxn`}
            inputMode="decimal"
            {...register("maxNLbPer1000", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
        <Field
          id={`${p}-maxwsn`}
          label="Max lb water-soluble N"
          error={errors.maxWsnLbPer1000?.message}
        >
          <input
            id={`${p}-maxwsn`}
            inputMode="decimal"
            {...register("maxWsnLbPer1000", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
        <Field
          id={`${p}-minslow`}
          label="Min slow-release share of N (%)"
          error={errors.minSlowReleasePct?.message}
        >
          <input
            id={`${p}-minslow`}
            inputMode="decimal"
            {...register("minSlowReleasePct", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
      </div>
      <Field
        id={`${p}-nsource`}
        label="Section stating these N limits"
        error={errors.nLimitsSource?.message}
      >
        <input id={`${p}-nsource`} {...register("nLimitsSource")} className={inputClass} />
      </Field>
      <fieldset className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-bold">
          No fertilizer after – or before, as the law words it (both days themselves allowed; leave
          empty for none). Type month and day, e.g. 12-01 for December 1.
        </legend>
        <Field
          id={`${p}-pro`}
          label="Professionals: after – before"
          error={windowError("proBlackout")}
        >
          <div className="flex gap-2">
            <input
              id={`${p}-pro`}
              placeholder="12-01"
              {...register("proBlackout.0")}
              className={inputClass}
              aria-label="Professionals: no fertilizer after"
            />
            <input
              placeholder="03-01"
              {...register("proBlackout.1")}
              className={inputClass}
              aria-label="Professionals: nor before"
            />
          </div>
        </Field>
        <Field
          id={`${p}-home`}
          label="Homeowners: after – before"
          error={windowError("homeownerBlackout")}
        >
          <div className="flex gap-2">
            <input
              id={`${p}-home`}
              placeholder="11-15"
              {...register("homeownerBlackout.0")}
              className={inputClass}
              aria-label="Homeowners: no fertilizer after"
            />
            <input
              placeholder="03-01"
              {...register("homeownerBlackout.1")}
              className={inputClass}
              aria-label="Homeowners: nor before"
            />
          </div>
        </Field>
        <Field
          id={`${p}-bsource`}
          label="Section stating these dates"
          error={errors.blackoutSource?.message}
        >
          <input id={`${p}-bsource`} {...register("blackoutSource")} className={inputClass} />
        </Field>
        <Field
          id={`${p}-csource`}
          label="Section naming frozen or saturated ground and heavy rain (empty if none)"
          error={errors.conditionsSource?.message}
        >
          <input id={`${p}-csource`} {...register("conditionsSource")} className={inputClass} />
        </Field>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${p}-phos`} label="Phosphorus">
          <select id={`${p}-phos`} {...register("phosphorusRule")} className={inputClass}>
            <option value="allowed">Allowed</option>
            <option value="soil_test_or_establishment">
              Only with a soil test showing need, or an exemption below
            </option>
          </select>
        </Field>
        <Field
          id={`${p}-soil`}
          label="Soil test valid for (years; empty = no limit)"
          error={errors.soilTestMaxAgeYears?.message}
        >
          <input
            id={`${p}-soil`}
            inputMode="numeric"
            {...register("soilTestMaxAgeYears", { setValueAs: numberOrNull })}
            className={inputClass}
          />
        </Field>
        <label className="flex min-h-tap items-center gap-2">
          <input
            type="checkbox"
            {...register("phosphorusExemptEstablishment")}
            className="size-6"
          />
          Exempt: first establishment of turf (seeding or sodding)
        </label>
        <label className="flex min-h-tap items-center gap-2">
          <input type="checkbox" {...register("phosphorusExemptRepair")} className="size-6" />
          Exempt: repair or re-establishment of turf
        </label>
        <Field
          id={`${p}-psource`}
          label="Section stating the phosphorus rule"
          error={errors.phosphorusSource?.message}
        >
          <input id={`${p}-psource`} {...register("phosphorusSource")} className={inputClass} />
        </Field>
      </div>
      <fieldset className="space-y-3 rounded-lg border border-line p-3">
        <legend className="px-1 font-bold">Application records</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            id={`${p}-retention`}
            label="Keep records for (years)"
            error={errors.recordRetentionYears?.message}
          >
            <input
              id={`${p}-retention`}
              inputMode="numeric"
              {...register("recordRetentionYears", { setValueAs: numberOrNull })}
              className={inputClass}
            />
          </Field>
          <Field id={`${p}-applyto`} label="Required fields apply to">
            <select id={`${p}-applyto`} {...register("recordFieldsApplyTo")} className={inputClass}>
              <option value="pesticides">Pesticide applications</option>
              <option value="all">Every application</option>
            </select>
          </Field>
        </div>
        <div className="flex flex-wrap gap-3">
          {(Object.entries(RECORD_FIELDS) as [RecordField, string][]).map(([key, label]) => (
            <label key={key} className="flex min-h-tap items-center gap-2">
              <input
                type="checkbox"
                className="size-6"
                value={key}
                {...register("recordRequiredFields")}
              />
              {label}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {ruleSet ? "Save rule set" : "Add rule set"}
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
