"use client";

// One zone check on a phone: ratings, ground, symptoms, mowing signs, notes — or "zone skipped".
// Every tap is kept on the device and autosaved; nothing needs typing except notes.
import { Ban, CheckCircle2, RotateCcw } from "lucide-react";
import { useState } from "react";

import { ApplicationPanel } from "@/components/applications/application-panel";
import { ConflictPanel } from "@/components/offline/conflict-panel";
import { PhotoUploader } from "@/components/photos/photo-uploader";
import { Button } from "@/components/ui/button";
import { CharacterCount } from "@/components/ui/character-count";
import { ChoiceGroup } from "@/components/ui/choice-group";
import { Stepper } from "@/components/ui/stepper";
import { ToggleChip } from "@/components/ui/toggle-chip";
import type { ApplicationDto } from "@/lib/applications/dto";
import type { OutboxOp } from "@/lib/offline/db";
import type { PhotoDto } from "@/lib/photos/dto";
import type { ZoneDto } from "@/lib/properties/dto";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { mowingReading, mowingSentence } from "@/lib/reference/mowing";
import {
  MOWED_TODAY,
  MOWING_DIRECTION,
  RATING_FIELDS,
  SKIP_REASONS,
  SOIL_MOISTURE,
} from "@/lib/reference/visit-options";
import type { LastZoneCheckDto, ZoneCheckDto, ZoneCheckValues } from "@/lib/visits/dto";
import { parseProbeReading, ZONE_CHECK_BOUNDS } from "@/lib/visits/zone-check-bounds";
import { mowingConsistency, zoneCheckCompleteness } from "@/lib/visits/zone-check-rules";

import { LastCheck } from "./last-check";
import { RatingPicker } from "./rating-picker";
import { SaveStatus } from "./save-status";
import { SymptomPicker } from "./symptom-picker";
import { useZoneCheckAutosave } from "./use-zone-check-autosave";

const choicesOf = <T extends string>(labels: Record<T, string>) =>
  (Object.entries(labels) as [T, string][]).map(([value, label]) => ({ value, label }));

function Section({ title, children }: { title: string; children: React.ReactNode }) {
  return (
    <section className="space-y-4 rounded-xl border border-line bg-card p-4">
      <h3 className="text-lg font-bold">{title}</h3>
      {children}
    </section>
  );
}

export function ZoneCheckForm({
  visitId,
  zone,
  serverCheck,
  canEdit,
  timeZone,
  onSaved,
  footer,
  photos,
  onPhotoUploaded,
  applications,
  onApplicationRecorded,
  ruleSetId,
  isManager,
  weather,
  correctionReason = null,
  entries,
  lastCheck,
  waiting = [],
}: {
  /** This visit's operations waiting in the phone's outbox. */
  waiting?: OutboxOp[];
  /** On a finished visit: the reason for the manager's correction, sent with every save. */
  correctionReason?: string | null;
  /** Correct and Delete of this zone's photos and applications, for whoever may. */
  entries?: {
    canChange: (authorId: string | null) => boolean;
    deletePhoto: (photo: PhotoDto) => void;
    correctApplication: (a: ApplicationDto) => void;
    deleteApplication: (a: ApplicationDto) => void;
  };
  /** The zone's last check at an earlier finished visit, to compare with. */
  lastCheck?: LastZoneCheckDto;
  weather: {
    tmaxF: number;
    tminF?: number;
    precipIn?: number;
    isForecast?: boolean;
    windMph: number | null;
  } | null;
  applications: ApplicationDto[];
  onApplicationRecorded: (application: ApplicationDto) => void;
  ruleSetId: string | null;
  isManager: boolean;
  footer?: React.ReactNode;
  photos: PhotoDto[];
  onPhotoUploaded: (photo: PhotoDto) => void;
  visitId: string;
  zone: ZoneDto;
  serverCheck: ZoneCheckDto | undefined;
  canEdit: boolean;
  timeZone: string;
  onSaved: (check: ZoneCheckDto) => void;
}) {
  const { values, saveState, isRestored, isReady, store } = useZoneCheckAutosave(
    visitId,
    zone.id,
    serverCheck,
    canEdit,
    onSaved,
    correctionReason,
  );
  const [localErrors, setLocalErrors] = useState<Record<string, string[]>>({});
  // The probe reading as typed: a reading outside 0–100 % stays in the box with its message and is
  // not saved (the last good reading stays saved), never clamped.
  const [probeText, setProbeText] = useState<string | null>(null);
  const serverErrors = saveState.kind === "invalid" ? saveState.fieldErrors : {};
  const errorOf = (field: string) => localErrors[field]?.[0] ?? serverErrors[field]?.[0];
  const set = <K extends keyof ZoneCheckValues>(field: K, value: ZoneCheckValues[K]) => {
    setLocalErrors((e) => ({ ...e, [field]: [] }));
    store.update((v) => {
      const next = { ...v, [field]: value };
      // Clearing a rating on a zone marked done puts it back to draft instead of failing to save.
      if (
        next.status === "done" &&
        (Object.keys(RATING_FIELDS) as (keyof typeof RATING_FIELDS)[]).some((k) => next[k] === null)
      )
        next.status = "draft";
      return next;
    });
  };
  const setMowedToday = (choice: keyof typeof MOWED_TODAY | null) => {
    setLocalErrors((e) => ({ ...e, heightBeforeMowingIn: [] }));
    store.update((v) => ({
      ...v,
      mowedToday: choice === null ? null : choice === "yes",
      // A height before mowing belongs to a mowing at this visit only.
      heightBeforeMowingIn: choice === "yes" ? v.heightBeforeMowingIn : null,
    }));
  };
  const species = findGrassSpecies(zone.grassSpecies.key);
  const reading = mowingReading(values);
  const mowingError =
    mowingConsistency(values).heightBeforeMowingIn ?? errorOf("heightBeforeMowingIn");
  const isSkipped = values.status === "skipped";
  const disabled = !canEdit;

  function markDone() {
    const missing = zoneCheckCompleteness({ ...values, status: "done" });
    if (Object.keys(missing).length) {
      setLocalErrors(
        Object.fromEntries(Object.entries(missing).map(([field, message]) => [field, [message]])),
      );
      return;
    }
    setLocalErrors({});
    store.update((v) => ({ ...v, status: "done" }));
  }

  return (
    <fieldset disabled={!isReady} aria-busy={!isReady} className="min-w-0 space-y-4">
      <legend className="sr-only">Zone check of {zone.name}</legend>
      {isRestored ? (
        <p className="rounded-lg border border-rain bg-rain-tint p-3 text-ink" role="status">
          Restored the unsaved changes kept on this phone.
        </p>
      ) : null}
      {saveState.kind === "conflict" ? (
        <ConflictPanel
          theirs={saveState.current}
          mine={values}
          onKeepMine={() => store.resolveConflict("mine")}
          onUseTheirs={() => store.resolveConflict("theirs")}
        />
      ) : null}
      {isSkipped ? (
        <Section title="Zone skipped">
          <ChoiceGroup
            label="Why was the zone skipped?"
            choices={choicesOf(SKIP_REASONS)}
            value={values.skipReason}
            onChange={(v) => set("skipReason", v)}
            columns={2}
            allowClear={false}
          />
          {errorOf("skipReason") ? (
            <p className="font-semibold text-clay">{errorOf("skipReason")}</p>
          ) : null}
          <label className="block space-y-1">
            <span className="font-semibold">
              {values.skipReason === "other"
                ? "Describe the reason (required)"
                : "Anything to add (optional)"}
            </span>
            <textarea
              value={values.skipNote}
              disabled={disabled}
              onChange={(e) => set("skipNote", e.target.value)}
              rows={2}
              maxLength={1000}
              className="block w-full rounded-lg border border-line p-3 text-base"
            />
          </label>
          {errorOf("skipNote") ? (
            <p className="font-semibold text-clay">{errorOf("skipNote")}</p>
          ) : null}
          <Button
            type="button"
            variant="secondary"
            disabled={disabled}
            onClick={() => set("status", "draft")}
          >
            <RotateCcw className="size-5" aria-hidden="true" />
            Check this zone after all
          </Button>
        </Section>
      ) : (
        <>
          <Section title="Ratings">
            {lastCheck ? <LastCheck check={lastCheck} /> : null}
            {(Object.entries(RATING_FIELDS) as [keyof typeof RATING_FIELDS, string][]).map(
              ([field, label]) => (
                <RatingPicker
                  key={field}
                  id={`${zone.id}-${field}`}
                  label={label}
                  value={values[field]}
                  onChange={(v) => set(field, v)}
                  error={errorOf(field)}
                  lastValue={
                    lastCheck && lastCheck.status === "done" ? lastCheck[field] : undefined
                  }
                />
              ),
            )}
          </Section>

          <Section title="Ground">
            <div>
              <p className="mb-1 font-semibold">Bare ground</p>
              <Stepper
                label="Bare ground"
                value={values.barePct}
                onChange={(v) => set("barePct", v)}
                step={5}
                min={0}
                max={100}
                startAt={0}
                unit="%"
              />
            </div>
            <div>
              <p className="mb-1 font-semibold">Weeds</p>
              <Stepper
                label="Weeds"
                value={values.weedsPct}
                onChange={(v) => set("weedsPct", v)}
                step={5}
                min={0}
                max={100}
                startAt={0}
                unit="%"
              />
            </div>
            <div>
              <p className="mb-1 font-semibold">Thatch depth</p>
              <Stepper
                label="Thatch depth"
                value={values.thatchIn}
                onChange={(v) => set("thatchIn", v)}
                step={0.25}
                min={0}
                max={6}
                startAt={0.25}
                unit="in"
                format={(v) => v.toFixed(2)}
              />
            </div>
            <div className="space-y-2">
              <p className="font-semibold">Soil moisture</p>
              <ChoiceGroup
                label="Soil moisture"
                choices={choicesOf(SOIL_MOISTURE)}
                value={values.soilMoisture}
                onChange={(v) => set("soilMoisture", v)}
              />
              <label className="flex items-center gap-2">
                <span className="text-sm">Probe reading (optional)</span>
                <input
                  type="text"
                  inputMode="decimal"
                  disabled={disabled}
                  value={probeText ?? (values.soilMoisturePct ?? "").toString()}
                  onChange={(e) => {
                    setProbeText(e.target.value);
                    const reading = parseProbeReading(e.target.value);
                    if ("error" in reading)
                      setLocalErrors((errs) => ({ ...errs, soilMoisturePct: [reading.error] }));
                    else set("soilMoisturePct", reading.value);
                  }}
                  aria-invalid={errorOf("soilMoisturePct") ? true : undefined}
                  aria-describedby={errorOf("soilMoisturePct") ? "probe-error" : undefined}
                  className="min-h-tap w-24 rounded-lg border border-line px-2 text-right text-base aria-[invalid=true]:border-clay"
                  aria-label="Soil moisture probe reading in percent"
                />
                <span className="text-sm">%</span>
              </label>
              {errorOf("soilMoisturePct") ? (
                <p id="probe-error" className="font-semibold text-clay" role="alert">
                  {errorOf("soilMoisturePct")}
                </p>
              ) : null}
            </div>
          </Section>

          <Section title="Photos">
            <PhotoUploader
              visitId={visitId}
              zoneId={zone.id}
              ensureSaved={() => store.ensureSaved()}
              ensureQueued={() => store.ensureQueued()}
              waiting={waiting}
              photos={photos}
              onUploaded={onPhotoUploaded}
              disabled={disabled}
              uploadQuery={
                correctionReason ? `?correctionReason=${encodeURIComponent(correctionReason)}` : ""
              }
              canDelete={entries ? (p) => entries.canChange(p.uploadedById) : undefined}
              onDelete={entries?.deletePhoto}
            />
          </Section>

          <Section title="Applications">
            <ApplicationPanel
              visitId={visitId}
              zoneId={zone.id}
              areaFt2={zone.areaFt2}
              ruleSetId={ruleSetId}
              timeZone={timeZone}
              applications={applications}
              isManager={isManager}
              disabled={disabled}
              onRecorded={onApplicationRecorded}
              waiting={waiting}
              weather={weather}
              correctionReason={correctionReason}
              entries={
                entries
                  ? {
                      canChange: (a) => entries.canChange(a.createdById),
                      correct: entries.correctApplication,
                      remove: entries.deleteApplication,
                    }
                  : undefined
              }
            />
          </Section>

          <Section title="Symptoms">
            <SymptomPicker
              value={values.symptoms}
              onChange={(v) => set("symptoms", v)}
              disabled={disabled}
            />
          </Section>

          <Section title="Mowing">
            <div className="space-y-2">
              <p className="font-semibold">Mowed at this visit?</p>
              <ChoiceGroup
                label="Mowed at this visit"
                choices={choicesOf(MOWED_TODAY)}
                value={values.mowedToday === null ? null : values.mowedToday ? "yes" : "no"}
                onChange={setMowedToday}
                columns={2}
              />
            </div>
            {values.mowedToday ? (
              <div>
                <p className="mb-1 font-semibold">Grass height before mowing</p>
                <p className="mb-2 text-sm text-muted">
                  Measure before the mower goes over. The one-third rule: take off no more than a
                  third of the blade at one mowing.
                </p>
                <Stepper
                  label="Height before mowing"
                  value={values.heightBeforeMowingIn}
                  onChange={(v) => set("heightBeforeMowingIn", v)}
                  step={0.25}
                  min={ZONE_CHECK_BOUNDS.heightBeforeMowingIn.min}
                  max={ZONE_CHECK_BOUNDS.heightBeforeMowingIn.max}
                  startAt={Math.max(4, values.heightOfCutIn ?? 0)}
                  unit="in"
                  format={(v) => v.toFixed(2)}
                />
                {mowingError ? (
                  <p className="mt-1 font-semibold text-clay" role="alert">
                    {mowingError}
                  </p>
                ) : null}
              </div>
            ) : null}
            <div>
              <p className="mb-1 font-semibold">
                {values.mowedToday ? "Height of cut, after mowing" : "Measured height of cut"}
              </p>
              {species ? (
                <p className="mb-2 text-sm text-muted">
                  {species.name}, home lawns: {species.heightOfCutIn.min}–
                  {species.heightOfCutIn.max} in
                </p>
              ) : null}
              {lastCheck && lastCheck.heightOfCutIn !== null ? (
                <p className="mb-2 text-sm font-semibold">
                  Last check: {lastCheck.heightOfCutIn.toFixed(2)} in
                </p>
              ) : null}
              <Stepper
                label="Height of cut"
                value={values.heightOfCutIn}
                onChange={(v) => set("heightOfCutIn", v)}
                step={0.25}
                min={ZONE_CHECK_BOUNDS.heightOfCutIn.min}
                max={ZONE_CHECK_BOUNDS.heightOfCutIn.max}
                startAt={3}
                unit="in"
                format={(v) => v.toFixed(2)}
              />
              <p className="mt-1 text-sm text-muted">
                Accepted: {ZONE_CHECK_BOUNDS.heightOfCutIn.min}–
                {ZONE_CHECK_BOUNDS.heightOfCutIn.max} in.
              </p>
              {errorOf("heightOfCutIn") ? (
                <p className="mt-1 font-semibold text-clay" role="alert">
                  {errorOf("heightOfCutIn")}
                </p>
              ) : null}
            </div>
            {reading ? (
              <p
                role="status"
                className={
                  reading.breaksOneThird
                    ? "rounded-lg bg-sun-tint p-3 text-sm font-semibold"
                    : "text-sm text-muted"
                }
              >
                {mowingSentence(reading)}
              </p>
            ) : null}
            <div className="space-y-2">
              <p className="font-semibold">Mowing direction, compared with the last check</p>
              <ChoiceGroup
                label="Mowing direction"
                choices={choicesOf(MOWING_DIRECTION)}
                value={values.mowingDirection}
                onChange={(v) => set("mowingDirection", v)}
                columns={3}
              />
            </div>
            <div className="grid grid-cols-2 gap-2">
              <ToggleChip
                label="Lay-over / matting"
                isOn={values.isMatted}
                onChange={(v) => set("isMatted", v)}
              />
              <ToggleChip
                label="Scalping"
                isOn={values.isScalped}
                onChange={(v) => set("isScalped", v)}
              />
              <ToggleChip
                label="Torn leaf tips"
                isOn={values.hasTornTips}
                onChange={(v) => set("hasTornTips", v)}
              />
              <ToggleChip
                label="Clumped clippings"
                isOn={values.hasClumpedClippings}
                onChange={(v) => set("hasClumpedClippings", v)}
              />
            </div>
            {values.hasTornTips ? (
              <p className="rounded-lg bg-sun-tint p-3 text-sm">
                Torn tips point to a dull blade. Remind the homeowner: blades are sharpened with the
                engine off and the spark plug disconnected, cutting edges pointed away from yourself
                and others.
              </p>
            ) : null}
          </Section>

          <Section title="Notes">
            <label className="block">
              <span className="sr-only">Notes about this zone</span>
              <textarea
                value={values.notes}
                disabled={disabled}
                onChange={(e) => set("notes", e.target.value)}
                rows={3}
                aria-describedby="zone-notes-count"
                aria-invalid={values.notes.length > ZONE_CHECK_BOUNDS.notesMax ? true : undefined}
                placeholder="What stood out in this zone"
                className="block w-full rounded-lg border border-line p-3 text-base aria-[invalid=true]:border-clay"
              />
            </label>
            <CharacterCount
              id="zone-notes-count"
              length={values.notes.length}
              max={ZONE_CHECK_BOUNDS.notesMax}
            />
            {errorOf("notes") ? (
              <p className="font-semibold text-clay" role="alert">
                {errorOf("notes")}
              </p>
            ) : null}
          </Section>

          {canEdit ? (
            <div className="grid gap-2 sm:grid-cols-2">
              {values.status === "done" ? (
                <p className="flex min-h-tap items-center gap-2 rounded-lg bg-sward-tint px-3 font-semibold text-sward-deep">
                  <CheckCircle2 className="size-5" aria-hidden="true" /> Zone marked done
                </p>
              ) : (
                <Button type="button" onClick={markDone}>
                  <CheckCircle2 className="size-5" aria-hidden="true" />
                  Mark zone done
                </Button>
              )}
              <Button type="button" variant="secondary" onClick={() => set("status", "skipped")}>
                <Ban className="size-5" aria-hidden="true" />
                Skip this zone
              </Button>
            </div>
          ) : null}
        </>
      )}
      {/* One row on a phone (status beside the buttons) so the rating area keeps at least 70 % of
          a 390×844 screen with the bottom navigation (tests/e2e/stop-outcomes.test.ts measures it). */}
      <div
        data-save-bar
        className="sticky bottom-[5.25rem] z-10 flex flex-wrap items-center gap-2 rounded-xl border border-line bg-card p-1.5 shadow-lg md:bottom-2"
      >
        <div
          className={
            saveState.kind === "retrying" ||
            saveState.kind === "invalid" ||
            saveState.kind === "locked"
              ? "basis-full" // a problem to read and act on: a row of its own
              : "min-w-0 flex-[1_1_6.5rem] empty:hidden"
          }
        >
          <SaveStatus state={saveState} onRetry={() => store.retryNow()} timeZone={timeZone} />
        </div>
        {footer ? <div className="flex min-w-0 flex-[1_1_13rem] gap-2">{footer}</div> : null}
      </div>
    </fieldset>
  );
}
