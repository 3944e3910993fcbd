// Reads of the day's route: a technician's stops of a day with their locations, where the day
// starts (the technician's start point, else the company's yard, else nowhere: an open route), and
// the route worked out over the routing service's matrix (or the estimate when it fails).
import "server-only";

import type { Kysely, Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";
import { todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";
import { services } from "@/lib/services";
import { travelMatrix } from "@/lib/services/routing/client";

import type { DayRouteDto } from "./dto";
import { dayRoute, routePoints, type DayStop, type Depot } from "./plan";

type Executor = Kysely<Database> | Transaction<Database>;

/**
 * Whose day: a technician's own (another technician's is 404, as out of scope); a manager names
 * one of the company's technicians.
 */
export async function dayTechnician(
  executor: Executor,
  actor: Actor,
  technicianId: string | undefined,
): Promise<string> {
  if (actor.role === "technician") {
    if (technicianId && technicianId !== actor.userId) throw notFound("That technician's day");
    return actor.userId;
  }
  if (actor.role !== "manager") throw notFound("That day");
  if (!technicianId)
    throw new AppError("invalid_input", "Some values need attention.", {
      technicianId: ["Technician: choose whose day."],
    });
  const tech = await executor
    .selectFrom("memberships")
    .select("user_id")
    .where("company_id", "=", actor.companyId)
    .where("user_id", "=", technicianId)
    .where("role", "=", "technician")
    .executeTakeFirst();
  if (!tech)
    throw new AppError("invalid_input", "Some values need attention.", {
      technicianId: ["Technician: choose one of your technicians."],
    });
  return technicianId;
}

/** Every stop of the technician's day (called-off ones too), in stored order. */
export function dayStopsQuery(
  executor: Executor,
  actor: Actor,
  technicianId: string,
  date: string,
) {
  return executor
    .selectFrom("visits")
    .innerJoin("properties", (j) =>
      j
        .onRef("properties.id", "=", "visits.property_id")
        .onRef("properties.company_id", "=", "visits.company_id"),
    )
    .select([
      "visits.id",
      "visits.status",
      "visits.stop_order",
      "properties.name as property_name",
      "properties.latitude",
      "properties.longitude",
    ])
    .where(visitInScope(actor))
    .where("visits.technician_id", "=", technicianId)
    .where("visits.scheduled_for", "=", date)
    .orderBy("visits.stop_order")
    .orderBy("properties.name")
    .orderBy("visits.id");
}

/** The technician's start point, else the company's yard, else null (an open route). */
export async function findDepot(
  executor: Executor,
  actor: Actor,
  technicianId: string,
): Promise<Depot | null> {
  const row = await executor
    .selectFrom("memberships")
    .innerJoin("companies", "companies.id", "memberships.company_id")
    .select([
      "memberships.start_label",
      "memberships.start_latitude",
      "memberships.start_longitude",
      "companies.yard_address",
      "companies.yard_latitude",
      "companies.yard_longitude",
    ])
    .where("memberships.company_id", "=", actor.companyId)
    .where("memberships.user_id", "=", technicianId)
    .executeTakeFirst();
  if (!row) return null;
  if (row.start_latitude !== null && row.start_longitude !== null)
    return {
      kind: "start_point",
      label: row.start_label || "Your start point",
      latitude: row.start_latitude,
      longitude: row.start_longitude,
    };
  if (row.yard_latitude !== null && row.yard_longitude !== null)
    return {
      kind: "yard",
      label: row.yard_address || "The yard",
      latitude: row.yard_latitude,
      longitude: row.yard_longitude,
    };
  return null;
}

export const toDayStop = (r: {
  id: string;
  status: string;
  property_name: string;
  latitude: number;
  longitude: number;
}): DayStop => ({
  visitId: r.id,
  propertyName: r.property_name,
  started: r.status !== "scheduled",
  latitude: r.latitude,
  longitude: r.longitude,
});

/** The day's route of a technician (their own for a technician). Never fails on the routing service. */
export async function getDayRoute(
  actor: Actor,
  query: { date?: string; technicianId?: string },
): Promise<DayRouteDto> {
  const date = query.date ?? todayIn(actor.companyTimeZone);
  const technicianId = await dayTechnician(db(), actor, query.technicianId);
  const rows = await dayStopsQuery(db(), actor, technicianId, date).execute();
  const stops = rows.filter((r) => r.status !== "cancelled").map(toDayStop);
  const depot = await findDepot(db(), actor, technicianId);
  const { matrix, estimated, reason } = await travelMatrix(
    services().routing,
    routePoints(stops, depot),
  );
  return {
    date,
    technicianId,
    start: depot ? { kind: depot.kind, label: depot.label } : null,
    estimated,
    estimateReason: reason,
    ...dayRoute(stops, depot, matrix),
  };
}
