// The New Jersey rule set was seeded under a British spelling ("fertiliser"); screens, exports and
// records read US English, so stored names follow (unless a company already has the US name).
// Frozen: never import app code.
import { sql, type Kysely } from "kysely";

const rename = (from: string, to: string) => sql`
  update rule_sets set name = ${to}
  where name = ${from}
    and not exists (
      select 1 from rule_sets other
      where other.company_id = rule_sets.company_id and other.name = ${to}
    )`;

export async function up(db: Kysely<any>): Promise<void> {
  await rename("New Jersey turf fertiliser law", "New Jersey turf fertilizer law").execute(db);
}

export async function down(db: Kysely<any>): Promise<void> {
  await rename("New Jersey turf fertilizer law", "New Jersey turf fertiliser law").execute(db);
}
