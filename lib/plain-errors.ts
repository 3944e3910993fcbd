// Validation messages in plain US English for every schema, in the browser (zod/mini ships no
// messages, so without this a form would say "Invalid input") and on the server (instead of the
// validator's own wording, e.g. "expected number, received NaN"). A message written in a schema
// wins; this map fills in the rest. Used by the route/action guard and by `formResolver`.
import type { z } from "zod/mini";

type Issue = z.core.$ZodRawIssue;

/**
 * Fields whose schema leaves the message to this map: what the field is called on its form and
 * the unit it is typed in, so a refusal names both ("The stop number must be 0 or more.").
 * Keyed by the field's name (the last part of its path).
 */
const FIELD_WORDS: Record<string, { label: string; unit?: string }> = {
  stopOrder: { label: "the stop number" },
  sortOrder: { label: "the position in the list" },
  windMph: { label: "the wind speed", unit: "mph" },
  temperatureF: { label: "the temperature", unit: "°F" },
  minSlowReleasePct: { label: "the smallest slow-release N share", unit: "%" },
  soilTestMaxAgeYears: { label: "the soil test's greatest age", unit: "years" },
  recordRetentionYears: { label: "how long records are kept", unit: "years" },
  latitude: { label: "the latitude", unit: "degrees" },
  longitude: { label: "the longitude", unit: "degrees" },
  soilMoisturePct: { label: "the soil moisture", unit: "%" },
  extentPct: { label: "the share of the zone", unit: "%" },
  depthIn: { label: "the watering depth", unit: "in" },
  runMinutes: { label: "the run time", unit: "minutes" },
  precipitationRateInPerHour: { label: "the precipitation rate", unit: "in/h" },
};

const fieldOf = (issue: Issue) => {
  const last = issue.path?.at(-1);
  return typeof last === "string" ? FIELD_WORDS[last] : undefined;
};
const capital = (s: string) => s[0]!.toUpperCase() + s.slice(1);
const withUnit = (figure: string, unit?: string) => (unit ? `${figure} ${unit}` : figure);

const isEmpty = (input: unknown) =>
  input === undefined || input === null || (typeof input === "string" && input.trim() === "");

function typeMessage(issue: Issue & { expected?: string }): string {
  const field = fieldOf(issue);
  if (isEmpty(issue.input))
    return field ? `${capital(field.label)} is required.` : "This is required.";
  const asNumber = field
    ? `Enter ${field.label} as a number${field.unit ? `, in ${field.unit}` : ""}.`
    : "Enter a number.";
  switch (issue.expected) {
    case "int":
      return typeof issue.input === "number" && Number.isFinite(issue.input)
        ? field
          ? `Use a whole number for ${field.label}${field.unit ? `, in ${field.unit}` : ""}.`
          : "Use a whole number."
        : asNumber;
    case "number":
      return asNumber;
    case "string":
      return "Enter some text.";
    case "boolean":
      return "Choose yes or no.";
    case "array":
      return "Choose from the list.";
    case "object":
      return "Some values are missing.";
    default:
      return "This value is not allowed here.";
  }
}

const figure = (v: unknown) =>
  typeof v === "number" ? v.toLocaleString("en-US") : typeof v === "bigint" ? String(v) : "";

export const plainErrors: z.core.$ZodErrorMap = (issue) => {
  switch (issue.code) {
    case "invalid_type":
      return typeMessage(issue);
    case "too_small": {
      const min = figure(issue.minimum);
      if (issue.origin === "string")
        return Number(issue.minimum) <= 1 ? "This is required." : `Use at least ${min} characters.`;
      if (issue.origin === "array" || issue.origin === "set") return `Choose at least ${min}.`;
      const field = fieldOf(issue);
      const who = field ? `${capital(field.label)} must be` : "Must be";
      const at = withUnit(min, field?.unit);
      return issue.inclusive === false ? `${who} above ${at}.` : `${who} ${at} or more.`;
    }
    case "too_big": {
      const max = figure(issue.maximum);
      if (issue.origin === "string") return `Use at most ${max} characters.`;
      if (issue.origin === "array" || issue.origin === "set") return `Choose at most ${max}.`;
      const field = fieldOf(issue);
      const who = field ? `${capital(field.label)} must be` : "Must be";
      const at = withUnit(max, field?.unit);
      return issue.inclusive === false ? `${who} below ${at}.` : `${who} ${at} or less.`;
    }
    case "not_multiple_of":
      return `Use steps of ${figure(issue.divisor)}.`;
    case "invalid_format":
      if (issue.format === "email") return "Enter a valid e-mail address.";
      if (issue.format === "uuid" || issue.format === "guid") return "Choose one from the list.";
      return "Check the format of this value.";
    case "invalid_value":
    case "invalid_union":
      return "Choose one of the options.";
    case "unrecognized_keys":
      return "This form sent a field it does not have.";
    default:
      return "Check this value.";
  }
};
