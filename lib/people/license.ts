// An applicator license's standing on a day (pure). A license is good through its expiry date and
// lapses the day after. The warning window of 30 days before expiry is common practice (state
// certification offices send renewal notices ahead of expiry; there is no single published figure).
import { addDays, daysBetween, type IsoDate } from "@/lib/dates";

export const LICENSE_WARNING_DAYS = 30;

export type LicenseStanding = "none" | "valid" | "expiring" | "expired";

export interface LicenseOnRecord {
  number: string;
  category: string;
  /** The last day the license is good (YYYY-MM-DD). */
  expiresOn: IsoDate;
}

export function licenseStanding(license: LicenseOnRecord | null, today: IsoDate): LicenseStanding {
  if (!license || !license.number) return "none";
  if (license.expiresOn < today) return "expired";
  if (license.expiresOn <= addDays(today, LICENSE_WARNING_DAYS)) return "expiring";
  return "valid";
}

/** Whole days from `today` to the expiry (0 on the expiry day; negative once expired). */
export function daysUntilExpiry(license: LicenseOnRecord, today: IsoDate): number {
  return daysBetween(today, license.expiresOn);
}
