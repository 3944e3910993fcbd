// A stop called off as a whole: rained out or canceled, with a reason. The request schemas (shared
// by the route handlers and the form: zod/mini) and the words for each outcome.
import { z } from "zod/mini";

import type { CancelKind } from "@/db/schema";
import { isIsoDate } from "@/lib/dates";
import { en } from "@/lib/i18n/messages/en";

/** The reason's bounds (characters), as the column's check has them. */
const CANCEL_REASON_MIN = 3;
export const CANCEL_REASON_MAX = 500;

export const CANCEL_KINDS: Record<CancelKind, { label: string; done: string }> =
  en.terms.cancelKinds;

export const cancelVisitSchema = z.strictObject({
  outcome: z.enum(["rained_out", "cancelled"], "Outcome: choose Rained out or Canceled."),
  reason: z
    .string("Reason: say why the stop did not happen.")
    .check(
      z.trim(),
      z.minLength(
        CANCEL_REASON_MIN,
        `Reason: say why the stop did not happen (at least ${CANCEL_REASON_MIN} characters).`,
      ),
      z.maxLength(
        CANCEL_REASON_MAX,
        `Reason: at most ${CANCEL_REASON_MAX} characters; shorten it.`,
      ),
    ),
});
export type CancelVisitInput = z.infer<typeof cancelVisitSchema>;

export const rescheduleVisitSchema = z.strictObject({
  scheduledFor: z
    .string("Date: choose the day for the new visit.")
    .check(z.refine(isIsoDate, "Date: choose the day for the new visit (a date like 2026-06-15).")),
});
export type RescheduleVisitInput = z.infer<typeof rescheduleVisitSchema>;
