// US telephone numbers, as the North American Numbering Plan writes them: NPA-NXX-XXXX, ten digits
// — a three-digit area code (NPA) and exchange (NXX) each starting with 2–9, then four digits —
// optionally after the country code 1 (NANPA, "About the North American Numbering Plan"; the
// N = 2–9 rule from memory of the plan's format). Stored in ITU-T E.164 form (+ country code
// and national number, no spaces: +16095550142) and shown as (609) 555-0142.
// 555-0100 to 555-0199 are set aside for fiction (NANPA), which is where the demo's numbers live.

const NANP = /^([2-9]\d{2})([2-9]\d{2})(\d{4})$/;

/** The E.164 form of a US number typed any usual way ("(609) 555-0142", "609.555.0142", "+1 609 555 0142"), or null. */
export function usPhoneE164(typed: string): string | null {
  const trimmed = typed.trim();
  // Only digits and the usual separators; letters (vanity numbers) and extensions are refused.
  if (!/^\+?[\d\s().-]+$/.test(trimmed)) return null;
  let digits = trimmed.replace(/\D/g, "");
  if (trimmed.startsWith("+") && !digits.startsWith("1")) return null; // another country
  if (digits.length === 11 && digits.startsWith("1")) digits = digits.slice(1);
  const m = NANP.exec(digits);
  return m ? `+1${m[1]}${m[2]}${m[3]}` : null;
}

/** (609) 555-0142 for +16095550142; anything else as stored. */
export function formatUsPhone(e164: string): string {
  const m = /^\+1(\d{3})(\d{3})(\d{4})$/.exec(e164);
  return m ? `(${m[1]}) ${m[2]}-${m[3]}` : e164;
}
