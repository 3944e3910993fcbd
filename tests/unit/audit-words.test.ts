// The visit's audit trail in words (lib/visits/audit-words.ts): every kind of event reads as one
// sentence with the zone's name, the change in the catalogue's words, who did it and why — no
// raw field names, enum keys or ISO dates (the house-words scan, tests/helpers/house-words.ts).
// Dates read the US way (CLDR en-US: "Dec 2, 2026, 3:05 PM"; 20:05 UTC is 3:05 PM in New York in
// December, Eastern Standard Time UTC−5).
import { describe, expect, it } from "vitest";

import { auditWords, changeWords, valueWords } from "@/lib/visits/audit-words";

import { scanWords } from "../helpers/house-words";

const NY = { timeZone: "America/New_York" };
const AT = "2026-12-02T20:05:00.000Z";
const base = {
  at: AT,
  actor: "Dana Whitcombe",
  reason: null,
  zoneName: "Front lawn",
  changes: {},
};

function clean(sentence: string) {
  expect(scanWords("audit sentence", sentence)).toEqual([]);
  return sentence;
}

describe("auditWords", () => {
  it("reads a corrected rating with the zone, the corrector and the reason", () => {
    const w = auditWords(
      {
        ...base,
        entity: "zone_check",
        action: "edit_after_finish",
        changes: { color: { from: 6, to: 8 } },
        reason: "misread in shade",
      },
      NY,
    );
    expect(clean(w.sentence)).toBe(
      "Front lawn · color 6 → 8 — corrected by Dana Whitcombe: misread in shade",
    );
    expect(w.when).toBe("Dec 2, 2026, 3:05 PM");
  });

  it("reads a finished visit as words, not its status values", () => {
    const w = auditWords(
      {
        ...base,
        zoneName: null,
        entity: "visit",
        action: "finish",
        changes: { status: { from: "in_progress", to: "completed" } },
      },
      NY,
    );
    expect(clean(w.sentence)).toBe("Visit finished — by Dana Whitcombe");
    expect(
      auditWords({ ...base, zoneName: null, entity: "visit", action: "cancel" }, NY).sentence,
    ).toBe("Visit canceled — by Dana Whitcombe");
  });

  it("names skip reasons, soil moisture, check status and symptoms in words", () => {
    const s = changeWords(
      {
        status: { from: "done", to: "skipped" },
        skipReason: { from: null, to: "dog_in_yard" },
        soilMoisture: { from: "dry", to: "moist" },
        isMatted: { from: false, to: true },
        thatchIn: { from: 0.5, to: 0.75 },
        notes: { from: "", to: "gate locked" },
      },
      NY,
    );
    expect(clean(s)).toBe(
      "status done → skipped, reason skipped blank → Dog in yard, soil moisture dry → moist, lay-over / matting no → yes, thatch (in) 0.5 → 0.75, notes blank → “gate locked”",
    );
  });

  it("reads an application added, corrected and removed with the product and the rate in the label's units", () => {
    const added = auditWords(
      {
        ...base,
        entity: "application",
        action: "add_after_finish",
        changes: {
          product: { from: null, to: "Larkmoor 24-0-11" },
          rate: { from: null, to: { amount: 3.5, unit: "lb/1000ft2" } },
        },
        reason: "entered on paper at the stop",
      },
      NY,
    );
    expect(clean(added.sentence)).toBe(
      "Front lawn · application of Larkmoor 24-0-11 at 3.5 lb / 1,000 ft² — added by Dana Whitcombe: entered on paper at the stop",
    );
    const corrected = auditWords(
      {
        ...base,
        entity: "application",
        action: "edit_after_finish",
        changes: {
          product: { from: "Larkmoor 24-0-11", to: "Larkmoor 24-0-11" },
          rate: {
            from: { amount: 3.5, unit: "lb/1000ft2" },
            to: { amount: 3, unit: "lb/1000ft2" },
          },
        },
        reason: "typo",
      },
      NY,
    );
    expect(clean(corrected.sentence)).toBe(
      "Front lawn · application of Larkmoor 24-0-11: rate 3.5 lb / 1,000 ft² → 3 lb / 1,000 ft² — corrected by Dana Whitcombe: typo",
    );
    const removed = auditWords(
      {
        ...base,
        entity: "application",
        action: "delete",
        changes: {
          product: { from: "Larkmoor 24-0-11", to: null },
          rate: { from: { amount: 2, unit: "floz/1000ft2" }, to: null },
        },
      },
      NY,
    );
    expect(clean(removed.sentence)).toBe(
      "Front lawn · application of Larkmoor 24-0-11 at 2 fl oz / 1,000 ft² — removed by Dana Whitcombe",
    );
  });

  it("reads an override with its category and reason, and a moved application time as US dates", () => {
    const o = auditWords(
      {
        ...base,
        entity: "application",
        action: "override_legal_limit",
        changes: {
          category: { from: null, to: "research_plot" },
          reason: { from: null, to: "university trial" },
        },
      },
      NY,
    );
    expect(clean(o.sentence)).toBe(
      "Front lawn · application recorded over a legal limit (Research or trial plot) — by Dana Whitcombe: university trial",
    );
    const moved = auditWords(
      {
        ...base,
        entity: "application",
        action: "applied_at_differs",
        changes: {
          appliedAt: { from: "2026-12-02T15:00:00.000Z", to: "2026-12-02T14:00:00.000Z" },
        },
      },
      NY,
    );
    expect(clean(moved.sentence)).toContain(
      "dated Dec 2, 2026, 9:00 AM instead of Dec 2, 2026, 10:00 AM",
    );
  });

  it("reads photos and waterings, and a watering without a zone as the whole property", () => {
    expect(
      clean(
        auditWords(
          { ...base, entity: "photo", action: "delete_after_finish", reason: "wrong lawn" },
          NY,
        ).sentence,
      ),
    ).toBe("Front lawn · photo — removed by Dana Whitcombe: wrong lawn");
    expect(
      clean(
        auditWords(
          {
            ...base,
            zoneName: null,
            entity: "watering",
            action: "edit",
            changes: {
              depthIn: { from: 0.5, to: 0.75 },
              wateredOn: { from: "2026-12-01", to: "2026-12-02" },
            },
          },
          NY,
        ).sentence,
      ),
    ).toBe(
      "Whole property · watering: depth (in) 0.5 → 0.75, date watered Dec 1, 2026 → Dec 2, 2026 — corrected by Dana Whitcombe",
    );
  });

  it("says someone when the person's account is gone, and never shows a raw field name", () => {
    const w = auditWords(
      {
        ...base,
        actor: null,
        entity: "zone_check",
        action: "edit_after_finish",
        changes: { some_new_field: { from: "a_b", to: null } },
      },
      NY,
    );
    expect(clean(w.sentence)).toBe(
      "Front lawn · some new field a b → blank — corrected by someone",
    );
    expect(valueWords("mowingDirection", "changed", NY)).toBe("changed");
  });
});
