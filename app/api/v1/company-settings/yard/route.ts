// PUT /api/v1/company-settings/yard { address, latitude, longitude } — the company's yard, where
// each day's route starts and ends (manager; null coordinates clear it).
import { route } from "@/lib/auth/guards";
import { saveYard } from "@/lib/company-settings/mutations";
import { yardSchema } from "@/lib/company-settings/schemas";

export const PUT = route({ access: ["manager"], body: yardSchema }, async ({ actor, body }) =>
  saveYard(actor, body),
);
