// Finishing a visit publishes its visit report: in one transaction the visit is locked and
// finished, afterWrite evaluates the property's alerts (so the technician sees them before
// leaving, and the report's care notes include them), and each homeowner's report e-mail is an
// outbox row — a crash after the commit delays the e-mail, never loses it (one per visit and
// homeowner, by its dedupe key).
import "server-only";

import { sql, type Transaction } from "kysely";

import { db } from "@/db";
import type { Database } from "@/db/schema";
import { afterWrite } from "@/lib/after-write";
import { refreshAlertWeather } from "@/lib/after-write/alerts";
import { recordAudit } from "@/lib/audit/record";
import type { Actor } from "@/lib/auth/actor";
import { REPORT_LINK_HOURS, reportSignInLink } from "@/lib/auth/sign-in-link";
import { appOrigin, serverEnv } from "@/lib/env";
import { AppError } from "@/lib/http/app-error";
import { log } from "@/lib/log";
import { enqueueMail } from "@/lib/mail/outbox";
import { visitReportPath } from "@/lib/paths";
import { services } from "@/lib/services";
import { assertEditable, lockVisit } from "@/lib/visit-state/lock";
import type { VisitDetailDto } from "@/lib/visits/dto";
import { getVisit } from "@/lib/visits/queries";

import { getVisitReport } from "./queries";
import { reportEmail } from "./report-email";

/** Locks the visit. Every active zone must be checked (done) or skipped with a reason. */
export async function finishVisit(actor: Actor, visitId: string): Promise<VisitDetailDto> {
  // Fresh weather for the alerts, fetched before the transaction (a quick, single try).
  const target = await getVisit(actor, visitId);
  if (target.status !== "completed") {
    await refreshAlertWeather(
      db(),
      services().quickWeather,
      actor.companyId,
      target.propertyId,
    ).catch((err: unknown) => log.warn({ err, visitId }, "weather refresh before finish failed"));
  }
  await db()
    .transaction()
    .execute(async (trx) => {
      const visit = await lockVisit(trx, actor, visitId);
      if (visit.status === "completed") return; // finishing twice is harmless
      assertEditable(actor, visit);
      const open = await trx
        .selectFrom("zones")
        .leftJoin("zone_checks", (j) =>
          j.onRef("zone_checks.zone_id", "=", "zones.id").on("zone_checks.visit_id", "=", visitId),
        )
        .select(["zones.name", "zone_checks.status"])
        .where("zones.company_id", "=", actor.companyId)
        .where("zones.property_id", "=", visit.property_id)
        .where("zones.archived_at", "is", null)
        .where((eb) =>
          eb.or([eb("zone_checks.status", "is", null), eb("zone_checks.status", "=", "draft")]),
        )
        .orderBy("zones.sort_order")
        .execute();
      if (open.length) {
        throw new AppError(
          "invalid_input",
          `Finish or skip every zone first: ${open.map((z) => z.name).join(", ")}.`,
          {
            zones: open.map(
              (z) => `${z.name} is ${z.status === "draft" ? "not marked done" : "not checked"}.`,
            ),
          },
        );
      }
      await trx
        .updateTable("visits")
        .set({
          status: "completed",
          // The moment of the lock, not of the transaction's start: every write that held the
          // visit before it committed earlier, and every later one sees the visit finished.
          completed_at: sql<Date>`clock_timestamp()`,
          completed_by: actor.userId,
          version: sql<number>`version + 1`,
          updated_at: sql<Date>`now()`,
        })
        .where("id", "=", visitId)
        .execute();
      await recordAudit(trx, actor, {
        entity: "visit",
        entityId: visitId,
        action: "finish",
        changes: { status: { from: visit.status, to: "completed" } },
      });
      await afterWrite(trx, {
        companyId: actor.companyId,
        propertyId: visit.property_id,
        alerts: "evaluate",
        visitId,
      });
      await queueVisitReportMail(trx, actor, visit.property_id, visitId);
    });
  return getVisit(actor, visitId);
}

/** One report e-mail per active homeowner of the lawn, as that homeowner will see the report. */
async function queueVisitReportMail(
  trx: Transaction<Database>,
  actor: Actor,
  propertyId: string,
  visitId: string,
): Promise<number> {
  const homeowners = await trx
    .selectFrom("property_homeowners")
    .innerJoin("users", "users.id", "property_homeowners.user_id")
    .select(["users.id", "users.email", "users.name"])
    .where("property_homeowners.company_id", "=", actor.companyId)
    .where("property_homeowners.property_id", "=", propertyId)
    .where("users.disabled_at", "is", null)
    .execute();
  const appUrl = appOrigin(serverEnv());
  let queued = 0;
  for (const h of homeowners) {
    const homeowner: Actor = {
      ...actor,
      userId: h.id,
      role: "homeowner",
      email: h.email,
      name: h.name,
      sessionId: "",
    };
    const report = await getVisitReport(homeowner, visitId, trx);
    // The button signs this homeowner in once and opens the report: no second e-mail to ask for.
    const signedLink = {
      url: await reportSignInLink(trx, h.email, visitReportPath(visitId)),
      hours: REPORT_LINK_HOURS,
    };
    const mail = reportEmail(report, appUrl, h.name, actor.companyLocale, signedLink);
    const isNew = await enqueueMail(trx, {
      companyId: actor.companyId,
      kind: "visit_report",
      dedupeKey: `visit_report:${visitId}:${h.id}`,
      to: h.email,
      ...mail,
    });
    if (isNew) queued++;
  }
  return queued;
}
