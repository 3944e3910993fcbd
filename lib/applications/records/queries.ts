// Application records for export: every field record-keeping rules ask for, one row per
// application (the property's homeowners together in the customer cell),
// streamed page by page (keyset on applied_at, id) so a long range never sits in memory.
import "server-only";

import { sql } from "kysely";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { formatNumericDate, formatNumericDateTime } from "@/lib/dates";
import { AppError } from "@/lib/http/app-error";

import { OVERRIDE_CATEGORY_LABEL, RATE_UNIT_LABEL } from "../units";

export const RECORD_COLUMNS = [
  "applied_on",
  "applied_at_local",
  "customer",
  "address",
  "zone",
  "area_ft2",
  "product",
  "registration_number",
  "rate",
  "rate_unit",
  "total_product_lb",
  "total_product_gal",
  "n_lb_per_1000ft2",
  "wsn_lb_per_1000ft2",
  "p2o5_lb_per_1000ft2",
  "k2o_lb_per_1000ft2",
  "applicator",
  "applicator_license",
  "wind_mph",
  "temperature_f",
  "rule_set",
  "findings",
  "override_reason",
  "override_category",
  "keep_until",
] as const;

export async function* listApplicationRecords(
  actor: Actor,
  from: string,
  to: string,
): AsyncGenerator<(string | number | null)[]> {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can export application records.");
  const page = (cursor: { at: Date; id: string } | null) =>
    db()
      .selectFrom("applications as a")
      .innerJoin("visits as v", "v.id", "a.visit_id")
      .innerJoin("properties as p", "p.id", "v.property_id")
      .innerJoin("zones as z", "z.id", "a.zone_id")
      .innerJoin("products as pr", "pr.id", "a.product_id")
      .leftJoin("rule_sets as r", "r.id", "p.rule_set_id")
      .select([
        "a.id",
        "a.applied_on",
        "a.applied_at",
        "p.time_zone",
        "p.name as property_name",
        "p.street",
        "p.city",
        "p.region",
        "p.postal_code",
        "z.name as zone_name",
        "a.area_ft2",
        "pr.name as product_name",
        "pr.registration_number",
        "a.rate_amount",
        "a.rate_unit",
        "a.product_total_lb",
        "a.product_total_gal",
        "a.n_lb_per_1000",
        "a.wsn_lb_per_1000",
        "a.p2o5_lb_per_1000",
        "a.k2o_lb_per_1000",
        "a.applicator_name",
        "a.applicator_licence",
        "a.wind_mph",
        "a.temperature_f",
        "r.name as rule_set_name",
        "r.record_retention_years",
        "a.findings",
        "a.override_reason",
        "a.override_category",
      ])
      // The homeowners of the lawn in one cell: joined as rows they would repeat the application
      // once per homeowner (and a repeat on a page boundary would be skipped by the keyset).
      .select((eb) =>
        eb
          .selectFrom("property_homeowners as ph")
          .innerJoin("users as owner", "owner.id", "ph.user_id")
          .select(sql<string | null>`string_agg(owner.name, ', ' order by owner.name)`.as("names"))
          .whereRef("ph.property_id", "=", "p.id")
          .whereRef("ph.company_id", "=", "a.company_id")
          .as("owner_names"),
      )
      .where("a.company_id", "=", actor.companyId)
      .where("a.applied_on", ">=", from)
      .where("a.applied_on", "<=", to)
      .$if(cursor !== null, (q) =>
        q.where((eb) =>
          eb.or([
            eb("a.applied_at", ">", cursor!.at),
            eb.and([eb("a.applied_at", "=", cursor!.at), eb("a.id", ">", cursor!.id)]),
          ]),
        ),
      )
      .orderBy("a.applied_at")
      .orderBy("a.id")
      .limit(500)
      .execute();
  let after: { at: Date; id: string } | null = null;
  for (;;) {
    const rows = await page(after);
    if (rows.length === 0) return;
    for (const r of rows) {
      const at = new Date(r.applied_at);
      const keepYears = r.record_retention_years ?? 2;
      yield [
        formatNumericDate(r.applied_on, actor.companyLocale),
        formatNumericDateTime(at, r.time_zone, actor.companyLocale),
        r.owner_names ? `${r.owner_names} (${r.property_name})` : r.property_name,
        `${r.street}, ${r.city}, ${r.region} ${r.postal_code}`,
        r.zone_name,
        Number(r.area_ft2),
        r.product_name,
        r.registration_number || null,
        Number(r.rate_amount),
        RATE_UNIT_LABEL[r.rate_unit as keyof typeof RATE_UNIT_LABEL] ?? r.rate_unit,
        Number(r.product_total_lb),
        r.product_total_gal === null ? null : Number(r.product_total_gal),
        Number(r.n_lb_per_1000),
        Number(r.wsn_lb_per_1000),
        Number(r.p2o5_lb_per_1000),
        Number(r.k2o_lb_per_1000),
        r.applicator_name || null,
        r.applicator_licence || null,
        r.wind_mph === null ? null : Number(r.wind_mph),
        r.temperature_f === null ? null : Number(r.temperature_f),
        r.rule_set_name,
        // In words, as the record showed them (no internal keys).
        (r.findings as { severity: string; basis?: string; message: string }[])
          .map(
            (f) =>
              `${f.severity === "refusal" ? (f.basis === "label" ? "Refused by the label" : "Refused (legal limit)") : "Warning"}: ${f.message}`,
          )
          .join(" | ") || null,
        r.override_reason,
        r.override_category ? OVERRIDE_CATEGORY_LABEL[r.override_category] : null,
        formatNumericDate(
          `${Number(r.applied_on.slice(0, 4)) + keepYears}${r.applied_on.slice(4)}`,
          actor.companyLocale,
        ),
      ];
    }
    const lastRow = rows[rows.length - 1]!;
    after = { at: new Date(lastRow.applied_at), id: lastRow.id };
  }
}
