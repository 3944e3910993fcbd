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

/**
 * The company's yard, where each day's route starts and ends: a label people read and its
 * location. Both coordinates empty (null) clear it; then routes are open unless a technician has
 * a start point.
 */
export const yardSchema = z.strictObject({
  address: z._default(
    z.string().check(z.trim(), z.maxLength(200, "Yard address: at most 200 characters.")),
    "",
  ),
  latitude: z.nullable(
    z
      .number("Yard latitude: a number between -90 and 90, e.g. 40.3342.")
      .check(
        z.gte(-90, "Yard latitude: between -90 and 90."),
        z.lte(90, "Yard latitude: between -90 and 90."),
      ),
  ),
  longitude: z.nullable(
    z
      .number("Yard longitude: a number between -180 and 180, e.g. -74.7391.")
      .check(
        z.gte(-180, "Yard longitude: between -180 and 180."),
        z.lte(180, "Yard longitude: between -180 and 180."),
      ),
  ),
});
export type YardInput = z.output<typeof yardSchema>;
