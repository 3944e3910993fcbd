// Company settings input (managers), shared by the route and the form: the locale (language and
// region, from the offered list) and the time zone (an IANA zone the runtime knows).
import { z } from "zod/mini";

import { isValidTimeZone } from "@/lib/dates";
import { placeSchema } from "@/lib/day-route/schemas";
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

/**
 * The company's yard, where each day's route starts and ends: a label people read and its
 * location. Both coordinates empty (null) clear it; then routes are open unless a technician has
 * a start point.
 */
export const yardSchema = placeSchema("Yard");
export type YardInput = z.output<typeof yardSchema>;
