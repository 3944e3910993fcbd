// Company settings writes (managers): the locale and the time zone of their own company only.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";

import type { CompanySettingsDto } from "./dto";
import type { CompanySettingsInput } from "./schemas";

export async function saveCompanySettings(
  actor: Actor,
  input: CompanySettingsInput,
): Promise<CompanySettingsDto> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the company's settings.");
  const row = await db()
    .updateTable("companies")
    .set({ locale: input.locale, time_zone: input.timeZone })
    .where("id", "=", actor.companyId)
    .returning(["name", "locale", "time_zone"])
    .executeTakeFirst();
  if (!row) throw notFound("Company settings");
  return { companyName: row.name, locale: row.locale, timeZone: row.time_zone };
}
