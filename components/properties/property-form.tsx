"use client";

// Create or edit a property (manager). The zod schema that validates the route drives this form.
import { LocateFixed, MapPin } from "lucide-react";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, nullIfEmpty } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import type { PersonDto } from "@/lib/people/dto";
import type { AddressMatchDto, GeocodeResult, PropertyDetailDto } from "@/lib/properties/dto";
import { ACCESS_NOTES_MAX, propertySchema } from "@/lib/properties/schemas";
import { fetchJson, HttpError, sendJson } from "@/lib/query-client";
import { formatUsPhone } from "@/lib/reference/us-phone";
import { findUsState, US_STATES, zipStateWarning } from "@/lib/reference/us-states";
import type { RuleSetDto } from "@/lib/rule-sets/dto";
import { proposeRuleSet } from "@/lib/rule-sets/propose";

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
  const [lookup, setLookup] = useState<
    | { kind: "idle" }
    | { kind: "busy" }
    | { kind: "matches"; address: string; matches: AddressMatchDto[] }
    | { kind: "message"; text: string }
  >({ kind: "idle" });
  const [proposalNote, setProposalNote] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setValue,
    setError,
    getValues,
    control,
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
          customerPhone: property.customerPhone ? formatUsPhone(property.customerPhone) : "",
          accessNotes: property.accessNotes,
        }
      : {
          timeZone: "America/New_York",
          ruleSetId: ruleSets[0]?.id ?? null,
          technicianId: null,
          notes: "",
          customerPhone: "",
          accessNotes: "",
        },
  });

  const [region, postalCode, ruleSetId, latitude, longitude] = useWatch({
    control,
    name: ["region", "postalCode", "ruleSetId", "latitude", "longitude"],
  });
  const zipWarning = zipStateWarning(postalCode ?? "", region ?? "");
  const proposal = proposeRuleSet(ruleSets, region ?? "");
  const hasTypedCoordinates =
    typeof latitude === "number" &&
    Number.isFinite(latitude) &&
    typeof longitude === "number" &&
    Number.isFinite(longitude);

  // A new state proposes its rule set (the manager may choose another afterwards).
  function onStateChosen(code: string) {
    const next = proposeRuleSet(ruleSets, code);
    if (next?.kind === "state") {
      setValue("ruleSetId", next.ruleSetId, { shouldValidate: true });
      setProposalNote(next.reason);
    } else setProposalNote(next ? next.reason : null);
  }

  async function findLocation() {
    const { street, city, region: state, postalCode: zip } = getValues();
    if (!street?.trim() || (!city?.trim() && !zip?.trim()))
      return setLookup({
        kind: "message",
        text: "Type the street address and the town or ZIP code first, then look up the location.",
      });
    setLookup({ kind: "busy" });
    const query = new URLSearchParams({
      street: street ?? "",
      city: city ?? "",
      region: state ?? "",
      postalCode: zip ?? "",
    });
    try {
      const result = await fetchJson<GeocodeResult>(`/api/v1/geocode?${query}`);
      setLookup(
        result.status === "found"
          ? { kind: "matches", address: result.address, matches: result.matches }
          : { kind: "message", text: result.message },
      );
    } catch (err) {
      setLookup({
        kind: "message",
        text:
          err instanceof HttpError
            ? err.message
            : "No connection to Sward right now. Type the coordinates, or try again.",
      });
    }
  }

  function applyMatch(match: AddressMatchDto) {
    setValue("latitude", match.latitude, { shouldValidate: true });
    setValue("longitude", match.longitude, { shouldValidate: true });
    setLookup({ kind: "idle" });
    setLocating(`Location set from the address found: ${match.matchedAddress}.`);
  }

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
          <select
            id="region"
            {...register("region", { onChange: (e) => onStateChosen(e.target.value) })}
            {...aria("region")}
            className={inputClass}
          >
            <option value="">Choose a state</option>
            {region && !findUsState(region) ? (
              <option value={region}>{region} (not a state code; choose one)</option>
            ) : null}
            {US_STATES.map((s) => (
              <option key={s.code} value={s.code}>
                {s.code} — {s.name}
              </option>
            ))}
          </select>
        </Field>
        <Field id="postalCode" label="ZIP code" hint="5 digits, or ZIP+4" error={err("postalCode")}>
          <input
            id="postalCode"
            inputMode="numeric"
            autoComplete="postal-code"
            maxLength={10}
            {...register("postalCode")}
            {...aria("postalCode")}
            className={inputClass}
          />
        </Field>
      </div>
      {zipWarning && !errors.postalCode && !errors.region ? (
        <p role="status" className="rounded-lg bg-sun-tint p-3 text-sm font-semibold">
          {zipWarning}
        </p>
      ) : null}
      <fieldset className="space-y-3 rounded-xl border border-line p-4">
        <legend className="px-1 font-bold">Location</legend>
        <p className="text-sm text-muted">
          Where the lawn is: the weather and the season&apos;s rules are read for this point.
        </p>
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
        <div className="flex flex-wrap gap-2">
          <Button
            type="button"
            variant="secondary"
            onClick={findLocation}
            disabled={lookup.kind === "busy"}
          >
            <MapPin className="size-5" aria-hidden="true" />
            {lookup.kind === "busy"
              ? "Looking up the address…"
              : "Find the location from the address"}
          </Button>
          <Button type="button" variant="secondary" onClick={useDeviceLocation}>
            <LocateFixed className="size-5" aria-hidden="true" />
            Use this device&apos;s location
          </Button>
        </div>
        {lookup.kind === "message" ? <p role="status">{lookup.text}</p> : null}
        {lookup.kind === "matches" ? (
          <div role="status" className="space-y-2 rounded-lg bg-sward-tint p-3">
            <p className="font-semibold">
              {lookup.matches.length === 1
                ? "The address lookup found this place. Is it the property?"
                : "The address lookup found these places. Choose the property's."}
            </p>
            <ul className="space-y-2">
              {lookup.matches.map((m) => (
                <li
                  key={`${m.matchedAddress}-${m.latitude}-${m.longitude}`}
                  className="flex flex-wrap items-center justify-between gap-2"
                >
                  <span>
                    {m.matchedAddress}
                    <span className="block text-sm text-muted">
                      Latitude {m.latitude.toFixed(5)}°, longitude {m.longitude.toFixed(5)}°
                    </span>
                  </span>
                  <Button type="button" onClick={() => applyMatch(m)}>
                    {hasTypedCoordinates
                      ? "Replace the coordinates with these"
                      : "Use this location"}
                  </Button>
                </li>
              ))}
            </ul>
            {hasTypedCoordinates ? (
              <p className="text-sm">
                The coordinates typed above ({Number(latitude).toFixed(5)}°,{" "}
                {Number(longitude).toFixed(5)}°) stay until you choose to replace them.
              </p>
            ) : null}
            <Button type="button" variant="secondary" onClick={() => setLookup({ kind: "idle" })}>
              None of these
            </Button>
          </div>
        ) : null}
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
        hint="The local rules every application here is checked against. Proposed from the state."
        error={err("ruleSetId")}
      >
        <select
          id="ruleSetId"
          {...register("ruleSetId", {
            setValueAs: nullIfEmpty,
            onChange: () => setProposalNote(null),
          })}
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
        {proposalNote ? (
          <p role="status" className="text-sm">
            {proposalNote}
          </p>
        ) : proposal?.kind === "state" && ruleSetId !== proposal.ruleSetId ? (
          <p role="status" className="flex flex-wrap items-center gap-2 text-sm">
            For {proposal.state.name}, “{proposal.ruleSetName}” is proposed; another is chosen.
            <Button
              type="button"
              variant="secondary"
              onClick={() => {
                setValue("ruleSetId", proposal.ruleSetId, { shouldValidate: true });
                setProposalNote(proposal.reason);
              }}
            >
              Use the proposed rule set
            </Button>
          </p>
        ) : null}
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
      <Field
        id="customerPhone"
        label="Customer phone (for the technician's Call button)"
        error={err("customerPhone")}
      >
        <input
          id="customerPhone"
          type="tel"
          autoComplete="off"
          inputMode="tel"
          placeholder="(609) 555-0142"
          {...register("customerPhone")}
          {...aria("customerPhone")}
          className={inputClass}
        />
      </Field>
      <Field
        id="accessNotes"
        label="Access notes (shown on the technician's stop: gate code, dog in the yard)"
        error={err("accessNotes")}
      >
        <textarea
          id="accessNotes"
          rows={2}
          maxLength={ACCESS_NOTES_MAX}
          {...register("accessNotes")}
          {...aria("accessNotes")}
          className={inputClass}
        />
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
