// Validation messages in plain US English for every schema, in the browser (zod/mini ships no
// messages, so without this a form would say "Invalid input") and on the server (instead of the
// validator's own wording, e.g. "expected number, received NaN"). A message written in a schema
// wins; this map fills in the rest. Used by the route/action guard and by `formResolver`.
import type { z } from "zod/mini";

type Issue = z.core.$ZodRawIssue;

const isEmpty = (input: unknown) =>
  input === undefined || input === null || (typeof input === "string" && input.trim() === "");

function typeMessage(issue: Issue & { expected?: string }): string {
  if (isEmpty(issue.input)) return "This is required.";
  switch (issue.expected) {
    case "int":
      return typeof issue.input === "number" && Number.isFinite(issue.input)
        ? "Use a whole number."
        : "Enter a number.";
    case "number":
      return "Enter a number.";
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
      return issue.inclusive === false ? `Must be above ${min}.` : `Must be ${min} or more.`;
    }
    case "too_big": {
      const max = figure(issue.maximum);
      if (issue.origin === "string") return `Use at most ${max} characters.`;
      if (issue.origin === "array" || issue.origin === "set") return `Choose at most ${max}.`;
      return issue.inclusive === false ? `Must be below ${max}.` : `Must be ${max} or less.`;
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
