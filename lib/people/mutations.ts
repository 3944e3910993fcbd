// Writes of the People page (managers): a staff role, disabling and re-enabling an account, a
// technician's applicator license, and moving one technician's properties to another. Each write
// is audited in its own transaction; disabling ends the person's sessions in it, so their next
// request is signed out (the actor lookup also refuses a disabled account).
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { todayIn } from "@/lib/dates";
import { halfGivenPlace, type PlaceInput } from "@/lib/day-route/schemas";
import { AppError, notFound } from "@/lib/http/app-error";

import type { ReassignCountDto } from "./dto";
import type { LicenseInput, PersonChange, ReassignInput } from "./schemas";

export const PEOPLE_MESSAGES = {
  lastManager:
    "This is the company's last active manager: make another person a manager first, so someone can still run the company.",
  notYourself:
    "You cannot take away your own manager access or disable yourself: ask another manager.",
  staffOnly: "Role: only technicians and managers can change role.",
  licenseTechniciansOnly: "Applicator licenses are kept for technicians.",
  startPointTechniciansOnly: "Start points are kept for technicians: a manager's day has no route.",
  licenseIncomplete: "License: give the number and the expiry date, or clear all three fields.",
  sameTechnician: "To: choose a different technician than the one the properties come from.",
  disabledTarget: "To: that technician's account is disabled; re-enable it or choose another.",
} as const;

function requireManager(actor: Actor): void {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the company's people.");
}

async function lockPerson(trx: Transaction<Database>, actor: Actor, personId: string) {
  const row = await trx
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select([
      "users.id",
      "users.disabled_at",
      "memberships.role",
      "users.license_number",
      "users.license_category",
      "users.license_expires_on",
    ])
    .where("memberships.company_id", "=", actor.companyId)
    .where("users.id", "=", personId)
    .forUpdate()
    .executeTakeFirst();
  if (!row) throw notFound("That person");
  return row;
}

/**
 * The company's managers, locked in id order: every role change and disabling takes these locks
 * first and in the same order, so two managers demoting each other at once cannot both pass (the
 * second waits, then sees the first's change) and cannot deadlock.
 */
async function lockManagers(trx: Transaction<Database>, actor: Actor) {
  return trx
    .selectFrom("memberships")
    .innerJoin("users", "users.id", "memberships.user_id")
    .select(["users.id", "users.disabled_at"])
    .where("memberships.company_id", "=", actor.companyId)
    .where("memberships.role", "=", "manager")
    .orderBy("users.id")
    .forUpdate()
    .execute();
}

/** Changes a person's staff role and/or disables or re-enables their account. */
export async function changePerson(
  actor: Actor,
  personId: string,
  change: PersonChange,
): Promise<{ role: string; isDisabled: boolean }> {
  requireManager(actor);
  return db()
    .transaction()
    .execute(async (trx) => {
      const managers = await lockManagers(trx, actor);
      const person = await lockPerson(trx, actor, personId);
      const otherActiveManagers = managers.filter(
        (m) => m.id !== personId && m.disabled_at === null,
      ).length;
      const changes: Record<string, { from: unknown; to: unknown }> = {};
      const losesManaging =
        person.role === "manager" &&
        ((change.role !== undefined && change.role !== "manager") || change.disabled === true);
      if (losesManaging && personId === actor.userId)
        throw new AppError("conflict", PEOPLE_MESSAGES.notYourself);
      if (change.disabled === true && personId === actor.userId)
        throw new AppError("conflict", PEOPLE_MESSAGES.notYourself);
      if (losesManaging && !person.disabled_at && otherActiveManagers === 0)
        throw new AppError("conflict", PEOPLE_MESSAGES.lastManager);
      let role = person.role;
      if (change.role !== undefined && change.role !== person.role) {
        if (person.role === "homeowner")
          throw new AppError("invalid_input", PEOPLE_MESSAGES.staffOnly, {
            role: [PEOPLE_MESSAGES.staffOnly],
          });
        await trx
          .updateTable("memberships")
          .set({ role: change.role })
          .where("company_id", "=", actor.companyId)
          .where("user_id", "=", personId)
          .execute();
        changes.role = { from: person.role, to: change.role };
        role = change.role;
      }
      let isDisabled = person.disabled_at !== null;
      if (change.disabled !== undefined && change.disabled !== isDisabled) {
        await trx
          .updateTable("users")
          .set({ disabled_at: change.disabled ? sql<Date>`now()` : null })
          .where("id", "=", personId)
          .execute();
        if (change.disabled)
          await trx.deleteFrom("auth_sessions").where("user_id", "=", personId).execute();
        changes.disabled = { from: isDisabled, to: change.disabled };
        isDisabled = change.disabled;
      }
      if (Object.keys(changes).length)
        await recordAudit(trx, actor, {
          entity: "person",
          entityId: personId,
          action: changes.disabled ? (isDisabled ? "disable" : "enable") : "change_role",
          changes,
        });
      return { role, isDisabled };
    });
}

/** Records, replaces or clears (all fields empty) a technician's applicator license. */
export async function setLicense(
  actor: Actor,
  personId: string,
  input: LicenseInput,
): Promise<void> {
  requireManager(actor);
  const clearing = !input.number && !input.category && !input.expiresOn;
  if (!clearing && (!input.number || !input.expiresOn))
    throw new AppError("invalid_input", PEOPLE_MESSAGES.licenseIncomplete, {
      ...(input.number ? {} : { number: ["License number is required."] }),
      ...(input.expiresOn
        ? {}
        : { expiresOn: ["Expiry date is required: a date like 2027-03-31."] }),
    });
  await db()
    .transaction()
    .execute(async (trx) => {
      const person = await lockPerson(trx, actor, personId);
      if (person.role !== "technician")
        throw new AppError("invalid_input", PEOPLE_MESSAGES.licenseTechniciansOnly);
      const next = {
        license_number: input.number,
        license_category: input.category,
        license_expires_on: clearing ? null : input.expiresOn,
      };
      await trx.updateTable("users").set(next).where("id", "=", personId).execute();
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: personId,
        action: clearing ? "clear_license" : "set_license",
        changes: {
          license: {
            from: person.license_number
              ? {
                  number: person.license_number,
                  category: person.license_category,
                  expiresOn: person.license_expires_on,
                }
              : null,
            to: clearing
              ? null
              : { number: input.number, category: input.category, expiresOn: input.expiresOn },
          },
        },
      });
    });
}

/**
 * A technician's own start point (audited): their Today's route starts and ends there instead of
 * at the company's yard. Both coordinates empty clear it (the yard again).
 */
export async function setStartPoint(
  actor: Actor,
  personId: string,
  input: PlaceInput,
): Promise<void> {
  requireManager(actor);
  const half = halfGivenPlace("Start point", input);
  if (half) throw new AppError("invalid_input", "Some values need attention.", half);
  const clearing = input.latitude === null;
  await db()
    .transaction()
    .execute(async (trx) => {
      const person = await lockPerson(trx, actor, personId);
      if (person.role !== "technician")
        throw new AppError("invalid_input", PEOPLE_MESSAGES.startPointTechniciansOnly);
      const before = await trx
        .selectFrom("memberships")
        .select(["start_label", "start_latitude", "start_longitude"])
        .where("company_id", "=", actor.companyId)
        .where("user_id", "=", personId)
        .executeTakeFirstOrThrow();
      await trx
        .updateTable("memberships")
        .set({
          start_label: clearing ? "" : input.address,
          start_latitude: input.latitude,
          start_longitude: input.longitude,
        })
        .where("company_id", "=", actor.companyId)
        .where("user_id", "=", personId)
        .execute();
      const place = (label: string, lat: number | null, lng: number | null) =>
        lat === null ? null : { address: label, location: [lat, lng] };
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: personId,
        action: clearing ? "clear_start_point" : "set_start_point",
        changes: {
          startPoint: {
            from: place(before.start_label, before.start_latitude, before.start_longitude),
            to: place(input.address, input.latitude, input.longitude),
          },
        },
      });
    });
}

/**
 * Moves every property of one technician to another, with their future scheduled stops (finished,
 * started and called-off visits keep who did them). The book shows each property's technician, so
 * each moved property goes through the after-write step.
 */
export async function reassignProperties(
  actor: Actor,
  input: ReassignInput,
): Promise<ReassignCountDto> {
  requireManager(actor);
  if (input.fromTechnicianId === input.toTechnicianId)
    throw new AppError("invalid_input", PEOPLE_MESSAGES.sameTechnician, {
      toTechnicianId: [PEOPLE_MESSAGES.sameTechnician],
    });
  const today = todayIn(actor.companyTimeZone);
  return db()
    .transaction()
    .execute(async (trx) => {
      const technicians = await trx
        .selectFrom("memberships")
        .innerJoin("users", "users.id", "memberships.user_id")
        .select(["users.id", "users.disabled_at"])
        .where("memberships.company_id", "=", actor.companyId)
        .where("memberships.role", "=", "technician")
        .where("users.id", "in", [input.fromTechnicianId, input.toTechnicianId])
        .execute();
      const from = technicians.find((t) => t.id === input.fromTechnicianId);
      const to = technicians.find((t) => t.id === input.toTechnicianId);
      if (!from || !to) throw notFound("That technician");
      if (to.disabled_at)
        throw new AppError("invalid_input", PEOPLE_MESSAGES.disabledTarget, {
          toTechnicianId: [PEOPLE_MESSAGES.disabledTarget],
        });
      const moved = await trx
        .updateTable("properties")
        .set({ technician_id: input.toTechnicianId })
        .where("company_id", "=", actor.companyId)
        .where("technician_id", "=", input.fromTechnicianId)
        .returning("id")
        .execute();
      const propertyIds = moved.map((p) => p.id);
      const stops = propertyIds.length
        ? await trx
            .updateTable("visits")
            .set({ technician_id: input.toTechnicianId })
            .where("company_id", "=", actor.companyId)
            .where("property_id", "in", propertyIds)
            .where("technician_id", "=", input.fromTechnicianId)
            .where("status", "=", "scheduled")
            .where("scheduled_for", ">=", today)
            .returning("id")
            .execute()
        : [];
      for (const propertyId of propertyIds) {
        await recordAudit(trx, actor, {
          entity: "property",
          entityId: propertyId,
          action: "reassign_technician",
          changes: { technician: { from: input.fromTechnicianId, to: input.toTechnicianId } },
        });
        await afterWrite(trx, { companyId: actor.companyId, propertyId, alerts: "keep" });
      }
      await recordAudit(trx, actor, {
        entity: "person",
        entityId: input.fromTechnicianId,
        action: "reassign_properties",
        changes: {
          properties: { from: input.fromTechnicianId, to: input.toTechnicianId },
          counts: { from: null, to: { properties: propertyIds.length, stops: stops.length } },
        },
      });
      return { properties: propertyIds.length, stops: stops.length };
    });
}
