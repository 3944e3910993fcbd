// Recording an application: the time is bound to the visit (applied-at.ts), the nutrient maths
// are computed here (never trusted from the client) and checked against the property's rule set
// on that date and against the product label (assess.ts). A broken label limit is always
// refused; a broken legal limit is refused unless a manager records an override category and
// reason. The client's id makes a retry harmless.
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { NutrientInputError } from "@/lib/agronomy/nutrients";
import { correctionReasonFor } from "@/lib/audit/correction";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { visitInScope } from "@/lib/auth/scope";
import { addDays, formatDate, todayIn } from "@/lib/dates";
import { AppError, notFound } from "@/lib/http/app-error";
import { toProductDto } from "@/lib/products/map";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { toRuleSetDto } from "@/lib/rule-sets/map";
import { phosphorusSoilTestOn } from "@/lib/soil-tests/queries";
import { assertEditable, lockVisit } from "@/lib/visit-state/lock";

import { bindAppliedAt } from "./applied-at";
import { assessApplication, type Assessment } from "./assess";
import type { ApplicationDto } from "./dto";
import { getZoneNitrogenYearToDate, listVisitApplications } from "./queries";
import type { ApplicationInput } from "./schemas";

/** What an audit event says of an application (before and after), in the trail's field names. */
interface ApplicationFacts {
  product: string;
  zone?: string;
  rate_amount: number;
  rate_unit: string;
  applied_at: Date;
  wind_mph: number | null;
  temperature_f: number | null;
  is_establishing: boolean;
  is_repairing: boolean;
  applicator_name: string;
  applicator_licence: string;
}

function factsOf(f: ApplicationFacts) {
  return {
    rate: { amount: Number(f.rate_amount), unit: f.rate_unit },
    appliedAt: new Date(f.applied_at).toISOString(),
    windMph: f.wind_mph === null ? null : Number(f.wind_mph),
    temperatureF: f.temperature_f === null ? null : Number(f.temperature_f),
    isEstablishing: f.is_establishing,
    isRepairing: f.is_repairing,
    applicatorName: f.applicator_name,
    applicatorLicence: f.applicator_licence,
  } as Record<string, unknown>;
}

/**
 * The changes an audit event keeps: every fact from null (added) or to null (removed), or only
 * those that differ (corrected); the product's name always, as context (equal from and to when
 * it did not change — lib/visits/audit-words.ts reads such an entry as the subject).
 */
function applicationFacts(
  before: ApplicationFacts | null,
  after: ApplicationFacts | null,
): Record<string, { from: unknown; to: unknown }> {
  const a = before ? factsOf(before) : {};
  const b = after ? factsOf(after) : {};
  const changes: Record<string, { from: unknown; to: unknown }> = {
    product: { from: before?.product ?? null, to: after?.product ?? null },
  };
  if (before && after && before.product === after.product)
    changes.product = { from: before.product, to: after.product };
  if (before?.zone && after?.zone && before.zone !== after.zone)
    changes.zone = { from: before.zone, to: after.zone };
  for (const key of new Set([...Object.keys(a), ...Object.keys(b)])) {
    const from = a[key] ?? null;
    const to = b[key] ?? null;
    if (!before || !after || JSON.stringify(from) !== JSON.stringify(to))
      changes[key] = { from, to };
  }
  return changes;
}

const invalid = (fieldErrors: Record<string, string[]>, message = "Some values need attention.") =>
  new AppError("invalid_input", message, fieldErrors);

/** The application already recorded under this client id (a retry), or undefined; a conflict when the id is another one's. */
async function recordedApplication(
  actor: Actor,
  visitId: string,
  id: string,
): Promise<ApplicationDto | undefined> {
  const existing = await db()
    .selectFrom("applications")
    .select(["id", "visit_id", "company_id"])
    .where("id", "=", id)
    .executeTakeFirst();
  if (!existing) return undefined;
  if (existing.company_id !== actor.companyId || existing.visit_id !== visitId)
    throw new AppError("conflict", "A different application already uses that id.");
  const found = (await listVisitApplications(actor, visitId)).find((a) => a.id === id);
  if (!found) throw notFound("That application");
  return found;
}

/**
 * A technician records a pesticide application only under an applicator license on record that
 * is good on the day of the application (the license the People page keeps). Every pesticide in
 * our product data is one whose commercial application needs a certified applicator (US EPA,
 * 40 CFR 171: certification of pesticide applicators; state rules extend it to general-use
 * products applied for hire), so no license on record is refused as an expired one is.
 */
async function assertLicensedApplicator(actor: Actor, appliedOn: string): Promise<void> {
  const license = await db()
    .selectFrom("users")
    .select(["license_number", "license_category", "license_expires_on"])
    .where("id", "=", actor.userId)
    .executeTakeFirst();
  if (!license?.license_number || !license.license_expires_on)
    throw invalid(
      {
        applicatorLicence: [
          "Applicator license: none is on record for you. Ask your manager to record your license on the People page before applying a pesticide.",
        ],
      },
      "A pesticide application needs an applicator license on record.",
    );
  if (license.license_expires_on < appliedOn) {
    const expired = formatDate(license.license_expires_on, actor.companyLocale);
    throw invalid(
      {
        applicatorLicence: [
          `Applicator license ${license.license_number} expired on ${expired}. A pesticide cannot be recorded under it; renew it and ask your manager to update it on the People page.`,
        ],
      },
      `Applicator license ${license.license_number} expired on ${expired}.`,
    );
  }
}

/** The visit an application is recorded on, with what its checks read (unlocked: checked again under the lock). */
async function applicationVisit(actor: Actor, visitId: string) {
  const visit = await db()
    .selectFrom("visits")
    .innerJoin("properties", "properties.id", "visits.property_id")
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .select([
      "visits.id",
      "visits.status",
      "visits.property_id",
      "visits.started_at",
      "visits.completed_at",
      "visits.weather",
      "properties.time_zone",
      "rule_sets.id as rule_set_id",
    ])
    .where(visitInScope(actor))
    .where("visits.id", "=", visitId)
    .executeTakeFirst();
  if (!visit) throw notFound("That visit");
  if (visit.status === "cancelled") throw new AppError("conflict", "This visit was canceled.");
  if (visit.status === "completed" && actor.role !== "manager")
    throw new AppError(
      "forbidden",
      "This visit is finished and locked. Ask your manager to correct the application.",
    );
  return visit;
}
type ApplicationVisit = Awaited<ReturnType<typeof applicationVisit>>;

/** What an application's fields are checked against when it is corrected (its own row left out). */
interface Correcting {
  id: string;
  appliedAt: Date;
}

/**
 * The checks every application goes through, new or corrected: the zone and product of the
 * company, the record's required fields, the time bound to the visit, the label and the rule set
 * on that date. Refusals throw (422); what passes comes back with the row's computed columns.
 */
async function prepareApplication(
  actor: Actor,
  visit: ApplicationVisit,
  input: Omit<ApplicationInput, "id">,
  correcting: Correcting | null,
) {
  const zone = await db()
    .selectFrom("zones")
    .selectAll()
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", visit.property_id)
    .where("id", "=", input.zoneId)
    .executeTakeFirst();
  if (!zone) throw invalid({ zoneId: ["That zone is not part of this property."] });
  const productRow = await db()
    .selectFrom("products")
    .selectAll()
    .where("company_id", "=", actor.companyId)
    .where("id", "=", input.productId)
    .executeTakeFirst();
  if (!productRow) throw invalid({ productId: ["Choose a product from your catalog."] });
  const product = toProductDto(productRow);
  if (product.isArchived) throw invalid({ productId: ["That product is archived."] });
  const ruleRow = visit.rule_set_id
    ? await db()
        .selectFrom("rule_sets")
        .selectAll()
        .where("id", "=", visit.rule_set_id)
        .executeTakeFirstOrThrow()
    : null;
  const ruleSet = ruleRow ? toRuleSetDto(ruleRow) : null;
  // A record is not complete until the fields its rule set requires are filled (pesticides
  // always need the applicator's name and certification number).
  const required = new Set<string>(
    product.isPesticide ? ["applicator_name", "applicator_licence"] : [],
  );
  if (ruleSet && (ruleSet.recordFieldsApplyTo === "all" || product.isPesticide))
    for (const f of ruleSet.recordRequiredFields) required.add(f);
  const missing: Record<string, string[]> = {};
  if (required.has("applicator_name") && !input.applicatorName)
    missing.applicatorName = ["The record needs the certified applicator's name."];
  if (required.has("applicator_licence") && !input.applicatorLicence)
    missing.applicatorLicence = [
      "The record needs the applicator's certification (license) number.",
    ];
  if (required.has("wind_mph") && input.windMph === null)
    missing.windMph = ["The record needs the wind speed at application."];
  if (required.has("temperature_f") && input.temperatureF === null)
    missing.temperatureF = ["The record needs the temperature at application."];
  if (Object.keys(missing).length) throw invalid(missing, "The application record is incomplete.");

  // The time of the record: within the visit, never any date a client sends (a date outside the
  // visit would move the blackout, the year's N and the legal record).
  const bound = bindAppliedAt(
    input.appliedAt ? new Date(input.appliedAt) : (correcting?.appliedAt ?? null),
    {
      startedAt: visit.started_at ? new Date(visit.started_at) : null,
      completedAt: visit.completed_at ? new Date(visit.completed_at) : null,
    },
    new Date(),
  );
  if (!bound.ok) {
    const local = (d: Date) =>
      new Intl.DateTimeFormat("en-US", {
        timeZone: visit.time_zone,
        dateStyle: "medium",
        timeStyle: "short",
      }).format(d);
    throw invalid(
      {
        appliedAt: [
          `An application is recorded at the time of its visit: between ${local(bound.from)} and ${local(bound.to)}.`,
        ],
      },
      "The application time is outside the visit.",
    );
  }
  const appliedAt = bound.at;
  const appliedOn = todayIn(visit.time_zone, appliedAt);
  if (product.isPesticide && actor.role === "technician")
    await assertLicensedApplicator(actor, appliedOn);
  const species = findGrassSpecies(zone.grass_species);
  const weather = visit.weather as {
    status?: string;
    tminF?: unknown;
    precipIn?: unknown;
    isForecast?: unknown;
  } | null;
  const sameProduct = await db()
    .selectFrom("applications")
    .select(["applied_on", "product_total_lb", "area_ft2"])
    .where("company_id", "=", actor.companyId)
    .where("zone_id", "=", zone.id)
    .where("product_id", "=", product.id)
    .$if(correcting !== null, (q) => q.where("id", "!=", correcting!.id))
    .execute();
  // The zone's applications of seed and pre-emergence products in the year around this one
  // (the longest interval is under a year), for the seeding checks (lib/agronomy/seeding.ts).
  const seedingRows = await db()
    .selectFrom("applications")
    .innerJoin("products", "products.id", "applications.product_id")
    .select([
      "applications.applied_on",
      "products.name",
      "products.pre_emergence_active",
      "products.seeding_interval_days",
      "products.seed_species",
    ])
    .where("applications.company_id", "=", actor.companyId)
    .where("applications.zone_id", "=", zone.id)
    .where((eb) =>
      eb.or([
        eb("products.pre_emergence_active", "is not", null),
        eb("products.seed_species", "is not", null),
      ]),
    )
    .where("applications.applied_on", ">", addDays(appliedOn, -366))
    .where("applications.applied_on", "<", addDays(appliedOn, 366))
    .$if(correcting !== null, (q) => q.where("applications.id", "!=", correcting!.id))
    .execute();
  let assessed: Assessment;
  try {
    assessed = assessApplication({
      product,
      rate: { amount: input.rateAmount, unit: input.rateUnit },
      areaFt2: Number(zone.area_ft2),
      ruleSet,
      facts: {
        appliedOn,
        isEstablishing: input.isEstablishing,
        isRepairing: input.isRepairing ?? false,
        soilTestOn: await phosphorusSoilTestOn(
          db(),
          actor.companyId,
          visit.property_id,
          zone.id,
          appliedOn,
        ),
        yearToDateNLb: await getZoneNitrogenYearToDate(
          actor.companyId,
          zone.id,
          appliedOn,
          correcting?.id,
        ),
        annualNRange: species
          ? { min: species.annualNitrogenLb.min, max: species.annualNitrogenLb.max }
          : null,
        weather:
          weather?.status === "ok"
            ? {
                tminF: typeof weather.tminF === "number" ? weather.tminF : null,
                precipIn: typeof weather.precipIn === "number" ? weather.precipIn : null,
                isForecast: weather.isForecast === true,
              }
            : null,
      },
      zoneTreatments: seedingRows.map((r) => ({
        date: r.applied_on,
        productName: r.name,
        preEmergence: r.pre_emergence_active
          ? { active: r.pre_emergence_active, labelIntervalDays: r.seeding_interval_days }
          : null,
        seedSpecies: r.seed_species,
      })),
      zoneSpecies: zone.grass_species,
      formatDate: (d) => formatDate(d, actor.companyLocale),
      sameProductOnZone: sameProduct.map((r) => ({
        appliedOn: r.applied_on,
        productLbPer1000: (Number(r.product_total_lb) / Number(r.area_ft2)) * 1000,
      })),
    });
  } catch (err) {
    if (err instanceof NutrientInputError) throw invalid({ rateUnit: [err.message] });
    throw err;
  }
  const { per1000, totals, findings, refused } = assessed;
  const refusals = findings.filter((f) => f.severity === "refusal").map((f) => f.message);
  if (assessed.labelRefused)
    throw new AppError(
      "invalid_input",
      "The product label does not allow this application, and no one can override a label limit.",
      { rateAmount: refusals },
      { findings },
    );
  if (refused && (actor.role !== "manager" || !input.overrideReason)) {
    throw new AppError(
      "invalid_input",
      actor.role === "manager"
        ? "This application breaks a legal limit. Record an override category and reason to save it anyway."
        : "This application breaks a legal limit and was not recorded. Ask your manager if it must go ahead.",
      { rateAmount: refusals },
      { findings },
    );
  }
  if (refused && !input.overrideCategory)
    throw new AppError(
      "invalid_input",
      "An override needs its category as well as the reason.",
      { overrideCategory: ["Choose why the override applies."] },
      { findings },
    );

  return {
    zone,
    product,
    bound,
    refused,
    columns: {
      zone_id: zone.id,
      product_id: product.id,
      rate_amount: input.rateAmount,
      rate_unit: input.rateUnit,
      area_ft2: Number(zone.area_ft2),
      product_total_lb: totals.lb,
      product_total_gal: totals.gal,
      n_lb_per_1000: per1000.nLb,
      p2o5_lb_per_1000: per1000.p2o5Lb,
      k2o_lb_per_1000: per1000.k2oLb,
      wsn_lb_per_1000: per1000.wsnLb,
      applied_on: appliedOn,
      applied_at: appliedAt,
      wind_mph: input.windMph,
      temperature_f: input.temperatureF,
      is_establishing: input.isEstablishing,
      is_repairing: input.isRepairing ?? false,
      applicator_name: input.applicatorName,
      applicator_licence: input.applicatorLicence,
      findings: JSON.stringify(findings),
      override_reason: refused ? input.overrideReason : null,
      override_category: refused ? (input.overrideCategory ?? null) : null,
      override_by: refused ? actor.userId : null,
    },
  };
}

export async function recordApplication(
  actor: Actor,
  visitId: string,
  input: ApplicationInput,
): Promise<ApplicationDto> {
  const retried = await recordedApplication(actor, visitId, input.id);
  if (retried) return retried; // a retry of a recorded application

  const visit = await applicationVisit(actor, visitId);
  // A technician may not write to a finished visit at all (403, before asking for a reason); a
  // manager's application added to it is a correction: it says why (422 before any work).
  assertEditable(actor, visit);
  correctionReasonFor(visit, input.correctionReason);
  const { zone, product, bound, refused, columns } = await prepareApplication(
    actor,
    visit,
    input,
    null,
  );
  const appliedAt = columns.applied_at;

  const inserted = await db()
    .transaction()
    .execute(async (trx) => {
      // The visit, locked: a finish (or a cancel) that committed since the checks above wins,
      // and this application is refused instead of being stored after the visit was closed.
      const locked = await lockVisit(trx, actor, visitId);
      assertEditable(actor, locked);
      if (locked.status === "completed" && visit.status !== "completed")
        throw new AppError(
          "conflict",
          "This visit was finished while the application was being recorded, so it was not saved. A manager can add it as a correction.",
        );
      const reason = correctionReasonFor(locked, input.correctionReason);
      const row = await trx
        .insertInto("applications")
        .values({
          id: input.id,
          company_id: actor.companyId,
          visit_id: visitId,
          ...columns,
          created_by: actor.userId,
        })
        // The same submission sent again while the first was being recorded: the first one wins.
        // No conflict target: the id is unique twice over (primary key and (company_id, id)).
        .onConflict((oc) => oc.doNothing())
        .returning("id")
        .executeTakeFirst();
      if (!row) return false;
      const where = { visitId, zoneId: zone.id };
      if (locked.status === "completed")
        await recordAudit(trx, actor, {
          entity: "application",
          entityId: input.id,
          action: "add_after_finish",
          changes: applicationFacts(null, { product: product.name, ...columns }),
          reason,
          ...where,
        });
      // The applicator typed on a record is remembered on the account of whoever recorded it, and
      // fills the next application's form (a field left empty keeps the remembered value).
      if (input.applicatorName || input.applicatorLicence)
        await trx
          .updateTable("users")
          .set({
            ...(input.applicatorName ? { applicator_name: input.applicatorName } : {}),
            ...(input.applicatorLicence ? { applicator_license: input.applicatorLicence } : {}),
          })
          .where("id", "=", actor.userId)
          .execute();
      if (refused)
        await recordAudit(trx, actor, {
          entity: "application",
          entityId: input.id,
          action: "override_legal_limit",
          ...where,
          changes: {
            category: { from: null, to: input.overrideCategory ?? null },
            reason: { from: null, to: input.overrideReason },
          },
        });
      if (bound.differs)
        // Dated away from the visit's own time (within the visit): kept, and said so.
        await recordAudit(trx, actor, {
          entity: "application",
          entityId: input.id,
          action: "applied_at_differs",
          ...where,
          changes: {
            appliedAt: { from: bound.expected.toISOString(), to: appliedAt.toISOString() },
          },
        });
      if (locked.status === "scheduled")
        await trx
          .updateTable("visits")
          .set({ status: "in_progress", started_at: sql<Date>`now()`, started_by: actor.userId })
          .where("id", "=", visitId)
          .execute();
      // N this year in the book at once; alerts at once on a finished visit (an open visit's
      // are evaluated when it is finished).
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: visit.status === "completed" ? "evaluate" : "keep",
      });
      return true;
    });
  if (!inserted) {
    const first = await recordedApplication(actor, visitId, input.id);
    if (!first) throw new Error("application missing after a concurrent insert");
    return first;
  }
  const saved = (await listVisitApplications(actor, visitId)).find((a) => a.id === input.id);
  if (!saved) throw new Error("application missing after insert");
  return saved;
}

/**
 * Who may correct or delete an application: on an open visit its author, or a manager; on a
 * finished visit only a manager, with a reason (audited). Out of scope is 404; another
 * technician's application on a visit in scope is 403.
 */
function assertMayChange(
  actor: Actor,
  visit: { status: string },
  row: { created_by: string | null },
  verb: "correct" | "delete",
) {
  assertEditable(actor, visit);
  if (actor.role !== "manager" && row.created_by !== actor.userId)
    throw new AppError(
      "forbidden",
      `Only the person who recorded this application, or a manager, can ${verb} it.`,
    );
}

async function lockedApplication(trx: Transaction<Database>, actor: Actor, applicationId: string) {
  const row = await trx
    .selectFrom("applications")
    .innerJoin("products", "products.id", "applications.product_id")
    .innerJoin("zones", "zones.id", "applications.zone_id")
    .selectAll("applications")
    .select(["products.name as product_name", "zones.name as zone_name"])
    .where("applications.company_id", "=", actor.companyId)
    .where("applications.id", "=", applicationId)
    .forUpdate("applications")
    .executeTakeFirst();
  if (!row) throw notFound("That application");
  return row;
}

/** The application's visit, in scope (404 otherwise), before any work. */
async function visitOfApplication(actor: Actor, applicationId: string) {
  const row = await db()
    .selectFrom("applications")
    .innerJoin("visits", "visits.id", "applications.visit_id")
    .select(["applications.visit_id", "applications.created_by"])
    .where(visitInScope(actor))
    .where("applications.company_id", "=", actor.companyId)
    .where("applications.id", "=", applicationId)
    .executeTakeFirst();
  if (!row) throw notFound("That application");
  return row;
}

/**
 * Corrects an application: the whole record again, through the same checks as a new one (the
 * time bound to the visit, the label, the rule set on that date, with this application's own N
 * and product left out of the totals it is checked against). Audited with before → after.
 */
export async function correctApplication(
  actor: Actor,
  applicationId: string,
  input: Omit<ApplicationInput, "id">,
): Promise<ApplicationDto> {
  const { visit_id: visitId, created_by } = await visitOfApplication(actor, applicationId);
  const visit = await applicationVisit(actor, visitId);
  assertMayChange(actor, visit, { created_by }, "correct");
  correctionReasonFor(visit, input.correctionReason);
  const current = await db()
    .selectFrom("applications")
    .select(["applied_at"])
    .where("id", "=", applicationId)
    .executeTakeFirstOrThrow();
  const { zone, product, refused, columns } = await prepareApplication(actor, visit, input, {
    id: applicationId,
    appliedAt: new Date(current.applied_at),
  });
  await db()
    .transaction()
    .execute(async (trx) => {
      const locked = await lockVisit(trx, actor, visitId);
      const before = await lockedApplication(trx, actor, applicationId);
      assertMayChange(actor, locked, before, "correct");
      if (locked.status !== visit.status)
        throw new AppError(
          "conflict",
          "This visit changed while the application was being corrected. Open it again and retry.",
        );
      const reason = correctionReasonFor(locked, input.correctionReason);
      await trx
        .updateTable("applications")
        .set(columns)
        .where("company_id", "=", actor.companyId)
        .where("id", "=", applicationId)
        .execute();
      const changes = applicationFacts(
        { product: before.product_name, zone: before.zone_name, ...before },
        { product: product.name, zone: zone.name, ...columns },
      );
      // A record already audited as it stands is not audited again (a retry of the same correction).
      if (Object.entries(changes).some(([, c]) => JSON.stringify(c.from) !== JSON.stringify(c.to)))
        await recordAudit(trx, actor, {
          entity: "application",
          entityId: applicationId,
          action: locked.status === "completed" ? "edit_after_finish" : "edit",
          changes,
          reason,
          visitId,
          zoneId: zone.id,
        });
      if (refused)
        await recordAudit(trx, actor, {
          entity: "application",
          entityId: applicationId,
          action: "override_legal_limit",
          changes: {
            category: { from: null, to: input.overrideCategory ?? null },
            reason: { from: null, to: input.overrideReason },
          },
          visitId,
          zoneId: zone.id,
        });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: locked.status === "completed" ? "evaluate" : "keep",
      });
    });
  const saved = (await listVisitApplications(actor, visitId)).find((a) => a.id === applicationId);
  if (!saved) throw new Error("application missing after correction");
  return saved;
}

/** Deletes an application (its author while the visit is open, a manager with a reason after); audited. */
export async function deleteApplication(
  actor: Actor,
  applicationId: string,
  correctionReason: string | null | undefined,
): Promise<void> {
  const { visit_id: visitId } = await visitOfApplication(actor, applicationId);
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      const before = await lockedApplication(trx, actor, applicationId);
      assertMayChange(actor, visit, before, "delete");
      const reason = correctionReasonFor(visit, correctionReason);
      await trx
        .deleteFrom("applications")
        .where("company_id", "=", actor.companyId)
        .where("id", "=", applicationId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "application",
        entityId: applicationId,
        action: visit.status === "completed" ? "delete_after_finish" : "delete",
        changes: applicationFacts({ product: before.product_name, ...before }, null),
        reason,
        visitId,
        zoneId: before.zone_id,
      });
      // The zone's N this year and the book follow at once; a finished visit's alerts too.
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: visit.status === "completed" ? "evaluate" : "keep",
      });
    });
}
