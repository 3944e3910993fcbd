// Requests of the week's schedule (zod/mini, shared by the route handlers and the page's forms).
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

const isoDate = (field: string) =>
  z
    .string(`${field}: choose a date.`)
    .check(z.refine(isIsoDate, `${field}: use a date like 2026-06-15.`));

/** At most this many stops in one move (a busy day of a whole crew). */
const MOVE_MAX_STOPS = 200;

export const moveStopsSchema = z.strictObject({
  visitIds: z
    .array(z.uuid("Stops: choose stops of the schedule."))
    .check(
      z.minLength(1, "Stops: choose at least one stop to move."),
      z.maxLength(MOVE_MAX_STOPS, `Stops: at most ${MOVE_MAX_STOPS} in one move.`),
    ),
  toDate: isoDate("Move to"),
  /** Another technician for every stop moved; absent: each stop keeps its own. */
  technicianId: z.optional(z.uuid("Technician: choose one of your technicians.")),
  /** Make the move in spite of the warnings the preview showed. */
  confirm: z._default(z.boolean(), false),
  /** Only say what would happen. */
  preview: z._default(z.boolean(), false),
});
export type MoveStopsInput = z.infer<typeof moveStopsSchema>;

export const rainDelaySchema = z.strictObject({
  date: isoDate("Day"),
  /** One technician's stops; absent: every technician's. */
  technicianId: z.optional(z.uuid("Technician: choose one of your technicians.")),
  confirm: z._default(z.boolean(), false),
  preview: z._default(z.boolean(), false),
});
export type RainDelayInput = z.infer<typeof rainDelaySchema>;

export const CAPACITY_BOUNDS = { min: 1, max: 40 } as const;

export const capacitySchema = z.strictObject({
  capacity: z
    .number("Stops a day: a whole number from 1 to 40.")
    .check(
      z.int("Stops a day: a whole number from 1 to 40."),
      z.gte(CAPACITY_BOUNDS.min, "Stops a day: at least 1."),
      z.lte(CAPACITY_BOUNDS.max, "Stops a day: at most 40."),
    ),
});

export const weekQuery = z.strictObject({ week: z.optional(isoDate("Week")) });
export const technicianParams = z.object({ technicianId: z.uuid() });
