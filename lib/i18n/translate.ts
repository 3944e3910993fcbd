// The catalogue's words outside React (e-mails, CSV exports, pure sentence builders) through
// use-intl's translator, in the company's locale. Pages use next-intl (lib/auth/request-locale.ts).
import { createTranslator } from "use-intl/core";

import { localeChoice } from "./locales";
import { en, type Messages } from "./messages/en";

const CATALOGUES: Record<"en", Messages> = { en };

/** The catalogue of a company's locale (its language). */
export function messagesFor(locale: string | null | undefined): Messages {
  return CATALOGUES[localeChoice(locale).language];
}

const made = new Map<string, unknown>();

/** A translator for one namespace of the catalogue, in the company's locale (made once, kept). */
export function translator<N extends keyof Messages>(
  locale: string | null | undefined,
  namespace: N,
) {
  const tag = localeChoice(locale).tag;
  const key = `${tag}/${namespace}`;
  const make = () => createTranslator({ locale: tag, messages: messagesFor(tag), namespace });
  if (!made.has(key)) made.set(key, make());
  return made.get(key) as ReturnType<typeof make>;
}

/** Values a message's placeholders take. */
export type WordValues = Record<string, string | number | Date>;

/**
 * The catalogue's words under a dotted path ("report.zone") for pure code that builds sentences
 * from keys it computes: `words("en-US", "report.zone")("bare", { pct: 5 })`. Loosely typed on
 * the key: the tests of each caller render the sentences it builds.
 */
export function words(
  locale: string | null | undefined,
  path: string,
): (key: string, values?: WordValues) => string {
  const [namespace, ...rest] = path.split(".") as [keyof Messages, ...string[]];
  const t = translator(locale, namespace) as unknown as (k: string, v?: WordValues) => string;
  const prefix = rest.length ? `${rest.join(".")}.` : "";
  return (key, values) => t(`${prefix}${key}`, values);
}
