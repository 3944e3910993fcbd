// The company's product catalogue (staff read it; managers change it).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { notFound } from "@/lib/http/app-error";

import type { ProductDto } from "./dto";
import { toProductDto } from "./map";

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
