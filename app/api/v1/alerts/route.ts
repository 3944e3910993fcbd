// GET /api/v1/alerts — { items: AlertDto[] } across the actor's properties (staff), filtered by kind, severity, status, technician, area.
import { route } from "@/lib/auth/guards";
import { listAlerts } from "@/lib/risk-alerts/queries";
import { alertFilters } from "@/lib/risk-alerts/schemas";

export const GET = route(
  { access: ["manager", "technician"], query: alertFilters },
  async ({ actor, query }) => ({ items: await listAlerts(actor, query) }),
);
