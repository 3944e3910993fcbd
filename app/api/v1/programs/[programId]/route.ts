// GET    /api/v1/programs/:programId — one program with its rounds (managers).
// PUT    /api/v1/programs/:programId — replace its name, grass, notes and rounds (managers).
// DELETE /api/v1/programs/:programId — delete a program no property follows (managers).
import { route } from "@/lib/auth/guards";
import { deleteProgram, updateProgram } from "@/lib/programs/mutations";
import { getProgram } from "@/lib/programs/queries";
import { programIdParams, programSchema } from "@/lib/programs/schemas";

export const GET = route(
  { access: ["manager"], params: programIdParams, resource: "That program" },
  async ({ actor, params }) => getProgram(actor, params.programId),
);

export const PUT = route(
  { access: ["manager"], params: programIdParams, body: programSchema, resource: "That program" },
  async ({ actor, params, body }) => updateProgram(actor, params.programId, body),
);

export const DELETE = route(
  { access: ["manager"], params: programIdParams, resource: "That program" },
  async ({ actor, params }) => {
    await deleteProgram(actor, params.programId);
    return new Response(null, { status: 204 });
  },
);
