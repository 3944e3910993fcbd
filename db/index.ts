// The app's Kysely instance, created on first use. Only data-access modules (lib/**/queries.ts,
// lib/**/mutations.ts) import it; eslint enforces that (see eslint.config.mjs).
import "server-only";

import type { Kysely } from "kysely";

import { serverEnv } from "@/lib/env";

import { createDb } from "./client";
import type { Database } from "./schema";

const globalForDb = globalThis as unknown as { swardDb?: Kysely<Database> };

export function db(): Kysely<Database> {
  globalForDb.swardDb ??= createDb(serverEnv().DATABASE_URL);
  return globalForDb.swardDb;
}
