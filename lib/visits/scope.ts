// Which visits an actor may reach. Managers: their company. Technicians: visits assigned to
// them, plus any they started. Homeowners reach visits only through published reports (later).
import type { ExpressionBuilder } from "kysely";

import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";

export function visitInScope(actor: Actor) {
  return (eb: ExpressionBuilder<Database, "visits">) => {
    const company = eb("visits.company_id", "=", actor.companyId);
    switch (actor.role) {
      case "manager":
        return company;
      case "technician":
        return eb.and([
          company,
          eb.or([
            eb("visits.technician_id", "=", actor.userId),
            eb("visits.started_by", "=", actor.userId),
          ]),
        ]);
      case "homeowner":
        return eb.val(false);
    }
  };
}
