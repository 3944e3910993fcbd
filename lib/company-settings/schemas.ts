// Company settings input (managers), shared by the route and the form: the locale (language and
// region, from the offered list) and the time zone (an IANA zone the runtime knows).
import { z } from "zod/mini";

import { isValidTimeZone } from "@/lib/dates";
import { isSupportedLocale } from "@/lib/i18n/locales";

export const companySettingsSchema = z.strictObject({
  locale: z
    .string()
    .check(z.refine(isSupportedLocale, "Language and region: choose one from the list.")),
  timeZone: z
    .string()
    .check(
      z.refine(
        isValidTimeZone,
        "Time zone: choose one from the list, e.g. America/New_York (Eastern Time).",
      ),
    ),
});

export type CompanySettingsInput = z.output<typeof companySettingsSchema>;
