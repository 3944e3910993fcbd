// GET /api/v1/me — the signed-in user: { id, email, name, role, companyId }.
import { ROLES } from "@/lib/auth/actor";
import { route } from "@/lib/auth/guards";

export const GET = route({ access: ROLES }, async ({ actor }) => ({
  id: actor.userId,
  email: actor.email,
  name: actor.name,
  role: actor.role,
  companyId: actor.companyId,
}));
