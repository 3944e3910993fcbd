// Student's t (lib/scoring/student-t.ts) against outside references: closed forms for 1 and 2
// degrees of freedom, printed t-table values, and jstat (a general-purpose statistics library).
import jStat from "jstat";
import { describe, expect, it } from "vitest";

import { studentTCdf, studentTQuantile, twoSidedP } from "@/lib/scoring/student-t";
import { correlationPValue } from "@/lib/scoring/trend";

const DFS = [1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 12, 15, 20, 30, 60, 120, 1000];
const PS = [0.5001, 0.55, 0.6, 0.75, 0.8, 0.9, 0.95, 0.975, 0.99, 0.995, 0.999, 0.9995];

describe("Student's t", () => {
  it("matches the closed forms: df 1 is Cauchy, tan(π(p − ½)); df 2 is (2p − 1) / √(2p(1 − p))", () => {
    // Closed forms: e.g. Johnson, Kotz & Balakrishnan, Continuous Univariate Distributions vol. 2,
    // ch. 28 (from memory); both follow from integrating the density directly.
    for (const p of [...PS, 0.3, 0.1, 0.025, 0.001]) {
      expect(studentTQuantile(p, 1)).toBeCloseTo(Math.tan(Math.PI * (p - 0.5)), 6);
      expect(studentTQuantile(p, 2)).toBeCloseTo((2 * p - 1) / Math.sqrt(2 * p * (1 - p)), 8);
    }
    for (const t of [-5, -1, 0, 0.7, 3, 40]) {
      expect(studentTCdf(t, 1)).toBeCloseTo(0.5 + Math.atan(t) / Math.PI, 12);
      expect(studentTCdf(t, 2)).toBeCloseTo(0.5 + t / (2 * Math.sqrt(2 + t * t)), 12);
    }
  });

  it("matches printed t-table values (one-sided 0.95 and 0.975 quantiles, 3 decimals)", () => {
    // The t table printed in most statistics texts (e.g. NIST/SEMATECH e-Handbook of Statistical
    // Methods §1.3.6.7.2, "Critical values of the Student's t distribution"); values from memory.
    const table: [number, number, number][] = [
      // df, t(0.95), t(0.975)
      [1, 6.314, 12.706],
      [2, 2.92, 4.303],
      [3, 2.353, 3.182],
      [4, 2.132, 2.776],
      [5, 2.015, 2.571],
      [6, 1.943, 2.447],
      [8, 1.86, 2.306],
      [9, 1.833, 2.262],
      [10, 1.812, 2.228],
      [20, 1.725, 2.086],
      [30, 1.697, 2.042],
    ];
    for (const [df, t95, t975] of table) {
      expect(studentTQuantile(0.95, df)).toBeCloseTo(t95, 3);
      expect(studentTQuantile(0.975, df)).toBeCloseTo(t975, 3);
    }
    // Towards the normal: z(0.95) = 1.645.
    expect(studentTQuantile(0.95, 1e6)).toBeCloseTo(1.645, 3);
  });

  it("agrees with jstat's studentt.inv and studentt.cdf over a grid", () => {
    for (const df of DFS)
      for (const p of PS) {
        const ours = studentTQuantile(p, df);
        const theirs = jStat.studentt.inv(p, df);
        expect(Math.abs(ours - theirs) / Math.abs(theirs)).toBeLessThan(1e-6);
        expect(studentTQuantile(1 - p, df)).toBeCloseTo(-ours, 9); // symmetry
      }
    for (const df of DFS)
      for (const t of [-30, -4, -1.5, -0.3, 0, 0.2, 1, 2.5, 6, 100])
        expect(studentTCdf(t, df)).toBeCloseTo(jStat.studentt.cdf(t, df), 7);
  });

  it("refuses what has no answer", () => {
    expect(() => studentTQuantile(0, 4)).toThrow(/between 0 and 1/);
    expect(() => studentTQuantile(1, 4)).toThrow(/between 0 and 1/);
    expect(() => studentTCdf(1, 0)).toThrow(/Degrees of freedom/);
    expect(twoSidedP(0, 5)).toBe(1);
  });
});

describe("significance of a correlation: t = r√(n − 2) / √(1 − r²)", () => {
  it("the printed critical values of r are where p crosses 0.05 (two-sided)", () => {
    // Table of critical values of Pearson's r (two-tailed α = .05), as printed in statistics
    // texts (from memory): n 6 → .811, n 10 → .632, n 12 → .576, n 22 → .423.
    for (const [n, r] of [
      [6, 0.811],
      [10, 0.632],
      [12, 0.576],
      [22, 0.423],
    ] as const) {
      expect(correlationPValue(r, n)).toBeCloseTo(0.05, 3);
      expect(correlationPValue(r + 0.01, n)).toBeLessThan(0.05);
      expect(correlationPValue(r - 0.01, n)).toBeGreaterThan(0.05);
    }
  });
  it("r = 0.5 over 6 pairs is not significant (p 0.31); over 30 pairs it is (p < 0.01)", () => {
    expect(correlationPValue(0.5, 6)).toBeCloseTo(
      2 * (1 - jStat.studentt.cdf((0.5 * 2) / Math.sqrt(0.75), 4)),
      7,
    );
    expect(correlationPValue(0.5, 6)).toBeCloseTo(0.3125, 3);
    expect(correlationPValue(-0.5, 6)).toBeCloseTo(0.3125, 3);
    expect(correlationPValue(0.5, 30)).toBeLessThan(0.01);
    expect(correlationPValue(1, 6)).toBe(0);
  });
});
