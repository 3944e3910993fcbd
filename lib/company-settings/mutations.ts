// Company settings writes (managers): the locale and the time zone of their own company only.
import "server-only";

import { db } from "@/db";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { halfGivenPlace } from "@/lib/day-route/schemas";
import { AppError, notFound } from "@/lib/http/app-error";

import type { CompanySettingsDto } from "./dto";
import { toCompanySettingsDto } from "./queries";
import type { CompanySettingsInput, YardInput } from "./schemas";

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
    .returning(["name", "locale", "time_zone", "yard_address", "yard_latitude", "yard_longitude"])
    .executeTakeFirst();
  if (!row) throw notFound("Company settings");
  return toCompanySettingsDto(row);
}

/** The company's yard (audited): both coordinates or neither. */
export async function saveYard(actor: Actor, input: YardInput): Promise<CompanySettingsDto> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the company's settings.");
  const half = halfGivenPlace("Yard", input);
  if (half) throw new AppError("invalid_input", "Some values need attention.", half);
  return db()
    .transaction()
    .execute(async (trx) => {
      const before = await trx
        .selectFrom("companies")
        .select(["yard_address", "yard_latitude", "yard_longitude"])
        .where("id", "=", actor.companyId)
        .forUpdate()
        .executeTakeFirst();
      if (!before) throw notFound("Company settings");
      const row = await trx
        .updateTable("companies")
        .set({
          yard_address: input.address,
          yard_latitude: input.latitude,
          yard_longitude: input.longitude,
        })
        .where("id", "=", actor.companyId)
        .returning([
          "name",
          "locale",
          "time_zone",
          "yard_address",
          "yard_latitude",
          "yard_longitude",
        ])
        .executeTakeFirstOrThrow();
      await recordAudit(trx, actor, {
        entity: "company",
        entityId: actor.companyId,
        action: "update_yard",
        changes: {
          yardAddress: { from: before.yard_address, to: row.yard_address },
          yardLocation: {
            from:
              before.yard_latitude === null ? null : [before.yard_latitude, before.yard_longitude],
            to: row.yard_latitude === null ? null : [row.yard_latitude, row.yard_longitude],
          },
        },
      });
      return toCompanySettingsDto(row);
    });
}
