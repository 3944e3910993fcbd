// Reads of season programs: the company's programs with their rounds, one program, and what a
// property's plan is computed from (its program, zones, rule set, products).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { notFound } from "@/lib/http/app-error";

import type { ProgramDto } from "./dto";
import { toRoundDto } from "./map";
import type { PlanProduct, PlanZone } from "./plan";

export async function listPrograms(actor: Actor): Promise<ProgramDto[]> {
  const programs = await db()
    .selectFrom("programs")
    .selectAll("programs")
    .select((eb) =>
      eb
        .selectFrom("properties")
        .select((e) => e.fn.countAll<number>().as("n"))
        .whereRef("properties.program_id", "=", "programs.id")
        .where("properties.company_id", "=", actor.companyId)
        .where("properties.archived_at", "is", null)
        .as("property_count"),
    )
    .where("programs.company_id", "=", actor.companyId)
    .orderBy("programs.name")
    .execute();
  if (!programs.length) return [];
  const rounds = await db()
    .selectFrom("program_rounds")
    .selectAll()
    .where("company_id", "=", actor.companyId)
    .where(
      "program_id",
      "in",
      programs.map((p) => p.id),
    )
    .orderBy("position")
    .execute();
  return programs.map((p) => ({
    id: p.id,
    name: p.name,
    grassSeason: p.grass_season,
    notes: p.notes,
    propertyCount: Number(p.property_count ?? 0),
    rounds: rounds.filter((r) => r.program_id === p.id).map(toRoundDto),
  }));
}

export async function getProgram(actor: Actor, programId: string): Promise<ProgramDto> {
  const found = (await listPrograms(actor)).find((p) => p.id === programId);
  if (!found) throw notFound("That program");
  return found;
}

/** The facts a property's season plan reads; 404 outside the actor's scope. */
export async function getPlanFacts(actor: Actor, propertyId: string) {
  const property = await db()
    .selectFrom("properties")
    .leftJoin("rule_sets", "rule_sets.id", "properties.rule_set_id")
    .select([
      "properties.id",
      "properties.latitude",
      "properties.longitude",
      "properties.time_zone",
      "properties.program_id",
      "rule_sets.name as rule_set_name",
      "rule_sets.max_n_lb_per_1000",
      "rule_sets.pro_no_fertilizer_after",
      "rule_sets.pro_no_fertilizer_before",
    ])
    .where(propertyInScope(actor))
    .where("properties.id", "=", propertyId)
    .executeTakeFirst();
  if (!property) throw notFound("That property");
  const program = property.program_id
    ? await db()
        .selectFrom("programs")
        .select(["id", "name", "grass_season"])
        .where("company_id", "=", actor.companyId)
        .where("id", "=", property.program_id)
        .executeTakeFirst()
    : undefined;
  const rounds = program
    ? (
        await db()
          .selectFrom("program_rounds")
          .selectAll()
          .where("company_id", "=", actor.companyId)
          .where("program_id", "=", program.id)
          .orderBy("position")
          .execute()
      ).map(toRoundDto)
    : [];
  const zoneRows = await db()
    .selectFrom("zones")
    .select([
      "id",
      "name",
      "area_ft2",
      "grass_species",
      "sun_exposure",
      "is_irrigated",
      "program_method",
      "program_excluded_year",
      "program_excluded_reason",
    ])
    .where("company_id", "=", actor.companyId)
    .where("property_id", "=", propertyId)
    .where("archived_at", "is", null)
    .orderBy("sort_order")
    .orderBy("name")
    .execute();
  const zones: PlanZone[] = zoneRows.map((z) => ({
    id: z.id,
    name: z.name,
    areaFt2: Number(z.area_ft2),
    species: z.grass_species,
    sun: z.sun_exposure,
    irrigated: z.is_irrigated,
    method: z.program_method,
    excluded:
      z.program_excluded_year !== null && z.program_excluded_reason !== null
        ? { year: z.program_excluded_year, reason: z.program_excluded_reason }
        : null,
  }));
  const productIds = [
    ...new Set(rounds.flatMap((r) => [r.granular.productId, r.liquid.productId])),
  ].filter((id): id is string => id !== null);
  const productRows = productIds.length
    ? await db()
        .selectFrom("products")
        .selectAll()
        .where("company_id", "=", actor.companyId)
        .where("id", "in", productIds)
        .execute()
    : [];
  const products = new Map<string, PlanProduct>(
    productRows.map((p) => [
      p.id,
      {
        id: p.id,
        name: p.name,
        form: p.form,
        nPct: Number(p.n_pct),
        p2o5Pct: Number(p.p2o5_pct),
        k2oPct: Number(p.k2o_pct),
        densityLbPerGal: p.density_lb_per_gal === null ? undefined : Number(p.density_lb_per_gal),
        labelMaxRate: p.label_max_rate === null ? null : Number(p.label_max_rate),
        labelMaxYearly: p.label_max_yearly === null ? null : Number(p.label_max_yearly),
        labelRateUnit: p.label_rate_unit,
      },
    ]),
  );
  const blackout =
    property.pro_no_fertilizer_after && property.pro_no_fertilizer_before
      ? ([property.pro_no_fertilizer_after, property.pro_no_fertilizer_before] as const)
      : null;
  return {
    property: {
      id: property.id,
      latitude: Number(property.latitude),
      longitude: Number(property.longitude),
      timeZone: property.time_zone,
    },
    program: program
      ? { id: program.id, name: program.name, grassSeason: program.grass_season }
      : null,
    rounds,
    zones,
    products,
    ruleSet:
      property.rule_set_name !== null
        ? {
            name: property.rule_set_name,
            maxNLbPer1000:
              property.max_n_lb_per_1000 === null ? null : Number(property.max_n_lb_per_1000),
            proBlackout: blackout,
          }
        : null,
  };
}
