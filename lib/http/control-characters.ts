// Characters refused in any text a request carries: the C0 controls other than tab, line feed and
// carriage return (NUL among them: PostgreSQL cannot store it in text), DEL, the C1 controls
// (U+0080–U+009F), and lone UTF-16 surrogates (not valid Unicode: encoding them to UTF-8 would
// silently change the text). Unicode's line and paragraph separators (U+2028, U+2029) are
// ordinary text here: they are stored, exported and shown as they are.
const CONTROL = "\\u0000-\\u0008\\u000B\\u000C\\u000E-\\u001F\\u007F-\\u009F";
const LONE_SURROGATE =
  "[\\uD800-\\uDBFF](?![\\uDC00-\\uDFFF])|(?<![\\uD800-\\uDBFF])[\\uDC00-\\uDFFF]";
const REFUSED = new RegExp(`[${CONTROL}]|${LONE_SURROGATE}`);
const REFUSED_ALL = new RegExp(`[${CONTROL}]|${LONE_SURROGATE}`, "g");

export const CONTROL_CHARACTER_MESSAGE =
  "Remove the control characters (such as a NUL byte) from this text; they cannot be stored.";

export const hasControlCharacters = (text: string): boolean => REFUSED.test(text);

/** For search text, where dropping them is harmless: what remains is searched. */
export const stripControlCharacters = (text: string): string => text.replace(REFUSED_ALL, "");

/**
 * The fields of a parsed JSON value (or form) holding a refused character, named by their
 * top-level key ("" for a value that is not an object). Object keys count as text too.
 */
export function fieldsWithControlCharacters(value: unknown): string[] {
  const found = new Set<string>();
  const visit = (v: unknown, field: string, depth: number) => {
    if (typeof v === "string") {
      if (hasControlCharacters(v)) found.add(field);
    } else if (Array.isArray(v)) {
      if (depth < 64) for (const item of v) visit(item, field, depth + 1);
    } else if (v !== null && typeof v === "object") {
      if (depth < 64)
        for (const [k, item] of Object.entries(v)) {
          const name = depth === 0 ? k : field;
          if (hasControlCharacters(k))
            found.add(depth === 0 ? stripControlCharacters(k) || "_" : field);
          visit(item, name, depth + 1);
        }
    }
  };
  visit(value, "", 0);
  return [...found];
}
