// The acting user of a request, as the data-access layer sees it. Always loaded from the
// database (lib/auth/queries.ts), so a disabled account or a changed role applies at once.
import type { Role } from "@/db/schema";
import { BOOK_PATH } from "@/lib/paths";

export interface Actor {
  userId: string;
  companyId: string;
  companyName: string;
  companyTimeZone: string;
  /** The company's locale (BCP 47, lib/i18n/locales.ts): words, dates and units. */
  companyLocale: string;
  role: Role;
  email: string;
  name: string;
  sessionId: string;
}

export const ROLES = ["manager", "technician", "homeowner"] as const satisfies readonly Role[];

/** Where each role lands after signing in. */
export function landingPath(role: Role): string {
  return { manager: BOOK_PATH, technician: "/today", homeowner: "/my-lawn" }[role];
}
