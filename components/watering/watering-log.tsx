"use client";

// The watering log of a property: add an entry (depth in inches, or run time × precipitation
// rate) for a zone or the whole lawn, and read the recent entries with their volume.
import { Droplets } from "lucide-react";
import { useRouter } from "next/navigation";
import { useState } from "react";

import { Button } from "@/components/ui/button";
import { Field, inputClass } from "@/components/ui/field";
import { GAL_PER_INCH_1000FT2 } from "@/lib/agronomy/units";
import { wateringDepthIn } from "@/lib/agronomy/water";
import { formatDate } from "@/lib/dates";
import type { ZoneDto } from "@/lib/properties/dto";
import { sendJson } from "@/lib/query-client";
import type { WateringDto } from "@/lib/watering/dto";
import { wateringSchema } from "@/lib/watering/schemas";

const num = (s: string) => (s.trim() === "" ? null : Number(s));

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
  const [zoneId, setZoneId] = useState("");
  const [wateredOn, setWateredOn] = useState(today);
  const [mode, setMode] = useState<"depth" | "run">("depth");
  const [depth, setDepth] = useState("");
  const [run, setRun] = useState("");
  const [rate, setRate] = useState("");
  const [notes, setNotes] = useState("");
  const [errors, setErrors] = useState<Record<string, string>>({});
  const [id, setId] = useState(() => crypto.randomUUID());
  const areaOf = (zid: string | null) =>
    zid
      ? (zones.find((z) => z.id === zid)?.areaFt2 ?? 0)
      : zones.reduce((s, z) => s + z.areaFt2, 0);
  const previewDepth =
    mode === "depth"
      ? num(depth)
      : num(run) && num(rate)
        ? wateringDepthIn(num(run)!, num(rate)!)
        : null;

  async function add(event: React.FormEvent) {
    event.preventDefault();
    const body = {
      id,
      zoneId: zoneId || null,
      wateredOn,
      depthIn: mode === "depth" ? num(depth) : null,
      runMinutes: mode === "run" ? num(run) : null,
      precipitationRateInPerHour: mode === "run" ? num(rate) : null,
      notes,
    };
    const parsed = wateringSchema.safeParse(body);
    if (!parsed.success)
      return setErrors(
        Object.fromEntries(parsed.error.issues.map((i) => [String(i.path[0]), i.message])),
      );
    const result = await sendJson<WateringDto>(
      "POST",
      `/api/v1/properties/${propertyId}/waterings`,
      parsed.data,
    );
    if (!result.ok)
      return setErrors({
        form: result.error.message,
        ...Object.fromEntries(
          Object.entries(result.error.fieldErrors ?? {}).map(([k, m]) => [k, m[0] ?? ""]),
        ),
      });
    setErrors({});
    setDepth("");
    setRun("");
    setNotes("");
    setId(crypto.randomUUID());
    router.refresh();
  }

  return (
    <div className="space-y-4">
      {canAdd ? (
        <form
          onSubmit={add}
          noValidate
          className="space-y-3 rounded-xl border border-line bg-card p-4"
          aria-label="Log a watering"
        >
          {errors.form ? (
            <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
              {errors.form}
            </p>
          ) : null}
          <div className="grid gap-3 sm:grid-cols-2">
            <Field id="w-zone" label="Where">
              <select
                id="w-zone"
                value={zoneId}
                onChange={(e) => setZoneId(e.target.value)}
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
            <Field id="w-date" label="Date" error={errors.wateredOn}>
              <input
                id="w-date"
                type="date"
                value={wateredOn}
                onChange={(e) => setWateredOn(e.target.value)}
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
                onClick={() => setMode(m)}
                className={`min-h-tap rounded-lg border-2 px-2 font-semibold ${mode === m ? "border-rain bg-rain text-white" : "border-line bg-card"}`}
              >
                {m === "depth" ? "Depth (in)" : "Run time × rate"}
              </button>
            ))}
          </div>
          {mode === "depth" ? (
            <Field id="w-depth" label="Depth of water (in)" error={errors.depthIn}>
              <input
                id="w-depth"
                inputMode="decimal"
                value={depth}
                onChange={(e) => setDepth(e.target.value)}
                className={inputClass}
                placeholder="e.g. 0.5"
              />
            </Field>
          ) : (
            <div className="grid grid-cols-2 gap-2">
              <Field id="w-run" label="Run time (min)" error={errors.runMinutes}>
                <input
                  id="w-run"
                  inputMode="decimal"
                  value={run}
                  onChange={(e) => setRun(e.target.value)}
                  className={inputClass}
                />
              </Field>
              <Field
                id="w-rate"
                label="Precipitation rate (in/h)"
                error={errors.precipitationRateInPerHour}
              >
                <input
                  id="w-rate"
                  inputMode="decimal"
                  value={rate}
                  onChange={(e) => setRate(e.target.value)}
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
                (previewDepth * GAL_PER_INCH_1000FT2 * areaOf(zoneId || null)) / 1000,
              ).toLocaleString("en-US")}{" "}
              gal on {areaOf(zoneId || null).toLocaleString("en-US")} ft²
            </p>
          ) : null}
          <Field id="w-notes" label="Notes (optional)" error={errors.notes}>
            <input
              id="w-notes"
              value={notes}
              onChange={(e) => setNotes(e.target.value)}
              className={inputClass}
            />
          </Field>
          <Button type="submit">
            <Droplets className="size-5" aria-hidden="true" /> Log watering
          </Button>
        </form>
      ) : null}
      {waterings.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">No watering logged yet.</p>
      ) : (
        <ul className="space-y-2" aria-label="Waterings">
          {waterings.slice(0, 20).map((w) => (
            <li
              key={w.id}
              className="flex flex-wrap items-center justify-between gap-2 rounded-lg border border-line bg-card p-3"
            >
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
            </li>
          ))}
        </ul>
      )}
    </div>
  );
}
