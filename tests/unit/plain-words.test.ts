// The words Sward shows, at their source: every message of the catalogue, the reference tables
// people read (symptoms, care notes, record fields, units), alert and evidence labels — scanned
// with the one list of British spellings and internals (tests/helpers/house-words.ts). The pages,
// e-mails and CSV exports themselves are scanned end to end in tests/e2e/plain-words.test.ts.
// Dates: CLDR en-US patterns (Unicode CLDR, the data behind Intl.DateTimeFormat).
import { describe, expect, it } from "vitest";

import { OVERRIDE_CATEGORY_LABEL, RATE_UNIT_LABEL } from "@/lib/applications/units";
import {
  formatDate,
  formatDateTime,
  formatNumericDate,
  formatNumericDateTime,
  formatShortDate,
} from "@/lib/dates";
import { en } from "@/lib/i18n/messages/en";
import { CARE_NOTES } from "@/lib/reference/care-notes";
import { RECORD_FIELDS } from "@/lib/reference/record-fields";
import { symptoms } from "@/lib/reference/symptoms";
import { ALERT_KINDS, EVIDENCE_LABELS, evidenceEntry, evidenceValue } from "@/lib/risk/labels";

import { scanWords } from "../helpers/house-words";

const strings = (node: unknown, path: string): [string, string][] =>
  typeof node === "string"
    ? [[path, node]]
    : node && typeof node === "object"
      ? Object.entries(node).flatMap(([k, v]) => strings(v, `${path}.${k}`))
      : [];

describe("plain words at the source", () => {
  it("the catalogue, reference tables and labels have no British spelling or internal name", () => {
    const texts: [string, string][] = [
      ...strings(en, "messages"),
      ...symptoms.flatMap((s): [string, string][] => [
        [`symptom ${s.key}`, s.name],
        [`symptom ${s.key} signs`, s.signs],
      ]),
      ...CARE_NOTES.flatMap((n) =>
        strings(
          {
            title: n.title,
            body: n.body,
            source: n.source,
            cautions: n.cautions,
            variants: n.variants,
          },
          `care note ${n.key}`,
        ),
      ),
      ...strings(RECORD_FIELDS, "record fields"),
      ...strings(RATE_UNIT_LABEL, "rate units"),
      ...strings(OVERRIDE_CATEGORY_LABEL, "override categories"),
      ...strings(ALERT_KINDS, "alert kinds"),
      ...strings(EVIDENCE_LABELS, "evidence labels"),
    ];
    const found = texts.flatMap(([where, text]) => scanWords(where, text));
    expect(texts.length).toBeGreaterThan(200);
    expect(found).toEqual([]);
  });

  it("the scan itself catches what it must (a check that can fail)", () => {
    const caught = (text: string) => scanWords("t", text).map((f) => f.found);
    expect(caught("Colour 6 → 8; Snow mould; fertiliser licence; catalogue; organise")).toEqual([
      "Colour",
      "fertiliser",
      "licence",
      "mould",
      "catalogue",
      "organise",
    ]);
    expect(caught("status: in_progress (lib/scoring/history.ts)")).toEqual(
      expect.arrayContaining(["in_progress", "lib/scoring/history.ts", "history.ts"]),
    );
    expect(caught("Invalid input: expected number, received NaN")).toEqual(
      expect.arrayContaining(["Invalid input", "NaN"]),
    );
    expect(
      scanWords("t", "Your lawn (n 6), r² 0.4, DGCI 0.607", { homeowner: true }).map(
        (f) => f.found,
      ),
    ).toEqual(expect.arrayContaining(["(n 6)", "r²", "DGCI"]));
    // Day-before-month dates are caught; month-first dates and quantities pass.
    expect(caught("GDD since 1 January; Wed, 2 Dec 2026; the 3rd March round")).toEqual([
      "1 January",
      "2 Dec",
      "3rd March",
    ]);
    expect(
      caught("GDD since January 1; Wed, Dec 2, 2026; 3 zones, 12 in; 57 Marrowfield Road"),
    ).toEqual([]);
    // Addresses are not words: links and e-mail addresses pass.
    expect(caught("https://x.test/my_lawn?a_b=1 owner_1@demo.sward.test")).toEqual([]);
    // US words pass.
    expect(
      caught("color, fertilizer, license, mold, catalog, organize, gray, center, program"),
    ).toEqual([]);
  });

  it("dates read the US way in every helper (month before day)", () => {
    expect(formatDate("2026-12-02")).toBe("Wed, Dec 2, 2026");
    expect(formatShortDate("2026-12-02")).toBe("Dec 2, 2026");
    expect(formatNumericDate("2026-12-02")).toBe("12/02/2026");
    expect(formatDateTime("2026-12-02T20:05:00Z", "America/New_York")).toBe("Wed, Dec 2, 3:05 PM");
    expect(formatNumericDateTime("2026-05-12T13:15:00Z", "America/New_York")).toBe(
      "05/12/2026, 9:15 AM",
    );
    // Evidence values: ISO dates in words, coded values in words.
    expect(evidenceValue("2026-07-08")).toBe("Jul 8, 2026");
    expect(evidenceValue("cool")).toBe("cool-season");
    // Temperatures the models keep in °C read in °F first for a US reader (°F = °C × 9/5 + 32).
    expect(evidenceEntry("tmaxC", 30)).toEqual({ label: "High", value: "86 °F (30 °C)" });
    expect(evidenceEntry("tMean5dC", 24.6).value).toBe("76.3 °F (24.6 °C)");
    expect(evidenceEntry("nightMinC", -5).value).toBe("23 °F (−5 °C)");
    expect(evidenceEntry("rainIn", 0.4)).toEqual({ label: "Rain (in)", value: "0.4" });
    expect(evidenceValue(["2026-07-08", "2026-07-09"])).toBe("Jul 8, 2026; Jul 9, 2026");
  });
});
