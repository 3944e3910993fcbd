// The pure parts of calling a stop off: the day offered to reschedule it and the request's bounds.
import { describe, expect, it } from "vitest";

import { nextFreeDay } from "@/lib/visits/next-free-day";
import { cancelVisitSchema, rescheduleVisitSchema } from "@/lib/visits/stop-outcomes";

// New Jersey's professional no-fertilizer window: none after December 1 nor before March 1
// (N.J.S.A. 58:10A-62b), as the shipped rule set holds it in month-days.
const NJ_WINDOW = ["12-01", "03-01"] as const;

describe("nextFreeDay", () => {
  it("is the next day when nothing is booked (Wed Dec 2, 2026 → Thu Dec 3; weekdays from the calendar)", () => {
    expect(
      nextFreeDay({
        today: "2026-12-02",
        taken: [],
        window: null,
        putsDownNOrP: false,
        aheadDays: 30,
      }),
    ).toBe("2026-12-03");
  });

  it("skips the property's booked days and Sundays (Dec 6, 2026 is a Sunday — common practice: crews work Monday to Saturday)", () => {
    expect(
      nextFreeDay({
        today: "2026-12-03",
        taken: ["2026-12-04", "2026-12-05"],
        window: null,
        putsDownNOrP: false,
        aheadDays: 30,
      }),
    ).toBe("2026-12-07");
  });

  it("a round with nitrogen or phosphorus waits for the end of the no-fertilizer window (March 1 allowed); other rounds do not", () => {
    const base = { today: "2026-12-02", taken: [], window: NJ_WINDOW, aheadDays: 200 };
    // March 1, 2027 is a Monday.
    expect(nextFreeDay({ ...base, putsDownNOrP: true })).toBe("2027-03-01");
    expect(nextFreeDay({ ...base, putsDownNOrP: false })).toBe("2026-12-03");
  });

  it("is null when no day within the horizon is free", () => {
    expect(
      nextFreeDay({
        today: "2026-12-02",
        taken: ["2026-12-03", "2026-12-04", "2026-12-05"],
        window: null,
        putsDownNOrP: false,
        aheadDays: 4, // Dec 3–6: three booked and a Sunday
      }),
    ).toBeNull();
  });
});

describe("cancelVisitSchema", () => {
  it("needs an outcome and a reason of 3 to 500 characters, trimmed", () => {
    expect(cancelVisitSchema.safeParse({ outcome: "rained_out", reason: "  Rain  " }).data).toEqual(
      {
        outcome: "rained_out",
        reason: "Rain",
      },
    );
    const messageOf = (body: unknown) =>
      cancelVisitSchema.safeParse(body).error?.issues.map((i) => i.message);
    expect(messageOf({ outcome: "cancelled", reason: "ab" })).toEqual([
      "Reason: say why the stop did not happen (at least 3 characters).",
    ]);
    expect(messageOf({ outcome: "cancelled", reason: "x".repeat(501) })).toEqual([
      "Reason: at most 500 characters; shorten it.",
    ]);
    expect(
      cancelVisitSchema.safeParse({ outcome: "cancelled", reason: "x".repeat(500) }).success,
    ).toBe(true);
    expect(messageOf({ outcome: "snowed_in", reason: "Snow" })).toEqual([
      "Outcome: choose Rained out or Canceled.",
    ]);
  });

  it("a reschedule needs a real date", () => {
    expect(rescheduleVisitSchema.safeParse({ scheduledFor: "2026-12-07" }).success).toBe(true);
    expect(rescheduleVisitSchema.safeParse({ scheduledFor: "2026-02-30" }).success).toBe(false);
  });
});
