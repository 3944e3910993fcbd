// GET  /api/v1/people/reassign?from= — what moving that technician's properties would move:
//      { properties, stops } (manager), shown before confirming.
// POST /api/v1/people/reassign — { fromTechnicianId, toTechnicianId }: move them, with their
//      future scheduled stops (manager).
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { reassignProperties } from "@/lib/people/mutations";
import { countReassignment } from "@/lib/people/queries";
import { reassignSchema } from "@/lib/people/schemas";

export const GET = route(
  {
    access: ["manager"],
    query: z.object({ from: z.uuid("From: choose a technician.") }).strict(),
    resource: "That technician",
  },
  async ({ actor, query }) => countReassignment(actor, query.from),
);

export const POST = route({ access: ["manager"], body: reassignSchema }, async ({ actor, body }) =>
  reassignProperties(actor, body),
);
