// The daily sweep: every property (of every company, or of the companies named) evaluated on its
// own local date, each in its own transaction through afterWrite. A property that fails is logged
// and the sweep goes on; the sweep then fails as a whole so the job queue retries it (evaluation
// is idempotent, so properties done the first time change nothing).
import type { Kysely } from "kysely";

import type { Database } from "@/db/schema";
import type { WeatherProvider } from "@/lib/services/weather/provider";

import { refreshAlertWeather } from "./alerts";
import { afterWrite, type EvaluationSummary } from "./index";

/**
 * One property on its own (the sweep, the seed, tests): the weather cache refreshed from the
 * provider first (outside any transaction), then afterWrite in a transaction of its own.
 */
export async function evaluateProperty(
  executor: Kysely<Database>,
  companyId: string,
  propertyId: string,
  options: { at?: string; provider: WeatherProvider | null },
): Promise<EvaluationSummary> {
  await refreshAlertWeather(executor, options.provider, companyId, propertyId, options.at);
  const summary = await executor
    .transaction()
    .execute((trx) =>
      afterWrite(trx, { companyId, propertyId, alerts: "evaluate", at: options.at }),
    );
  if (!summary) throw new Error(`property ${propertyId} not found in company ${companyId}`);
  return summary;
}

export interface SweepResult {
  properties: number;
  failed: number;
  raised: number;
  reopened: number;
  updated: number;
  cleared: number;
  autoResolved: number;
  ms: number;
}

export async function sweepBook(
  executor: Kysely<Database>,
  provider: WeatherProvider | null,
  options: {
    onError?: (propertyId: string, err: unknown) => void;
    concurrency?: number;
    /** Only these companies (the per-time-zone daily run); default: every company. */
    companyIds?: string[];
  } = {},
): Promise<SweepResult> {
  const started = Date.now();
  let query = executor
    .selectFrom("properties")
    .select(["id", "company_id"])
    .where("archived_at", "is", null);
  if (options.companyIds) {
    if (!options.companyIds.length) query = query.where((eb) => eb.val(false));
    else query = query.where("company_id", "in", options.companyIds);
  }
  const properties = await query.orderBy("company_id").orderBy("id").execute();
  const result: SweepResult = {
    properties: properties.length,
    failed: 0,
    raised: 0,
    reopened: 0,
    updated: 0,
    cleared: 0,
    autoResolved: 0,
    ms: 0,
  };
  // Properties are independent: a few at a time keep the database busy while Node evaluates rules.
  let next = 0;
  const lane = async () => {
    while (next < properties.length) {
      const p = properties[next++]!;
      try {
        const s = await evaluateProperty(executor, p.company_id, p.id, { provider });
        result.raised += s.raised;
        result.reopened += s.reopened;
        result.updated += s.updated;
        result.cleared += s.cleared;
        result.autoResolved += s.autoResolved;
      } catch (err) {
        result.failed++;
        options.onError?.(p.id, err);
      }
    }
  };
  await Promise.all(
    Array.from({ length: Math.max(1, options.concurrency ?? SWEEP_CONCURRENCY) }, lane),
  );
  result.ms = Date.now() - started;
  if (result.failed) throw new SweepIncomplete(result);
  return result;
}

/** Properties evaluated at once by the sweep (each holds one database connection at a time). */
const SWEEP_CONCURRENCY = 3;

class SweepIncomplete extends Error {
  constructor(readonly result: SweepResult) {
    super(`risk sweep: ${result.failed} of ${result.properties} properties failed`);
  }
}
