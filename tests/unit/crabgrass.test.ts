// Crabgrass pre-emergence timing against its published thresholds (lib/agronomy/crabgrass.ts):
// 250 GDD base 32 °F from 15 Feb opens the window (Calhoun, MSU 2004, as the University of
// Wisconsin timer gives it); emergence from 70 GDD base 50 °F from 1 Jan (Virginia Tech, Goatley
// et al. 2007); germination by 200 GDD base 50 °F (Purdue, Patton, citing Calhoun).
import { describe, expect, it } from "vitest";

import { CRABGRASS, crabgrassTiming, type CrabgrassDay } from "@/lib/agronomy/crabgrass";
import { addDays } from "@/lib/dates";

/** `n` days from `from` at one high and low. */
function run(from: string, n: number, tmaxF: number, tminF: number): CrabgrassDay[] {
  return Array.from({ length: n }, (_, i) => ({ date: addDays(from, i), tmaxF, tminF }));
}

describe("crabgrass pre-emergence timing", () => {
  it("uses the published bases and thresholds", () => {
    expect(CRABGRASS.openBase32F).toEqual({ base: 32, from: "02-15", gdd: 250 });
    expect(CRABGRASS.closingBase50F).toEqual({ base: 50, from: "01-01", gdd: 70 });
    expect(CRABGRASS.lateBase50F).toEqual({ base: 50, from: "01-01", gdd: 200 });
  });

  it("Virginia Tech's worked day: a high of 75 and a low of 27 °F gives 1 GDD base 50", () => {
    const t = crabgrassTiming([{ date: "2026-01-05", tmaxF: 75, tminF: 27 }], "2026-01-05");
    expect(t!.gdd50).toBe(1);
    expect(t!.gdd32).toBe(0); // before 15 February nothing counts on base 32
    expect(t!.stage).toBe("early");
  });

  it("a hand-worked spring: window opens, closes and passes on the days worked out by hand", () => {
    // 1 Jan – 14 Feb (45 days) at 40/20 °F: mean 30 → 0 GDD50, and base 32 not counted yet.
    // 15 Feb – 31 Mar (45 days) at 50/30 °F: mean 40 → 0 GDD50, 8 GDD32 a day → 360 by 31 Mar;
    //   250 is reached on day 32 (32 × 8 = 256): 15 Feb + 31 = 18 Mar.
    // 1 Apr onwards at 70/50 °F: mean 60 → 10 GDD50 a day (and 28 GDD32):
    //   70 reached on day 7 → 7 Apr; 200 on day 20 → 20 Apr.
    const days = [
      ...run("2026-01-01", 45, 40, 20),
      ...run("2026-02-15", 45, 50, 30),
      ...run("2026-04-01", 30, 70, 50),
    ];
    expect(crabgrassTiming(days, "2026-03-17")!.stage).toBe("early");
    const open = crabgrassTiming(days, "2026-03-18")!;
    expect(open).toMatchObject({
      stage: "apply_now",
      openedOn: "2026-03-18",
      gdd32: 256,
      gdd50: 0,
    });
    const closing = crabgrassTiming(days, "2026-04-07")!;
    expect(closing).toMatchObject({ stage: "closing", closingOn: "2026-04-07", gdd50: 70 });
    expect(crabgrassTiming(days, "2026-04-19")!.stage).toBe("closing"); // 190
    const late = crabgrassTiming(days, "2026-04-20")!;
    expect(late).toMatchObject({ stage: "too_late", lateOn: "2026-04-20", gdd50: 200 });
    expect(late.missingDays).toBe(0);
  });

  it("reads only this year's days up to today (forecasts and last year ignored) and counts gaps", () => {
    const days = [
      ...run("2025-12-20", 12, 90, 70), // last year: would be 30 GDD50 a day
      ...run("2026-01-01", 5, 60, 50), // 5 GDD50 a day
      ...run("2026-01-08", 3, 60, 50), // 6–7 Jan missing
      ...run("2026-01-11", 10, 95, 75), // forecast after today
    ];
    const t = crabgrassTiming(days, "2026-01-10")!;
    expect(t.gdd50).toBe(40);
    expect(t.asOf).toBe("2026-01-10");
    expect(t.missingDays).toBe(2);
  });

  it("no day of this year: no timing", () => {
    expect(crabgrassTiming(run("2025-05-01", 3, 80, 60), "2026-01-02")).toBeNull();
  });
});
