// Property reads, scoped to the actor in every WHERE: managers see their company's book,
// technicians the properties assigned to them, homeowners their own. Out of scope = not found.
import "server-only";

import type { SelectQueryBuilder } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/http/app-error";

import type { PropertyDetailDto, PropertySummaryDto } from "./dto";
import { toPropertySummaryDto, toZoneDto } from "./map";

type PropertyQuery<O> = SelectQueryBuilder<Database, "properties", O>;

function selectSummary<O>(query: PropertyQuery<O>) {
  return query
    .leftJoin("users as tech", "tech.id", "properties.technician_id")
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .select((eb) => [
      "properties.id",
      "properties.name",
      "properties.street",
      "properties.city",
      "properties.region",
      "properties.postal_code",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
      "properties.technician_id",
      "tech.name as technician_name",
      "properties.rule_set_id",
      "rule_sets.name as rule_set_name",
      "properties.archived_at",
      "properties.notes",
      "properties.customer_phone",
      "properties.access_notes",
      eb
        .selectFrom("zones")
        .select((z) => z.fn.countAll<number>().as("n"))
        .whereRef("zones.property_id", "=", "properties.id")
        .where("zones.archived_at", "is", null)
        .as("zone_count"),
      eb
        .selectFrom("zones")
        .select((z) => z.fn.coalesce(z.fn.sum<number>("zones.area_ft2"), z.lit(0)).as("a"))
        .whereRef("zones.property_id", "=", "properties.id")
        .where("zones.archived_at", "is", null)
        .as("lawn_area_ft2"),
    ]);
}

export async function listProperties(
  actor: Actor,
  options: { includeArchived?: boolean } = {},
): Promise<PropertySummaryDto[]> {
  const withArchived = options.includeArchived === true && actor.role === "manager";
  const rows = await selectSummary(db().selectFrom("properties"))
    .where(propertyInScope(actor))
    .$if(!withArchived, (q) => q.where("properties.archived_at", "is", null))
    .orderBy("properties.name")
    .orderBy("properties.id")
    .execute();
  return rows.map(toPropertySummaryDto);
}

/** 404 "That property" unless the property is within the actor's scope (lists under a property answer as the property does). */
export async function assertPropertyInScope(actor: Actor, propertyId: string): Promise<void> {
  const row = await db()
    .selectFrom("properties")
    .select("properties.id")
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!row) throw notFound("That property");
}

/** The zone, if its property is within the actor's scope; else 404 "That zone". */
export async function findZoneInScope(
  actor: Actor,
  zoneId: string,
): Promise<{ id: string; name: string; property_id: string }> {
  const zone = await db()
    .selectFrom("zones")
    .innerJoin("properties", "properties.id", "zones.property_id")
    .select(["zones.id", "zones.name", "zones.property_id"])
    .where("zones.id", "=", zoneId)
    .where("zones.company_id", "=", actor.companyId)
    .where(propertyInScope(actor))
    .executeTakeFirst();
  if (!zone) throw notFound("That zone");
  return zone;
}

export async function getProperty(actor: Actor, propertyId: string): Promise<PropertyDetailDto> {
  const row = await selectSummary(db().selectFrom("properties"))
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!row) throw notFound("That property");
  if (row.archived_at && actor.role !== "manager") throw notFound("That property");

  const zones = await db()
    .selectFrom("zones")
    .select(["id", "name", "area_ft2", "grass_species", "sun_exposure", "is_irrigated", "slope"])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", propertyId)
    .where("archived_at", "is", null)
    .orderBy("sort_order")
    .orderBy("name")
    .execute();

  const homeowners =
    actor.role === "homeowner"
      ? []
      : await db()
          .selectFrom("property_homeowners as ph")
          .innerJoin("users", "users.id", "ph.user_id")
          .select(["users.id", "users.name", "users.email"])
          .where("ph.company_id", "=", actor.companyId)
          .where("ph.property_id", "=", propertyId)
          .orderBy("users.name")
          .execute();

  return {
    ...toPropertySummaryDto(row),
    zones: zones.map(toZoneDto),
    homeowners,
    notes: actor.role === "homeowner" ? "" : row.notes,
    customerPhone: actor.role === "homeowner" ? null : row.customer_phone,
    accessNotes: actor.role === "homeowner" ? "" : row.access_notes,
  };
}
