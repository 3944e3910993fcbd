// Product catalogue writes (managers).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { AppError, notFound } from "@/lib/http/app-error";

import type { ProductDto } from "./dto";
import { productColumns as columns } from "./map";
import { getProduct } from "./queries";
import type { ProductInput } from "./schemas";

function requireManager(actor: Actor) {
  if (actor.role !== "manager")
    throw new AppError("forbidden", "Only a manager can change the product catalog.");
}

const duplicate = (err: unknown) => (err as { code?: string }).code === "23505";
const nameTaken = () =>
  new AppError("invalid_input", "Some values need attention.", {
    name: ["A product with this name is already in the catalog."],
  });

export async function createProduct(actor: Actor, input: ProductInput): Promise<ProductDto> {
  requireManager(actor);
  try {
    const { id } = await db()
      .insertInto("products")
      .values({ company_id: actor.companyId, ...columns(input) })
      .returning("id")
      .executeTakeFirstOrThrow();
    return getProduct(actor, id);
  } catch (err) {
    if (duplicate(err)) throw nameTaken();
    throw err;
  }
}

export async function updateProduct(
  actor: Actor,
  productId: string,
  input: ProductInput,
): Promise<ProductDto> {
  requireManager(actor);
  try {
    const row = await db()
      .updateTable("products")
      .set(columns(input))
      .where("company_id", "=", actor.companyId)
      .where("id", "=", productId)
      .returning("id")
      .executeTakeFirst();
    if (!row) throw notFound("That product");
    return getProduct(actor, productId);
  } catch (err) {
    if (duplicate(err)) throw nameTaken();
    throw err;
  }
}

export async function setProductArchived(
  actor: Actor,
  productId: string,
  isArchived: boolean,
): Promise<ProductDto> {
  requireManager(actor);
  const row = await db()
    .updateTable("products")
    .set({ archived_at: isArchived ? new Date() : null })
    .where("company_id", "=", actor.companyId)
    .where("id", "=", productId)
    .returning("id")
    .executeTakeFirst();
  if (!row) throw notFound("That product");
  return getProduct(actor, productId);
}
