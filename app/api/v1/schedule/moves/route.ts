// POST /api/v1/schedule/moves — move stops not yet started to another day (and technician), in
// their order after what the day has: { preview: true } answers the plan and its warnings without
// writing; warnings refuse the move (422) until { confirm: true } (managers).
import { route } from "@/lib/auth/guards";
import { moveStops } from "@/lib/schedule/mutations";
import { moveStopsSchema } from "@/lib/schedule/schemas";

export const POST = route(
  { access: ["manager"], body: moveStopsSchema, resource: "That stop" },
  async ({ actor, body }) => ({ items: await moveStops(actor, body) }),
);
