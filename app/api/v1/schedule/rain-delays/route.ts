// POST /api/v1/schedule/rain-delays — a rained-out day: its stops not yet started (one technician's
// or everyone's) go to the next working day in the same order; preview and confirm as for moves
// (managers).
import { route } from "@/lib/auth/guards";
import { rainDelay } from "@/lib/schedule/mutations";
import { rainDelaySchema } from "@/lib/schedule/schemas";

export const POST = route(
  { access: ["manager"], body: rainDelaySchema },
  async ({ actor, body }) => ({
    items: await rainDelay(actor, body),
  }),
);
