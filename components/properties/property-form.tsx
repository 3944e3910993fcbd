"use client";

// Create or edit a property (manager). The zod schema that validates the route drives this form.
import { LocateFixed } from "lucide-react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, nullIfEmpty } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import type { PersonDto } from "@/lib/people/dto";
import type { PropertyDetailDto } from "@/lib/properties/dto";
import { propertySchema } from "@/lib/properties/schemas";
import { sendJson } from "@/lib/query-client";
import type { RuleSetDto } from "@/lib/rule-sets/dto";

type FormIn = z.input<typeof propertySchema>;
type FormOut = z.output<typeof propertySchema>;

export function PropertyForm({
  property,
  technicians,
  ruleSets,
  timeZones,
}: {
  property?: PropertyDetailDto;
  technicians: PersonDto[];
  ruleSets: RuleSetDto[];
  timeZones: string[];
}) {
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [locating, setLocating] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({
    resolver: formResolver(propertySchema),
    defaultValues: property
      ? {
          name: property.name,
          street: property.address.street,
          city: property.address.city,
          region: property.address.region,
          postalCode: property.address.postalCode,
          latitude: property.location.latitude,
          longitude: property.location.longitude,
          timeZone: property.timeZone,
          ruleSetId: property.ruleSet?.id ?? null,
          technicianId: property.technician?.id ?? null,
          notes: property.notes,
        }
      : {
          timeZone: "America/New_York",
          ruleSetId: ruleSets[0]?.id ?? null,
          technicianId: null,
          notes: "",
        },
  });

  async function onSubmit(values: FormOut) {
    setMessage(null);
    const result = property
      ? await sendJson<PropertyDetailDto>("PUT", `/api/v1/properties/${property.id}`, values)
      : await sendJson<PropertyDetailDto>("POST", "/api/v1/properties", values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      setMessage(result.error.message);
      return;
    }
    router.push(`/properties/${result.data.id}`);
    router.refresh();
  }

  function useDeviceLocation() {
    if (!("geolocation" in navigator))
      return setLocating("This device cannot share its location; type the coordinates.");
    setLocating("Finding this device's location…");
    navigator.geolocation.getCurrentPosition(
      (p) => {
        setValue("latitude", Number(p.coords.latitude.toFixed(5)), { shouldValidate: true });
        setValue("longitude", Number(p.coords.longitude.toFixed(5)), { shouldValidate: true });
        setLocating(`Location set (±${Math.round(p.coords.accuracy)} m).`);
      },
      () =>
        setLocating("Location was not shared. Allow it in the browser, or type the coordinates."),
      { timeout: 10_000, enableHighAccuracy: true },
    );
  }

  const err = (name: keyof FormIn) => errors[name]?.message;
  const aria = (name: keyof FormIn) => ({
    "aria-invalid": errors[name] ? true : undefined,
    "aria-describedby": errors[name] ? `${name}-error` : undefined,
  });

  return (
    <form onSubmit={handleSubmit(onSubmit)} className="max-w-2xl space-y-5" noValidate>
      {message ? (
        <p role="alert" className="rounded-lg border border-clay bg-clay-tint p-3 text-clay">
          {message}
        </p>
      ) : null}
      <Field
        id="name"
        label="Property name"
        hint="How the office refers to it, e.g. “Haddad residence”."
        error={err("name")}
      >
        <input id="name" {...register("name")} {...aria("name")} className={inputClass} />
      </Field>
      <Field id="street" label="Street address" error={err("street")}>
        <input
          id="street"
          autoComplete="street-address"
          {...register("street")}
          {...aria("street")}
          className={inputClass}
        />
      </Field>
      <div className="grid gap-4 sm:grid-cols-3">
        <Field id="city" label="Town or city" error={err("city")}>
          <input id="city" {...register("city")} {...aria("city")} className={inputClass} />
        </Field>
        <Field id="region" label="State" error={err("region")}>
          <input id="region" {...register("region")} {...aria("region")} className={inputClass} />
        </Field>
        <Field id="postalCode" label="ZIP code" error={err("postalCode")}>
          <input
            id="postalCode"
            inputMode="numeric"
            {...register("postalCode")}
            {...aria("postalCode")}
            className={inputClass}
          />
        </Field>
      </div>
      <fieldset className="space-y-3 rounded-xl border border-line p-4">
        <legend className="px-1 font-bold">Location</legend>
        <div className="grid gap-4 sm:grid-cols-2">
          <Field id="latitude" label="Latitude (°)" error={err("latitude")}>
            <input
              id="latitude"
              inputMode="decimal"
              {...register("latitude", { valueAsNumber: true })}
              {...aria("latitude")}
              className={inputClass}
            />
          </Field>
          <Field id="longitude" label="Longitude (°)" error={err("longitude")}>
            <input
              id="longitude"
              inputMode="decimal"
              {...register("longitude", { valueAsNumber: true })}
              {...aria("longitude")}
              className={inputClass}
            />
          </Field>
        </div>
        <Button type="button" variant="secondary" onClick={useDeviceLocation}>
          <LocateFixed className="size-5" aria-hidden="true" />
          Use this device&apos;s location
        </Button>
        {locating ? <p role="status">{locating}</p> : null}
      </fieldset>
      <Field id="timeZone" label="Time zone" error={err("timeZone")}>
        <select
          id="timeZone"
          {...register("timeZone")}
          {...aria("timeZone")}
          className={inputClass}
        >
          {timeZones.map((tz) => (
            <option key={tz} value={tz}>
              {tz.replaceAll("_", " ")}
            </option>
          ))}
        </select>
      </Field>
      <Field
        id="ruleSetId"
        label="Fertilizer rule set"
        hint="The local rules every application here is checked against."
        error={err("ruleSetId")}
      >
        <select
          id="ruleSetId"
          {...register("ruleSetId", { setValueAs: nullIfEmpty })}
          {...aria("ruleSetId")}
          className={inputClass}
        >
          <option value="">None chosen yet</option>
          {ruleSets.map((r) => (
            <option key={r.id} value={r.id}>
              {r.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="technicianId" label="Assigned technician" error={err("technicianId")}>
        <select
          id="technicianId"
          {...register("technicianId", { setValueAs: nullIfEmpty })}
          {...aria("technicianId")}
          className={inputClass}
        >
          <option value="">Not assigned</option>
          {technicians.map((t) => (
            <option key={t.id} value={t.id}>
              {t.name}
            </option>
          ))}
        </select>
      </Field>
      <Field id="notes" label="Office notes (not shown to the homeowner)" error={err("notes")}>
        <textarea id="notes" rows={3} {...register("notes")} className={inputClass} />
      </Field>
      <div className="flex flex-wrap gap-2">
        <Button type="submit" disabled={isSubmitting}>
          {isSubmitting ? "Saving…" : property ? "Save changes" : "Add property"}
        </Button>
        <Button type="button" variant="secondary" onClick={() => router.back()}>
          Cancel
        </Button>
      </div>
    </form>
  );
}
