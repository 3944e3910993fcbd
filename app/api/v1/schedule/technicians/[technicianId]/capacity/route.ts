// PUT /api/v1/schedule/technicians/:technicianId/capacity — { capacity }: the stops a day this
// technician can do, for the week's capacity bars and warnings (managers).
import { route } from "@/lib/auth/guards";
import { setDailyCapacity } from "@/lib/schedule/mutations";
import { capacitySchema, technicianParams } from "@/lib/schedule/schemas";

export const PUT = route(
  {
    access: ["manager"],
    params: technicianParams,
    body: capacitySchema,
    resource: "That technician",
  },
  async ({ actor, params, body }) => setDailyCapacity(actor, params.technicianId, body.capacity),
);
