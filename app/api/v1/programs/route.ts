// GET  /api/v1/programs — { items: ProgramDto[] }: the company's season programs with their rounds (managers).
// POST /api/v1/programs — create a program with its rounds (managers); a replay of the same id returns it.
import { route } from "@/lib/auth/guards";
import { createProgram } from "@/lib/programs/mutations";
import { listPrograms } from "@/lib/programs/queries";
import { programSchema } from "@/lib/programs/schemas";

export const GET = route({ access: ["manager"] }, async ({ actor }) => ({
  items: await listPrograms(actor),
}));

export const POST = route({ access: ["manager"], body: programSchema }, async ({ actor, body }) =>
  Response.json(await createProgram(actor, body), { status: 201 }),
);
