// PATCH /api/v1/people/:personId — { role?: "manager" | "technician", disabled?: boolean }
// (manager): change a staff role, disable or re-enable an account. Never the last active manager,
// never yourself out of managing; disabling ends the person's sessions at once.
import { route } from "@/lib/auth/guards";
import { changePerson } from "@/lib/people/mutations";
import { personChangeSchema, personParams } from "@/lib/people/schemas";

export const PATCH = route(
  { access: ["manager"], params: personParams, body: personChangeSchema, resource: "That person" },
  async ({ actor, params, body }) => ({ person: await changePerson(actor, params.personId, body) }),
);
