// The locales a company can choose (a company setting, `companies.locale`): the language and the
// region. The language picks the message catalogue (lib/i18n/messages/); the region the style of
// dates, times and numbers (`Intl`, CLDR data) and the units. Pure.

export interface LocaleChoice {
  /** BCP 47 language-region tag. */
  tag: string;
  /** The name a manager picks, in the locale's own language. */
  label: string;
  /** The catalogue of words (lib/i18n/messages/<language>.ts). */
  language: "en";
  /** Units of the figures shown: US customary (lb/1,000 ft², in, °F). */
  units: "us-customary";
}

export const LOCALES: readonly LocaleChoice[] = [
  { tag: "en-US", label: "English (United States)", language: "en", units: "us-customary" },
];

export function isSupportedLocale(tag: unknown): tag is string {
  return typeof tag === "string" && LOCALES.some((l) => l.tag === tag);
}

/** The company's locale, or the default when the stored value is not (or no longer) offered. */
export function localeChoice(tag: string | null | undefined): LocaleChoice {
  return LOCALES.find((l) => l.tag === tag) ?? LOCALES[0]!;
}
