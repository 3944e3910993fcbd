"use client";

// The company's locale and time zone (manager), with a preview of how dates, times and numbers
// read in the chosen locale (Intl through next-intl's formatter).
import { useFormatter, useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm, useWatch } from "react-hook-form";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { HydratedForm } from "@/components/ui/hydrated-form";
import type { CompanySettingsDto } from "@/lib/company-settings/dto";
import { companySettingsSchema, type CompanySettingsInput } from "@/lib/company-settings/schemas";
import { sendJson } from "@/lib/query-client";

const resolver = formResolver(companySettingsSchema);
const SAMPLE = new Date("2026-12-02T20:05:00Z");

export function CompanySettingsForm({
  settings,
  locales,
  timeZones,
}: {
  settings: CompanySettingsDto;
  locales: { tag: string; label: string }[];
  timeZones: string[];
}) {
  const t = useTranslations("settings");
  const format = useFormatter();
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    control,
    formState: { errors, isSubmitting },
  } = useForm<CompanySettingsInput>({
    resolver,
    defaultValues: { locale: settings.locale, timeZone: settings.timeZone },
  });
  const timeZone = useWatch({ control, name: "timeZone" });
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await sendJson<CompanySettingsDto>("PUT", "/api/v1/company-settings", values);
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError);
      setMessage(result.error.message);
      return;
    }
    setMessage(t("saved"));
    router.refresh();
  });
  return (
    <HydratedForm
      onSubmit={onSubmit}
      className="max-w-xl space-y-5 rounded-xl border border-line bg-card p-4"
      noValidate
    >
      <Field
        id="settings-locale"
        label={t("locale")}
        hint={t("localeHint")}
        error={errors.locale?.message}
      >
        <select
          id="settings-locale"
          className={inputClass}
          aria-describedby="settings-locale-hint"
          aria-invalid={errors.locale ? true : undefined}
          {...register("locale")}
        >
          {locales.map((l) => (
            <option key={l.tag} value={l.tag}>
              {l.label}
            </option>
          ))}
        </select>
      </Field>
      <Field
        id="settings-time-zone"
        label={t("timeZone")}
        hint={t("timeZoneHint")}
        error={errors.timeZone?.message}
      >
        <select
          id="settings-time-zone"
          className={inputClass}
          aria-describedby="settings-time-zone-hint"
          aria-invalid={errors.timeZone ? true : undefined}
          {...register("timeZone")}
        >
          {timeZones.map((tz) => (
            <option key={tz} value={tz}>
              {tz.replaceAll("_", " ")}
            </option>
          ))}
        </select>
      </Field>
      <section aria-labelledby="settings-preview" className="rounded-lg bg-paper p-3">
        <h2 id="settings-preview" className="font-semibold">
          {t("preview")}
        </h2>
        <dl className="mt-2 grid grid-cols-[auto_1fr] gap-x-4 gap-y-1 text-sm">
          <dt className="text-muted">{t("previewDate")}</dt>
          <dd className="tabular-nums">
            {format.dateTime(SAMPLE, {
              weekday: "short",
              day: "numeric",
              month: "short",
              year: "numeric",
              timeZone,
            })}
          </dd>
          <dt className="text-muted">{t("previewDateTime")}</dt>
          <dd className="tabular-nums">
            {format.dateTime(SAMPLE, {
              weekday: "short",
              day: "numeric",
              month: "short",
              hour: "numeric",
              minute: "2-digit",
              timeZone,
            })}
          </dd>
          <dt className="text-muted">{t("previewNumber")}</dt>
          <dd className="tabular-nums">{format.number(12345.67, { maximumFractionDigits: 2 })}</dd>
          <dt className="text-muted">{t("previewUnits")}</dt>
          <dd>{t("units")}</dd>
        </dl>
      </section>
      {message ? (
        <p role="status" className="font-semibold">
          {message}
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? t("saving") : t("save")}
      </Button>
    </HydratedForm>
  );
}
