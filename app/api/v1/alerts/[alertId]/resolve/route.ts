// POST /api/v1/alerts/:alertId/resolve — { note } (manager); resolving twice is harmless.
import { route } from "@/lib/auth/guards";
import { resolveAlert } from "@/lib/risk-alerts/mutations";
import { alertIdParams, resolveSchema } from "@/lib/risk-alerts/schemas";

export const POST = route(
  { access: ["manager"], params: alertIdParams, body: resolveSchema, resource: "That alert" },
  async ({ actor, params, body }) => resolveAlert(actor, params.alertId, body.note),
);
