// Inputs of the alert endpoints and the alerts page filters.
import { z } from "zod";

import { ALERT_KINDS } from "@/lib/risk/labels";

export const alertIdParams = z.object({ alertId: z.uuid() });

const note = z.string().trim().max(2000, "Keep the note under 2,000 characters.");
export const acknowledgeSchema = z.object({ note: note.default("") }).strict();
export const resolveSchema = z.object({ note: note.min(1, "Say how it was resolved.") }).strict();

const kinds = Object.keys(ALERT_KINDS) as [
  keyof typeof ALERT_KINDS,
  ...(keyof typeof ALERT_KINDS)[],
];
/** The alerts page filters, read from the URL (anything unknown is ignored, never an error). */
export const alertFilters = z.object({
  kind: z.enum(kinds).optional().catch(undefined),
  severity: z.enum(["low", "moderate", "high"]).optional().catch(undefined),
  status: z.enum(["open", "acknowledged", "resolved", "live", "all"]).optional().catch(undefined),
  technician: z.uuid().optional().catch(undefined),
  area: z.string().trim().max(80).optional().catch(undefined),
});
export type AlertFilters = z.infer<typeof alertFilters>;
