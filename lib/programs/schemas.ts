// A season program as the manager edits it (zod/mini: shared by the routes and the form), the
// property's choice of program and a zone's method or exclusion. Bounds are refused in words that
// name the field, never clamped.
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

export const PROGRAM_ROUND_KINDS = [
  "feeding",
  "pre_emergence",
  "grub_control",
  "weed_control",
  "aeration_overseeding",
  "lime",
  "soil_sampling",
  "fall_feeding",
] as const;
export const PROGRAM_WINDOW_KINDS = [
  "dates",
  "gdd",
  "soil_temperature",
  "air_temperature",
] as const;
export const PROGRAM_TARGETS = ["lb", "growth_potential", "none"] as const;
const PROGRAM_METHODS = ["granular", "liquid"] as const;
/** The most rounds one program holds. */
export const PROGRAM_MAX_ROUNDS = 30;
/** The most lb N per 1,000 ft² a round's fixed target may name (above any label's single rate). */
const PROGRAM_MAX_N_LB = 3;

/** "04-15": a month and day that exist (February 29 allowed). */
const isMonthDay = (md: string) => /^\d{2}-\d{2}$/.test(md) && isIsoDate(`2024-${md}`);

const monthDay = (label: string) =>
  z.nullable(
    z.string().check(z.refine(isMonthDay, `${label}: a month and day like 04-15 (MM-DD).`)),
  );

const methodSchema = (method: string) =>
  z.strictObject({
    productId: z.nullable(z.uuid(`${method} product: choose a product of your catalog.`)),
    target: z.enum(
      PROGRAM_TARGETS,
      `${method} target: lb N per 1,000 ft², from growth potential, or no nitrogen.`,
    ),
    nLb: z.nullable(
      z
        .number(`${method} N: enter a number in lb per 1,000 ft².`)
        .check(
          z.gt(0, `${method} N: more than 0 lb per 1,000 ft².`),
          z.lte(PROGRAM_MAX_N_LB, `${method} N: at most ${PROGRAM_MAX_N_LB} lb per 1,000 ft².`),
        ),
    ),
  });

const programRoundSchema = z
  .strictObject({
    kind: z.enum(PROGRAM_ROUND_KINDS, "Round: choose what the round does."),
    windowKind: z.enum(
      PROGRAM_WINDOW_KINDS,
      "Window: dates, growing degree days, soil temperature or air temperature.",
    ),
    startMd: monthDay("Window from"),
    endMd: monthDay("Window to"),
    triggerBaseF: z.nullable(
      z
        .number("GDD base: enter a number in °F.")
        .check(z.gte(32, "GDD base: at least 32 °F."), z.lte(70, "GDD base: at most 70 °F.")),
    ),
    triggerValue: z.nullable(
      z
        .number("Trigger: enter a number.")
        .check(z.gte(0, "Trigger: 0 or more."), z.lte(6000, "Trigger: at most 6,000.")),
    ),
    windowDays: z.nullable(
      z
        .int("Days open: a whole number of days.")
        .check(z.gte(1, "Days open: at least 1 day."), z.lte(120, "Days open: at most 120 days.")),
    ),
    granular: methodSchema("Granular"),
    liquid: methodSchema("Liquid"),
  })
  .check(
    z.superRefine((r, ctx) => {
      const need = (path: string, message: string) =>
        ctx.addIssue({ code: "custom", path: [path], message });
      if (r.windowKind === "dates") {
        if (r.startMd === null) need("startMd", "Window from: a month and day like 04-15.");
        if (r.endMd === null) need("endMd", "Window to: a month and day like 05-15.");
        if (r.startMd !== null && r.endMd !== null && r.endMd < r.startMd)
          need("endMd", "Window to: on or after the window's first day (in the same year).");
      } else {
        if (r.triggerValue === null)
          need(
            "triggerValue",
            r.windowKind === "gdd"
              ? "Trigger: the growing degree days (°F) that open the window."
              : "Trigger: the temperature (°F) that opens the window.",
          );
        if (r.triggerValue !== null && r.windowKind !== "gdd" && r.triggerValue > 110)
          need("triggerValue", "Trigger: a temperature of at most 110 °F.");
        if (r.windowKind === "gdd" && r.triggerBaseF === null)
          need("triggerBaseF", "GDD base: the base temperature in °F (50 °F is usual).");
        if (r.windowDays === null) need("windowDays", "Days open: how long the window stays open.");
      }
      for (const m of ["granular", "liquid"] as const) {
        const label = m === "granular" ? "Granular" : "Liquid";
        if (r[m].target === "lb" && r[m].nLb === null)
          ctx.addIssue({
            code: "custom",
            path: [m, "nLb"],
            message: `${label} N: enter the lb N per 1,000 ft² of the round.`,
          });
        if (r[m].target !== "none" && r[m].productId === null)
          ctx.addIssue({
            code: "custom",
            path: [m, "productId"],
            message: `${label} product: choose the product that carries the round's nitrogen.`,
          });
      }
    }),
  );
export type ProgramRoundInput = z.infer<typeof programRoundSchema>;

export const programSchema = z.strictObject({
  id: z.uuid("A program id must be a UUID."),
  name: z
    .string()
    .check(
      z.trim(),
      z.minLength(1, "Name: the program's name is required."),
      z.maxLength(80, "Name: at most 80 characters."),
    ),
  grassSeason: z.enum(["cool", "warm"], "Grass: cool-season or warm-season."),
  notes: z.string().check(z.trim(), z.maxLength(1000, "Notes: at most 1,000 characters.")),
  rounds: z
    .array(programRoundSchema)
    .check(
      z.minLength(1, "Rounds: a program has at least one round."),
      z.maxLength(PROGRAM_MAX_ROUNDS, `Rounds: at most ${PROGRAM_MAX_ROUNDS} in one program.`),
    ),
});
export type ProgramInput = z.infer<typeof programSchema>;

export const programIdParams = z.object({ programId: z.uuid() });

export const propertyProgramSchema = z.strictObject({
  programId: z.nullable(z.uuid("Program: choose one of your programs, or none.")),
});

export const zoneProgramSchema = z
  .strictObject({
    method: z.enum(PROGRAM_METHODS, "Method: granular or liquid."),
    excludedYear: z.nullable(
      z
        .int("Left out for: a season's year.")
        .check(
          z.gte(2000, "Left out for: 2000 or later."),
          z.lte(2100, "Left out for: 2100 or earlier."),
        ),
    ),
    excludedReason: z.nullable(
      z
        .string()
        .check(
          z.trim(),
          z.minLength(1, "Reason: say why the zone is left out (new sod, construction…)."),
          z.maxLength(200, "Reason: at most 200 characters."),
        ),
    ),
  })
  .check(
    z.superRefine((z2, ctx) => {
      if ((z2.excludedYear === null) !== (z2.excludedReason === null))
        ctx.addIssue({
          code: "custom",
          path: [z2.excludedYear === null ? "excludedYear" : "excludedReason"],
          message:
            z2.excludedYear === null
              ? "Left out for: the season the zone is left out."
              : "Reason: say why the zone is left out (new sod, construction…).",
        });
    }),
  );
export type ZoneProgramInput = z.infer<typeof zoneProgramSchema>;
