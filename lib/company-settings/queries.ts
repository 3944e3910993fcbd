// The company's settings as its managers see them.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { notFound } from "@/lib/http/app-error";

import type { CompanySettingsDto } from "./dto";

export const toCompanySettingsDto = (row: {
  name: string;
  locale: string;
  time_zone: string;
  yard_address: string;
  yard_latitude: number | null;
  yard_longitude: number | null;
}): CompanySettingsDto => ({
  companyName: row.name,
  locale: row.locale,
  timeZone: row.time_zone,
  yard: { address: row.yard_address, latitude: row.yard_latitude, longitude: row.yard_longitude },
});

export async function getCompanySettings(actor: Actor): Promise<CompanySettingsDto> {
  if (actor.role !== "manager") throw notFound("Company settings");
  const row = await db()
    .selectFrom("companies")
    .select(["name", "locale", "time_zone", "yard_address", "yard_latitude", "yard_longitude"])
    .where("id", "=", actor.companyId)
    .executeTakeFirst();
  if (!row) throw notFound("Company settings");
  return toCompanySettingsDto(row);
}
