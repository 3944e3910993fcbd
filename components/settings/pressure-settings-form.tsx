"use client";

// The company's pressure-area settings (manager): distance, days, fewest properties.
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { HydratedForm } from "@/components/ui/hydrated-form";
import type { PressureSettingsDto } from "@/lib/pressure-areas/dto";
import { pressureSettingsSchema, type PressureSettingsInput } from "@/lib/pressure-areas/schemas";
import { sendJson } from "@/lib/query-client";

const resolver = formResolver(pressureSettingsSchema);

export function PressureSettingsForm({ settings }: { settings: PressureSettingsDto }) {
  const t = useTranslations("settings");
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<PressureSettingsInput>({ resolver, defaultValues: settings });
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await sendJson<PressureSettingsDto>(
      "PUT",
      "/api/v1/company-settings/pressure-areas",
      values,
    );
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError);
      setMessage(result.error.message);
      return;
    }
    setMessage(t("pressureSaved"));
    router.refresh();
  });
  const field = (
    name: keyof PressureSettingsInput,
    label: string,
    hint: string,
    inputMode: "decimal" | "numeric",
  ) => (
    <Field id={`pressure-${name}`} label={label} hint={hint} error={errors[name]?.message}>
      <input
        id={`pressure-${name}`}
        inputMode={inputMode}
        className={`${inputClass} tabular-nums`}
        aria-describedby={`pressure-${name}-hint`}
        aria-invalid={errors[name] ? true : undefined}
        {...register(name, { setValueAs: numberOrNull })}
      />
    </Field>
  );
  return (
    <HydratedForm
      id="pressure-settings"
      onSubmit={onSubmit}
      className="mt-8 max-w-xl space-y-5 rounded-xl border border-line bg-card p-4"
      aria-labelledby="pressure-settings-title"
      noValidate
    >
      <h2 id="pressure-settings-title" className="text-xl font-bold">
        {t("pressureTitle")}
      </h2>
      <p className="text-sm text-muted">{t("pressureIntro")}</p>
      {field("distanceMi", t("pressureDistance"), t("pressureDistanceHint"), "decimal")}
      {field("days", t("pressureDays"), t("pressureDaysHint"), "numeric")}
      {field(
        "minProperties",
        t("pressureMinProperties"),
        t("pressureMinPropertiesHint"),
        "numeric",
      )}
      {message ? (
        <p role="status" className="font-semibold">
          {message}
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting}>
        {isSubmitting ? t("saving") : t("pressureSave")}
      </Button>
    </HydratedForm>
  );
}
