// EXPLAIN (ANALYZE, BUFFERS) of the book query exactly as the manager's page builds it (the same
// Kysely builder), for three views. Prints one JSON line { view: plan }. Run by `npm run bench`
// with `--conditions=react-server`, so the data-access layer's "server-only" guard lets it load.
import { createDb } from "@/db/client";
import type { Actor } from "@/lib/auth/actor";
import { bookPageQuery } from "@/lib/book/queries";
import { bookQuery } from "@/lib/book/schemas";

const db = createDb(process.env.DATABASE_URL!, { max: 1 });
const manager = await db
  .selectFrom("users")
  .innerJoin("memberships", "memberships.user_id", "users.id")
  .innerJoin("companies", "companies.id", "memberships.company_id")
  .select([
    "users.id",
    "users.email",
    "users.name",
    "memberships.company_id",
    "companies.name as company_name",
    "companies.time_zone",
    "companies.locale",
  ])
  .where("users.email", "=", process.argv[2]!)
  .executeTakeFirstOrThrow();
const actor: Actor = {
  userId: manager.id,
  companyId: manager.company_id,
  companyName: manager.company_name,
  companyTimeZone: manager.time_zone,
  companyLocale: manager.locale,
  role: "manager",
  email: manager.email,
  name: manager.name,
  sessionId: "bench",
};
const plans: Record<string, string> = {};
for (const [name, q] of [
  ["first page", {}],
  ["declining + high", { trend: "declining", severity: "high" }],
  ["text search", { q: "Cinder" }],
] as const) {
  const compiled = bookPageQuery(actor, bookQuery.parse({ limit: 20, ...q })).compile();
  const explained = await db.executeQuery<{ "QUERY PLAN": string }>({
    ...compiled,
    sql: `explain (analyze, buffers) ${compiled.sql}`,
  });
  plans[name] = explained.rows.map((r) => r["QUERY PLAN"]).join("\n");
}
await db.destroy();
console.log(JSON.stringify(plans));
