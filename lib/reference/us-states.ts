// US states, the District of Columbia and the inhabited territories: the two-letter codes the
// Postal Service assigns and the first three digits of the ZIP Codes it delivers in each.
//
// Codes: USPS Publication 28, "Postal Addressing Standards", Appendix B (two-letter state and
// possession abbreviations). Listed here: the 50 states, DC and the five inhabited territories
// (AS, GU, MP, PR, VI). Left out on purpose: the Armed Forces codes (AA, AE, AP) and the freely
// associated states (FM, MH, PW), which Publication 28 also lists but where no lawn in a US
// company's book lies. The list was written from memory of Appendix B; Sward's tests check its
// size (56) and a few codes against it.
//
// ZIP prefixes: the three-digit prefixes of USPS's sectional center facilities by state, as the
// Postal Service's list of three-digit ZIP Code prefixes gives them (Domestic Mail Manual, L002
// "3-Digit ZIP Code Prefix Matrix"). Written from memory of that list, not read here. A few
// delivery areas cross a state line (an island or a town served from the neighboring state's
// facility), so a mismatch is a warning the manager reads, never a refusal.

export interface UsState {
  code: string;
  name: string;
  /** Inclusive ranges of the ZIP Code's first three digits, as numbers (e.g. [70, 89] is 070–089). */
  zipPrefixes: readonly (readonly [number, number])[];
}

export const US_STATES: readonly UsState[] = [
  { code: "AL", name: "Alabama", zipPrefixes: [[350, 369]] },
  { code: "AK", name: "Alaska", zipPrefixes: [[995, 999]] },
  { code: "AZ", name: "Arizona", zipPrefixes: [[850, 865]] },
  { code: "AR", name: "Arkansas", zipPrefixes: [[716, 729]] },
  { code: "CA", name: "California", zipPrefixes: [[900, 961]] },
  { code: "CO", name: "Colorado", zipPrefixes: [[800, 816]] },
  { code: "CT", name: "Connecticut", zipPrefixes: [[60, 69]] },
  { code: "DE", name: "Delaware", zipPrefixes: [[197, 199]] },
  {
    code: "DC",
    name: "District of Columbia",
    zipPrefixes: [
      [200, 200],
      [202, 205],
      [569, 569],
    ],
  },
  { code: "FL", name: "Florida", zipPrefixes: [[320, 349]] },
  {
    code: "GA",
    name: "Georgia",
    zipPrefixes: [
      [300, 319],
      [398, 399],
    ],
  },
  { code: "HI", name: "Hawaii", zipPrefixes: [[967, 968]] },
  { code: "ID", name: "Idaho", zipPrefixes: [[832, 838]] },
  { code: "IL", name: "Illinois", zipPrefixes: [[600, 629]] },
  { code: "IN", name: "Indiana", zipPrefixes: [[460, 479]] },
  { code: "IA", name: "Iowa", zipPrefixes: [[500, 528]] },
  { code: "KS", name: "Kansas", zipPrefixes: [[660, 679]] },
  { code: "KY", name: "Kentucky", zipPrefixes: [[400, 427]] },
  { code: "LA", name: "Louisiana", zipPrefixes: [[700, 714]] },
  { code: "ME", name: "Maine", zipPrefixes: [[39, 49]] },
  { code: "MD", name: "Maryland", zipPrefixes: [[206, 219]] },
  {
    code: "MA",
    name: "Massachusetts",
    zipPrefixes: [
      [10, 27],
      [55, 55],
    ],
  },
  { code: "MI", name: "Michigan", zipPrefixes: [[480, 499]] },
  { code: "MN", name: "Minnesota", zipPrefixes: [[550, 567]] },
  { code: "MS", name: "Mississippi", zipPrefixes: [[386, 397]] },
  { code: "MO", name: "Missouri", zipPrefixes: [[630, 658]] },
  { code: "MT", name: "Montana", zipPrefixes: [[590, 599]] },
  { code: "NE", name: "Nebraska", zipPrefixes: [[680, 693]] },
  { code: "NV", name: "Nevada", zipPrefixes: [[889, 898]] },
  { code: "NH", name: "New Hampshire", zipPrefixes: [[30, 38]] },
  { code: "NJ", name: "New Jersey", zipPrefixes: [[70, 89]] },
  { code: "NM", name: "New Mexico", zipPrefixes: [[870, 884]] },
  {
    code: "NY",
    name: "New York",
    zipPrefixes: [
      [5, 5],
      [100, 149],
    ],
  },
  { code: "NC", name: "North Carolina", zipPrefixes: [[270, 289]] },
  { code: "ND", name: "North Dakota", zipPrefixes: [[580, 588]] },
  { code: "OH", name: "Ohio", zipPrefixes: [[430, 459]] },
  { code: "OK", name: "Oklahoma", zipPrefixes: [[730, 749]] },
  { code: "OR", name: "Oregon", zipPrefixes: [[970, 979]] },
  { code: "PA", name: "Pennsylvania", zipPrefixes: [[150, 196]] },
  { code: "RI", name: "Rhode Island", zipPrefixes: [[28, 29]] },
  { code: "SC", name: "South Carolina", zipPrefixes: [[290, 299]] },
  { code: "SD", name: "South Dakota", zipPrefixes: [[570, 577]] },
  { code: "TN", name: "Tennessee", zipPrefixes: [[370, 385]] },
  {
    code: "TX",
    name: "Texas",
    zipPrefixes: [
      [733, 733],
      [750, 799],
      [885, 885],
    ],
  },
  { code: "UT", name: "Utah", zipPrefixes: [[840, 847]] },
  {
    code: "VT",
    name: "Vermont",
    zipPrefixes: [
      [50, 54],
      [56, 59],
    ],
  },
  {
    code: "VA",
    name: "Virginia",
    zipPrefixes: [
      [201, 201],
      [220, 246],
    ],
  },
  { code: "WA", name: "Washington", zipPrefixes: [[980, 994]] },
  { code: "WV", name: "West Virginia", zipPrefixes: [[247, 268]] },
  { code: "WI", name: "Wisconsin", zipPrefixes: [[530, 549]] },
  { code: "WY", name: "Wyoming", zipPrefixes: [[820, 831]] },
  { code: "AS", name: "American Samoa", zipPrefixes: [[967, 967]] },
  { code: "GU", name: "Guam", zipPrefixes: [[969, 969]] },
  { code: "MP", name: "Northern Mariana Islands", zipPrefixes: [[969, 969]] },
  {
    code: "PR",
    name: "Puerto Rico",
    zipPrefixes: [
      [6, 7],
      [9, 9],
    ],
  },
  { code: "VI", name: "U.S. Virgin Islands", zipPrefixes: [[8, 8]] },
];

export const US_STATE_CODES = US_STATES.map((s) => s.code) as [string, ...string[]];

export function findUsState(code: string): UsState | undefined {
  const upper = code.trim().toUpperCase();
  return US_STATES.find((s) => s.code === upper);
}

/** A ZIP Code as USPS writes it: five digits, or ZIP+4 (five digits, a hyphen, four digits). */
export const ZIP_PATTERN = /^\d{5}(-\d{4})?$/;

/**
 * Whether a ZIP Code's first three digits belong to the state (USPS prefix list above). Undefined
 * when either is not well formed: the format checks speak for those.
 */
export function zipMatchesState(zip: string, stateCode: string): boolean | undefined {
  const state = findUsState(stateCode);
  if (!state || !ZIP_PATTERN.test(zip.trim())) return undefined;
  const prefix = Number(zip.trim().slice(0, 3));
  return state.zipPrefixes.some(([lo, hi]) => prefix >= lo && prefix <= hi);
}

/** The states whose prefixes hold this ZIP Code's first three digits (for the warning's words). */
export function statesOfZip(zip: string): UsState[] {
  if (!ZIP_PATTERN.test(zip.trim())) return [];
  const prefix = Number(zip.trim().slice(0, 3));
  return US_STATES.filter((s) => s.zipPrefixes.some(([lo, hi]) => prefix >= lo && prefix <= hi));
}

/**
 * The warning a manager reads when the ZIP Code's first digits belong to another state, or null.
 * "ZIP code 10001 is a New York ZIP code, but State is NJ (New Jersey). Check both."
 */
export function zipStateWarning(zip: string, stateCode: string): string | null {
  if (zipMatchesState(zip, stateCode) !== false) return null;
  const state = findUsState(stateCode)!;
  const owners = statesOfZip(zip);
  const owner = owners.length
    ? `a ${owners.map((s) => s.name).join(" or ")} ZIP code`
    : "not a ZIP code USPS uses in any state";
  return `ZIP code ${zip.trim()} is ${owner}, but State is ${state.code} (${state.name}). Check both; save as it is if the address really is so.`;
}
