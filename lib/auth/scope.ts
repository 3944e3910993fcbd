// Which properties (and visits) an actor may reach: managers their company's book; technicians the
// properties assigned to them and any property where they have an open visit; homeowners
// the properties linked to them. Used in every property read and write.
import type { ExpressionBuilder } from "kysely";

import type { Database } from "@/db/schema";
import type { Actor } from "@/lib/auth/actor";

export function propertyInScope(actor: Actor) {
  return (eb: ExpressionBuilder<Database, "properties">) => {
    const company = eb("properties.company_id", "=", actor.companyId);
    switch (actor.role) {
      case "manager":
        return company;
      case "technician":
        return eb.and([
          company,
          eb.or([
            eb("properties.technician_id", "=", actor.userId),
            eb.exists(
              eb
                .selectFrom("visits as v")
                .select("v.id")
                .whereRef("v.property_id", "=", "properties.id")
                .where("v.company_id", "=", actor.companyId)
                .where("v.technician_id", "=", actor.userId)
                .where("v.status", "in", ["scheduled", "in_progress"]),
            ),
          ]),
        ]);
      case "homeowner":
        return eb.and([
          company,
          eb.exists(
            eb
              .selectFrom("property_homeowners as ph")
              .select("ph.property_id")
              .whereRef("ph.property_id", "=", "properties.id")
              .where("ph.user_id", "=", actor.userId)
              .where("ph.company_id", "=", actor.companyId),
          ),
        ]);
    }
  };
}

// Which visits an actor may reach. Managers: their company. Technicians: visits assigned to
// them, plus any they started. Homeowners reach visits only through published reports.
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
