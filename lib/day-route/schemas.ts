// Requests of the day's route (zod/mini, shared by the route handlers and Today's buttons).
import { z } from "zod/mini";

import { isIsoDate } from "@/lib/dates";

const day = z
  .string("Day: choose a date.")
  .check(z.refine(isIsoDate, "Day: use a date like 2026-06-15."));

/** A technician's day has at most 40 stops (memberships.daily_stop_capacity); room for moved ones. */
export const DAY_ORDER_MAX_STOPS = 100;

export const dayRouteQuery = z.strictObject({
  date: z.optional(day),
  /** Managers: whose day. Technicians: their own, always. */
  technicianId: z.optional(z.uuid("Technician: choose one of your technicians.")),
});

/** "Put in driving order": the stops not yet started, in the computed order. */
export const drivingOrderSchema = z.strictObject({
  date: day,
  technicianId: z.optional(z.uuid("Technician: choose one of your technicians.")),
});
export type DrivingOrderInput = z.infer<typeof drivingOrderSchema>;

/** The order set by hand: every stop of the day, first to last. */
export const stopOrderSchema = z.strictObject({
  date: day,
  technicianId: z.optional(z.uuid("Technician: choose one of your technicians.")),
  visitIds: z
    .array(z.uuid("Stops: list the day's stops."))
    .check(
      z.minLength(1, "Stops: list the day's stops, first to last."),
      z.maxLength(DAY_ORDER_MAX_STOPS, `Stops: at most ${DAY_ORDER_MAX_STOPS} in one day.`),
    ),
});
export type StopOrderInput = z.infer<typeof stopOrderSchema>;
