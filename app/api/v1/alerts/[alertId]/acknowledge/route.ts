// POST /api/v1/alerts/:alertId/acknowledge — { note } (technician or manager); acknowledging twice is harmless.
import { route } from "@/lib/auth/guards";
import { acknowledgeAlert } from "@/lib/risk-alerts/mutations";
import { acknowledgeSchema, alertIdParams } from "@/lib/risk-alerts/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: alertIdParams,
    body: acknowledgeSchema,
    resource: "That alert",
  },
  async ({ actor, params, body }) => acknowledgeAlert(actor, params.alertId, body.note),
);
