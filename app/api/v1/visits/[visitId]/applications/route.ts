// POST /api/v1/visits/:visitId/applications — record an application on a zone of this visit.
// 422 with the rule findings (and their citations) when a legal limit is broken and no manager
// override reason is given; idempotent by the client's id.
import { recordApplication } from "@/lib/applications/mutations";
import { applicationSchema } from "@/lib/applications/schemas";
import { route } from "@/lib/auth/guards";
import { visitIdParams } from "@/lib/visits/schemas";

export const POST = route(
  {
    access: ["manager", "technician"],
    params: visitIdParams,
    body: applicationSchema,
    resource: "That visit",
  },
  async ({ actor, params, body }) =>
    Response.json(await recordApplication(actor, params.visitId, body), {
      status: 201,
      headers: { "Cache-Control": "no-store" },
    }),
);
