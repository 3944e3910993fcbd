// The characters the request boundary refuses in text (lib/http/control-characters.ts), listed
// one by one from the Unicode code charts rather than by the same pattern: the C0 controls other
// than tab, LF and CR (U+0000–U+001F), DEL (U+007F) and the C1 controls (U+0080–U+009F) — Unicode
// general category Cc — and lone UTF-16 surrogates (U+D800–U+DFFF unpaired, not valid Unicode).
// Line and paragraph separators (U+2028, U+2029, category Zl/Zp) are text and are accepted.
const range = (from: number, to: number) =>
  Array.from({ length: to - from + 1 }, (_, i) => String.fromCharCode(from + i));

export const CONTROL_ALPHABET: readonly string[] = [
  ...range(0x00, 0x1f).filter((c) => !["\t", "\n", "\r"].includes(c)),
  "\u007f",
  ...range(0x80, 0x9f),
];

const LONE_SURROGATES: readonly string[] = [
  "\ud800",
  "\udbff",
  "\udc00",
  "\udfff",
  "\udc00\ud800", // a pair in the wrong order is two lone halves
];

export const REFUSED_TEXT: readonly string[] = [...CONTROL_ALPHABET, ...LONE_SURROGATES];

export const ACCEPTED_SEPARATORS: readonly string[] = ["\u2028", "\u2029"];
