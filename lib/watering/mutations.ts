// Logging a watering (staff, and homeowners for their own lawn). Idempotent by id; the alerts
// and the book follow in the same transaction (afterWrite).
import "server-only";

import { db } from "@/db";
import { afterWrite } from "@/lib/after-write";
import { usDate } from "@/lib/agronomy/season";
import { wateringDepthIn } from "@/lib/agronomy/water";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";

import type { WateringDto } from "./dto";
import { listWaterings } from "./queries";
import { WATERING_BACK_DAYS, type WateringInput } from "./schemas";

export async function logWatering(
  actor: Actor,
  propertyId: string,
  input: WateringInput,
): Promise<WateringDto> {
  const property = await db()
    .selectFrom("properties")
    .select(["properties.id", "properties.time_zone"])
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  // The property's own day: no watering in the future, none more than a year back.
  const today = todayIn(property.time_zone);
  if (input.wateredOn > today)
    throw new AppError("invalid_input", "Some values need attention.", {
      wateredOn: [`Date watered: not in the future (today is ${usDate(today)}).`],
    });
  if (input.wateredOn < addDays(today, -WATERING_BACK_DAYS))
    throw new AppError("invalid_input", "Some values need attention.", {
      wateredOn: [
        `Date watered: within the last year (${usDate(addDays(today, -WATERING_BACK_DAYS))} or later).`,
      ],
    });
  if (input.zoneId) {
    const zone = await db()
      .selectFrom("zones")
      .select("id")
      .where("company_id", "=", actor.companyId)
      .where("property_id", "=", propertyId)
      .where("id", "=", input.zoneId)
      .executeTakeFirst();
    if (!zone)
      throw new AppError("invalid_input", "Some values need attention.", {
        zoneId: ["That zone is not part of this property."],
      });
  }
  const depth =
    input.depthIn ?? wateringDepthIn(input.runMinutes!, input.precipitationRateInPerHour!);
  if (depth > 10)
    throw new AppError("invalid_input", "Some values need attention.", {
      runMinutes: ["That run time and rate make more than 10 in of water. Check both."],
    });
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .insertInto("waterings")
        .values({
          id: input.id,
          company_id: actor.companyId,
          property_id: propertyId,
          zone_id: input.zoneId,
          watered_on: input.wateredOn,
          depth_in: Math.round(depth * 1000) / 1000,
          run_minutes: input.runMinutes,
          precipitation_rate_in_per_h: input.precipitationRateInPerHour,
          entered_by_role: actor.role,
          notes: input.notes,
          created_by: actor.userId,
        })
        .onConflict((oc) => oc.column("id").doNothing())
        .returning("id")
        .executeTakeFirst();
      // The water balance feeds the drought and disease rules: the alerts and the book follow.
      if (row)
        await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "evaluate" });
    });
  const saved = (await listWaterings(actor, propertyId, { limit: 500 })).find(
    (w) => w.id === input.id,
  );
  if (!saved) throw new AppError("conflict", "A different watering already uses that id.");
  return saved;
}
