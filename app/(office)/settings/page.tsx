import type { Metadata } from "next";
import { NextIntlClientProvider } from "next-intl";
import { getMessages, getTranslations } from "next-intl/server";

import { CompanySettingsForm } from "@/components/settings/company-settings-form";
import { PressureSettingsForm } from "@/components/settings/pressure-settings-form";
import { YardForm } from "@/components/settings/yard-form";
import { requireActor } from "@/lib/auth/require";
import { getCompanySettings } from "@/lib/company-settings/queries";
import { LOCALES } from "@/lib/i18n/locales";
import { getPressureSettings } from "@/lib/pressure-areas/queries";
import { timeZoneChoices } from "@/lib/time-zones";

export const metadata: Metadata = { title: "Company settings" };

export default async function SettingsPage() {
  const actor = await requireActor(["manager"]);
  const [settings, pressure] = await Promise.all([
    getCompanySettings(actor),
    getPressureSettings(actor),
  ]);
  const t = await getTranslations("settings");
  const messages = await getMessages();
  return (
    <>
      <h1 className="text-3xl font-bold">{t("title")}</h1>
      <p className="mt-1 mb-6 max-w-prose text-muted">
        {t("intro", { company: settings.companyName })}
      </p>
      <NextIntlClientProvider messages={{ settings: messages.settings }}>
        <CompanySettingsForm
          settings={settings}
          locales={LOCALES.map((l) => ({ tag: l.tag, label: l.label }))}
          timeZones={timeZoneChoices()}
        />
        <PressureSettingsForm settings={pressure} />
        <YardForm yard={settings.yard} />
      </NextIntlClientProvider>
    </>
  );
}
