// Watering log reads, within the actor's property scope.
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { assertPropertyInScope } from "@/lib/properties/queries";

import type { WateringDto } from "./dto";

export async function listWaterings(
  actor: Actor,
  propertyId: string,
  options: { from?: string; limit?: number } = {},
): Promise<WateringDto[]> {
  await assertPropertyInScope(actor, propertyId); // an unknown or foreign property is 404, as the property itself is
  const rows = await db()
    .selectFrom("waterings")
    .innerJoin("properties", "properties.id", "waterings.property_id")
    .leftJoin("zones", "zones.id", "waterings.zone_id")
    .leftJoin("users", "users.id", "waterings.created_by")
    .selectAll("waterings")
    .select(["zones.name as zone_name", "users.name as user_name"])
    .where(propertyInScope(actor))
    .where("waterings.company_id", "=", actor.companyId)
    .where("waterings.property_id", "=", propertyId)
    .$if(options.from !== undefined, (q) => q.where("waterings.watered_on", ">=", options.from!))
    .orderBy("waterings.watered_on", "desc")
    .orderBy("waterings.created_at", "desc")
    .limit(options.limit ?? 100)
    .execute();
  return rows.map((r) => ({
    id: r.id,
    zoneId: r.zone_id,
    zoneName: r.zone_name,
    wateredOn: r.watered_on,
    depthIn: Number(r.depth_in),
    runMinutes: r.run_minutes === null ? null : Number(r.run_minutes),
    precipitationRateInPerHour:
      r.precipitation_rate_in_per_h === null ? null : Number(r.precipitation_rate_in_per_h),
    enteredBy: r.user_name,
    enteredByRole: r.entered_by_role,
    notes: r.notes,
  }));
}
