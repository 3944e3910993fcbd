// The one list of words and shapes that must never reach a screen, an e-mail or an export: British
// spellings (Sward's screens speak US English, PRODUCT.md) and developer internals (file paths,
// snake_case names, raw enum values, validator jargon). Used by the page/e-mail/CSV scan
// (tests/e2e/plain-words.test.ts) and by the unit scan of the message catalogue and the reference
// tables (tests/unit/plain-words.test.ts). Spellings follow Merriam-Webster's US entries; the -ise
// verbs are the Oxford/British forms of the US -ize verbs.

/** British spelling → the US spelling a reader expects. Patterns match whole words, any case. */
const BRITISH_SPELLINGS: readonly (readonly [RegExp, string])[] = [
  [/\b\w*colour\w*\b/i, "color"],
  [/\bfertilis(e|er|ers|ed|es|ing|ation)\b/i, "fertilize / fertilizer"],
  [/\blicence[sd]?\b/i, "license"],
  [/\b\w*mould\w*\b/i, "mold"],
  [/\bcatalogue[sd]?\b/i, "catalog"],
  [/\b(centi|milli|kilo)?metres?\b/i, "meter"],
  [/\b(milli)?litres?\b/i, "liter"],
  [/\bgrey(s|ed|ing|ish)?\b/i, "gray"],
  [/\bcentre[sd]?\b/i, "center"],
  [/\bprogrammes?\b/i, "program"],
  [/\baluminium\b/i, "aluminum"],
  [
    /\b(behaviour|neighbour|favour|honour|labour|harbour|odour|vapour|savour|flavour)(s|ed|ing|hood|able|ite)?\b/i,
    "-or",
  ],
  [/\b(analys|paralys|catalys)(e|ed|ing)\b/i, "-yze"],
  [
    /\b(organ|recogn|minim|maxim|priorit|summar|util|author|optim|standard|visual|categor|custom|normal|real|apolog|final|initial|memor|sanit|stabil|item|synchron|character|emphas|critic|capital|harmon|general|special|local|neutral|equal|immun|mobil|steril|symbol|vapor|penal|legal|modern|computer|digit|central|personal|random|serial|pressur|winter)is(e|es|ed|ing|ation|ations|er|ers)\b/i,
    "-ize",
  ],
  [/\bcancell(ed|ing)\b/i, "canceled / canceling"],
  [/\b(travell|labell|modell|levell|signall|fuell|totall)(ed|ing|er)\b/i, "single l"],
  [/\bartefacts?\b/i, "artifact"],
  [/\bjudgement\b/i, "judgment"],
  [/\benrolment\b/i, "enrollment"],
  [/\bdefence\b|\boffence\b/i, "defense / offense"],
  [/\bpractise[sd]?\b|\bpractising\b/i, "practice"],
  [/\b(fibre|calibre|theatre|sabre|spectre)s?\b/i, "-er"],
  [
    /\b(kerb|tyre|plough|sulphur|manoeuvre|draught|aeroplane|cheque|pyjamas|storey)s?\b/i,
    "US word",
  ],
  [/\b(whilst|amongst)\b/i, "while / among"],
  [/\bageing\b/i, "aging"],
  [/\btonnes?\b/i, "ton / metric ton"],
  [/\bspeciality\b/i, "specialty"],
  [/\bmoult(s|ed|ing)?\b/i, "molt"],
];

/** Day-before-month dates ("1 January", "2 Dec 2026"): US readers expect the month first. */
const DATE_ORDER: readonly (readonly [RegExp, string])[] = [
  [
    /\b\d{1,2}(st|nd|rd|th)? (January|February|March|April|May|June|July|August|September|October|November|December|Jan|Feb|Mar|Apr|Jun|Jul|Aug|Sept?|Oct|Nov|Dec)\b/,
    "month first (January 1, Dec 2)",
  ],
];

/** Statistics and imaging jargon a homeowner should not meet (pages and e-mails for homeowners). */
const HOMEOWNER_JARGON: readonly (readonly [RegExp, string])[] = [
  [/\br²|\br2\b|\bR-squared\b/i, "a correlation figure"],
  [/\bDGCI\b|Dark Green Color Index/i, "a photo-analysis index"],
  [
    /\(n \d+\)|\bn = \d+|\bp-value\b|\bp [<=]|\bregression\b|points per 30 days|\bconfidence interval\b/i,
    "statistics notation",
  ],
];

/** Developer internals that must not reach a reader. */
const INTERNAL_NAMES: readonly (readonly [RegExp, string])[] = [
  [/\b(lib|app|components|db|fixtures|jobs|tests)\/[\w./[\]-]+/, "a source file path"],
  [/\b[\w-]+\.(tsx?|mjs|cjs|jsx)\b/, "a source file name"],
  [/\b[a-z][a-z0-9]*(_[a-z0-9]+)+\b/, "a snake_case name or raw enum value"],
  [/\b(NaN|undefined|\[object Object\])\b/, "a program value"],
  [/Invalid input|expected \w+, received|Too (small|big): expected/i, "raw validator text"],
  [/\(month-day\)|\btemperature f\b/i, "notation for developers"],
];

export interface WordFinding {
  where: string;
  found: string;
  rule: string;
  context: string;
}

/** Text that is not ours to judge: addresses of links, e-mail addresses, URLs. */
function stripAddresses(text: string): string {
  return text
    .replace(/https?:\/\/\S+/g, " ")
    .replace(/\b[\w.+-]+@[\w-]+(\.[\w-]+)+\b/g, " ")
    .replace(/\b[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}\b/gi, " ");
}

/** Every British spelling and internal name in `text`, with a little context around each. */
export function scanWords(
  where: string,
  text: string,
  options: { homeowner?: boolean } = {},
): WordFinding[] {
  const clean = stripAddresses(text);
  const out: WordFinding[] = [];
  const lists: [readonly (readonly [RegExp, string])[], string][] = [
    [BRITISH_SPELLINGS, "British spelling"],
    [INTERNAL_NAMES, "internal"],
    [DATE_ORDER, "British date order"],
  ];
  if (options.homeowner) lists.push([HOMEOWNER_JARGON, "jargon for a homeowner"]);
  for (const [list, kind] of lists)
    for (const [pattern, hint] of list) {
      const global = new RegExp(
        pattern.source,
        pattern.flags.includes("g") ? pattern.flags : `${pattern.flags}g`,
      );
      for (const m of clean.matchAll(global))
        out.push({
          where,
          found: m[0],
          rule: `${kind}: ${hint}`,
          context: clean
            .slice(Math.max(0, m.index - 40), m.index + m[0].length + 40)
            .replace(/\s+/g, " "),
        });
    }
  return out;
}
