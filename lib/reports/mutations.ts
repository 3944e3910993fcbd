// After a visit is finished: the report e-mail for each homeowner of the lawn, into the outbox
// (sent by the worker, retried while SMTP is down; one message per visit and homeowner).
import "server-only";

import { db } from "@/db";
import type { Actor } from "@/lib/auth/actor";
import { serverEnv } from "@/lib/env";
import { log } from "@/lib/log";
import { enqueueMail } from "@/lib/mail/outbox";
import { reportEmail } from "@/lib/mail/report-email";

import { getVisitReport } from "./queries";

export async function enqueueVisitReportMail(actor: Actor, visitId: string): Promise<number> {
  try {
    const report = await getVisitReport(actor, visitId);
    const homeowners = await db()
      .selectFrom("property_homeowners")
      .innerJoin("users", "users.id", "property_homeowners.user_id")
      .select(["users.id", "users.email", "users.name"])
      .where("property_homeowners.company_id", "=", actor.companyId)
      .where("property_homeowners.property_id", "=", report.propertyId)
      .where("users.disabled_at", "is", null)
      .execute();
    let queued = 0;
    const appUrl = serverEnv().AUTH_URL ?? "http://localhost:3000";
    for (const h of homeowners) {
      const mail = reportEmail(report, appUrl, h.name);
      if (
        await enqueueMail(db(), {
          companyId: actor.companyId,
          kind: "visit_report",
          dedupeKey: `visit_report:${visitId}:${h.id}`,
          to: h.email,
          ...mail,
        })
      )
        queued++;
    }
    return queued;
  } catch (err) {
    log.error({ err, visitId }, "queueing the visit report e-mail failed");
    return 0;
  }
}
