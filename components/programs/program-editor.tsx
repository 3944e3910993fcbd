"use client";

// Create or edit a season program (manager): its name and grass, then its rounds in season order —
// what each does, its window (dates every year, or a trigger: growing degree days on a stated base,
// soil or air temperature, and how many days it stays open), and per method the default product
// and the nitrogen target (lb N per 1,000 ft², from growth potential, or none).
import { ArrowDown, ArrowUp, Plus, Trash2 } from "lucide-react";
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useFieldArray, useForm, useWatch, type Control } from "react-hook-form";
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
import type { ProgramDto, ProgramRoundDto } from "@/lib/programs/dto";
import {
  PROGRAM_MAX_ROUNDS,
  PROGRAM_ROUND_KINDS,
  PROGRAM_TARGETS,
  PROGRAM_WINDOW_KINDS,
  programSchema,
  type ProgramRoundInput,
} from "@/lib/programs/schemas";
import { sendJson } from "@/lib/query-client";

type FormIn = z.input<typeof programSchema>;
type FormOut = z.output<typeof programSchema>;

export interface ProgramProduct {
  id: string;
  name: string;
  form: "granular" | "liquid" | "soluble";
  nPct: number;
}

const resolver = formResolver(programSchema);

const blankRound = (): ProgramRoundInput => ({
  kind: "feeding",
  windowKind: "dates",
  startMd: "",
  endMd: "",
  triggerBaseF: null,
  triggerValue: null,
  windowDays: null,
  granular: { productId: null, target: "growth_potential", nLb: null },
  liquid: { productId: null, target: "growth_potential", nLb: null },
});

function roundInput(r: ProgramRoundDto): ProgramRoundInput {
  const w = r.window;
  return {
    kind: r.kind,
    windowKind: w.kind,
    startMd: w.kind === "dates" ? w.startMd : null,
    endMd: w.kind === "dates" ? w.endMd : null,
    triggerBaseF: w.kind === "gdd" ? w.baseF : null,
    triggerValue: w.kind === "dates" ? null : w.value,
    windowDays: w.kind === "dates" ? null : w.days,
    granular: r.granular,
    liquid: r.liquid,
  };
}

export function ProgramEditor({
  program,
  products,
  onDone,
}: {
  program?: ProgramDto;
  products: ProgramProduct[];
  onDone: () => void;
}) {
  const t = useTranslations("terms");
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [id] = useState(() => program?.id ?? crypto.randomUUID());
  const {
    register,
    control,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver,
    defaultValues: {
      id,
      name: program?.name ?? "",
      grassSeason: program?.grassSeason ?? "cool",
      notes: program?.notes ?? "",
      rounds: program ? program.rounds.map(roundInput) : [blankRound()],
    },
  });
  const rounds = useFieldArray({ control, name: "rounds" });
  const p = `pg-${id.slice(0, 8)}`;

  async function save(values: FormOut) {
    setMessage(null);
    // Dates only for a dated window; a trigger only otherwise (what the server keeps).
    const body = {
      ...values,
      rounds: values.rounds.map((r) =>
        r.windowKind === "dates"
          ? { ...r, triggerBaseF: null, triggerValue: null, windowDays: null }
          : {
              ...r,
              startMd: null,
              endMd: null,
              triggerBaseF: r.windowKind === "gdd" ? r.triggerBaseF : null,
            },
      ),
    };
    const result = program
      ? await sendJson<ProgramDto>("PUT", `/api/v1/programs/${program.id}`, body)
      : await sendJson<ProgramDto>("POST", "/api/v1/programs", body);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      return setMessage(result.error.message);
    }
    router.refresh();
    onDone();
  }

  return (
    <form
      onSubmit={handleSubmit(save)}
      noValidate
      className="space-y-4 rounded-xl border-2 border-sward bg-card p-4"
      aria-label={program ? `Edit ${program.name}` : "New program"}
    >
      {message ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${p}-name`} label="Program name" error={errors.name?.message}>
          <input
            id={`${p}-name`}
            {...register("name")}
            className={inputClass}
            aria-invalid={!!errors.name}
          />
        </Field>
        <Field id={`${p}-grass`} label="Grass" error={errors.grassSeason?.message}>
          <select id={`${p}-grass`} {...register("grassSeason")} className={inputClass}>
            <option value="cool">Cool-season</option>
            <option value="warm">Warm-season</option>
          </select>
        </Field>
      </div>
      <Field id={`${p}-notes`} label="Notes (optional)" error={errors.notes?.message}>
        <textarea id={`${p}-notes`} rows={2} {...register("notes")} className={inputClass} />
      </Field>

      <fieldset className="space-y-3">
        <legend className="text-xl font-bold">Rounds, in season order</legend>
        <p className="text-sm text-muted">
          &ldquo;From growth potential&rdquo; spreads each zone&apos;s yearly nitrogen over these
          rounds by how fast the grass grows in each window (monthly normals of the property&apos;s
          weather). No round goes above the rule set&apos;s or the label&apos;s limit per
          application, and none plans nitrogen inside the no-fertilizer window.
        </p>
        {errors.rounds?.message || errors.rounds?.root?.message ? (
          <p className="font-semibold text-clay">
            {errors.rounds?.message ?? errors.rounds?.root?.message}
          </p>
        ) : null}
        <ol className="space-y-3">
          {rounds.fields.map((field, i) => (
            <li key={field.id} className="rounded-lg border border-line p-3">
              <div className="mb-2 flex flex-wrap items-center justify-between gap-2">
                <h3 className="text-lg font-bold">Round {i + 1}</h3>
                <div className="flex gap-1">
                  <Button
                    type="button"
                    variant="quiet"
                    aria-label={`Move round ${i + 1} earlier`}
                    disabled={i === 0}
                    onClick={() => rounds.move(i, i - 1)}
                  >
                    <ArrowUp className="size-5" aria-hidden="true" />
                  </Button>
                  <Button
                    type="button"
                    variant="quiet"
                    aria-label={`Move round ${i + 1} later`}
                    disabled={i === rounds.fields.length - 1}
                    onClick={() => rounds.move(i, i + 1)}
                  >
                    <ArrowDown className="size-5" aria-hidden="true" />
                  </Button>
                  <Button
                    type="button"
                    variant="quiet"
                    aria-label={`Remove round ${i + 1}`}
                    disabled={rounds.fields.length === 1}
                    onClick={() => rounds.remove(i)}
                  >
                    <Trash2 className="size-5" aria-hidden="true" />
                  </Button>
                </div>
              </div>
              <RoundFields
                i={i}
                p={`${p}-r${i}`}
                control={control}
                register={register}
                errors={errors.rounds?.[i]}
                products={products}
                t={t}
              />
            </li>
          ))}
        </ol>
        <Button
          type="button"
          variant="secondary"
          disabled={rounds.fields.length >= PROGRAM_MAX_ROUNDS}
          onClick={() => rounds.append(blankRound())}
        >
          <Plus className="size-5" aria-hidden="true" /> Add a round
        </Button>
      </fieldset>

      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {program ? "Save program" : "Create program"}
        </Button>
        <Button type="button" variant="secondary" onClick={onDone}>
          Cancel
        </Button>
      </div>
    </form>
  );
}

type RoundErrors = NonNullable<
  NonNullable<
    ReturnType<typeof useForm<FormIn, unknown, FormOut>>["formState"]["errors"]["rounds"]
  >[number]
>;

function RoundFields({
  i,
  p,
  control,
  register,
  errors,
  products,
  t,
}: {
  i: number;
  p: string;
  control: Control<FormIn, unknown, FormOut>;
  register: ReturnType<typeof useForm<FormIn, unknown, FormOut>>["register"];
  errors: RoundErrors | undefined;
  products: ProgramProduct[];
  t: ReturnType<typeof useTranslations<"terms">>;
}) {
  const windowKind = useWatch({ control, name: `rounds.${i}.windowKind` });
  const targets = {
    granular: useWatch({ control, name: `rounds.${i}.granular.target` }),
    liquid: useWatch({ control, name: `rounds.${i}.liquid.target` }),
  };
  const invalid = (e: unknown) => (e ? true : undefined);
  return (
    <div className="space-y-3">
      <div className="grid gap-3 sm:grid-cols-2">
        <Field id={`${p}-kind`} label="What the round does" error={errors?.kind?.message}>
          <select id={`${p}-kind`} {...register(`rounds.${i}.kind`)} className={inputClass}>
            {PROGRAM_ROUND_KINDS.map((k) => (
              <option key={k} value={k}>
                {t(`programRoundKinds.${k}`)}
              </option>
            ))}
          </select>
        </Field>
        <Field id={`${p}-window`} label="Window" error={errors?.windowKind?.message}>
          <select id={`${p}-window`} {...register(`rounds.${i}.windowKind`)} className={inputClass}>
            {PROGRAM_WINDOW_KINDS.map((k) => (
              <option key={k} value={k}>
                {t(`programWindowKinds.${k}`)}
              </option>
            ))}
          </select>
        </Field>
      </div>
      {windowKind === "dates" ? (
        <div className="grid grid-cols-2 gap-3">
          <Field
            id={`${p}-from`}
            label="From (MM-DD)"
            hint="Every year, e.g. 04-15"
            error={errors?.startMd?.message}
          >
            <input
              id={`${p}-from`}
              inputMode="numeric"
              placeholder="04-15"
              {...register(`rounds.${i}.startMd`, { setValueAs: nullIfEmpty })}
              className={inputClass}
              aria-invalid={invalid(errors?.startMd)}
            />
          </Field>
          <Field
            id={`${p}-to`}
            label="To (MM-DD)"
            hint="The last day of the window"
            error={errors?.endMd?.message}
          >
            <input
              id={`${p}-to`}
              inputMode="numeric"
              placeholder="05-15"
              {...register(`rounds.${i}.endMd`, { setValueAs: nullIfEmpty })}
              className={inputClass}
              aria-invalid={invalid(errors?.endMd)}
            />
          </Field>
        </div>
      ) : (
        <div className="grid gap-3 sm:grid-cols-3">
          {windowKind === "gdd" ? (
            <Field
              id={`${p}-base`}
              label="GDD base (°F)"
              hint="50 °F is usual"
              error={errors?.triggerBaseF?.message}
            >
              <input
                id={`${p}-base`}
                inputMode="decimal"
                {...register(`rounds.${i}.triggerBaseF`, { setValueAs: numberOrNull })}
                className={inputClass}
                aria-invalid={invalid(errors?.triggerBaseF)}
              />
            </Field>
          ) : null}
          <Field
            id={`${p}-trigger`}
            label={windowKind === "gdd" ? "Opens at (GDD, °F·days)" : "Opens at (°F)"}
            hint={
              windowKind === "gdd"
                ? "Accumulated from January 1"
                : windowKind === "soil_temperature"
                  ? "Soil at 4 in; planned from the monthly normals"
                  : "Monthly mean air temperature"
            }
            error={errors?.triggerValue?.message}
          >
            <input
              id={`${p}-trigger`}
              inputMode="decimal"
              {...register(`rounds.${i}.triggerValue`, { setValueAs: numberOrNull })}
              className={inputClass}
              aria-invalid={invalid(errors?.triggerValue)}
            />
          </Field>
          <Field id={`${p}-days`} label="Days open" error={errors?.windowDays?.message}>
            <input
              id={`${p}-days`}
              inputMode="numeric"
              {...register(`rounds.${i}.windowDays`, { setValueAs: numberOrNull })}
              className={inputClass}
              aria-invalid={invalid(errors?.windowDays)}
            />
          </Field>
        </div>
      )}
      <div className="grid gap-3 md:grid-cols-2">
        {(["granular", "liquid"] as const).map((m) => (
          <fieldset key={m} className="space-y-2 rounded-lg bg-paper p-3">
            <legend className="font-bold">{t(`programMethods.${m}`)} zones</legend>
            <Field id={`${p}-${m}-product`} label="Product" error={errors?.[m]?.productId?.message}>
              <select
                id={`${p}-${m}-product`}
                {...register(`rounds.${i}.${m}.productId`, { setValueAs: nullIfEmpty })}
                className={inputClass}
                aria-invalid={invalid(errors?.[m]?.productId)}
              >
                <option value="">None</option>
                {products
                  .filter((x) => (m === "liquid" ? x.form === "liquid" : x.form !== "liquid"))
                  .map((x) => (
                    <option key={x.id} value={x.id}>
                      {x.name}
                    </option>
                  ))}
              </select>
            </Field>
            <div className="grid grid-cols-2 gap-2">
              <Field id={`${p}-${m}-target`} label="Nitrogen" error={errors?.[m]?.target?.message}>
                <select
                  id={`${p}-${m}-target`}
                  {...register(`rounds.${i}.${m}.target`)}
                  className={inputClass}
                >
                  {PROGRAM_TARGETS.map((x) => (
                    <option key={x} value={x}>
                      {t(`programTargets.${x}`)}
                    </option>
                  ))}
                </select>
              </Field>
              {targets[m] === "lb" ? (
                <Field
                  id={`${p}-${m}-n`}
                  label="lb N / 1,000 ft²"
                  error={errors?.[m]?.nLb?.message}
                >
                  <input
                    id={`${p}-${m}-n`}
                    inputMode="decimal"
                    {...register(`rounds.${i}.${m}.nLb`, { setValueAs: numberOrNull })}
                    className={inputClass}
                    aria-invalid={invalid(errors?.[m]?.nLb)}
                  />
                </Field>
              ) : null}
            </div>
          </fieldset>
        ))}
      </div>
    </div>
  );
}
