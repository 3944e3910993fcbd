// IANA time zones for pickers: the United States and Canada first, then the rest.
export function timeZoneChoices(): string[] {
  const all = Intl.supportedValuesOf("timeZone");
  const first = all.filter((tz) => tz.startsWith("America/") || tz === "Pacific/Honolulu");
  return [...first, ...all.filter((tz) => !first.includes(tz))];
}
