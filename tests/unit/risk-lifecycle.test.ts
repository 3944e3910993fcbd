// The alert lifecycle decisions (pure): raise, update, clearing, auto-resolve after a clear week,
// and a recurrence after resolution as a new episode linked to the old one.
import { describe, expect, it } from "vitest";

import { AUTO_RESOLVE_AFTER_DAYS, decide, type LiveAlert } from "@/lib/risk/lifecycle";

const raised = { raised: true, severity: "moderate" as const, summary: "s" };
const quiet = { raised: false, severity: "low" as const, summary: "" };
const live = (o: Partial<LiveAlert> = {}): LiveAlert => ({
  id: "a1",
  status: "open",
  severity: "moderate",
  summary: "s",
  clearSince: null,
  ...o,
});

describe("decide", () => {
  it("raises a new alert, linked to the last resolved episode when there was one", () => {
    expect(decide(null, null, raised, "2026-07-01")).toEqual({
      action: "raise",
      previousAlertId: null,
    });
    expect(decide(null, "old", raised, "2026-07-01")).toEqual({
      action: "raise",
      previousAlertId: "old",
    });
  });
  it("updates the live alert while the condition holds (never a second one)", () => {
    expect(decide(live(), null, raised, "2026-07-02")).toEqual({
      action: "update",
      severityChanged: false,
      returned: false,
    });
    expect(decide(live({ severity: "low" }), null, raised, "2026-07-02")).toMatchObject({
      severityChanged: true,
    });
    expect(decide(live({ clearSince: "2026-07-01" }), null, raised, "2026-07-03")).toMatchObject({
      returned: true,
    });
  });
  it(`notes the day the condition cleared, and resolves after ${AUTO_RESOLVE_AFTER_DAYS} clear days`, () => {
    expect(decide(live(), null, quiet, "2026-07-10")).toEqual({
      action: "clearing",
      since: "2026-07-10",
    });
    expect(decide(live({ clearSince: "2026-07-10" }), null, quiet, "2026-07-16")).toEqual({
      action: "none",
    });
    expect(decide(live({ clearSince: "2026-07-10" }), null, quiet, "2026-07-17")).toEqual({
      action: "auto_resolve",
      clearSince: "2026-07-10",
    });
    expect(
      decide(live({ status: "acknowledged", clearSince: "2026-07-10" }), null, quiet, "2026-08-01"),
    ).toMatchObject({ action: "auto_resolve" });
  });
  it("does nothing when there is no alert and no condition", () => {
    expect(decide(null, "old", quiet, "2026-07-10")).toEqual({ action: "none" });
  });
});
