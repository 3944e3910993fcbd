// Reads of soil tests: a property's, newest first, and the test the phosphorus rule reads.
import "server-only";

import type { Kysely } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { readSoilTest } from "@/lib/agronomy/soil-test";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/http/app-error";

import type { SoilTestDto } from "./dto";
import { toSoilTestDto, valuesOf } from "./map";

export async function listSoilTests(actor: Actor, propertyId: string): Promise<SoilTestDto[]> {
  const property = await db()
    .selectFrom("properties")
    .select("properties.id")
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  const rows = await db()
    .selectFrom("soil_tests")
    .leftJoin("zones", "zones.id", "soil_tests.zone_id")
    .leftJoin("users", "users.id", "soil_tests.recorded_by")
    .selectAll("soil_tests")
    .select(["zones.name as zone_name", "users.name as recorded_by_name"])
    .where("soil_tests.company_id", "=", actor.companyId)
    .where("soil_tests.property_id", "=", propertyId)
    .orderBy("soil_tests.sampled_on", "desc")
    .orderBy("soil_tests.created_at", "desc")
    .execute();
  return rows.map(toSoilTestDto);
}

/**
 * The soil test a phosphorus application on `zoneId` on `on` is judged by: the latest sampled on
 * or before that day, of the zone itself or of the whole property. Its date when it shows that
 * phosphorus is needed, otherwise null (a later test that shows no need outweighs an older one
 * that did). The caller's transaction or the pool.
 */
export async function phosphorusSoilTestOn(
  executor: Kysely<Database>,
  companyId: string,
  propertyId: string,
  zoneId: string,
  on: string,
): Promise<string | null> {
  const latest = await executor
    .selectFrom("soil_tests")
    .selectAll()
    .where("company_id", "=", companyId)
    .where("property_id", "=", propertyId)
    .where((eb) => eb.or([eb("zone_id", "is", null), eb("zone_id", "=", zoneId)]))
    .where("sampled_on", "<=", on)
    .orderBy("sampled_on", "desc")
    .orderBy("created_at", "desc")
    .limit(1)
    .executeTakeFirst();
  if (!latest) return null;
  return readSoilTest(valuesOf(latest)).showsPhosphorusNeed ? latest.sampled_on : null;
}
