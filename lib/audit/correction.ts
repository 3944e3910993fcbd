// The reason a correction of a finished visit carries (zod/mini: forms import it too). Required
// on a finished visit, 1–500 characters on one line: no control characters, not even a line break.
import { z } from "zod/mini";

import { AppError } from "@/lib/http/app-error";

export const CORRECTION_REASON_MAX = 500;

const ONE_LINE = /^[^\u0000-\u001F\u007F-\u009F\u2028\u2029]*$/;

export const correctionReasonField = z.optional(
  z.nullable(
    z
      .string()
      .check(
        z.trim(),
        z.maxLength(
          CORRECTION_REASON_MAX,
          `Reason for the correction: at most ${CORRECTION_REASON_MAX} characters; shorten it.`,
        ),
        z.regex(
          ONE_LINE,
          "Reason for the correction: one line of text, without line breaks or control characters.",
        ),
      ),
  ),
);

/** A body that carries only the reason (deleting an entry). */
export const correctionOnlySchema = z.strictObject({ correctionReason: correctionReasonField });

const CORRECTION_REASON_REQUIRED =
  "Reason for the correction: required on a finished visit — say what was wrong (up to 500 characters).";

/**
 * The reason the write is recorded with: on a finished visit a non-empty one is required (422
 * naming `correctionReason`); on an open visit whatever was given (or null).
 */
export function correctionReasonFor(
  visit: { status: string },
  reason: string | null | undefined,
): string | null {
  const given = reason?.trim() ? reason.trim() : null;
  if (visit.status === "completed" && !given)
    throw new AppError("invalid_input", "This visit is finished: a correction needs its reason.", {
      correctionReason: [CORRECTION_REASON_REQUIRED],
    });
  return given;
}
