// Loads a scenario (fixtures/demo-scenario.ts) into a database. Shared by the demo seed and the
// tests, which call it with their own scenario or the demo one.
import type { Kysely } from "kysely";
import type { ScenarioCompany } from "@/fixtures/demo-scenario";
import { hashPassword } from "@/lib/auth/password";
import type { Database } from "./schema";

export interface SeededCompany {
  companyId: string;
  userIds: Record<string, string>;
  propertyIds: Record<string, string>;
}

export async function seedCompany(db: Kysely<Database>, company: ScenarioCompany, password: string): Promise<SeededCompany> {
  const passwordHash = await hashPassword(password);
  return db.transaction().execute(async (trx) => {
    const { id: companyId } = await trx
      .insertInto("companies")
      .values({ name: company.name, slug: company.slug, unit_system: company.unitSystem })
      .returning("id")
      .executeTakeFirstOrThrow();

    const userIds: Record<string, string> = {};
    for (const person of company.people) {
      const { id } = await trx
        .insertInto("users")
        .values({ email: person.email.toLowerCase(), name: person.name, password_hash: passwordHash })
        .returning("id")
        .executeTakeFirstOrThrow();
      await trx.insertInto("memberships").values({ company_id: companyId, user_id: id, role: person.role }).execute();
      userIds[person.key] = id;
    }

    const propertyIds: Record<string, string> = {};
    for (const p of company.properties) {
      const technicianId = p.technician ? userIds[p.technician] : null;
      if (technicianId === undefined) throw new Error(`Scenario ${company.slug}: unknown technician ${p.technician}`);
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
        })
        .returning("id")
        .executeTakeFirstOrThrow();
      propertyIds[p.key] = id;
      for (const owner of p.homeowners) {
        const userId = userIds[owner];
        if (!userId) throw new Error(`Scenario ${company.slug}: unknown homeowner ${owner}`);
        await trx.insertInto("property_homeowners").values({ property_id: id, user_id: userId, company_id: companyId }).execute();
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
    return { companyId, userIds, propertyIds };
  });
}

/** Removes a company and everything it owns (cascades), then the users who belonged to it. */
export async function removeCompany(db: Kysely<Database>, slug: string): Promise<void> {
  await db.transaction().execute(async (trx) => {
    const company = await trx.selectFrom("companies").select("id").where("slug", "=", slug).executeTakeFirst();
    if (!company) return;
    const members = await trx.selectFrom("memberships").select("user_id").where("company_id", "=", company.id).execute();
    await trx.deleteFrom("companies").where("id", "=", company.id).execute();
    if (members.length) await trx.deleteFrom("users").where("id", "in", members.map((m) => m.user_id)).execute();
  });
}
