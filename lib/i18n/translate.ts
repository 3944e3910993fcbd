// The catalogue's words outside React (e-mails, CSV exports, pure sentence builders) through
// use-intl's translator, in the company's locale. Pages use next-intl (lib/i18n/request.ts).
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
