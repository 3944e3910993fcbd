"use client";

// The company's yard (manager): a label and its latitude and longitude, where each technician's
// day on Today starts and ends.
import { useTranslations } from "next-intl";
import { useRouter } from "next/navigation";
import { useState } from "react";
import { useForm } from "react-hook-form";
import type { z } from "zod/mini";

import { Button } from "@/components/ui/button";
import { applyFieldErrors, Field, inputClass, numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { HydratedForm } from "@/components/ui/hydrated-form";
import type { CompanySettingsDto } from "@/lib/company-settings/dto";
import { yardSchema } from "@/lib/company-settings/schemas";
import { sendJson } from "@/lib/query-client";

const resolver = formResolver(yardSchema);
type FormIn = z.input<typeof yardSchema>;
type FormOut = z.output<typeof yardSchema>;

export function YardForm({ yard }: { yard: CompanySettingsDto["yard"] }) {
  const t = useTranslations("settings.yard");
  const router = useRouter();
  const [message, setMessage] = useState<string | null>(null);
  const {
    register,
    handleSubmit,
    setError,
    formState: { errors, isSubmitting },
  } = useForm<FormIn, unknown, FormOut>({ resolver, defaultValues: yard });
  const onSubmit = handleSubmit(async (values) => {
    setMessage(null);
    const result = await sendJson<CompanySettingsDto>(
      "PUT",
      "/api/v1/company-settings/yard",
      values,
    );
    if (!result.ok) {
      applyFieldErrors(result.error.fieldErrors, setError);
      setMessage(result.error.message);
      return;
    }
    setMessage(result.data.yard.latitude === null ? t("cleared") : t("saved"));
    router.refresh();
  });
  return (
    <HydratedForm
      onSubmit={onSubmit}
      aria-labelledby="yard-heading"
      className="mt-6 max-w-xl space-y-5 rounded-xl border border-line bg-card p-4"
      noValidate
    >
      <div>
        <h2 id="yard-heading" className="text-xl font-bold">
          {t("title")}
        </h2>
        <p className="mt-1 text-muted">{t("intro")}</p>
      </div>
      <Field id="yard-address" label={t("address")} error={errors.address?.message}>
        <input
          id="yard-address"
          className={inputClass}
          autoComplete="off"
          aria-invalid={errors.address ? true : undefined}
          {...register("address")}
        />
      </Field>
      <div className="grid gap-4 sm:grid-cols-2">
        <Field id="yard-latitude" label={t("latitude")} error={errors.latitude?.message}>
          <input
            id="yard-latitude"
            inputMode="decimal"
            className={inputClass}
            aria-describedby="yard-location-hint"
            aria-invalid={errors.latitude ? true : undefined}
            {...register("latitude", { setValueAs: numberOrNull })}
          />
        </Field>
        <Field id="yard-longitude" label={t("longitude")} error={errors.longitude?.message}>
          <input
            id="yard-longitude"
            inputMode="decimal"
            className={inputClass}
            aria-describedby="yard-location-hint"
            aria-invalid={errors.longitude ? true : undefined}
            {...register("longitude", { setValueAs: numberOrNull })}
          />
        </Field>
      </div>
      <p id="yard-location-hint" className="-mt-3 text-sm text-muted">
        {t("locationHint")}
      </p>
      {message ? (
        <p role="status" className="font-semibold">
          {message}
        </p>
      ) : null}
      <Button type="submit" disabled={isSubmitting}>
        {t("save")}
      </Button>
    </HydratedForm>
  );
}
