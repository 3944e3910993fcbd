// The company's product catalogue (staff read it; managers change it).
import "server-only";

import { db } from "@/db";
import type { Product } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";
import { notFound } from "@/lib/http/app-error";

import type { ProductDto } from "./dto";

export function toProductDto(p: Product): ProductDto {
  return {
    id: p.id,
    name: p.name,
    form: p.form,
    nPct: Number(p.n_pct),
    p2o5Pct: Number(p.p2o5_pct),
    k2oPct: Number(p.k2o_pct),
    slowReleasePctOfN: Number(p.slow_release_pct_of_n),
    densityLbPerGal: p.density_lb_per_gal === null ? null : Number(p.density_lb_per_gal),
    isPesticide: p.is_pesticide,
    registrationNumber: p.registration_number,
    labelCautions: p.label_cautions,
    reentryGuidance: p.reentry_guidance,
    isArchived: p.archived_at !== null,
  };
}

export async function listProducts(
  actor: Actor,
  options: { includeArchived?: boolean } = {},
): Promise<ProductDto[]> {
  if (actor.role === "homeowner") return [];
  const rows = await db()
    .selectFrom("products")
    .selectAll()
    .where("company_id", "=", actor.companyId)
    .$if(!options.includeArchived, (q) => q.where("archived_at", "is", null))
    .orderBy("name")
    .execute();
  return rows.map(toProductDto);
}

export async function getProduct(actor: Actor, productId: string): Promise<ProductDto> {
  const row =
    actor.role === "homeowner"
      ? undefined
      : await db()
          .selectFrom("products")
          .selectAll()
          .where("company_id", "=", actor.companyId)
          .where("id", "=", productId)
          .executeTakeFirst();
  if (!row) throw notFound("That product");
  return toProductDto(row);
}
