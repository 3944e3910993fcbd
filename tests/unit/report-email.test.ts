// The report e-mail: one button to the report, keep-off guidance, care-note titles, and stored
// text rendered inert in the HTML.
import { describe, expect, it } from "vitest";

import { CARE_NOTES } from "@/lib/reference/care-notes";
import { reportEmail } from "@/lib/reports/report-email";

const report = {
  visitId: "11111111-1111-4111-8111-111111111111",
  date: "2026-10-20",
  propertyName: "<script>alert(1)</script> residence",
  companyName: "Larkmoor Lawn Care",
  technicianName: "Luis Arroyo",
  propertyIndex: 78.4,
  zones: [
    {
      zoneId: "z",
      name: "Front lawn",
      skipped: null,
      sentences: [],
      index: 80,
      photos: [
        {
          id: "p",
          visitId: "v",
          zoneId: "z",
          zoneCheckId: "c",
          visitedOn: "2026-10-20",
          greenCoverPct: 80,
          dgci: 0.5,
          lighting: "ok" as const,
          darkPct: 0,
          clippedPct: 0,
          measuredByCanopyRule: true,
          width: 1600,
          height: 1200,
          displayUrl: "/api/v1/photos/p/display",
          thumbUrl: "/api/v1/photos/p/thumb",
          capturedLocal: null,
          gps: null,
          uploadedById: null,
        },
      ],
    },
  ],
  applications: [
    {
      zoneName: "Front lawn",
      productName: "Autumn Anchor 20-0-10",
      isPesticide: false,
      registrationNumber: "",
      nLb: 0.9,
      p2o5Lb: 0,
      k2oLb: 0.45,
      labelCautions: "",
      reentryGuidance: "Keep off until watered in and the turf has dried.",
    },
  ],
  careNotes: [
    {
      note: CARE_NOTES.find((n) => n.key === "after_fertiliser")!,
      because: ["Front lawn: fed today"],
    },
  ],
  nextVisit: null,
};

describe("report e-mail", () => {
  it("has the summary, keep-off guidance, care notes, photo links and one button to the report", () => {
    const m = reportEmail(report, "http://localhost:3000/", "Samir Haddad");
    expect(m.subject).toBe(
      "Your lawn visit report — <script>alert(1)</script> residence, Tue, Oct 20, 2026",
    );
    expect(m.text).toMatch(/Your lawn's Sward Index at this visit: 78 out of 100\./);
    expect(m.text).toMatch(/Safety: Keep off until watered in and the turf has dried\./);
    expect(m.text).toMatch(/• After today's feeding/);
    expect(m.text).toContain("http://localhost:3000/api/v1/photos/p/display");
    expect(m.html.match(/Read your visit report/g)).toHaveLength(1);
    expect(m.html).toContain(
      'href="http://localhost:3000/my-lawn/reports/11111111-1111-4111-8111-111111111111"',
    );
    // Without a one-time link (a preview), the button opens the report's own address.
    expect(m.text).not.toMatch(/signs you in once/);
    expect(m.html).not.toContain("<script>");
    expect(m.html).toContain("&lt;script&gt;");
  });

  it("with a one-time link, the button signs in and opens the report; the plain address stays", () => {
    const signed = "http://localhost:3000/sign-in/link?callbackUrl=x&token=t&email=e";
    const m = reportEmail(report, "http://localhost:3000", "Samir Haddad", "en-US", {
      url: signed,
      hours: 72,
    });
    expect(m.html).toContain(`href="${signed.replaceAll("&", "&amp;")}"`);
    expect(m.html.match(/Read your visit report/g)).toHaveLength(1);
    expect(m.text).toContain(
      `Read the full report (this link signs you in once, within 72 hours): ${signed}`,
    );
    expect(m.text).toContain(
      "http://localhost:3000/my-lawn/reports/11111111-1111-4111-8111-111111111111",
    );
  });

  it("names the next scheduled visit and its planned service, and nothing when none is scheduled", () => {
    // Nov 10, 2026 is a Tuesday (calendar).
    const m = reportEmail(
      { ...report, nextVisit: { date: "2026-11-10", service: "fall_feeding" } },
      "http://localhost:3000",
      "Samir Haddad",
      "en-US",
    );
    expect(m.text).toContain("Next visit: Fall feeding on Tue, Nov 10, 2026.");
    expect(m.html).toContain("Next visit: Fall feeding on Tue, Nov 10, 2026.");
    const none = reportEmail(report, "http://localhost:3000", "Samir Haddad", "en-US");
    expect(none.text).not.toContain("Next visit");
    expect(none.html).not.toContain("Next visit");
  });
});
