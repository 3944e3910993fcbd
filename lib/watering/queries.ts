// Watering log reads, within the actor's property scope.
import "server-only";

import type { Selectable } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope, visitInScope } from "@/lib/auth/scope";
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
  return rows.map(toWateringDto);
}

type WateringRow = Selectable<Database["waterings"]> & {
  zone_name: string | null;
  user_name: string | null;
};

/** The waterings recorded on a visit (staff who reach the visit), oldest first. */
export async function listVisitWaterings(actor: Actor, visitId: string): Promise<WateringDto[]> {
  if (actor.role === "homeowner") return [];
  const rows = await db()
    .selectFrom("waterings")
    .innerJoin("visits", "visits.id", "waterings.visit_id")
    .leftJoin("zones", "zones.id", "waterings.zone_id")
    .leftJoin("users", "users.id", "waterings.created_by")
    .selectAll("waterings")
    .select(["zones.name as zone_name", "users.name as user_name"])
    .where(visitInScope(actor))
    .where("waterings.company_id", "=", actor.companyId)
    .where("waterings.visit_id", "=", visitId)
    .orderBy("waterings.created_at")
    .execute();
  return rows.map(toWateringDto);
}

function toWateringDto(r: WateringRow): WateringDto {
  return {
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
    enteredById: r.created_by,
    visitId: r.visit_id,
    notes: r.notes,
  };
}
