// POST /api/v1/visits/:visitId/cancel — cancel a visit that is not finished (manager).
import { z } from "zod";

import { route } from "@/lib/auth/guards";
import { cancelVisit } from "@/lib/visits/mutations";
import { visitIdParams } from "@/lib/visits/schemas";

export const POST = route(
  {
    access: ["manager"],
    params: visitIdParams,
    body: z.object({}).strict(),
    resource: "That visit",
  },
  async ({ actor, params }) => cancelVisit(actor, params.visitId),
);
