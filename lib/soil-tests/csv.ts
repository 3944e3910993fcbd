// Reading a lab's results from a CSV file in Sward's own soil-test format (documented in
// lib/soil-tests/README.md): a header row naming the columns in any order, one sample a row.
// Each row is checked by the same schema as the form; errors name the row and the column.
import { parse } from "csv-parse/sync";
import { z } from "zod/mini";

import { BUFFER_METHODS, SOIL_EXTRACTANTS } from "@/lib/agronomy/soil-test";
import { plainErrors } from "@/lib/plain-errors";

import { SOIL_TEST_IMPORT_MAX_ROWS, soilTestSchema, type SoilTestInput } from "./schemas";

/** The columns of the format: its name in the file → the field it fills. */
const SOIL_TEST_CSV_COLUMNS = {
  sampled_on: "sampledOn",
  lab: "lab",
  zone: "zoneId",
  depth_in: "sampleDepthIn",
  extractant: "extractant",
  ph: "ph",
  buffer_ph: "bufferPh",
  buffer_method: "bufferMethod",
  organic_matter_pct: "organicMatterPct",
  p_ppm: "pPpm",
  k_ppm: "kPpm",
  ca_ppm: "caPpm",
  mg_ppm: "mgPpm",
  s_ppm: "sPpm",
  lab_lime_lb_per_1000: "labLimeLbPer1000",
  lab_p_needed: "labPhosphorusNeeded",
  notes: "notes",
} as const;
type Column = keyof typeof SOIL_TEST_CSV_COLUMNS;
/** Each column's header as people write it (and as errors name it); it reads back as the column. */
const SOIL_TEST_CSV_HEADERS: Record<Column, string> = {
  sampled_on: "Sampled on",
  lab: "Lab",
  zone: "Zone",
  depth_in: "Depth (in)",
  extractant: "Extractant",
  ph: "pH",
  buffer_ph: "Buffer pH",
  buffer_method: "Buffer method",
  organic_matter_pct: "Organic matter (%)",
  p_ppm: "P (ppm)",
  k_ppm: "K (ppm)",
  ca_ppm: "Ca (ppm)",
  mg_ppm: "Mg (ppm)",
  s_ppm: "S (ppm)",
  lab_lime_lb_per_1000: "Lab lime (lb per 1,000 ft²)",
  lab_p_needed: "Lab P needed",
  notes: "Notes",
};
const REQUIRED: Column[] = ["sampled_on", "lab", "depth_in", "extractant"];
const NUMBER_COLUMNS: Column[] = [
  "depth_in",
  "ph",
  "buffer_ph",
  "organic_matter_pct",
  "p_ppm",
  "k_ppm",
  "ca_ppm",
  "mg_ppm",
  "s_ppm",
  "lab_lime_lb_per_1000",
];

/**
 * Header text → column name: case is ignored, "%" reads as "pct", and any run of other signs
 * (spaces, dashes, brackets) as one underscore — "Depth (in)" is depth_in, "P ppm" is p_ppm.
 */
const columnOf = (header: string): Column | undefined => {
  const key = header
    .toLowerCase()
    .replace(/%/g, "pct")
    .replace(/[^a-z0-9]+/g, "_")
    .replace(/^_|_$/g, "");
  if (key.startsWith("lab_lime")) return "lab_lime_lb_per_1000";
  return key in SOIL_TEST_CSV_COLUMNS ? (key as Column) : undefined;
};

const squash = (s: string) => s.toLowerCase().replace(/[^a-z0-9]/g, "");
const EXTRACTANT_WORDS: Record<string, (typeof SOIL_EXTRACTANTS)[number]> = {
  mehlich3: "mehlich3",
  m3: "mehlich3",
  mehlichiii: "mehlich3",
  bray1: "bray1",
  brayp1: "bray1",
  bray: "bray1",
  olsen: "olsen",
  ammoniumacetate: "ammonium_acetate",
  nh4oac: "ammonium_acetate",
  other: "other",
};
const BUFFER_WORDS: Record<string, (typeof BUFFER_METHODS)[number]> = {
  mehlich: "mehlich",
  smp: "smp",
  sikora: "sikora",
  adamsevans: "adams_evans",
  other: "other",
};

/** "2026-04-15" or a US "4/15/2026" → ISO; anything else is returned as typed (the schema refuses it). */
function isoDate(text: string): string {
  const us = /^(\d{1,2})\/(\d{1,2})\/(\d{4})$/.exec(text);
  return us ? `${us[3]}-${us[1]!.padStart(2, "0")}-${us[2]!.padStart(2, "0")}` : text;
}

export interface ParsedSoilTests {
  rows: SoilTestInput[];
  errors: string[];
}

/**
 * Reads `csv` into soil-test inputs for a property whose zones are `zones` (matched by name,
 * case-insensitive; a blank zone is the whole property). `newId` names each row.
 */
export function parseSoilTestCsv(
  csv: string,
  zones: { id: string; name: string }[],
  newId: () => string,
): ParsedSoilTests {
  let records: string[][];
  try {
    records = parse(csv, {
      bom: true,
      skip_empty_lines: true,
      relax_column_count: true,
      trim: true,
    });
  } catch (err) {
    const line = (err as { lines?: number }).lines;
    return {
      rows: [],
      errors: [`The file is not readable as CSV${line ? ` (line ${line})` : ""}.`],
    };
  }
  const [header, ...body] = records;
  if (!header || body.length === 0)
    return { rows: [], errors: ["The file needs a header row and at least one row of results."] };
  const columns = header.map(columnOf);
  const unknown = header.filter((_, i) => columns[i] === undefined);
  const missing = REQUIRED.filter((c) => !columns.includes(c));
  const errors: string[] = [];
  if (unknown.length)
    errors.push(`Unknown columns: ${unknown.map((h) => `"${h}"`).join(", ")}. See the format.`);
  if (missing.length)
    errors.push(`Missing columns: ${missing.map((c) => SOIL_TEST_CSV_HEADERS[c]).join(", ")}.`);
  if (body.length > SOIL_TEST_IMPORT_MAX_ROWS)
    errors.push(
      `The file has ${body.length} rows; import at most ${SOIL_TEST_IMPORT_MAX_ROWS} at a time.`,
    );
  if (errors.length) return { rows: [], errors };

  const zoneByName = new Map(zones.map((z) => [z.name.trim().toLowerCase(), z.id]));
  const rows: SoilTestInput[] = [];
  body.forEach((cells, index) => {
    const rowNo = index + 2; // the header is row 1
    const value = (c: Column) => {
      const i = columns.indexOf(c);
      return i < 0 ? "" : (cells[i] ?? "");
    };
    const rowErrors: string[] = [];
    const candidate: Record<string, unknown> = {
      id: newId(),
      sampledOn: isoDate(value("sampled_on")),
      lab: value("lab"),
      notes: value("notes"),
      zoneId: null,
      extractant: EXTRACTANT_WORDS[squash(value("extractant"))] ?? value("extractant"),
      bufferMethod: value("buffer_method")
        ? (BUFFER_WORDS[squash(value("buffer_method"))] ?? value("buffer_method"))
        : null,
      labPhosphorusNeeded: null,
    };
    const zone = value("zone");
    if (zone) {
      const id = zoneByName.get(zone.toLowerCase());
      if (id) candidate.zoneId = id;
      else rowErrors.push(`Zone: "${zone}" is not a zone of this property.`);
    }
    for (const c of NUMBER_COLUMNS) {
      const text = value(c).replace(/,/g, "");
      const n = text === "" ? null : Number(text);
      if (n !== null && !Number.isFinite(n))
        rowErrors.push(`${SOIL_TEST_CSV_HEADERS[c]}: "${value(c)}" is not a number.`);
      candidate[SOIL_TEST_CSV_COLUMNS[c]] = n;
    }
    const p = squash(value("lab_p_needed"));
    if (p) {
      if (["yes", "y", "true", "1"].includes(p)) candidate.labPhosphorusNeeded = true;
      else if (["no", "n", "false", "0"].includes(p)) candidate.labPhosphorusNeeded = false;
      else rowErrors.push(`Lab P needed: use yes, no or leave it blank.`);
    }
    if (rowErrors.length === 0) {
      const parsed = z.safeParse(soilTestSchema, candidate, { error: plainErrors });
      if (parsed.success) rows.push(parsed.data);
      else for (const issue of parsed.error.issues) rowErrors.push(issue.message);
    }
    for (const e of rowErrors) errors.push(`Row ${rowNo}: ${e}`);
  });
  return { rows: errors.length ? [] : rows, errors };
}
