// The application's time bound to its visit, the target-N helper under the label, and the entry
// traps: a liquid is measured by volume only (a weight oz for a fl oz understated N by
// 1 − (1/16) ÷ (density/128), 29 % at 11.2 lb/gal — unit definitions as in REFERENCES §9), and an
// organic or slow-release product must give the share the label states.
import fc from "fast-check";
import { describe, expect, it } from "vitest";

import {
  NutrientInputError,
  nutrientsPer1000,
  productLbPer1000,
  proposeRateForNitrogen,
  rateForNitrogen,
} from "@/lib/agronomy/nutrients";
import { bindAppliedAt, CLOCK_SKEW_MS, VISIT_MARGIN_MS } from "@/lib/applications/applied-at";
import { RATE_UNIT_LABEL, RATE_UNITS, rateUnitsFor } from "@/lib/applications/units";
import { productSchema } from "@/lib/products/schemas";

const H = 3_600_000;

describe("bindAppliedAt: an application happens during its visit", () => {
  const now = new Date("2026-12-02T15:00:00Z");
  const open = { startedAt: new Date("2026-12-02T14:00:00Z"), completedAt: null };
  const done = {
    startedAt: new Date("2026-12-01T14:00:00Z"),
    completedAt: new Date("2026-12-01T15:00:00Z"),
  };
  it("no time: an open visit's application is now, a finished one's at the finish", () => {
    expect(bindAppliedAt(null, open, now)).toMatchObject({ ok: true, at: now, differs: false });
    expect(bindAppliedAt(null, done, now)).toMatchObject({
      ok: true,
      at: done.completedAt,
      differs: false,
    });
  });
  it("the dates of the finding (a week before, years before, decades ahead) are refused", () => {
    for (const t of ["2026-11-25T15:00:00Z", "2019-06-01T12:00:00Z", "2099-06-01T12:00:00Z"])
      expect(bindAppliedAt(new Date(t), open, now).ok, t).toBe(false);
  });
  it("within the visit and its margin: kept, and flagged when it differs from the visit's time", () => {
    const r = bindAppliedAt(new Date("2026-12-02T13:30:00Z"), open, now);
    expect(r).toMatchObject({ ok: true, differs: true });
  });
  it("property: accepted exactly inside [start − margin, min(end + margin, now + skew)]", () => {
    fc.assert(
      fc.property(
        fc.integer({ min: -30 * 24, max: 30 * 24 }), // offset of the request, hours
        fc.integer({ min: 0, max: 48 }), // how long ago the visit started, hours
        fc.option(fc.integer({ min: 0, max: 12 }), { nil: null }), // finished after, hours
        (offsetH, agoH, doneAfterH) => {
          const startedAt = new Date(now.getTime() - agoH * H);
          const completedAt =
            doneAfterH === null
              ? null
              : new Date(Math.min(startedAt.getTime() + doneAfterH * H, now.getTime()));
          const requested = new Date(now.getTime() + offsetH * H);
          const end = Math.min(
            (completedAt ?? now).getTime() + VISIT_MARGIN_MS,
            now.getTime() + CLOCK_SKEW_MS,
          );
          const inside =
            requested.getTime() >= startedAt.getTime() - VISIT_MARGIN_MS &&
            requested.getTime() <= end;
          expect(bindAppliedAt(requested, { startedAt, completedAt }, now).ok).toBe(inside);
        },
      ),
    );
  });
});

describe("liquids are measured by volume", () => {
  const liquid = {
    nPct: 20,
    p2o5Pct: 0,
    k2oPct: 0,
    form: "liquid" as const,
    densityLbPerGal: 11.2,
  };
  it("the unit list for a liquid holds fluid units only; weight oz is named as weight", () => {
    expect(rateUnitsFor({ form: "liquid", densityLbPerGal: 11.2 })).toEqual([
      "floz/1000ft2",
      "gal/1000ft2",
      "L/ha",
    ]);
    expect(rateUnitsFor({ form: "granular", densityLbPerGal: null })).toEqual([
      "lb/1000ft2",
      "oz/1000ft2",
      "kg/ha",
      "g/m2",
      "lb/acre",
    ]);
    expect(RATE_UNIT_LABEL["oz/1000ft2"]).toBe("oz (weight) / 1,000 ft²");
  });
  it("a weight unit for a liquid is refused, whatever the unit", () => {
    for (const unit of RATE_UNITS.filter((u) => !rateUnitsFor(liquid).includes(u)))
      expect(() => nutrientsPer1000(liquid, { amount: 18, unit }), unit).toThrow(
        NutrientInputError,
      );
  });
  it("the trap it closes: 18 oz by weight would have read 29 % less N than 18 fl oz", () => {
    const fluid = nutrientsPer1000(liquid, { amount: 18, unit: "floz/1000ft2" }).nLb;
    expect(fluid).toBeCloseTo((18 * 11.2 * 0.2) / 128, 10); // REFERENCES §5 liquid formula
    expect(1 - ((18 / 16) * 0.2) / fluid).toBeCloseTo(1 - 128 / 16 / 11.2, 10);
    expect(1 - 128 / 16 / 11.2).toBeCloseTo(0.2857, 4);
  });
});

describe("the target-N helper never proposes more than the label", () => {
  const p28 = { nPct: 28, p2o5Pct: 3, k2oPct: 6, form: "granular" as const };
  it("below the label: the rate of the published worked example (UNL: 1 lb N from 28-3-6 = 3.57 lb)", () => {
    const r = proposeRateForNitrogen(p28, 1, 4.5);
    expect(r.cappedByLabel).toBe(false);
    expect(r.rate.amount).toBeCloseTo(3.571, 3);
  });
  it("above the label: capped at the label's maximum and says so", () => {
    const r = proposeRateForNitrogen(p28, 1.5, 4.5);
    expect(r).toMatchObject({ cappedByLabel: true, rate: { amount: 4.5, unit: "lb/1000ft2" } });
  });
  it("property: the proposal never exceeds the label, and meets the target when it can", () => {
    const liquid = {
      nPct: 20,
      p2o5Pct: 0,
      k2oPct: 0,
      form: "liquid" as const,
      densityLbPerGal: 11.2,
    };
    fc.assert(
      fc.property(
        fc.constantFrom(p28, liquid),
        fc.double({ min: 0.05, max: 3, noNaN: true }),
        fc.double({ min: 0.5, max: 20, noNaN: true }),
        (product, target, maxLb) => {
          const { rate, cappedByLabel } = proposeRateForNitrogen(product, target, maxLb);
          const lb = productLbPer1000(product, rate);
          expect(lb).toBeLessThanOrEqual(maxLb * (1 + 1e-12));
          const uncapped = productLbPer1000(product, rateForNitrogen(product, target));
          expect(cappedByLabel).toBe(uncapped > maxLb);
          if (!cappedByLabel) expect(nutrientsPer1000(product, rate).nLb).toBeCloseTo(target, 9);
        },
      ),
    );
  });
});

describe("the product form asks for what the label states", () => {
  const product = {
    name: "Demo organic 6-2-0",
    form: "granular" as const,
    nPct: 6,
    p2o5Pct: 2,
    k2oPct: 0,
    slowReleasePctOfN: 0,
    densityLbPerGal: null,
    isPesticide: false,
    registrationNumber: "",
    labelCautions: "",
    reentryGuidance: "",
  };
  const issues = (p: object) =>
    (productSchema.safeParse({ ...product, ...p }).error?.issues ?? []).map(
      (i) => `${i.path.join(".")}: ${i.message}`,
    );
  it("an organic product left at 0 % is asked for its water-insoluble share", () => {
    expect(issues({ nRelease: "organic" })).toEqual([
      "slowReleasePctOfN: Enter the water-insoluble share of N from the label: most of an organic product's N is water-insoluble.",
    ]);
    expect(issues({ nRelease: "organic", slowReleasePctOfN: 70 })).toEqual([]);
    expect(issues({ nRelease: "slow_release" })).toEqual([
      "slowReleasePctOfN: Enter the slow-release share of N from the label.",
    ]);
    expect(issues({ nRelease: "quick" })).toEqual([]);
  });
  it("label limits need their unit; a liquid's is by volume; a year holds at least one application", () => {
    expect(issues({ labelMaxRate: 4 })).toEqual([
      "labelRateUnit: Choose the unit the label gives its rates in.",
    ]);
    expect(
      issues({
        form: "liquid",
        densityLbPerGal: 11.2,
        labelMaxRate: 4,
        labelRateUnit: "oz/1000ft2",
      }),
    ).toEqual(["labelRateUnit: A liquid's label rate is by volume (fl oz, gal or L)."]);
    expect(issues({ labelMaxRate: 4, labelRateUnit: "lb/1000ft2", labelMaxYearly: 3 })).toEqual([
      "labelMaxYearly: The yearly maximum cannot be below the maximum per application.",
    ]);
  });
  it("a pesticide must give its label's maximum rate and re-entry instruction", () => {
    expect(issues({ nPct: 0, p2o5Pct: 0, isPesticide: true, registrationNumber: "X-1" })).toEqual([
      "reentryGuidance: A pesticide label says when people and pets may go back on the turf: enter it.",
      "labelMaxRate: A pesticide label states its maximum rate per application: enter it.",
    ]);
  });
});
