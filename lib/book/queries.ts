// The manager's book: every property with its summary, filtered, sorted and paged by keyset on
// (sort value, property id), so pages neither skip nor repeat rows while rows are added.
import "server-only";

import { sql, type ExpressionBuilder, type RawBuilder } from "kysely";
import { z } from "zod/mini";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { propertyInScope } from "@/lib/auth/scope";
import { addDays, isIsoDate, todayIn } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";
import { hasControlCharacters } from "@/lib/http/control-characters";
import { findCheckSoon } from "@/lib/pressure-areas/queries";
import { escapeLike } from "@/lib/text";

import type { BookMapDto, BookRow } from "./dto";
import { toBookMap, toBookRow } from "./map";
import type { BookQuery, BookSort } from "./schemas";
import { technicianActivity } from "./team";

/**
 * Sort keys: an expression without nulls (so row comparison works), its SQL type, the natural
 * direction, and the id column that breaks ties. Each expression is exactly the one indexed in
 * db/migrations/2026-12-02T0400-book-from-summaries.ts, so a page is read in index order.
 */
const SORTS: Record<
  BookSort,
  {
    expr: RawBuilder<unknown>;
    type: "int" | "real" | "text" | "date";
    dir: "asc" | "desc";
    id: "ps.property_id" | "properties.id";
  }
> = {
  attention: { expr: sql`ps.attention_score`, type: "int", dir: "desc", id: "ps.property_id" },
  name: { expr: sql`lower(properties.name)`, type: "text", dir: "asc", id: "properties.id" },
  index: {
    expr: sql`coalesce(ps.latest_index, -1)`,
    type: "real",
    dir: "asc",
    id: "ps.property_id",
  },
  slope: {
    expr: sql`coalesce(ps.trend_slope, 1000000)`,
    type: "real",
    dir: "asc",
    id: "ps.property_id",
  },
  last: {
    expr: sql`coalesce(ps.last_visit_on, date '0001-01-01')`,
    type: "date",
    dir: "asc",
    id: "ps.property_id",
  },
  next: {
    expr: sql`coalesce(ps.next_visit_on, date '9999-12-31')`,
    type: "date",
    dir: "asc",
    id: "ps.property_id",
  },
  n: { expr: sql`ps.n_ytd_lb`, type: "real", dir: "desc", id: "ps.property_id" },
};

const encodeCursor = (value: unknown, id: string) =>
  Buffer.from(JSON.stringify([value, id])).toString("base64url");

/** PostgreSQL's real (float4) holds magnitudes up to about 3.4e38; anything larger cannot be a sort value. */
const REAL_MAX = 3.4e38;
const REAL_MIN_NORMAL = 1.18e-38;
/** What the sort value of each sort type may be: exactly what encodeCursor writes for it. */
const CURSOR_VALUE = {
  int: z.int32(),
  // …and nothing between 0 and float4's smallest normal magnitude (casting 5e-324 underflows).
  real: z.number().check(
    z.gte(-REAL_MAX),
    z.lte(REAL_MAX),
    z.refine((n) => n === 0 || Math.abs(n) >= REAL_MIN_NORMAL),
  ),
  date: z.string().check(z.refine((d) => isIsoDate(d) && d >= "0001-01-01")), // PostgreSQL has no year 0
  text: z.string().check(
    z.maxLength(300),
    z.refine((s) => !hasControlCharacters(s)),
  ),
} as const;

/** The `after` cursor, checked by the schema of the sort's type: anything else is 422, never an SQL error. */
function decodeCursor(cursor: string, type: keyof typeof CURSOR_VALUE): [string | number, string] {
  let parsed: unknown;
  try {
    parsed = JSON.parse(Buffer.from(cursor, "base64url").toString("utf8"));
  } catch {
    parsed = undefined;
  }
  const checked = z.tuple([CURSOR_VALUE[type], z.guid()]).safeParse(parsed);
  if (checked.success) return [checked.data[0], checked.data[1]];
  throw new AppError(
    "invalid_input",
    "That page link is no longer valid. Start again from the first page.",
    { after: ["Not a page cursor."] },
  );
}

const castAs = (type: string, v: string | number) =>
  type === "date"
    ? sql`cast(${String(v)} as date)`
    : type === "text"
      ? sql`${String(v)}`
      : type === "int"
        ? sql`cast(${Number(v)} as integer)`
        : sql`cast(${Number(v)} as real)`;

/** The view's conditions on the property itself: scope, not archived, text search, technician. */
function propertyConditions(actor: Actor, q: BookQuery) {
  return (eb: ExpressionBuilder<Database, "properties">) =>
    eb.and([
      propertyInScope(actor)(eb),
      eb("properties.archived_at", "is", null),
      ...(q.q ? [eb("properties.search_text", "like", `%${escapeLike(q.q.toLowerCase())}%`)] : []),
      ...(q.technician !== undefined ? [eb("properties.technician_id", "=", q.technician)] : []),
    ]);
}

const filtersOnSummary = (q: BookQuery) =>
  q.trend !== undefined || q.kind !== undefined || q.severity !== undefined || q.overdue === "1";

/** Every property has its summary row (a trigger inserts it with the property), so the book starts from the summaries. */
function baseQuery(actor: Actor, q: BookQuery) {
  return db()
    .selectFrom("property_summaries as ps")
    .innerJoin("properties", "properties.id", "ps.property_id")
    .leftJoin("users as tech", "tech.id", "properties.technician_id")
    .where("ps.company_id", "=", actor.companyId)
    .where(propertyConditions(actor, q))
    .$if(q.trend !== undefined && q.trend !== "none", (b) =>
      b.where("ps.trend_word", "=", q.trend as "declining"),
    )
    .$if(q.trend === "none", (b) => b.where("ps.trend_word", "is", null))
    .$if(q.kind !== undefined, (b) => b.where(sql<boolean>`${q.kind!} = any(ps.alert_kinds)`))
    .$if(q.severity === "high", (b) => b.where("ps.alerts_high", ">", 0))
    .$if(q.severity === "moderate", (b) => b.where("ps.alerts_moderate", ">", 0))
    .$if(q.severity === "low", (b) => b.where("ps.alerts_low", ">", 0))
    .$if(q.overdue === "1", (b) => b.where("ps.is_overdue", "=", true));
}

/** How many rows the view has; without a condition on the summary, the properties alone answer it. */
function countQuery(actor: Actor, q: BookQuery) {
  return filtersOnSummary(q)
    ? baseQuery(actor, q).select((eb) => eb.fn.countAll<number>().as("n"))
    : db()
        .selectFrom("properties")
        .where(propertyConditions(actor, q))
        .select((eb) => eb.fn.countAll<number>().as("n"));
}

/**
 * One page of the book, the cursor of the next page (null on the last), and how many rows the
 * view has. The count rides in the page's own statement as a scalar subquery: one round trip to
 * the database instead of two (tests/bench measures the book API under load).
 */
export async function listBook(
  actor: Actor,
  q: BookQuery,
): Promise<{ rows: BookRow[]; nextCursor: string | null; total: number }> {
  const count = countQuery(actor, q);
  const rows = await bookPageQuery(actor, q).select(count.as("view_total")).execute();
  // A page past the end has no row to carry the count: ask for it on its own.
  const total = rows[0]
    ? Number(rows[0].view_total)
    : q.after
      ? Number((await count.executeTakeFirstOrThrow()).n)
      : 0;
  const page = toPage(rows, q);
  const checkSoon = await findCheckSoon(
    actor,
    rows.map((r) => ({
      id: r.id,
      lat: r.latitude,
      lng: r.longitude,
      lastVisitOn: r.last_visit_on,
    })),
  );
  for (const row of page.rows) row.checkSoon = checkSoon.has(row.propertyId);
  return { ...page, total };
}

/** The query of one page (also compiled by the benchmark for EXPLAIN). */
export function bookPageQuery(actor: Actor, q: BookQuery) {
  if (actor.role !== "manager") throw new AppError("forbidden", "The book is for managers.");
  const sort = SORTS[q.sort];
  const dir = q.dir ?? sort.dir;
  const after = q.after ? decodeCursor(q.after, sort.type) : null;
  return baseQuery(actor, q)
    .selectAll("ps")
    .select([
      "properties.id",
      "properties.name",
      "properties.street",
      "properties.city",
      "properties.technician_id",
      "properties.latitude",
      "properties.longitude",
      "tech.name as technician_name",
    ])
    .select(sort.expr.as("sort_value"))
    .$if(after !== null, (b) =>
      b.where(
        dir === "desc"
          ? sql<boolean>`(${sort.expr}, ${sql.ref(sort.id)}) < (${castAs(sort.type, after![0])}, cast(${after![1]} as uuid))`
          : sql<boolean>`(${sort.expr}, ${sql.ref(sort.id)}) > (${castAs(sort.type, after![0])}, cast(${after![1]} as uuid))`,
      ),
    )
    .orderBy(sort.expr, dir)
    .orderBy(sort.id, dir)
    .limit(q.limit + 1);
}

type PageRow = Awaited<ReturnType<ReturnType<typeof bookPageQuery>["execute"]>>[number];

function toPage(rows: PageRow[], q: BookQuery): { rows: BookRow[]; nextCursor: string | null } {
  const page = rows.slice(0, q.limit);
  const last = page.at(-1);
  return {
    rows: page.map(toBookRow),
    nextCursor:
      rows.length > q.limit && last ? encodeCursor(normalise(last.sort_value), last.id) : null,
  };
}

/** Dates come back as YYYY-MM-DD strings, numbers as numbers: both go into the cursor as they are. */
const normalise = (v: unknown): string | number =>
  typeof v === "number" ? v : v instanceof Date ? v.toISOString().slice(0, 10) : String(v);

/** Every row of the filtered book in its order, a page at a time (for the CSV export). */
export async function* listBookRows(actor: Actor, q: BookQuery): AsyncGenerator<BookRow> {
  let after: string | undefined;
  for (;;) {
    const pageQuery = { ...q, after, limit: 100 };
    const page = toPage(await bookPageQuery(actor, pageQuery).execute(), pageQuery);
    yield* page.rows;
    if (!page.nextCursor) return;
    after = page.nextCursor;
  }
}

/**
 * Every property of the filtered book for the map (no paging: the whole view at once, in name
 * order), with the "Check soon" flag of the pressure areas (lib/pressure-areas/read.ts).
 */
export async function listBookMap(actor: Actor, q: BookQuery): Promise<BookMapDto> {
  if (actor.role !== "manager") throw new AppError("forbidden", "The book is for managers.");
  const rows = await baseQuery(actor, q)
    .select([
      "properties.id",
      "properties.name",
      "properties.latitude",
      "properties.longitude",
      "ps.latest_index",
      "ps.alerts_high",
      "ps.alerts_moderate",
      "ps.alerts_low",
      "ps.alert_kinds",
      "ps.last_visit_on",
    ])
    .orderBy(sql`lower(properties.name)`)
    .orderBy("properties.id")
    .execute();
  const checkSoon = await findCheckSoon(
    actor,
    rows.map((r) => ({
      id: r.id,
      lat: r.latitude,
      lng: r.longitude,
      lastVisitOn: r.last_visit_on,
    })),
  );
  return toBookMap(rows, checkSoon);
}

/** Each technician's last eight weeks (managers). */
export async function getTeamActivity(actor: Actor) {
  if (actor.role !== "manager") throw new AppError("forbidden", "The team view is for managers.");
  const today = todayIn(actor.companyTimeZone);
  const since = addDays(today, -7 * 8 - 7);
  const [technicians, visits] = await Promise.all([
    db()
      .selectFrom("memberships")
      .innerJoin("users", "users.id", "memberships.user_id")
      .select(["users.id", "users.name"])
      .where("memberships.company_id", "=", actor.companyId)
      .where("memberships.role", "=", "technician")
      .orderBy("users.name")
      .execute(),
    db()
      .selectFrom("visits")
      .select(["visits.technician_id", "visits.scheduled_for"])
      .select((eb) => [
        eb
          .selectFrom("zone_checks")
          .select(eb.fn.countAll<number>().as("n"))
          .whereRef("zone_checks.visit_id", "=", "visits.id")
          .where("zone_checks.status", "=", "done")
          .as("checks"),
        eb
          .selectFrom("photos")
          .select(eb.fn.countAll<number>().as("n"))
          .whereRef("photos.visit_id", "=", "visits.id")
          .as("photos"),
      ])
      .where("visits.company_id", "=", actor.companyId)
      .where("visits.status", "=", "completed")
      .where("visits.technician_id", "is not", null)
      .where("visits.scheduled_for", ">=", since)
      .execute(),
  ]);
  return {
    today,
    technicians: technicianActivity(
      technicians,
      visits.map((v) => ({
        technicianId: v.technician_id!,
        completedOn: v.scheduled_for,
        checks: Number(v.checks ?? 0),
        photos: Number(v.photos ?? 0),
      })),
      today,
    ),
  };
}
