// Property and zone writes (managers). Scope is re-checked in every statement; archiving keeps
// history (visits and checks stay), every change is audited, and afterWrite keeps the property's
// Index, book row and alerts current in the same transaction.
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";
import { usPhoneE164 } from "@/lib/reference/us-phone";

import type { PropertyDetailDto, ZoneDto } from "./dto";
import { toZoneDto, ZONE_COLUMNS } from "./map";
import { getProperty } from "./queries";
import { areaInFt2, type PropertyInput, type ZoneInput } from "./schemas";

function requireManager(actor: Actor): void {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change properties and zones.");
}

const invalid = (field: string, message: string) =>
  new AppError("invalid_input", "Some values need attention.", { [field]: [message] });

async function checkReferences(
  trx: Transaction<Database>,
  actor: Actor,
  input: PropertyInput,
): Promise<void> {
  if (input.technicianId) {
    const tech = await trx
      .selectFrom("memberships")
      .select("user_id")
      .where("company_id", "=", actor.companyId)
      .where("role", "=", "technician")
      .where("user_id", "=", input.technicianId)
      .executeTakeFirst();
    if (!tech) throw invalid("technicianId", "Choose one of your technicians.");
  }
  if (input.ruleSetId) {
    const ruleSet = await trx
      .selectFrom("rule_sets")
      .select("id")
      .where("company_id", "=", actor.companyId)
      .where("id", "=", input.ruleSetId)
      .executeTakeFirst();
    if (!ruleSet) throw invalid("ruleSetId", "Choose one of your rule sets.");
  }
}

function propertyColumns(input: PropertyInput) {
  return {
    name: input.name,
    street: input.street,
    city: input.city,
    region: input.region,
    postal_code: input.postalCode,
    latitude: input.latitude,
    longitude: input.longitude,
    time_zone: input.timeZone,
    rule_set_id: input.ruleSetId,
    technician_id: input.technicianId,
    notes: input.notes,
    customer_phone: input.customerPhone ? usPhoneE164(input.customerPhone) : null,
    access_notes: input.accessNotes,
  };
}

export async function createProperty(
  actor: Actor,
  input: PropertyInput,
): Promise<PropertyDetailDto> {
  requireManager(actor);
  const id = await db()
    .transaction()
    .execute(async (trx) => {
      await checkReferences(trx, actor, input);
      const row = await trx
        .insertInto("properties")
        .values({ company_id: actor.companyId, ...propertyColumns(input) })
        .returning("id")
        .executeTakeFirstOrThrow();
      await recordAudit(trx, actor, { entity: "property", entityId: row.id, action: "create" });
      await afterWrite(trx, { companyId: actor.companyId, propertyId: row.id, alerts: "keep" });
      return row.id;
    });
  return getProperty(actor, id);
}

export async function updateProperty(
  actor: Actor,
  propertyId: string,
  input: PropertyInput,
): Promise<PropertyDetailDto> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const before = await trx
        .selectFrom("properties")
        .selectAll()
        .where("company_id", "=", actor.companyId)
        .where("id", "=", propertyId)
        .forUpdate()
        .executeTakeFirst();
      if (!before) throw notFound("That property");
      await checkReferences(trx, actor, input);
      const next = propertyColumns(input);
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const [key, value] of Object.entries(next)) {
        const old = before[key as keyof typeof before];
        if (old !== value) changes[key] = { from: old, to: value };
      }
      await trx
        .updateTable("properties")
        .set({ ...next, updated_at: sql<Date>`now()` })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", propertyId)
        .execute();
      if (Object.keys(changes).length)
        await recordAudit(trx, actor, {
          entity: "property",
          entityId: propertyId,
          action: "update",
          changes,
        });
      // Place, time zone and rule set feed the rules: the alerts and the book follow.
      await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "evaluate" });
    });
  return getProperty(actor, propertyId);
}

export async function setPropertyArchived(
  actor: Actor,
  propertyId: string,
  isArchived: boolean,
): Promise<PropertyDetailDto> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .updateTable("properties")
        .set({
          archived_at: isArchived ? sql<Date>`coalesce(archived_at, now())` : null,
          updated_at: sql<Date>`now()`,
        })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", propertyId)
        .returning("id")
        .executeTakeFirst();
      if (!row) throw notFound("That property");
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: isArchived ? "archive" : "restore",
      });
      await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "evaluate" });
    });
  return getProperty(actor, propertyId);
}

function zoneColumns(input: ZoneInput) {
  return {
    name: input.name,
    area_ft2: areaInFt2(input.area, input.areaUnit),
    grass_species: input.grassSpecies,
    sun_exposure: input.sunExposure,
    is_irrigated: input.isIrrigated,
    slope: input.slope,
  };
}

export async function createZone(
  actor: Actor,
  propertyId: string,
  input: ZoneInput,
): Promise<ZoneDto> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      const property = await trx
        .selectFrom("properties")
        .select(["id", "archived_at"])
        .where("company_id", "=", actor.companyId)
        .where("id", "=", propertyId)
        .executeTakeFirst();
      if (!property) throw notFound("That property");
      if (property.archived_at)
        throw new AppError(
          "conflict",
          "That property is archived; restore it before adding zones.",
        );
      const { next } = await trx
        .selectFrom("zones")
        .select((eb) => eb.fn.coalesce(eb.fn.max("sort_order"), eb.lit(-1)).as("next"))
        .where("property_id", "=", propertyId)
        .executeTakeFirstOrThrow();
      const row = await trx
        .insertInto("zones")
        .values({
          company_id: actor.companyId,
          property_id: propertyId,
          sort_order: input.sortOrder ?? Number(next) + 1,
          ...zoneColumns(input),
        })
        .returning([...ZONE_COLUMNS])
        .executeTakeFirstOrThrow();
      await recordAudit(trx, actor, { entity: "zone", entityId: row.id, action: "create" });
      await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "evaluate" });
      return toZoneDto(row);
    });
}

export async function updateZone(actor: Actor, zoneId: string, input: ZoneInput): Promise<ZoneDto> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      const before = await trx
        .selectFrom("zones")
        .selectAll()
        .where("company_id", "=", actor.companyId)
        .where("id", "=", zoneId)
        .forUpdate()
        .executeTakeFirst();
      if (!before) throw notFound("That zone");
      const next = zoneColumns(input);
      const row = await trx
        .updateTable("zones")
        .set({
          ...next,
          ...(input.sortOrder !== undefined ? { sort_order: input.sortOrder } : {}),
          updated_at: sql<Date>`now()`,
        })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", zoneId)
        .returning([...ZONE_COLUMNS])
        .executeTakeFirstOrThrow();
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      for (const [key, value] of Object.entries(next)) {
        const old = before[key as keyof typeof before];
        if (String(old) !== String(value)) changes[key] = { from: old, to: value };
      }
      if (Object.keys(changes).length)
        await recordAudit(trx, actor, {
          entity: "zone",
          entityId: zoneId,
          action: "update",
          changes,
        });
      // Area, species and irrigation feed the Index weighting, N per area and the rules.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: before.property_id,
        alerts: "evaluate",
      });
      return toZoneDto(row);
    });
}

export async function setZoneArchived(
  actor: Actor,
  zoneId: string,
  isArchived: boolean,
): Promise<void> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .updateTable("zones")
        .set({
          archived_at: isArchived ? sql<Date>`coalesce(archived_at, now())` : null,
          updated_at: sql<Date>`now()`,
        })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", zoneId)
        .returning(["id", "property_id"])
        .executeTakeFirst();
      if (!row) throw notFound("That zone");
      await recordAudit(trx, actor, {
        entity: "zone",
        entityId: zoneId,
        action: isArchived ? "archive" : "restore",
      });
      // An archived zone leaves the property index, the book and the alerts.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: row.property_id,
        alerts: "evaluate",
      });
    });
}

export async function unlinkHomeowner(
  actor: Actor,
  propertyId: string,
  userId: string,
): Promise<PropertyDetailDto> {
  requireManager(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const removed = await trx
        .deleteFrom("property_homeowners")
        .where("company_id", "=", actor.companyId)
        .where("property_id", "=", propertyId)
        .where("user_id", "=", userId)
        .returning("user_id")
        .executeTakeFirst();
      if (!removed) throw notFound("That homeowner link");
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: "unlink_homeowner",
        changes: { homeowner: { from: userId, to: null } },
      });
    });
  return getProperty(actor, propertyId);
}
