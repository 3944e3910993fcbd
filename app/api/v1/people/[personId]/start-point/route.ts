// PUT /api/v1/people/:personId/start-point — { address, latitude, longitude } (manager): where a
// technician's day on Today starts and ends instead of the company's yard; both coordinates null
// clear it.
import { route } from "@/lib/auth/guards";
import { startPointSchema } from "@/lib/day-route/schemas";
import { setStartPoint } from "@/lib/people/mutations";
import { personParams } from "@/lib/people/schemas";

export const PUT = route(
  { access: ["manager"], params: personParams, body: startPointSchema, resource: "That person" },
  async ({ actor, params, body }) => {
    await setStartPoint(actor, params.personId, body);
    return { saved: true };
  },
);
