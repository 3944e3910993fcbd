// The week's schedule, worked out without the database (pure): which days are working days, the
// week a date falls in, and where stops land when they are moved or a day is rained out — in the
// same order, after what the target day already has — with the warnings a manager confirms.
//
// Working days are Monday to Saturday: crews work six days and rest on Sunday (common practice of
// US lawn-care companies, not a rule of any standard; the same rule as lib/visits/next-free-day.ts).
import { inNoFertilizerWindow } from "@/lib/agronomy/rules";
import { addDays, type IsoDate } from "@/lib/dates";

const weekday = (date: IsoDate) => new Date(`${date}T00:00:00Z`).getUTCDay(); // 0 = Sunday

export const isWorkingDay = (date: IsoDate) => weekday(date) !== 0;

/** The first working day after `date`. */
export function nextWorkingDay(date: IsoDate): IsoDate {
  let day = addDays(date, 1);
  while (!isWorkingDay(day)) day = addDays(day, 1);
  return day;
}

/** The Monday of the week `date` falls in (weeks run Monday to Sunday, as ISO 8601 has them). */
export function weekStart(date: IsoDate): IsoDate {
  return addDays(date, -((weekday(date) + 6) % 7));
}

/** The seven days of the week that starts on `monday`. */
export const weekDays = (monday: IsoDate): IsoDate[] =>
  Array.from({ length: 7 }, (_, i) => addDays(monday, i));

/** A stop as the plan needs it. */
export interface PlanStop {
  id: string;
  propertyId: string;
  propertyName: string;
  scheduledFor: IsoDate;
  technicianId: string | null;
  stopOrder: number;
  /** Whether the round puts down nitrogen or phosphorus (lib/agronomy/season.ts putsDownNOrP). */
  putsDownNOrP: boolean;
  /** The property's professional no-fertilizer window, month-days [after, before], or null. */
  window: readonly [string, string] | null;
}

/** What the target day already holds, per technician (stops not canceled). */
export interface DayLoad {
  /** Property ids with a visit that day (any technician). */
  propertyIds: readonly string[];
  /** Stops of the target technician that day, and their highest stop number. */
  count: number;
  lastStopOrder: number;
  /** Stops a day the technician can do (the manager's setting). */
  capacity: number;
}

export type MoveWarning =
  | { kind: "same_day"; stopId: string; propertyName: string }
  | { kind: "blackout"; stopId: string; propertyName: string }
  | { kind: "over_capacity"; count: number; capacity: number }
  | { kind: "not_working_day" };

export interface MovePlan {
  toDate: IsoDate;
  technicianId: string | null;
  moves: { stopId: string; from: IsoDate; stopOrder: number }[];
  warnings: MoveWarning[];
}

/**
 * Where `stops` land on `toDate` for `technicianId`: in their present order (by day, then stop
 * number), numbered after the stops the technician already has that day. Warns for a property
 * that already has a visit that day, a round with N or P inside its no-fertilizer window, a day
 * past the technician's capacity, and a Sunday.
 */
export function planMove(
  stops: readonly PlanStop[],
  toDate: IsoDate,
  technicianId: string | null,
  target: DayLoad,
): MovePlan {
  const ordered = [...stops].sort(
    (a, b) => a.scheduledFor.localeCompare(b.scheduledFor) || a.stopOrder - b.stopOrder,
  );
  const warnings: MoveWarning[] = isWorkingDay(toDate) ? [] : [{ kind: "not_working_day" }];
  const busy = new Set(target.propertyIds);
  const moves = ordered.map((stop, i) => {
    if (busy.has(stop.propertyId))
      warnings.push({ kind: "same_day", stopId: stop.id, propertyName: stop.propertyName });
    busy.add(stop.propertyId);
    if (stop.window && stop.putsDownNOrP && inNoFertilizerWindow(toDate.slice(5), stop.window))
      warnings.push({ kind: "blackout", stopId: stop.id, propertyName: stop.propertyName });
    return { stopId: stop.id, from: stop.scheduledFor, stopOrder: target.lastStopOrder + i + 1 };
  });
  const count = target.count + ordered.length;
  if (technicianId && count > target.capacity)
    warnings.push({ kind: "over_capacity", count, capacity: target.capacity });
  return { toDate, technicianId, moves, warnings };
}
