// Season program writes (managers): create or replace a program with its rounds, delete one no
// property follows, choose a property's program, set a zone's method or leave it out for a season.
// Every change is audited. A program changes no Index, book row or alert (it plans; nothing it
// holds is read by them), so no after-write step is needed.
import "server-only";

import { randomUUID } from "node:crypto";
import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { AppError, notFound } from "@/lib/http/app-error";

import type { ProgramDto } from "./dto";
import { roundColumns } from "./map";
import { getProgram } from "./queries";
import type { ProgramInput, ZoneProgramInput } from "./schemas";

type Trx = Transaction<Database>;

const invalid = (fieldErrors: Record<string, string[]>) =>
  new AppError("invalid_input", "Some values need attention.", fieldErrors);

function managerOnly(actor: Actor) {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change season programs.");
}

/** Every product a round names is the company's, not archived, and carries N where N is planned. */
async function checkProducts(trx: Trx, actor: Actor, input: ProgramInput) {
  const ids = [
    ...new Set(input.rounds.flatMap((r) => [r.granular.productId, r.liquid.productId])),
  ].filter((id): id is string => id !== null);
  const rows = ids.length
    ? await trx
        .selectFrom("products")
        .select(["id", "form", "n_pct", "archived_at"])
        .where("company_id", "=", actor.companyId)
        .where("id", "in", ids)
        .execute()
    : [];
  const byId = new Map(rows.map((p) => [p.id, p]));
  const errors: Record<string, string[]> = {};
  input.rounds.forEach((r, i) => {
    for (const m of ["granular", "liquid"] as const) {
      const label = m === "granular" ? "Granular" : "Liquid";
      const id = r[m].productId;
      if (id === null) continue;
      const p = byId.get(id);
      const path = `rounds.${i}.${m}.productId`;
      if (!p || p.archived_at)
        errors[path] = [`${label} product: choose a product of your catalog.`];
      else if (m === "granular" && p.form === "liquid")
        errors[path] = ["Granular product: this product is a liquid; choose a dry one."];
      else if (m === "liquid" && p.form !== "liquid")
        errors[path] = ["Liquid product: this product is dry; choose a liquid."];
      else if (r[m].target !== "none" && Number(p.n_pct) <= 0)
        errors[path] = [
          `${label} product: it carries no nitrogen; choose another or set the target to no nitrogen.`,
        ];
    }
  });
  if (Object.keys(errors).length) throw invalid(errors);
}

async function writeRounds(trx: Trx, actor: Actor, programId: string, input: ProgramInput) {
  await trx
    .deleteFrom("program_rounds")
    .where("company_id", "=", actor.companyId)
    .where("program_id", "=", programId)
    .execute();
  await trx
    .insertInto("program_rounds")
    .values(
      input.rounds.map((r, i) => roundColumns(actor.companyId, programId, randomUUID(), i + 1, r)),
    )
    .execute();
}

const nameTaken = (err: unknown) =>
  (err as { code?: string; constraint?: string }).code === "23505" &&
  (err as { constraint?: string }).constraint === "programs_name_unique";

/** Creates the program; a replay of the same id returns it as saved. */
export async function createProgram(actor: Actor, input: ProgramInput): Promise<ProgramDto> {
  managerOnly(actor);
  try {
    await db()
      .transaction()
      .execute(async (trx) => {
        const existing = await trx
          .selectFrom("programs")
          .select(["id", "company_id"])
          .where("id", "=", input.id)
          .executeTakeFirst();
        if (existing) {
          if (existing.company_id !== actor.companyId)
            throw new AppError("conflict", "This program id is already used.");
          return; // a replay: the program is saved
        }
        await checkProducts(trx, actor, input);
        await trx
          .insertInto("programs")
          .values({
            id: input.id,
            company_id: actor.companyId,
            name: input.name,
            grass_season: input.grassSeason,
            notes: input.notes,
          })
          .execute();
        await writeRounds(trx, actor, input.id, input);
        await recordAudit(trx, actor, {
          entity: "program",
          entityId: input.id,
          action: "create_program",
        });
      });
  } catch (err) {
    if (nameTaken(err)) throw invalid({ name: ["Name: another program already has this name."] });
    throw err;
  }
  return getProgram(actor, input.id);
}

/** Replaces the program's name, grass, notes and rounds (the row lock makes two saves take turns). */
export async function updateProgram(
  actor: Actor,
  programId: string,
  input: ProgramInput,
): Promise<ProgramDto> {
  managerOnly(actor);
  if (input.id !== programId) throw invalid({ id: ["The program id does not match the address."] });
  try {
    await db()
      .transaction()
      .execute(async (trx) => {
        const row = await trx
          .selectFrom("programs")
          .select(["id", "name"])
          .where("company_id", "=", actor.companyId)
          .where("id", "=", programId)
          .forUpdate()
          .executeTakeFirst();
        if (!row) throw notFound("That program");
        await checkProducts(trx, actor, input);
        await trx
          .updateTable("programs")
          .set({
            name: input.name,
            grass_season: input.grassSeason,
            notes: input.notes,
            updated_at: sql<Date>`now()`,
          })
          .where("company_id", "=", actor.companyId)
          .where("id", "=", programId)
          .execute();
        await writeRounds(trx, actor, programId, input);
        await recordAudit(trx, actor, {
          entity: "program",
          entityId: programId,
          action: "update_program",
          changes:
            row.name !== input.name ? { name: { from: row.name, to: input.name } } : undefined,
        });
      });
  } catch (err) {
    if (nameTaken(err)) throw invalid({ name: ["Name: another program already has this name."] });
    throw err;
  }
  return getProgram(actor, programId);
}

/** Deletes a program no property follows (a followed one is a conflict naming how many). */
export async function deleteProgram(actor: Actor, programId: string): Promise<void> {
  managerOnly(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .selectFrom("programs")
        .select("id")
        .where("company_id", "=", actor.companyId)
        .where("id", "=", programId)
        .forUpdate()
        .executeTakeFirst();
      if (!row) throw notFound("That program");
      const { n } = await trx
        .selectFrom("properties")
        .select((eb) => eb.fn.countAll<number>().as("n"))
        .where("company_id", "=", actor.companyId)
        .where("program_id", "=", programId)
        .executeTakeFirstOrThrow();
      if (Number(n) > 0)
        throw new AppError(
          "conflict",
          `${Number(n)} ${Number(n) === 1 ? "property follows" : "properties follow"} this program; give ${Number(n) === 1 ? "it" : "them"} another program first.`,
        );
      await trx.deleteFrom("programs").where("id", "=", programId).execute();
      await recordAudit(trx, actor, {
        entity: "program",
        entityId: programId,
        action: "delete_program",
      });
    });
}

/** The program a property follows (or none). */
export async function setPropertyProgram(
  actor: Actor,
  propertyId: string,
  programId: string | null,
): Promise<void> {
  managerOnly(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const property = await trx
        .selectFrom("properties")
        .select(["properties.id", "properties.program_id"])
        .where(propertyInScope(actor))
        .where("properties.id", "=", propertyId)
        .forUpdate()
        .executeTakeFirst();
      if (!property) throw notFound("That property");
      if (programId !== null) {
        const program = await trx
          .selectFrom("programs")
          .select("id")
          .where("company_id", "=", actor.companyId)
          .where("id", "=", programId)
          .executeTakeFirst();
        if (!program)
          throw invalid({ programId: ["Program: choose one of your programs, or none."] });
      }
      if (property.program_id === programId) return;
      await trx
        .updateTable("properties")
        .set({ program_id: programId, updated_at: sql<Date>`now()` })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", propertyId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "property",
        entityId: propertyId,
        action: "set_program",
        changes: { program: { from: property.program_id, to: programId } },
      });
    });
}

/** A zone's method in its program, or its exclusion for a season with the reason. */
export async function setZoneProgram(
  actor: Actor,
  zoneId: string,
  input: ZoneProgramInput,
): Promise<void> {
  managerOnly(actor);
  await db()
    .transaction()
    .execute(async (trx) => {
      const zone = await trx
        .selectFrom("zones")
        .innerJoin("properties", "properties.id", "zones.property_id")
        .select([
          "zones.id",
          "zones.program_method",
          "zones.program_excluded_year",
          "zones.program_excluded_reason",
        ])
        .where(propertyInScope(actor))
        .where("zones.company_id", "=", actor.companyId)
        .where("zones.id", "=", zoneId)
        .forUpdate(["zones"])
        .executeTakeFirst();
      if (!zone) throw notFound("That zone");
      await trx
        .updateTable("zones")
        .set({
          program_method: input.method,
          program_excluded_year: input.excludedYear,
          program_excluded_reason: input.excludedReason,
          updated_at: sql<Date>`now()`,
        })
        .where("company_id", "=", actor.companyId)
        .where("id", "=", zoneId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "zone",
        entityId: zoneId,
        zoneId,
        action: "set_zone_program",
        changes: {
          method: { from: zone.program_method, to: input.method },
          excluded: {
            from: zone.program_excluded_year,
            to: input.excludedYear,
          },
        },
      });
    });
}
