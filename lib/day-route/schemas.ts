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

/**
 * A place a day's route starts and ends — the company's yard, or a technician's own start point:
 * a label people read and its location in decimal degrees. Both coordinates empty (null) clear it.
 * `name` begins each message ("Yard latitude: between -90 and 90.").
 */
export function placeSchema(name: string) {
  return z.strictObject({
    address: z._default(
      z.string().check(z.trim(), z.maxLength(200, `${name} address: at most 200 characters.`)),
      "",
    ),
    latitude: z.nullable(
      z
        .number(`${name} latitude: a number between -90 and 90, e.g. 40.3342.`)
        .check(
          z.gte(-90, `${name} latitude: between -90 and 90.`),
          z.lte(90, `${name} latitude: between -90 and 90.`),
        ),
    ),
    longitude: z.nullable(
      z
        .number(`${name} longitude: a number between -180 and 180, e.g. -74.7391.`)
        .check(
          z.gte(-180, `${name} longitude: between -180 and 180.`),
          z.lte(180, `${name} longitude: between -180 and 180.`),
        ),
    ),
  });
}
export type PlaceInput = z.output<ReturnType<typeof placeSchema>>;

/** A technician's own start point, which takes the yard's place on their Today. */
export const startPointSchema = placeSchema("Start point");

/** Both coordinates or neither: the field errors of a half-given place, or null. */
export function halfGivenPlace(
  name: string,
  place: Pick<PlaceInput, "latitude" | "longitude">,
): Record<string, string[]> | null {
  if ((place.latitude === null) === (place.longitude === null)) return null;
  return {
    [place.latitude === null ? "latitude" : "longitude"]: [
      `${name} location: give both the latitude and the longitude, or neither.`,
    ],
  };
}
