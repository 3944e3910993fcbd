// Inputs of the alert endpoints and the alerts page filters (zod/mini, as every domain schema).
import { z } from "zod/mini";

import { stripControlCharacters } from "@/lib/http/control-characters";
import { ALERT_KINDS } from "@/lib/risk/labels";

export const alertIdParams = z.object({ alertId: z.uuid() });

const note = z.string().check(z.trim(), z.maxLength(2000, "Keep the note under 2,000 characters."));
export const acknowledgeSchema = z.strictObject({ note: z._default(note, "") });
export const resolveSchema = z.strictObject({
  note: note.check(z.minLength(1, "Say how it was resolved.")),
});

const kinds = Object.keys(ALERT_KINDS) as [
  keyof typeof ALERT_KINDS,
  ...(keyof typeof ALERT_KINDS)[],
];
/** Optional, and ignored (undefined) when malformed. */
const lenient = <T extends z.ZodMiniType>(schema: T) => z.catch(z.optional(schema), undefined);

/** The alerts page filters, read from the URL (anything unknown is ignored, never an error). */
export const alertFilters = z.object({
  kind: lenient(z.enum(kinds)),
  severity: lenient(z.enum(["low", "moderate", "high"])),
  status: lenient(z.enum(["open", "acknowledged", "resolved", "live", "all"])),
  technician: lenient(z.uuid()),
  area: lenient(z.string().check(z.overwrite(stripControlCharacters), z.trim(), z.maxLength(80))),
});
export type AlertFilters = z.infer<typeof alertFilters>;
