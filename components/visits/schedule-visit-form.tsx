"use client";

// The manager schedules a visit: property, date, technician, planned service. The visit id is
// chosen here, so a double click or a retry after a timeout creates one visit, never two.
import { useQueryClient } from "@tanstack/react-query";
import { useLocale } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { CharacterCount } from "@/components/ui/character-count";
import { applyFieldErrors, Field, inputClass, nullIfEmpty } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { formatDate } from "@/lib/dates";
import type { PersonDto } from "@/lib/people/dto";
import type { PropertySummaryDto } from "@/lib/properties/dto";
import { sendJson } from "@/lib/query-client";
import { PLANNED_SERVICES } from "@/lib/reference/visit-options";
import type { VisitDetailDto } from "@/lib/visits/dto";
import { visitKeys } from "@/lib/visits/query-keys";
import { MAX_STOP_NUMBER, scheduleVisitSchema, VISIT_NOTES_MAX } from "@/lib/visits/schemas";

type FormIn = z.input<typeof scheduleVisitSchema>;
type ConfirmField = "confirmSameDay" | "confirmBlackout";
const CONFIRM_LABEL: Record<ConfirmField, string> = {
  confirmSameDay: "Schedule another visit that day anyway",
  confirmBlackout: "Schedule this round in the no-fertilizer window anyway",
};
type FormOut = z.output<typeof scheduleVisitSchema>;

export function ScheduleVisitForm({
  properties,
  technicians,
  defaultDate,
}: {
  properties: PropertySummaryDto[];
  technicians: PersonDto[];
  defaultDate: string;
}) {
  const router = useRouter();
  const locale = useLocale();
  const queryClient = useQueryClient();
  const [message, setMessage] = useState<{ tone: "ok" | "error"; text: string } | null>(null);
  const [visitId, setVisitId] = useState(() => crypto.randomUUID());
  // Warnings the server asks the manager to confirm (a second visit that day, a round with N or P
  // inside the rule set's no-fertilizer window): each shows with its "schedule anyway" box.
  const [warnings, setWarnings] = useState<Partial<Record<ConfirmField, string>>>({});
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    reset,
    control,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver: formResolver(scheduleVisitSchema),
    defaultValues: {
      scheduledFor: defaultDate,
      plannedService: "feeding_round",
      technicianId: null,
      stopOrder: undefined,
      notes: "",
      confirmSameDay: false,
      confirmBlackout: false,
    },
  });
  const notesLength = (useWatch({ control, name: "notes" }) ?? "").length;

  async function onSubmit(values: FormOut) {
    setMessage(null);
    const result = await sendJson<VisitDetailDto>("POST", "/api/v1/visits", {
      ...values,
      id: visitId,
    });
    if (!result.ok) {
      const { confirmSameDay, confirmBlackout, ...rest } = result.error.fieldErrors ?? {};
      setWarnings({
        ...(confirmSameDay?.[0] ? { confirmSameDay: confirmSameDay[0] } : {}),
        ...(confirmBlackout?.[0] ? { confirmBlackout: confirmBlackout[0] } : {}),
      });
      applyFieldErrors(rest, setError as never);
      return setMessage({ tone: "error", text: result.error.message });
    }
    setWarnings({});
    setMessage({
      tone: "ok",
      text: `Scheduled: ${result.data.propertyName} on ${formatDate(result.data.scheduledFor, locale)}.`,
    });
    setVisitId(crypto.randomUUID());
    reset({
      scheduledFor: values.scheduledFor,
      plannedService: values.plannedService,
      technicianId: null,
      stopOrder: undefined,
      notes: "",
      confirmSameDay: false,
      confirmBlackout: false,
    });
    void queryClient.invalidateQueries({ queryKey: visitKeys.all });
    router.refresh();
  }

  return (
    <form
      onSubmit={handleSubmit(onSubmit)}
      className="space-y-4 rounded-xl border border-line bg-card p-4"
      noValidate
      aria-label="Schedule a visit"
    >
      <h2 className="text-xl font-bold">Schedule a visit</h2>
      {message ? (
        <p
          role={message.tone === "error" ? "alert" : "status"}
          className={
            message.tone === "error"
              ? "rounded-lg bg-clay-tint p-3 text-clay"
              : "rounded-lg bg-sward-tint p-3 text-sward-deep"
          }
        >
          {message.text}
        </p>
      ) : null}
      <Field id="sv-property" label="Property" error={errors.propertyId?.message}>
        <select
          id="sv-property"
          {...register("propertyId", {
            onChange: (e: React.ChangeEvent<HTMLSelectElement>) => {
              const tech = properties.find((p) => p.id === e.target.value)?.technician?.id;
              if (tech) setValue("technicianId", tech);
            },
          })}
          aria-invalid={errors.propertyId ? true : undefined}
          className={inputClass}
          defaultValue=""
        >
          <option value="" disabled>
            Choose a property
          </option>
          {properties.map((p) => (
            <option key={p.id} value={p.id}>
              {p.name} — {p.address.street}
            </option>
          ))}
        </select>
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="sv-date" label="Date" error={errors.scheduledFor?.message}>
          <input id="sv-date" type="date" {...register("scheduledFor")} className={inputClass} />
        </Field>
        <Field id="sv-order" label="Stop number in the day" error={errors.stopOrder?.message}>
          <input
            id="sv-order"
            type="number"
            min={1}
            max={MAX_STOP_NUMBER}
            step={1}
            inputMode="numeric"
            placeholder="Not numbered"
            {...register("stopOrder", {
              setValueAs: (v: string) => (v === "" || v === undefined ? undefined : Number(v)),
            })}
            className={inputClass}
          />
        </Field>
      </div>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="sv-tech" label="Technician" error={errors.technicianId?.message}>
          <select
            id="sv-tech"
            {...register("technicianId", { setValueAs: nullIfEmpty })}
            className={inputClass}
          >
            <option value="">Not assigned yet</option>
            {technicians.map((t) => (
              <option key={t.id} value={t.id}>
                {t.name}
              </option>
            ))}
          </select>
        </Field>
        <Field id="sv-service" label="Planned service" error={errors.plannedService?.message}>
          <select id="sv-service" {...register("plannedService")} className={inputClass}>
            {Object.entries(PLANNED_SERVICES).map(([value, label]) => (
              <option key={value} value={value}>
                {label}
              </option>
            ))}
          </select>
        </Field>
      </div>
      <Field id="sv-notes" label="Note for the technician (optional)" error={errors.notes?.message}>
        <textarea
          id="sv-notes"
          rows={2}
          aria-describedby="sv-notes-count"
          {...register("notes")}
          className={inputClass}
        />
        <CharacterCount id="sv-notes-count" length={notesLength} max={VISIT_NOTES_MAX} />
      </Field>
      {(Object.keys(warnings) as ConfirmField[]).map((field) => (
        <div key={field} role="alert" className="rounded-lg border border-sun bg-card p-3">
          <p className="mb-2 font-semibold text-sun">Warning: {warnings[field]}</p>
          <label className="flex min-h-tap items-center gap-2">
            <input type="checkbox" {...register(field)} className="size-5" />
            {CONFIRM_LABEL[field]}
          </label>
        </div>
      ))}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? "Scheduling…" : "Schedule visit"}
      </Button>
    </form>
  );
}
