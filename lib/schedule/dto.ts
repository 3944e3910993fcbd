// The week's schedule as the manager's page and the API read it.
import type { CancelKind, PlannedService, VisitStatus } from "@/db/schema";

export interface ScheduleStopDto {
  id: string;
  propertyId: string;
  propertyName: string;
  city: string;
  scheduledFor: string;
  stopOrder: number;
  plannedService: PlannedService;
  status: VisitStatus;
  cancelKind: CancelKind | null;
  technicianId: string | null;
}

export interface ScheduleTechnicianDto {
  id: string;
  name: string;
  /** Stops a day this technician can do (the manager's setting). */
  capacity: number;
}

export interface WeekScheduleDto {
  /** Monday of the week, and its seven days. */
  weekStart: string;
  days: string[];
  /** Today in the company's time zone: days before it cannot receive stops. */
  today: string;
  technicians: ScheduleTechnicianDto[];
  /** Every stop of the week (canceled ones included, shown struck through), by day and stop number. */
  stops: ScheduleStopDto[];
}

export interface MovePreviewDto {
  toDate: string;
  technicianId: string | null;
  technicianName: string | null;
  moves: { stopId: string; propertyName: string; from: string; stopOrder: number }[];
  /** Plain sentences the manager confirms before the move is made. */
  warnings: string[];
}
