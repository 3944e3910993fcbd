// PUT    /api/v1/applications/:applicationId — correct an application: the whole record again,
//        through the same checks as a new one (time bound to the visit, label, rule set).
// DELETE /api/v1/applications/:applicationId — delete it ({ correctionReason } as the body).
// While the visit is open: its author or a manager; after it is finished: a manager, with a
// `correctionReason` (422 without one). Both are audited, in the same transaction as the change.
import { correctApplication, deleteApplication } from "@/lib/applications/mutations";
import { applicationCorrectionSchema, applicationIdParams } from "@/lib/applications/schemas";
import { correctionOnlySchema } from "@/lib/audit/correction";
import { route } from "@/lib/auth/guards";

export const PUT = route(
  {
    access: ["manager", "technician"],
    params: applicationIdParams,
    body: applicationCorrectionSchema,
    resource: "That application",
  },
  async ({ actor, params, body }) =>
    Response.json(await correctApplication(actor, params.applicationId, body), {
      headers: { "Cache-Control": "no-store" },
    }),
);

export const DELETE = route(
  {
    access: ["manager", "technician"],
    params: applicationIdParams,
    body: correctionOnlySchema,
    resource: "That application",
  },
  async ({ actor, params, body }) => {
    await deleteApplication(actor, params.applicationId, body.correctionReason);
    return new Response(null, { status: 204 });
  },
);
