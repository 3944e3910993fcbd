// The company's settings as its managers see them.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { notFound } from "@/lib/http/app-error";

import type { CompanySettingsDto } from "./dto";

export async function getCompanySettings(actor: Actor): Promise<CompanySettingsDto> {
  if (actor.role !== "manager") throw notFound("Company settings");
  const row = await db()
    .selectFrom("companies")
    .select(["name", "locale", "time_zone"])
    .where("id", "=", actor.companyId)
    .executeTakeFirst();
  if (!row) throw notFound("Company settings");
  return { companyName: row.name, locale: row.locale, timeZone: row.time_zone };
}
