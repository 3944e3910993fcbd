// The forms' validation as the browser runs it: react-hook-form's resolver (formResolver) with
// the shared zod/mini schemas. Every message a person can see is plain US English — never the
// validator's own wording ("Invalid input", "expected number, received NaN").
import type { FieldErrors, FieldValues } from "react-hook-form";
import { describe, expect, it } from "vitest";

import { numberOrNull } from "@/components/ui/field";
import { formResolver } from "@/components/ui/form-resolver";
import { addDays, todayIn } from "@/lib/dates";
import { invitationSchema } from "@/lib/invitations/schemas";
import { productSchema } from "@/lib/products/schemas";
import { propertySchema, zoneSchema } from "@/lib/properties/schemas";
import { ruleSetSchema } from "@/lib/rule-sets/schemas";
import { scheduleVisitSchema } from "@/lib/visits/schemas";
import { wateringSchema } from "@/lib/watering/schemas";

type AnyResolver = (
  values: FieldValues,
  context: unknown,
  options: { fields: object; shouldUseNativeValidation: boolean },
) => Promise<{ values: FieldValues; errors: FieldErrors }>;

async function validate(resolver: unknown, values: FieldValues) {
  const result = await (resolver as AnyResolver)(values, undefined, {
    fields: {},
    shouldUseNativeValidation: false,
  });
  // Field paths as react-hook-form nests them ("proBlackout.0"), with their messages.
  const messages: Record<string, string | undefined> = {};
  const walk = (node: unknown, path: string) => {
    if (!node || typeof node !== "object") return;
    const e = node as { message?: unknown; type?: unknown };
    if (typeof e.type === "string") messages[path] = e.message as string | undefined;
    else
      for (const [k, child] of Object.entries(node))
        if (k !== "ref") walk(child, path ? `${path}.${k}` : k);
  };
  walk(result.errors, "");
  return { values: result.values, messages };
}

const RAW = /invalid input|expected|received|nan|undefined|too (small|big)/i;

describe("forms validate with their shared schema, in plain words", () => {
  it("a zone with an empty area (NaN from the number field) asks for a number", async () => {
    const { messages } = await validate(formResolver(zoneSchema), {
      name: "",
      area: Number.NaN,
      areaUnit: "ft2",
      grassSpecies: "tall_fescue",
      sunExposure: "full_sun",
      isIrrigated: false,
      slope: "flat",
    });
    expect(messages).toEqual({
      name: "Zone name is required.",
      area: "Enter the area as a number.",
    });
  });

  it("fields without a message of their own get the plain fallback, not the validator's text", async () => {
    const { messages } = await validate(formResolver(ruleSetSchema), {
      name: "Shore towns",
      citation: "",
      limitsAreLaw: true,
      maxNLbPer1000: 0.7,
      maxWsnLbPer1000: null,
      minSlowReleasePct: Number.NaN,
      proBlackout: ["13-01", "02-15"],
      homeownerBlackout: null,
      phosphorusRule: "sometimes",
      soilTestMaxAgeYears: 2.5,
      phosphorusExemptEstablishment: true,
      phosphorusExemptRepair: false,
      nLimitsSource: "",
      blackoutSource: "",
      phosphorusSource: "",
      conditionsSource: "",
      recordRetentionYears: 3,
      recordRequiredFields: [],
      recordFieldsApplyTo: "all",
    });
    expect(messages.minSlowReleasePct).toBe(
      "Enter the smallest slow-release N share as a number, in %.",
    );
    expect(messages.soilTestMaxAgeYears).toBe(
      "Use a whole number for the soil test's greatest age, in years.",
    );
    expect(messages.phosphorusRule).toBe("Choose one of the options.");
    expect(messages["proBlackout.0"]).toBe(
      "Type month and day as two digits each, e.g. 12-01 for December 1.",
    );
    expect(Object.keys(messages)).toHaveLength(4);
    for (const m of Object.values(messages)) expect(m).not.toMatch(RAW);
  });

  it("the product form's cross-field rules reach the right field", async () => {
    const { messages } = await validate(formResolver(productSchema), {
      name: "Liquid 20-0-0",
      form: "liquid",
      nPct: 60,
      p2o5Pct: 30,
      k2oPct: 20,
      slowReleasePctOfN: 0,
      densityLbPerGal: null,
      isPesticide: true,
      registrationNumber: "",
      labelCautions: "",
      reentryGuidance: "",
    });
    expect(messages).toEqual({
      nPct: "N + P₂O₅ + K₂O adds up to more than 100 %.",
      densityLbPerGal: "A liquid needs its density (lb/gal) from the label.",
      registrationNumber: "A pesticide needs its registration number.",
      labelMaxRate: "A pesticide label states its maximum rate per application: enter it.",
      reentryGuidance:
        "A pesticide label says when people and pets may go back on the turf: enter it.",
    });
  });

  it("a watering needs a depth, or both run time and rate", async () => {
    const base = {
      id: "5f0c4a8e-2d1b-4c3a-9e7f-1a2b3c4d5e6f",
      zoneId: null,
      wateredOn: addDays(todayIn("UTC"), -1),
      notes: "",
    };
    const none = await validate(formResolver(wateringSchema), {
      ...base,
      depthIn: null,
      runMinutes: null,
      precipitationRateInPerHour: null,
    });
    expect(none.messages).toEqual({
      depthIn: "Give the depth, or the run time and the precipitation rate.",
    });
    const half = await validate(formResolver(wateringSchema), {
      ...base,
      depthIn: null,
      runMinutes: 20,
      precipitationRateInPerHour: null,
    });
    expect(half.messages).toEqual({
      precipitationRateInPerHour: "Give both the run time and the precipitation rate.",
    });
  });

  it("valid values come back parsed (trimmed, lower-cased, defaults filled)", async () => {
    const link = await validate(formResolver(invitationSchema), {
      email: "  Pat.Lee@Example.TEST ",
      name: " Pat Lee ",
    });
    expect(link.messages).toEqual({});
    expect(link.values).toEqual({ email: "pat.lee@example.test", name: "Pat Lee" });
    const visit = await validate(formResolver(scheduleVisitSchema), {
      propertyId: "5f0c4a8e-2d1b-4c3a-9e7f-1a2b3c4d5e6f",
      scheduledFor: addDays(todayIn("UTC"), 10),
      technicianId: null,
      plannedService: "inspection",
    });
    expect(visit.values).toMatchObject({ stopOrder: 0, notes: "" });
  });

  it("a property with empty required fields lists each field once, with its own words", async () => {
    const { messages } = await validate(formResolver(propertySchema), {
      name: " ",
      street: "",
      city: "Hopewell",
      region: "NJ",
      postalCode: "08525",
      latitude: Number.NaN,
      longitude: 200,
      timeZone: "America/New_York",
      ruleSetId: null,
      technicianId: null,
      notes: "",
    });
    expect(messages).toEqual({
      name: "Name is required.",
      street: "Street address is required.",
      latitude: "Enter the latitude as a number, e.g. 40.3342.",
      longitude: "Longitude is between -180 and 180.",
    });
  });

  it("number boxes: empty (or never typed in) is null, text is NaN and refused, a figure is a number", async () => {
    expect([null, undefined, "", "  "].map(numberOrNull)).toEqual([null, null, null, null]);
    expect(numberOrNull("0.5")).toBe(0.5);
    expect(numberOrNull("half")).toBeNaN();
    const { messages } = await validate(formResolver(wateringSchema), {
      id: "5f0c4a8e-2d1b-4c3a-9e7f-1a2b3c4d5e6f",
      zoneId: null,
      wateredOn: addDays(todayIn("UTC"), -1),
      depthIn: numberOrNull("half"),
      runMinutes: numberOrNull(null),
      precipitationRateInPerHour: numberOrNull(undefined),
      notes: "",
    });
    expect(messages).toEqual({ depthIn: "Enter the depth as a number." });
  });
  it("a refusal names the field, what is expected and the unit (stop −3, depth 'abc' or '1,5')", async () => {
    const schedule = await validate(formResolver(scheduleVisitSchema), {
      propertyId: "5b0c0a52-6a0e-4a8e-9d3c-0c3f7f4a1b11",
      technicianId: null,
      scheduledFor: "2026-12-10",
      plannedService: null,
      stopOrder: -3,
      notes: "",
    });
    // The bound of the schedule form (lib/visits/schemas.ts): stops are numbered from 1.
    expect(schedule.messages.stopOrder).toBe("Stop number: 1 or more (the day's first stop is 1).");
    expect(schedule.messages.stopOrder).not.toMatch(RAW);
    for (const typed of ["abc", "1,5"]) {
      const watering = await validate(formResolver(wateringSchema), {
        id: "5b0c0a52-6a0e-4a8e-9d3c-0c3f7f4a1b12",
        zoneId: null,
        wateredOn: "2026-11-20",
        depthIn: numberOrNull(typed),
        runMinutes: null,
        precipitationRateInPerHour: null,
        notes: "",
      });
      expect(watering.messages.depthIn).toBe("Enter the depth as a number.");
      expect(JSON.stringify(watering.messages)).not.toMatch(RAW);
    }
  });
});
