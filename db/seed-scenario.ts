// Loads a scenario (fixtures/demo/scenario.ts) into a database. Shared by the demo seed and the
// tests, which call it with their own scenario or the demo one.
import { randomUUID } from "node:crypto";
import type { Kysely, Transaction } from "kysely";

import { DEMO_PRODUCTS } from "@/fixtures/demo/products";
import type { ScenarioCompany, ScenarioFinding } from "@/fixtures/demo/scenario";
import { fakeWeatherDay } from "@/fixtures/demo/weather-days";
import { nutrientsPer1000, productForArea } from "@/lib/agronomy/nutrients";
import { checkApplication, isRefused } from "@/lib/agronomy/rules";
import { zoneWateringByDate } from "@/lib/agronomy/water";
import { hashPassword } from "@/lib/auth/password";
import { refreshPropertySummary } from "@/lib/book/summary";
import { addDays, todayIn } from "@/lib/dates";
import { productColumns } from "@/lib/products/map";
import { findGrassSpecies } from "@/lib/reference/grass-species";
import { SHIPPED_RULE_SETS } from "@/lib/reference/rule-sets";
import { ruleSetColumns } from "@/lib/rule-sets/map";
import { availableNitrogen } from "@/lib/scoring/available-nitrogen";
import { refreshCheckIndex } from "@/lib/scoring/store-index";
import { deriveDays } from "@/lib/weather/derived";

import type { Database, NewZoneCheck } from "./schema";

export interface SeededCompany {
  companyId: string;
  userIds: Record<string, string>;
  propertyIds: Record<string, string>;
}

export async function seedCompany(
  db: Kysely<Database>,
  company: ScenarioCompany,
  password: string,
): Promise<SeededCompany> {
  const passwordHash = await hashPassword(password);
  return db.transaction().execute(async (trx) => {
    const { id: companyId } = await trx
      .insertInto("companies")
      .values({
        name: company.name,
        slug: company.slug,
        unit_system: company.unitSystem,
        time_zone: companyTimeZone(company),
      })
      .returning("id")
      .executeTakeFirstOrThrow();

    const ruleSets = await trx
      .insertInto("rule_sets")
      .values(SHIPPED_RULE_SETS.map((r) => ({ company_id: companyId, ...ruleSetColumns(r) })))
      .returning(["id", "name"])
      .execute();

    await trx
      .insertInto("products")
      .values(DEMO_PRODUCTS.map((p) => ({ company_id: companyId, ...productColumns(p) })))
      .execute();

    const userIds: Record<string, string> = {};
    for (const person of company.people) {
      const { id } = await trx
        .insertInto("users")
        .values({
          email: person.email.toLowerCase(),
          name: person.name,
          password_hash: passwordHash,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      await trx
        .insertInto("memberships")
        .values({ company_id: companyId, user_id: id, role: person.role })
        .execute();
      userIds[person.key] = id;
    }

    const propertyIds: Record<string, string> = {};
    for (const p of company.properties) {
      const technicianId = p.technician ? userIds[p.technician] : null;
      if (technicianId === undefined)
        throw new Error(`Scenario ${company.slug}: unknown technician ${p.technician}`);
      const { id } = await trx
        .insertInto("properties")
        .values({
          company_id: companyId,
          name: p.name,
          street: p.street,
          city: p.city,
          region: p.region,
          postal_code: p.postalCode,
          latitude: p.latitude,
          longitude: p.longitude,
          time_zone: p.timeZone,
          technician_id: technicianId,
          rule_set_id: ruleSets.find((r) => r.name === p.ruleSet)?.id ?? null,
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      propertyIds[p.key] = id;
      for (const owner of p.homeowners) {
        const userId = userIds[owner];
        if (!userId) throw new Error(`Scenario ${company.slug}: unknown homeowner ${owner}`);
        await trx
          .insertInto("property_homeowners")
          .values({ property_id: id, user_id: userId, company_id: companyId })
          .execute();
      }
      if (p.zones.length) {
        await trx
          .insertInto("zones")
          .values(
            p.zones.map((z, i) => ({
              company_id: companyId,
              property_id: id,
              name: z.name,
              area_ft2: z.areaFt2,
              grass_species: z.grassSpecies,
              sun_exposure: z.sunExposure,
              is_irrigated: z.isIrrigated,
              slope: z.slope,
              sort_order: i,
            })),
          )
          .execute();
      }
    }
    const seeded = { companyId, userIds, propertyIds };
    await seedSchedule(trx, seeded, company, todayIn(companyTimeZone(company)));
    // The book reads each property's summary; the write paths keep it from here on.
    for (const propertyId of Object.values(propertyIds))
      await refreshPropertySummary(trx, companyId, propertyId);
    return seeded;
  });
}

function companyTimeZone(company: ScenarioCompany): string {
  return company.properties[0]?.timeZone ?? "America/New_York";
}

/** A small deterministic number from a text (stable demo values without a random generator). */
function pick(text: string, choices: readonly number[]): number {
  let h = 0;
  for (const ch of text) h = (h * 31 + ch.charCodeAt(0)) >>> 0;
  return choices[h % choices.length]!;
}

/**
 * A past check: the latest visit carries the scenario's findings; earlier ones are offset by the
 * zone's drift per visit (`stepsBack` visits before the latest), so the season tells a story.
 */
function pastCheck(
  seed: string,
  finding: ScenarioFinding | undefined,
  stepsBack: number,
  drift: number,
  fromHistory: number,
): Omit<NewZoneCheck, "id" | "company_id" | "visit_id" | "zone_id"> {
  const at = (latest: number, extra = 0) =>
    Math.min(9, Math.max(1, Math.round(latest - drift * stepsBack + extra)));
  const isLatest = stepsBack === 0;
  return {
    status: "done",
    quality: at(finding?.quality ?? pick(`${seed}q`, [7, 7, 8]), isLatest ? 0 : fromHistory / 2),
    // The latest visit keeps its findings as written; earlier ones show the feeding and water they had.
    color: at(finding?.color ?? pick(`${seed}c`, [7, 7, 8]), isLatest ? 0 : fromHistory),
    density: at(finding?.density ?? pick(`${seed}d`, [7, 7, 8])),
    uniformity: at(pick(`${seed}u`, [6, 7, 8])),
    bare_pct: Math.max(
      0,
      Math.min(
        100,
        Math.round(
          ((finding?.barePct ?? pick(`${seed}b`, [0, 0, 5])) +
            (drift > 0 ? 5 : -5) * stepsBack * Math.abs(drift)) /
            5,
        ) * 5,
      ),
    ),
    weeds_pct: finding?.weedsPct ?? pick(`${seed}w`, [0, 5, 5, 10]),
    thatch_in: pick(`${seed}t`, [0.25, 0.5, 0.5]),
    soil_moisture: "moist",
    height_of_cut_in: finding?.heightOfCutIn ?? pick(`${seed}h`, [3, 3.25, 3.5]),
    mowing_direction: finding?.mowingDirection ?? "changed",
    is_matted: finding?.isMatted ?? false,
    has_torn_tips: finding?.hasTornTips ?? false,
    symptoms: JSON.stringify(isLatest || stepsBack === 1 ? (finding?.symptoms ?? []) : []),
    notes: isLatest ? (finding?.notes ?? "") : "",
  };
}

/** Past completed visits with their zone checks, and today's stops (dates relative to today). */
async function seedSchedule(
  trx: Transaction<Database>,
  seeded: SeededCompany,
  company: ScenarioCompany,
  today: string,
): Promise<void> {
  const schedule = company.schedule;
  if (!schedule) return;
  const zones = await trx
    .selectFrom("zones")
    .select(["id", "name", "property_id", "area_ft2", "grass_species", "is_irrigated"])
    .where("company_id", "=", seeded.companyId)
    .execute();
  const products = await trx
    .selectFrom("products")
    .selectAll()
    .where("company_id", "=", seeded.companyId)
    .execute();
  const byRecency = [...schedule.pastVisitsDaysAgo].sort((a, b) => a.daysAgo - b.daysAgo);
  const oldestFirst = [...schedule.pastVisitsDaysAgo].sort((a, b) => b.daysAgo - a.daysAgo);
  for (const p of company.properties) {
    const technicianId = p.technician ? seeded.userIds[p.technician] : undefined;
    const propertyId = seeded.propertyIds[p.key];
    if (!technicianId || !propertyId) continue;
    const rules = SHIPPED_RULE_SETS.find((r) => r.name === p.ruleSet) ?? null;
    const applied = new Map<string, { date: string; wsnLb: number; slowLb: number }[]>(); // per zone id, so far
    const yearN = new Map<string, number>();
    // Irrigation of the irrigated zones, logged by the technician from the controller.
    const { everyDays, depthIn, fromDaysAgo, untilDaysAgo } = schedule.irrigation;
    const waterings = zones
      .filter((z) => z.property_id === propertyId && z.is_irrigated)
      .flatMap((z) => {
        const rows = [];
        for (let d = fromDaysAgo; d >= untilDaysAgo; d -= everyDays) {
          rows.push({
            id: randomUUID(),
            company_id: seeded.companyId,
            property_id: propertyId,
            zone_id: z.id,
            watered_on: addDays(today, -d),
            depth_in: depthIn,
            entered_by_role: "technician" as const,
            created_by: technicianId,
          });
        }
        return rows;
      });
    if (waterings.length) await trx.insertInto("waterings").values(waterings).execute();
    // The demo weather (the same deterministic days the local weather fake serves) gives each
    // zone its 14-day water balance before a check; lawns without irrigation show dry spells.
    const firstDate = addDays(today, -(oldestFirst[0]?.daysAgo ?? 0) - 15);
    const weatherDays = Array.from(
      {
        length: Math.max(
          0,
          Math.round((Date.parse(today) - Date.parse(firstDate)) / 86_400_000) + 1,
        ),
      },
      (_, i) => fakeWeatherDay(p.latitude, p.longitude, addDays(firstDate, i), today),
    );
    const balanceByZone = new Map(
      zones
        .filter((z) => z.property_id === propertyId)
        .map((z) => {
          return [
            z.id,
            new Map(
              deriveDays(weatherDays, {
                latitudeDeg: p.latitude,
                kc: 0.8,
                wateringInByDate: zoneWateringByDate(waterings, z.id),
              }).map((d) => [d.date, d.balance14In]),
            ),
          ];
        }),
    );
    for (const past of oldestFirst) {
      const date = addDays(today, -past.daysAgo);
      const at = new Date(`${date}T15:00:00Z`);
      const visitId = randomUUID();
      await trx
        .insertInto("visits")
        .values({
          id: visitId,
          company_id: seeded.companyId,
          property_id: propertyId,
          technician_id: technicianId,
          scheduled_for: date,
          planned_service: past.service,
          status: "completed",
          started_at: at,
          started_by: technicianId,
          completed_at: new Date(at.getTime() + 40 * 60_000),
          completed_by: technicianId,
        })
        .execute();
      const propertyZones = zones.filter((z) => z.property_id === propertyId);
      const checks = propertyZones.map((z) => {
        const key = `${p.key}/${z.name}`;
        // The zone's colour follows the N available before the check (what the feeding did).
        const nBefore = availableNitrogen(applied.get(z.id) ?? [], addDays(date, -1));
        const balance = Math.max(
          -2,
          Math.min(1, balanceByZone.get(z.id)?.get(addDays(date, -1)) ?? 0),
        );
        const fromWater = (z.is_irrigated ? 0.2 : 0.8) * balance;
        const jitter = pick(`${key}:${past.daysAgo}`, [-0.4, 0, 0, 0.4]);
        return {
          id: randomUUID(),
          company_id: seeded.companyId,
          visit_id: visitId,
          zone_id: z.id,
          updated_by: technicianId,
          ...pastCheck(
            key,
            schedule.findings[key],
            byRecency.indexOf(past),
            schedule.drift[key] ?? 0.1,
            (schedule.nitrogenResponse[key] ?? 1.5) * (nBefore - 0.5) + fromWater + jitter,
          ),
        };
      });
      if (checks.length) {
        await trx.insertInto("zone_checks").values(checks).execute();
        await refreshCheckIndex(
          trx,
          checks.map((c) => c.id),
        );
      }
      const plan = past.application;
      const product = plan ? products.find((x) => x.name === plan.product) : undefined;
      if (plan && !product)
        throw new Error(`Scenario ${company.slug}: unknown product ${plan.product}`);
      for (const z of plan && product
        ? propertyZones.filter((z) => !plan.except?.includes(`${p.key}/${z.name}`))
        : []) {
        const analysis = {
          nPct: Number(product!.n_pct),
          p2o5Pct: Number(product!.p2o5_pct),
          k2oPct: Number(product!.k2o_pct),
          form: product!.form,
          slowReleaseNPctOfN: Number(product!.slow_release_pct_of_n),
          densityLbPerGal:
            product!.density_lb_per_gal === null ? undefined : Number(product!.density_lb_per_gal),
        };
        const rate = { amount: plan!.rateLbPer1000, unit: "lb/1000ft2" as const };
        const per1000 = nutrientsPer1000(analysis, rate);
        const totals = productForArea(analysis, rate, Number(z.area_ft2));
        const species = findGrassSpecies(z.grass_species);
        const findings = rules
          ? checkApplication(rules, {
              appliedOn: date,
              byProfessional: true,
              nPct: analysis.nPct,
              nLb: per1000.nLb,
              wsnLb: per1000.wsnLb,
              p2o5Lb: per1000.p2o5Lb,
              slowReleasePctOfN: analysis.slowReleaseNPctOfN,
              isEstablishing: plan!.isEstablishing ?? false,
              soilTestOn: null,
              yearToDateNLb: yearN.get(z.id) ?? 0,
              annualNRange: species ? species.annualNitrogenLb : null,
            })
          : [];
        if (isRefused(findings))
          throw new Error(
            `Scenario ${company.slug}: ${plan!.product} at ${p.key}/${z.name} on ${date} breaks ${rules!.name}: ${findings.map((f) => f.message).join(" ")}`,
          );
        await trx
          .insertInto("applications")
          .values({
            id: randomUUID(),
            company_id: seeded.companyId,
            visit_id: visitId,
            zone_id: z.id,
            product_id: product!.id,
            rate_amount: rate.amount,
            rate_unit: rate.unit,
            area_ft2: Number(z.area_ft2),
            product_total_lb: totals.lb,
            product_total_gal: totals.gal,
            n_lb_per_1000: per1000.nLb,
            p2o5_lb_per_1000: per1000.p2o5Lb,
            k2o_lb_per_1000: per1000.k2oLb,
            wsn_lb_per_1000: per1000.wsnLb,
            applied_on: date,
            applied_at: new Date(at.getTime() + 20 * 60_000),
            is_establishing: plan!.isEstablishing ?? false,
            applicator_name: company.people.find((x) => x.key === p.technician)?.name ?? "",
            findings: JSON.stringify(findings),
            created_by: technicianId,
          })
          .execute();
        applied.set(z.id, [
          ...(applied.get(z.id) ?? []),
          { date, wsnLb: per1000.wsnLb, slowLb: per1000.nLb - per1000.wsnLb },
        ]);
        if (date.slice(0, 4) === today.slice(0, 4))
          yearN.set(z.id, (yearN.get(z.id) ?? 0) + per1000.nLb);
      }
    }
  }
  await seedDay(trx, seeded, company, today);
}

/** Today's stops, as scheduled visits in order. */
async function seedDay(
  trx: Transaction<Database> | Kysely<Database>,
  seeded: SeededCompany,
  company: ScenarioCompany,
  today: string,
): Promise<number> {
  const schedule = company.schedule;
  if (!schedule) return 0;
  let count = 0;
  for (const [techKey, stops] of Object.entries(schedule.today)) {
    const technicianId = seeded.userIds[techKey];
    if (!technicianId) throw new Error(`Scenario ${company.slug}: unknown technician ${techKey}`);
    for (const [index, key] of stops.entries()) {
      const propertyId = seeded.propertyIds[key];
      if (!propertyId) throw new Error(`Scenario ${company.slug}: unknown property ${key}`);
      await trx
        .insertInto("visits")
        .values({
          id: randomUUID(),
          company_id: seeded.companyId,
          property_id: propertyId,
          technician_id: technicianId,
          scheduled_for: today,
          stop_order: index + 1,
          planned_service: index === 0 ? "inspection" : "feeding_round",
        })
        .execute();
      count++;
    }
  }
  return count;
}

/**
 * Keeps the demo usable on later days: when the company has no visits today, today's stops are
 * scheduled again (the people and properties are looked up by their scenario e-mails and names).
 */
export async function ensureDemoDay(
  db: Kysely<Database>,
  company: ScenarioCompany,
): Promise<number> {
  const row = await db
    .selectFrom("companies")
    .select(["id", "time_zone"])
    .where("slug", "=", company.slug)
    .executeTakeFirst();
  if (!row || !company.schedule) return 0;
  const today = todayIn(row.time_zone);
  const existing = await db
    .selectFrom("visits")
    .select("id")
    .where("company_id", "=", row.id)
    .where("scheduled_for", "=", today)
    .executeTakeFirst();
  if (existing) return 0;
  const users = await db
    .selectFrom("users")
    .innerJoin("memberships", "memberships.user_id", "users.id")
    .select(["users.id", "users.email"])
    .where("memberships.company_id", "=", row.id)
    .execute();
  const properties = await db
    .selectFrom("properties")
    .select(["id", "name"])
    .where("company_id", "=", row.id)
    .execute();
  const userIds = Object.fromEntries(
    company.people.map((p) => [p.key, users.find((u) => u.email === p.email)?.id ?? ""]),
  );
  const propertyIds = Object.fromEntries(
    company.properties.map((p) => [p.key, properties.find((x) => x.name === p.name)?.id ?? ""]),
  );
  return seedDay(db, { companyId: row.id, userIds, propertyIds }, company, today);
}

/** Removes a company and everything it owns (cascades), then the users who belonged to it. */
export async function removeCompany(db: Kysely<Database>, slug: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const company = await trx
      .selectFrom("companies")
      .select("id")
      .where("slug", "=", slug)
      .executeTakeFirst();
    if (!company) return;
    const members = await trx
      .selectFrom("memberships")
      .select("user_id")
      .where("company_id", "=", company.id)
      .execute();
    // Applications keep their product (no cascade from products), so they go first.
    await trx.deleteFrom("applications").where("company_id", "=", company.id).execute();
    await trx.deleteFrom("companies").where("id", "=", company.id).execute();
    if (members.length)
      await trx
        .deleteFrom("users")
        .where(
          "id",
          "in",
          members.map((m) => m.user_id),
        )
        .execute();
  });
}
