"use client";

// Edit or add a fertiliser rule set (manager): limits per application, blackout windows,
// phosphorus rule, and the citation shown with every refusal.
import { useRouter } from "next/navigation";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { sendJson } from "@/lib/query-client";
import { RECORD_FIELDS, type RecordField } from "@/lib/reference/record-fields";
import type { RuleSetDto } from "@/lib/rule-sets/dto";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";

const num = (s: string) => (s.trim() === "" ? null : Number(s));
const str = (v: number | null) => (v === null ? "" : String(v));

export function RuleSetEditor({ ruleSet, onDone }: { ruleSet?: RuleSetDto; onDone: () => void }) {
  const router = useRouter();
  const [v, setV] = useState({
    name: ruleSet?.name ?? "",
    citation: ruleSet?.citation ?? "",
    limitsAreLaw: ruleSet?.limitsAreLaw ?? false,
    maxN: str(ruleSet?.maxNLbPer1000 ?? null),
    maxWsn: str(ruleSet?.maxWsnLbPer1000 ?? null),
    minSlow: str(ruleSet?.minSlowReleasePct ?? null),
    proStart: ruleSet?.proBlackout?.[0] ?? "",
    proEnd: ruleSet?.proBlackout?.[1] ?? "",
    homeStart: ruleSet?.homeownerBlackout?.[0] ?? "",
    homeEnd: ruleSet?.homeownerBlackout?.[1] ?? "",
    phosphorusRule: ruleSet?.phosphorusRule ?? "allowed",
    soilAge: str(ruleSet?.soilTestMaxAgeYears ?? null),
    retention: String(ruleSet?.recordRetentionYears ?? 3),
    applyTo: ruleSet?.recordFieldsApplyTo ?? "pesticides",
  });
  const [fields, setFields] = useState<RecordField[]>(
    ruleSet?.recordRequiredFields ?? ["applicator_name", "applicator_licence"],
  );
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [message, setMessage] = useState<string | null>(null);
  const set =
    (k: keyof typeof v) =>
    (e: React.ChangeEvent<HTMLInputElement | HTMLSelectElement | HTMLTextAreaElement>) =>
      setV({
        ...v,
        [k]:
          e.target instanceof HTMLInputElement && e.target.type === "checkbox"
            ? e.target.checked
            : e.target.value,
      });
  const p = ruleSet ? `rs-${ruleSet.id}` : "rs-new";

  async function save(event: React.FormEvent) {
    event.preventDefault();
    const body = {
      name: v.name,
      citation: v.citation,
      limitsAreLaw: v.limitsAreLaw,
      maxNLbPer1000: num(v.maxN),
      maxWsnLbPer1000: num(v.maxWsn),
      minSlowReleasePct: num(v.minSlow),
      proBlackout: v.proStart || v.proEnd ? [v.proStart, v.proEnd] : null,
      homeownerBlackout: v.homeStart || v.homeEnd ? [v.homeStart, v.homeEnd] : null,
      phosphorusRule: v.phosphorusRule,
      soilTestMaxAgeYears: num(v.soilAge),
      recordRetentionYears: Number(v.retention),
      recordRequiredFields: fields,
      recordFieldsApplyTo: v.applyTo,
    };
    const parsed = ruleSetSchema.safeParse(body);
    if (!parsed.success)
      return setErrors(
        Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])),
      );
    setErrors({});
    const result = ruleSet
      ? await sendJson("PUT", `/api/v1/rule-sets/${ruleSet.id}`, parsed.data)
      : await sendJson("POST", "/api/v1/rule-sets", parsed.data);
    if (!result.ok) {
      setErrors(
        Object.fromEntries(
          Object.entries(result.error.fieldErrors ?? {}).map(([k, m]) => [k, m[0] ?? ""]),
        ),
      );
      return setMessage(result.error.message);
    }
    router.refresh();
    onDone();
  }

  return (
    <form
      onSubmit={save}
      noValidate
      className="space-y-4 rounded-xl border-2 border-sward bg-card p-4"
      aria-label={ruleSet ? `Edit ${ruleSet.name}` : "New rule set"}
    >
      {message ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <Field id={`${p}-name`} label="Name" error={errors.name}>
        <input id={`${p}-name`} value={v.name} onChange={set("name")} className={inputClass} />
      </Field>
      <Field
        id={`${p}-citation`}
        label="Citation (shown with every refusal)"
        error={errors.citation}
      >
        <textarea
          id={`${p}-citation`}
          rows={3}
          value={v.citation}
          onChange={set("citation")}
          className={inputClass}
        />
      </Field>
      <label className="flex min-h-tap items-center gap-2 font-semibold">
        <input
          type="checkbox"
          checked={v.limitsAreLaw}
          onChange={set("limitsAreLaw")}
          className="size-6"
        />
        These limits are law (breaking them is refused unless a manager overrides)
      </label>
      <div className="grid gap-3 sm:grid-cols-3">
        <Field
          id={`${p}-maxn`}
          label="Max lb N / 1,000 ft² per application"
          error={errors.maxNLbPer1000}
        >
          <input
            id={`${p}-maxn`}
            inputMode="decimal"
            value={v.maxN}
            onChange={set("maxN")}
            className={inputClass}
          />
        </Field>
        <Field id={`${p}-maxwsn`} label="Max lb water-soluble N" error={errors.maxWsnLbPer1000}>
          <input
            id={`${p}-maxwsn`}
            inputMode="decimal"
            value={v.maxWsn}
            onChange={set("maxWsn")}
            className={inputClass}
          />
        </Field>
        <Field
          id={`${p}-minslow`}
          label="Min slow-release share of N (%)"
          error={errors.minSlowReleasePct}
        >
          <input
            id={`${p}-minslow`}
            inputMode="decimal"
            value={v.minSlow}
            onChange={set("minSlow")}
            className={inputClass}
          />
        </Field>
      </div>
      <fieldset className="grid gap-3 rounded-lg border border-line p-3 sm:grid-cols-2">
        <legend className="px-1 font-bold">
          Blackout windows (month-day, inclusive; empty for none)
        </legend>
        <Field id={`${p}-pro`} label="Professionals: from – to" error={errors.proBlackout}>
          <div className="flex gap-2">
            <input
              id={`${p}-pro`}
              placeholder="12-01"
              value={v.proStart}
              onChange={set("proStart")}
              className={inputClass}
              aria-label="Professional blackout from"
            />
            <input
              placeholder="03-01"
              value={v.proEnd}
              onChange={set("proEnd")}
              className={inputClass}
              aria-label="Professional blackout to"
            />
          </div>
        </Field>
        <Field id={`${p}-home`} label="Homeowners: from – to" error={errors.homeownerBlackout}>
          <div className="flex gap-2">
            <input
              id={`${p}-home`}
              placeholder="11-15"
              value={v.homeStart}
              onChange={set("homeStart")}
              className={inputClass}
              aria-label="Homeowner blackout from"
            />
            <input
              placeholder="03-01"
              value={v.homeEnd}
              onChange={set("homeEnd")}
              className={inputClass}
              aria-label="Homeowner blackout to"
            />
          </div>
        </Field>
      </fieldset>
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${p}-phos`} label="Phosphorus">
          <select
            id={`${p}-phos`}
            value={v.phosphorusRule}
            onChange={set("phosphorusRule")}
            className={inputClass}
          >
            <option value="allowed">Allowed</option>
            <option value="soil_test_or_establishment">
              Only with a soil test showing need, or when establishing turf
            </option>
          </select>
        </Field>
        <Field
          id={`${p}-soil`}
          label="Soil test valid for (years; empty = no limit)"
          error={errors.soilTestMaxAgeYears}
        >
          <input
            id={`${p}-soil`}
            inputMode="numeric"
            value={v.soilAge}
            onChange={set("soilAge")}
            className={inputClass}
          />
        </Field>
      </div>
      <fieldset className="space-y-3 rounded-lg border border-line p-3">
        <legend className="px-1 font-bold">Application records</legend>
        <div className="grid gap-3 sm:grid-cols-2">
          <Field
            id={`${p}-retention`}
            label="Keep records for (years)"
            error={errors.recordRetentionYears}
          >
            <input
              id={`${p}-retention`}
              inputMode="numeric"
              value={v.retention}
              onChange={set("retention")}
              className={inputClass}
            />
          </Field>
          <Field id={`${p}-applyto`} label="Required fields apply to">
            <select
              id={`${p}-applyto`}
              value={v.applyTo}
              onChange={set("applyTo")}
              className={inputClass}
            >
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
                checked={fields.includes(key)}
                onChange={(e) =>
                  setFields(e.target.checked ? [...fields, key] : fields.filter((f) => f !== key))
                }
              />
              {label}
            </label>
          ))}
        </div>
      </fieldset>
      <div className="flex gap-2">
        <Button type="submit">{ruleSet ? "Save rule set" : "Add rule set"}</Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
