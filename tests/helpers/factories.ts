// Test data: every test file seeds its own fresh company (unique slug and e-mails) from the
// demo scenario's shape, through the same seed function the demo uses.
import { randomUUID } from "node:crypto";
import type { Kysely } from "kysely";

import { createDb } from "@/db/client";
import type { Database } from "@/db/schema";
import { demoCompany, type ScenarioCompany } from "@/fixtures/demo/scenario";
import { seedCompany, type SeededCompany } from "@/fixtures/demo/seed-scenario";
import type { Actor } from "@/lib/auth/actor";
import { createAuthSession } from "@/lib/auth/mutations";
import { findActorBySession } from "@/lib/auth/queries";

export const TEST_PASSWORD = "test-password-2026";

let shared: Kysely<Database> | undefined;
export function testDb(): Kysely<Database> {
  shared ??= createDb(process.env.DATABASE_URL ?? "", { max: 4 });
  return shared;
}

export interface TestCompany extends SeededCompany {
  scenario: ScenarioCompany;
  emails: Record<string, string>;
  actor(personKey: string): Promise<Actor>;
}

export async function createTestCompany(base: ScenarioCompany = demoCompany): Promise<TestCompany> {
  const suffix = randomUUID().slice(0, 8);
  const scenario: ScenarioCompany = {
    ...base,
    slug: `t-${suffix}`,
    name: `${base.name} ${suffix}`,
    people: base.people.map((p) => ({ ...p, email: `${p.key}.${suffix}@test.sward.test` })),
  };
  const seeded = await seedCompany(testDb(), scenario, TEST_PASSWORD);
  const emails = Object.fromEntries(scenario.people.map((p) => [p.key, p.email]));
  return {
    ...seeded,
    scenario,
    emails,
    async actor(personKey: string) {
      const userId = seeded.userIds[personKey];
      if (!userId) throw new Error(`no person ${personKey}`);
      const actor = await findActorBySession(await createAuthSession(userId, 3600));
      if (!actor) throw new Error(`no actor for ${personKey}`);
      return actor;
    },
  };
}
