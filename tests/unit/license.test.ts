// An applicator license's standing (lib/people/license.ts). The expiry date is the last day the
// license is good — as state certification cards print "expires" with a date (common practice;
// from memory of how state pesticide licenses read). The 30-day warning is common practice (no
// published figure). Day counts are checked against the calendar by hand.
import { describe, expect, it } from "vitest";

import { daysUntilExpiry, LICENSE_WARNING_DAYS, licenseStanding } from "@/lib/people/license";

const license = (expiresOn: string) => ({ number: "NJ-TEST-1", category: "3B", expiresOn });

describe("licenseStanding", () => {
  it("none without a license or number", () => {
    expect(licenseStanding(null, "2026-12-03")).toBe("none");
    expect(licenseStanding({ ...license("2027-01-01"), number: "" }, "2026-12-03")).toBe("none");
  });

  it("good on its expiry day, expired the day after", () => {
    expect(licenseStanding(license("2026-12-03"), "2026-12-03")).toBe("expiring");
    expect(licenseStanding(license("2026-12-03"), "2026-12-04")).toBe("expired");
  });

  it("warns from 30 days before the expiry: Jan 2, 2027 is 30 days after Dec 3, 2026 (calendar)", () => {
    expect(LICENSE_WARNING_DAYS).toBe(30);
    expect(licenseStanding(license("2027-01-02"), "2026-12-03")).toBe("expiring");
    expect(licenseStanding(license("2027-01-03"), "2026-12-03")).toBe("valid");
  });

  it("counts whole days across a month and a leap day (Feb 28 → Mar 1, 2028: 2 days)", () => {
    expect(daysUntilExpiry(license("2027-01-02"), "2026-12-03")).toBe(30);
    expect(daysUntilExpiry(license("2028-03-01"), "2028-02-28")).toBe(2);
    expect(daysUntilExpiry(license("2026-12-01"), "2026-12-03")).toBe(-2);
  });
});
