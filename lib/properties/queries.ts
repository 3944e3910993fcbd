// Property reads, scoped to the actor in every WHERE: managers see their company's book,
// technicians the properties assigned to them, homeowners their own. Out of scope = not found.
import "server-only";
import type { ExpressionBuilder, SelectQueryBuilder } from "kysely";
import { db } from "@/db";
import type { Database } from "@/db/schema";
import { findGrassSpecies } from "@/fixtures/grass-species";
import type { Actor } from "@/lib/auth/actor";
import { notFound } from "@/lib/http/app-error";
import type { PropertyDetailDto, PropertySummaryDto, ZoneDto } from "./dto";

type PropertyQuery<O> = SelectQueryBuilder<Database, "properties", O>;

function inScope(actor: Actor) {
  return (eb: ExpressionBuilder<Database, "properties">) => {
    const company = eb("properties.company_id", "=", actor.companyId);
    switch (actor.role) {
      case "manager":
        return company;
      case "technician":
        return eb.and([company, eb("properties.technician_id", "=", actor.userId)]);
      case "homeowner":
        return eb.and([
          company,
          eb.exists(
            eb
              .selectFrom("property_homeowners as ph")
              .select("ph.property_id")
              .whereRef("ph.property_id", "=", "properties.id")
              .where("ph.user_id", "=", actor.userId)
              .where("ph.company_id", "=", actor.companyId),
          ),
        ]);
    }
  };
}

function selectSummary<O>(query: PropertyQuery<O>) {
  return query
    .leftJoin("users as tech", "tech.id", "properties.technician_id")
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

type SummaryRow = Awaited<ReturnType<ReturnType<typeof selectSummary>["execute"]>>[number];

function toSummary(row: SummaryRow): PropertySummaryDto {
  return {
    id: row.id,
    name: row.name,
    address: { street: row.street, city: row.city, region: row.region, postalCode: row.postal_code },
    location: { latitude: row.latitude, longitude: row.longitude },
    timeZone: row.time_zone,
    technician: row.technician_id ? { id: row.technician_id, name: row.technician_name ?? "" } : null,
    zoneCount: Number(row.zone_count ?? 0),
    lawnAreaFt2: Number(row.lawn_area_ft2 ?? 0),
  };
}

export async function listProperties(actor: Actor): Promise<PropertySummaryDto[]> {
  const rows = await selectSummary(db().selectFrom("properties"))
    .where(inScope(actor))
    .where("properties.archived_at", "is", null)
    .orderBy("properties.name")
    .orderBy("properties.id")
    .execute();
  return rows.map(toSummary);
}

export async function getProperty(actor: Actor, propertyId: string): Promise<PropertyDetailDto> {
  const row = await selectSummary(db().selectFrom("properties"))
    .where(inScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!row) throw notFound("That property");

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

  return { ...toSummary(row), zones: zones.map(toZoneDto), homeowners };
}

function toZoneDto(z: { id: string; name: string; area_ft2: number; grass_species: string; sun_exposure: ZoneDto["sunExposure"]; is_irrigated: boolean; slope: ZoneDto["slope"] }): ZoneDto {
  const species = findGrassSpecies(z.grass_species);
  return {
    id: z.id,
    name: z.name,
    areaFt2: Number(z.area_ft2),
    grassSpecies: { key: z.grass_species, name: species?.name ?? z.grass_species, season: species?.season ?? null },
    sunExposure: z.sun_exposure,
    isIrrigated: z.is_irrigated,
    slope: z.slope,
  };
}
