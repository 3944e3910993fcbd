// The daily sweep and digest fire at 05:15 on each company's own wall clock. Offsets checked
// against the IANA time zone database (tzdata): America/New_York is UTC−4 in July (daylight time)
// and UTC−5 in January; Asia/Kolkata UTC+5:30 all year; Australia/Adelaide UTC+10:30 in January
// (daylight time) and UTC+9:30 in July; America/Phoenix UTC−7 all year (no daylight time).
import { describe, expect, it } from "vitest";

import { DAILY_AT, DAILY_TICK_CRON, isDailyRunDue } from "@/lib/risk-alerts/jobs";

const at = (iso: string) => new Date(iso);

describe("isDailyRunDue", () => {
  it("is 05:15 local, whatever the offset or the season", () => {
    expect(DAILY_AT).toEqual({ hour: 5, minute: 15 });
    expect(isDailyRunDue("America/New_York", at("2026-07-15T09:15:00Z"))).toBe(true);
    expect(isDailyRunDue("America/New_York", at("2026-01-15T10:15:00Z"))).toBe(true);
    expect(isDailyRunDue("America/New_York", at("2026-01-15T09:15:00Z"))).toBe(false); // 04:15 EST
    expect(isDailyRunDue("Asia/Kolkata", at("2026-07-14T23:45:00Z"))).toBe(true);
    expect(isDailyRunDue("Australia/Adelaide", at("2026-01-14T18:45:00Z"))).toBe(true);
    expect(isDailyRunDue("Australia/Adelaide", at("2026-07-14T19:45:00Z"))).toBe(true);
    expect(isDailyRunDue("America/Phoenix", at("2026-07-15T12:15:00Z"))).toBe(true);
  });

  it("holds for the whole 15-minute window a tick can fire in, and only then", () => {
    expect(DAILY_TICK_CRON).toBe("*/15 * * * *");
    expect(isDailyRunDue("America/Chicago", at("2026-07-15T10:15:40Z"))).toBe(true); // tick a little late
    expect(isDailyRunDue("America/Chicago", at("2026-07-15T10:29:59Z"))).toBe(true);
    expect(isDailyRunDue("America/Chicago", at("2026-07-15T10:30:00Z"))).toBe(false);
    expect(isDailyRunDue("America/Chicago", at("2026-07-15T10:14:59Z"))).toBe(false);
    // Every quarter hour of a day: exactly one tick is due in each zone.
    for (const zone of [
      "America/New_York",
      "Asia/Kolkata",
      "Australia/Adelaide",
      "Asia/Kathmandu",
    ]) {
      const due = Array.from(
        { length: 96 },
        (_, i) => new Date(Date.UTC(2026, 6, 15) + i * 900_000),
      ).filter((d) => isDailyRunDue(zone, d));
      expect(due, zone).toHaveLength(1);
    }
  });
});
