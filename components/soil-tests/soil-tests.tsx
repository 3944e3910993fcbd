"use client";

// A property's soil tests: record a lab's results (or import its file), and read each test
// against the MLSN guidelines and the lime equation (lib/agronomy/soil-test.ts, computed on the
// server). Lime and fertilizer advice keeps the usual cautions beside it.
import { FlaskConical, Trash2, Upload } from "lucide-react";
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useId, useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { SafetyCautions } from "@/components/applications/safety-cautions";
import { Button } from "@/components/ui/button";
import {
  applyFieldErrors,
  Field,
  inputClass,
  nullIfEmpty,
  numberOrNull,
} from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import {
  BUFFER_METHODS,
  MLSN_MIN_PH,
  SOIL_ELEMENTS,
  SOIL_EXTRACTANTS,
  type LimeAdvice,
  type SoilElement,
} from "@/lib/agronomy/soil-test";
import { formatDate } from "@/lib/dates";
import type { ZoneDto } from "@/lib/properties/dto";
import { sendJson } from "@/lib/query-client";
import type { SoilTestDto, SoilTestImportDto } from "@/lib/soil-tests/dto";
import { soilTestSchema } from "@/lib/soil-tests/schemas";

type FormIn = z.input<typeof soilTestSchema>;
type FormOut = z.output<typeof soilTestSchema>;
const resolver = formResolver(soilTestSchema);

const lb = (n: number) =>
  n.toLocaleString("en-US", { maximumFractionDigits: n < 10 ? 2 : 1, minimumFractionDigits: 0 });

export function SoilTests({
  propertyId,
  zones,
  today,
  tests,
  canRecord,
  canDelete,
}: {
  propertyId: string;
  zones: ZoneDto[];
  today: string;
  tests: SoilTestDto[];
  canRecord: boolean;
  canDelete: boolean;
}) {
  const advisesLime = tests.some((t) => limeAmount(t.reading.lime) > 0);
  const advisesNutrients = tests.some((t) => t.reading.elements.some((e) => !e.meets));
  return (
    <div className="space-y-4">
      {canRecord ? (
        <div className="grid gap-3 lg:grid-cols-2">
          <RecordSoilTest propertyId={propertyId} zones={zones} today={today} />
          <ImportSoilTests propertyId={propertyId} />
        </div>
      ) : null}
      {tests.length === 0 ? (
        <p className="rounded-lg border border-line bg-card p-4">
          No soil test recorded yet. A lab test every two to three years tells what the lawn needs
          besides nitrogen.
        </p>
      ) : (
        <ul className="space-y-3" aria-label="Soil tests">
          {tests.map((t) => (
            <li key={t.id}>
              <SoilTestCard test={t} canDelete={canDelete} />
            </li>
          ))}
        </ul>
      )}
      {advisesLime || advisesNutrients ? <SafetyCautions /> : null}
    </div>
  );
}

function limeAmount(lime: LimeAdvice): number {
  return lime.kind === "mehlich_buffer" || lime.kind === "lab" ? lime.lbPer1000 : 0;
}

function limeSentence(lime: LimeAdvice, bufferName: (m: string) => string): string {
  switch (lime.kind) {
    case "none_needed":
      return `pH ${lime.ph.toFixed(1)}: at or above the guideline of ${MLSN_MIN_PH.toFixed(1)} — no lime needed.`;
    case "mehlich_buffer":
      return lime.lbPer1000 > 0
        ? `pH ${lime.ph.toFixed(1)}, Mehlich buffer pH ${lime.bufferPh.toFixed(1)}: about ${lb(lime.lbPer1000)} lb of calcium carbonate per 1,000 ft² brings it to pH ${lime.targetPh.toFixed(1)} (NCDA&CS buffer equation). Split large amounts over several applications.`
        : `pH ${lime.ph.toFixed(1)}: the buffer pH shows no lime is needed to reach pH ${lime.targetPh.toFixed(1)}.`;
    case "lab":
      return `${lime.ph === null ? "" : `pH ${lime.ph.toFixed(1)}: `}the lab recommends ${lb(lime.lbPer1000)} lb of lime per 1,000 ft²${lime.method ? ` (${bufferName(lime.method)} buffer)` : ""}.`;
    case "needs_buffer":
      return `pH ${lime.ph.toFixed(1)}: below the guideline of ${MLSN_MIN_PH.toFixed(1)}. How much lime depends on the buffer pH: Sward computes it from a Mehlich buffer; for another buffer, enter the lab's own recommendation.`;
    case "no_ph":
      return "No pH on this test.";
  }
}

function SoilTestCard({ test, canDelete }: { test: SoilTestDto; canDelete: boolean }) {
  const t = useTranslations("terms");
  const router = useRouter();
  const [error, setError] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);
  const r = test.reading;
  const extractant = t(`soilExtractants.${test.extractant}`);
  async function remove() {
    if (!window.confirm(`Delete the soil test of ${formatDate(test.sampledOn)} from ${test.lab}?`))
      return;
    setBusy(true);
    const result = await sendJson("DELETE", `/api/v1/soil-tests/${test.id}`, {});
    setBusy(false);
    if (!result.ok) setError(result.error.message);
    else router.refresh();
  }
  const phosphorus =
    test.labPhosphorusNeeded !== null
      ? `Phosphorus: ${test.labPhosphorusNeeded ? "needed" : "not needed"}, as the lab's report says.`
      : r.interpreted && test.ppm.p !== null
        ? `Phosphorus: ${r.showsPhosphorusNeed ? "needed — below the guideline" : "not needed — at or above the guideline"}.`
        : null;
  return (
    <article
      className="space-y-3 rounded-xl border border-line bg-card p-4"
      aria-label={`Soil test of ${formatDate(test.sampledOn)}`}
    >
      <header className="flex flex-wrap items-start justify-between gap-2">
        <div>
          <h3 className="text-lg font-bold">
            {formatDate(test.sampledOn)} · {test.zone?.name ?? "Whole property"}
          </h3>
          <p className="text-sm text-muted">
            {test.lab} · {extractant} · sampled to {test.sampleDepthIn} in
            {test.organicMatterPct !== null ? ` · organic matter ${test.organicMatterPct} %` : ""}
            {test.recordedBy ? ` · recorded by ${test.recordedBy}` : ""}
          </p>
        </div>
        {canDelete ? (
          <Button variant="secondary" onClick={remove} disabled={busy}>
            <Trash2 className="size-5" aria-hidden="true" /> Delete
          </Button>
        ) : null}
      </header>
      {error ? (
        <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
          {error}
        </p>
      ) : null}
      {r.interpreted ? (
        r.elements.length ? (
          <div
            className="overflow-x-auto"
            tabIndex={0}
            role="region"
            aria-label={`Nutrients of the soil test of ${formatDate(test.sampledOn)}`}
          >
            <table className="w-full text-left text-sm">
              <caption className="sr-only">
                Nutrients against the MLSN guidelines (Mehlich-3)
              </caption>
              <thead>
                <tr className="border-b border-line">
                  <th scope="col" className="py-1 pr-2">
                    Nutrient
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    Result
                  </th>
                  <th scope="col" className="py-1 pr-2 text-right">
                    Guideline
                  </th>
                  <th scope="col" className="py-1">
                    Reading
                  </th>
                </tr>
              </thead>
              <tbody>
                {r.elements.map((e) => (
                  <tr key={e.element} className="border-b border-line last:border-0">
                    <th scope="row" className="py-1 pr-2 font-semibold">
                      {t(`soilElements.${e.element as SoilElement}`)}
                    </th>
                    <td className="py-1 pr-2 text-right">{e.ppm} ppm</td>
                    <td className="py-1 pr-2 text-right">{e.guidelinePpm} ppm</td>
                    <td className="py-1">
                      {e.meets ? (
                        <span>✓ Meets the guideline</span>
                      ) : (
                        <span className="font-semibold text-clay">
                          ▼ Below: about {lb(e.toGuidelineLbPer1000)} lb {e.amountOf} per 1,000 ft²
                          brings it to the guideline
                        </span>
                      )}
                    </td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
        ) : null
      ) : (
        <p className="text-sm">
          Results by {extractant}: the MLSN guidelines Sward reads are for Mehlich-3 only, so these
          numbers are shown as the lab reported them — read the lab&apos;s own interpretation.{" "}
          {SOIL_ELEMENTS.filter((k) => test.ppm[k] !== null)
            .map((k) => `${t(`soilElements.${k}`)} ${test.ppm[k]} ppm`)
            .join(" · ")}
        </p>
      )}
      <p>
        {limeSentence(r.lime, (m) => t(`bufferMethods.${m as (typeof BUFFER_METHODS)[number]}`))}
      </p>
      {phosphorus ? <p>{phosphorus}</p> : null}
      {test.notes ? <p className="text-sm text-muted">{test.notes}</p> : null}
    </article>
  );
}

function RecordSoilTest({
  propertyId,
  zones,
  today,
}: {
  propertyId: string;
  zones: ZoneDto[];
  today: string;
}) {
  const t = useTranslations("terms");
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const [open, setOpen] = useState(false);
  const blank = (): FormIn => ({
    id: crypto.randomUUID(),
    zoneId: null,
    sampledOn: today,
    lab: "",
    sampleDepthIn: 4,
    extractant: "mehlich3",
    ph: null,
    bufferPh: null,
    bufferMethod: null,
    organicMatterPct: null,
    pPpm: null,
    kPpm: null,
    caPpm: null,
    mgPpm: null,
    sPpm: null,
    labLimeLbPer1000: null,
    labPhosphorusNeeded: null,
    notes: "",
  });
  const {
    register,
    handleSubmit,
    reset,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({ resolver, defaultValues: blank() });

  async function save(values: FormOut) {
    setMessage(null);
    const result = await sendJson<SoilTestDto>(
      "POST",
      `/api/v1/properties/${propertyId}/soil-tests`,
      values,
    );
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError as never);
      setMessage(result.error.message);
      return;
    }
    reset(blank());
    setOpen(false);
    router.refresh();
  }

  const number = (name: keyof FormIn, label: string, placeholder?: string) => (
    <Field id={`st-${name}`} label={label} error={errors[name]?.message}>
      <input
        id={`st-${name}`}
        inputMode="decimal"
        {...register(name, { setValueAs: numberOrNull })}
        aria-invalid={errors[name] ? true : undefined}
        className={inputClass}
        placeholder={placeholder}
      />
    </Field>
  );

  return (
    <details
      open={open}
      onToggle={(e) => setOpen(e.currentTarget.open)}
      className="rounded-xl border border-line bg-card p-4"
    >
      <summary className="flex min-h-tap cursor-pointer items-center gap-2 font-semibold">
        <FlaskConical className="size-5 text-sward" aria-hidden="true" /> Record a soil test
      </summary>
      <form
        onSubmit={handleSubmit(save)}
        noValidate
        className="mt-3 space-y-3"
        aria-label="Record a soil test"
      >
        {message ? (
          <p role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
            {message}
          </p>
        ) : null}
        <div className="grid gap-3 sm:grid-cols-2">
          <Field id="st-zone" label="Where the sample came from" error={errors.zoneId?.message}>
            <select
              id="st-zone"
              {...register("zoneId", { setValueAs: nullIfEmpty })}
              className={inputClass}
            >
              <option value="">Whole property</option>
              {zones.map((z) => (
                <option key={z.id} value={z.id}>
                  {z.name}
                </option>
              ))}
            </select>
          </Field>
          <Field id="st-date" label="Date sampled" error={errors.sampledOn?.message}>
            <input
              id="st-date"
              type="date"
              {...register("sampledOn")}
              aria-invalid={errors.sampledOn ? true : undefined}
              className={inputClass}
            />
          </Field>
          <Field id="st-lab" label="Lab" error={errors.lab?.message}>
            <input
              id="st-lab"
              {...register("lab")}
              aria-invalid={errors.lab ? true : undefined}
              className={inputClass}
            />
          </Field>
          {number("sampleDepthIn", "Sample depth (in)")}
          <Field id="st-extractant" label="Extractant" error={errors.extractant?.message}>
            <select id="st-extractant" {...register("extractant")} className={inputClass}>
              {SOIL_EXTRACTANTS.map((x) => (
                <option key={x} value={x}>
                  {t(`soilExtractants.${x}`)}
                </option>
              ))}
            </select>
          </Field>
          {number("ph", "Soil pH", "e.g. 6.2")}
          {number("bufferPh", "Buffer pH (optional)")}
          <Field id="st-buffer" label="Buffer method" error={errors.bufferMethod?.message}>
            <select
              id="st-buffer"
              {...register("bufferMethod", { setValueAs: nullIfEmpty })}
              aria-invalid={errors.bufferMethod ? true : undefined}
              className={inputClass}
            >
              <option value="">None reported</option>
              {BUFFER_METHODS.map((x) => (
                <option key={x} value={x}>
                  {t(`bufferMethods.${x}`)}
                </option>
              ))}
            </select>
          </Field>
        </div>
        <fieldset className="grid grid-cols-2 gap-3 sm:grid-cols-3">
          <legend className="mb-1 font-semibold">
            Nutrients, ppm (leave blank what the lab did not report)
          </legend>
          {number("pPpm", "Phosphorus (P)")}
          {number("kPpm", "Potassium (K)")}
          {number("caPpm", "Calcium (Ca)")}
          {number("mgPpm", "Magnesium (Mg)")}
          {number("sPpm", "Sulfur (S)")}
          {number("organicMatterPct", "Organic matter (%)")}
        </fieldset>
        <div className="grid gap-3 sm:grid-cols-2">
          {number("labLimeLbPer1000", "Lab's lime recommendation (lb per 1,000 ft², optional)")}
          <Field
            id="st-pneed"
            label="The lab's word on phosphorus"
            error={errors.labPhosphorusNeeded?.message}
          >
            <select
              id="st-pneed"
              {...register("labPhosphorusNeeded", {
                setValueAs: (v: unknown) => (v === "yes" ? true : v === "no" ? false : null),
              })}
              className={inputClass}
            >
              <option value="">Not stated</option>
              <option value="yes">Phosphorus needed</option>
              <option value="no">Phosphorus not needed</option>
            </select>
          </Field>
        </div>
        <Field id="st-notes" label="Notes (optional)" error={errors.notes?.message}>
          <input id="st-notes" {...register("notes")} className={inputClass} />
        </Field>
        <Button type="submit" disabled={isSubmitting}>
          <FlaskConical className="size-5" aria-hidden="true" /> Save soil test
        </Button>
      </form>
    </details>
  );
}

function ImportSoilTests({ propertyId }: { propertyId: string }) {
  const router = useRouter();
  const fileId = useId();
  const [csv, setCsv] = useState<string | null>(null);
  const [fileName, setFileName] = useState("");
  const [preview, setPreview] = useState<SoilTestImportDto | null>(null);
  const [errors, setErrors] = useState<string[]>([]);
  const [done, setDone] = useState<string | null>(null);
  const [busy, setBusy] = useState(false);

  async function send(text: string, asPreview: boolean) {
    setBusy(true);
    const result = await sendJson<SoilTestImportDto>(
      "POST",
      `/api/v1/properties/${propertyId}/soil-tests/import`,
      { csv: text, preview: asPreview },
    );
    setBusy(false);
    if (!result.ok) {
      setPreview(null);
      setErrors([result.error.message, ...(result.error.fieldErrors?.csv ?? [])]);
      return null;
    }
    setErrors([]);
    return result.data;
  }

  async function choose(file: File | undefined) {
    setPreview(null);
    setDone(null);
    setErrors([]);
    if (!file) return;
    const text = await file.text();
    setCsv(text);
    setFileName(file.name);
    setPreview(await send(text, true));
  }

  async function confirm() {
    if (!csv) return;
    const answer = await send(csv, false);
    if (!answer) return;
    setPreview(null);
    setCsv(null);
    setDone(
      `${answer.added} soil ${answer.added === 1 ? "test" : "tests"} imported from ${fileName}${answer.alreadyRecorded ? `; ${answer.alreadyRecorded} recorded already` : ""}.`,
    );
    router.refresh();
  }

  return (
    <details className="rounded-xl border border-line bg-card p-4">
      <summary className="flex min-h-tap cursor-pointer items-center gap-2 font-semibold">
        <Upload className="size-5 text-sward" aria-hidden="true" /> Import a lab&apos;s file (CSV)
      </summary>
      <div className="mt-3 space-y-3 text-sm">
        <p>
          One row a sample, with a header row. Required columns: <strong>Sampled on</strong>{" "}
          (2026-04-15 or 4/15/2026), <strong>Lab</strong>, <strong>Depth (in)</strong>,{" "}
          <strong>Extractant</strong> (Mehlich-3, Bray P1, Olsen, ammonium acetate or other).
          Optional: <strong>Zone</strong> (a zone&apos;s name; blank for the whole property),{" "}
          <strong>pH</strong>, <strong>Buffer pH</strong>, <strong>Buffer method</strong>,{" "}
          <strong>Organic matter (%)</strong>, <strong>P (ppm)</strong>, <strong>K (ppm)</strong>,{" "}
          <strong>Ca (ppm)</strong>, <strong>Mg (ppm)</strong>, <strong>S (ppm)</strong>,{" "}
          <strong>Lab lime (lb per 1,000 ft²)</strong>, <strong>Lab P needed</strong> (yes or no),{" "}
          <strong>Notes</strong>. Every row is checked first; if one is wrong, nothing is imported.
        </p>
        <label htmlFor={fileId} className="block font-semibold">
          Choose the file
        </label>
        <input
          id={fileId}
          type="file"
          accept=".csv,text/csv"
          onChange={(e) => void choose(e.currentTarget.files?.[0])}
          className="block min-h-tap w-full"
        />
        {busy ? <p aria-live="polite">Checking…</p> : null}
        {errors.length ? (
          <div role="alert" className="rounded-lg bg-clay-tint p-3 text-clay">
            <p className="font-semibold">{errors[0]}</p>
            <ul className="list-disc pl-5">
              {errors.slice(1).map((e) => (
                <li key={e}>{e}</li>
              ))}
            </ul>
          </div>
        ) : null}
        {preview ? (
          <div className="space-y-2 rounded-lg border border-line p-3" aria-live="polite">
            <p>
              {fileName}: {preview.rows} {preview.rows === 1 ? "row" : "rows"} read —{" "}
              {preview.added} new
              {preview.alreadyRecorded ? `, ${preview.alreadyRecorded} recorded already` : ""}.
            </p>
            {preview.added === 0 ? (
              <p className="font-semibold">Nothing new to import.</p>
            ) : (
              <Button onClick={confirm} disabled={busy}>
                <Upload className="size-5" aria-hidden="true" /> Import {preview.added}{" "}
                {preview.added === 1 ? "soil test" : "soil tests"}
              </Button>
            )}
          </div>
        ) : null}
        {done ? (
          <p role="status" className="font-semibold text-sward">
            {done}
          </p>
        ) : null}
      </div>
    </details>
  );
}
