// Recording soil tests: one from the form, or a lab's file at once (all rows or none). Managers
// and the property's technicians record; managers delete. Idempotent by id; the same lab, date
// and zone is one sample (a re-imported file adds nothing). Every change is audited. A soil test
// changes no Index, book row or alert (the phosphorus rule reads it when an application is
// recorded), so no after-write step is needed.
import "server-only";

import { randomUUID } from "node:crypto";
import type { Insertable, Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, formatDate, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";

import { parseSoilTestCsv } from "./csv";
import type { SoilTestDto, SoilTestImportDto } from "./dto";
import { listSoilTests } from "./queries";
import { SOIL_TEST_BACK_DAYS, type SoilTestInput } from "./schemas";

type Trx = Transaction<Database>;

const invalid = (fieldErrors: Record<string, string[]>, message = "Some values need attention.") =>
  new AppError("invalid_input", message, fieldErrors);

async function scopedProperty(trx: Trx, actor: Actor, propertyId: string) {
  if (actor.role === "homeowner") throw new AppError("forbidden", "Your role cannot do this.");
  const property = await trx
    .selectFrom("properties")
    .select(["properties.id", "properties.time_zone", "properties.archived_at"])
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  if (property.archived_at)
    throw new AppError("conflict", "This property is archived; restore it to record soil tests.");
  const zones = await trx
    .selectFrom("zones")
    .select(["id", "name"])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", propertyId)
    .execute();
  return { ...property, zones };
}

/** The property's own day: a sample is not dated in the future, nor more than ten years back. */
function dateProblem(sampledOn: string, timeZone: string, locale: string): string | null {
  const today = todayIn(timeZone);
  if (sampledOn > today)
    return `Date sampled: not in the future (today is ${formatDate(today, locale)}).`;
  const earliest = addDays(today, -SOIL_TEST_BACK_DAYS);
  if (sampledOn < earliest)
    return `Date sampled: within the last ten years (${formatDate(earliest, locale)} or later).`;
  return null;
}

const round1 = (n: number | null) => (n === null ? null : Math.round(n * 10) / 10);

function rowOf(
  actor: Actor,
  propertyId: string,
  t: SoilTestInput,
): Insertable<Database["soil_tests"]> {
  return {
    id: t.id,
    company_id: actor.companyId,
    property_id: propertyId,
    zone_id: t.zoneId,
    sampled_on: t.sampledOn,
    lab: t.lab,
    depth_in: round1(t.sampleDepthIn)!,
    extractant: t.extractant,
    ph: round1(t.ph),
    buffer_ph: round1(t.bufferPh),
    buffer_method: t.bufferMethod,
    organic_matter_pct: round1(t.organicMatterPct),
    p_ppm: round1(t.pPpm),
    k_ppm: round1(t.kPpm),
    ca_ppm: round1(t.caPpm),
    mg_ppm: round1(t.mgPpm),
    s_ppm: round1(t.sPpm),
    lab_lime_lb_per_1000: round1(t.labLimeLbPer1000),
    lab_p_needed: t.labPhosphorusNeeded,
    notes: t.notes,
    recorded_by: actor.userId,
  };
}

/** Inserts the rows that are new (by id and by lab, date and zone); returns the ids inserted. */
async function insertNew(trx: Trx, rows: Insertable<Database["soil_tests"]>[]): Promise<string[]> {
  if (rows.length === 0) return [];
  const inserted = await trx
    .insertInto("soil_tests")
    .values(rows)
    .onConflict((oc) => oc.doNothing())
    .returning("id")
    .execute();
  return inserted.map((r) => r.id);
}

/** Records one soil test from the form (a replay of the same id answers with the stored test). */
export async function recordSoilTest(
  actor: Actor,
  propertyId: string,
  input: SoilTestInput,
): Promise<SoilTestDto> {
  await db()
    .transaction()
    .execute(async (trx) => {
      const property = await scopedProperty(trx, actor, propertyId);
      const problem = dateProblem(input.sampledOn, property.time_zone, actor.companyLocale);
      if (problem) throw invalid({ sampledOn: [problem] });
      if (input.zoneId && !property.zones.some((z) => z.id === input.zoneId))
        throw invalid({ zoneId: ["That zone is not part of this property."] });
      const [inserted] = await insertNew(trx, [rowOf(actor, propertyId, input)]);
      if (!inserted) {
        const same = await trx
          .selectFrom("soil_tests")
          .select(["id", "property_id"])
          .where("id", "=", input.id)
          .executeTakeFirst();
        if (same && same.property_id === propertyId && same.id === input.id) return; // a replay
        const zone = property.zones.find((z) => z.id === input.zoneId);
        throw new AppError(
          "conflict",
          `A soil test from ${input.lab} sampled on ${formatDate(input.sampledOn, actor.companyLocale)} is already recorded for ${zone ? zone.name : "the whole property"}.`,
        );
      }
      await recordAudit(trx, actor, {
        entity: "soil_test",
        entityId: input.id,
        action: "record",
        changes: {
          soilTest: {
            from: null,
            to: { sampledOn: input.sampledOn, lab: input.lab, zoneId: input.zoneId },
          },
        },
      });
    });
  const recorded = (await listSoilTests(actor, propertyId)).find((t) => t.id === input.id);
  if (!recorded) throw notFound("That soil test");
  return recorded;
}

/** Imports a lab's CSV file: every row valid or nothing saved; rows recorded already are skipped. */
export async function importSoilTests(
  actor: Actor,
  propertyId: string,
  csv: string,
  preview: boolean,
): Promise<SoilTestImportDto> {
  return db()
    .transaction()
    .execute(async (trx) => {
      const property = await scopedProperty(trx, actor, propertyId);
      const parsed = parseSoilTestCsv(csv, property.zones, randomUUID);
      const errors = [...parsed.errors];
      parsed.rows.forEach((row, i) => {
        const problem = dateProblem(row.sampledOn, property.time_zone, actor.companyLocale);
        if (problem) errors.push(`Row ${i + 2}: ${problem}`);
      });
      if (errors.length)
        throw invalid(
          {
            csv: errors
              .slice(0, 20)
              .concat(errors.length > 20 ? [`…and ${errors.length - 20} more.`] : []),
          },
          "The file has rows that need attention; nothing was imported.",
        );
      const rows = parsed.rows.map((r) => rowOf(actor, propertyId, r));
      if (preview) {
        const existing = await trx
          .selectFrom("soil_tests")
          .select(["zone_id", "sampled_on", "lab"])
          .where("company_id", "=", actor.companyId)
          .where("property_id", "=", propertyId)
          .execute();
        const keys = new Set(existing.map((e) => `${e.zone_id}|${e.sampled_on}|${e.lab}`));
        const fresh = new Set(
          rows.map((r) => `${r.zone_id}|${r.sampled_on}|${r.lab}`).filter((k) => !keys.has(k)),
        );
        return {
          rows: rows.length,
          added: fresh.size,
          alreadyRecorded: rows.length - fresh.size,
          preview,
        };
      }
      const inserted = await insertNew(trx, rows);
      if (inserted.length)
        await recordAudit(trx, actor, {
          entity: "property",
          entityId: propertyId,
          action: "import_soil_tests",
          changes: { soilTests: { from: null, to: { added: inserted.length, ids: inserted } } },
        });
      return {
        rows: rows.length,
        added: inserted.length,
        alreadyRecorded: rows.length - inserted.length,
        preview,
      };
    });
}

/** Deletes a soil test (managers), audited with what it held. */
export async function deleteSoilTest(actor: Actor, soilTestId: string): Promise<void> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can delete a soil test.");
  await db()
    .transaction()
    .execute(async (trx) => {
      const row = await trx
        .deleteFrom("soil_tests")
        .where("company_id", "=", actor.companyId)
        .where("id", "=", soilTestId)
        .returningAll()
        .executeTakeFirst();
      if (!row) throw notFound("That soil test");
      const { company_id: _company, created_at: _created, ...held } = row;
      await recordAudit(trx, actor, {
        entity: "soil_test",
        entityId: row.id,
        action: "delete",
        changes: { soilTest: { from: held, to: null } },
      });
    });
}
