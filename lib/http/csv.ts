// CSV for spreadsheets: UTF-8 with a byte-order mark, and cells that a spreadsheet would run as
// a formula (starting with = + - @, or tab/carriage return) neutralised with a leading quote.
export const UTF8_BOM = "\uFEFF";

export function neutraliseCell(value: unknown): string {
  const text = value === null || value === undefined ? "" : String(value);
  return /^[=+\-@\t\r]/.test(text) ? `'${text}` : text;
}
