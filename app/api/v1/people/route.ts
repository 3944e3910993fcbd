// GET /api/v1/people?role= — { items: PersonDto[] } of the actor's company (staff).
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { listPeople } from "@/lib/people/queries";

export const GET = route(
  {
    access: ["manager", "technician"],
    query: z.object({ role: z.enum(["manager", "technician", "homeowner"]).optional() }).strict(),
  },
  async ({ actor, query }) => ({
    items: await listPeople(actor, query.role),
  }),
);
